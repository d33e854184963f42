package dev.tare.footprint;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/** Each footprint formula against values worked out by hand, with the source of the formula named. */
class FormulasTest {
    private static final double EXACT = 1e-9;

    /**
     * Source: Kwon et al., SOSP 2023, "Efficient Memory Management for Large Language Model Serving
     * with PagedAttention", §3: for a 13B model (40 layers, hidden size 5120) at fp16, one token's KV
     * cache is 2 (key and value) × 5120 × 40 × 2 bytes = 819,200 bytes, about 800 KB, and a request
     * of 2,048 tokens needs up to about 1.6 GB. Quoted from memory, not checked against the paper.
     */
    @Test
    void kvCacheMatchesThePagedAttentionWorkedExample() {
        // Hidden size 5120 = 40 heads × head size 128, every head its own KV head (no grouping).
        double perToken = Formulas.kvBytesPerToken(40, 40, 128, 16);
        // 2 × 40 layers × 40 heads × 128 × 16 / 8 = 2 × 40 × 5120 × 2 = 819,200 bytes.
        assertEquals(819_200, perToken, EXACT);
        // 819,200 × 2,048 = 1,677,721,600 bytes: the paper's "about 1.6 GB".
        double request = Formulas.kvCacheBytes(perToken, 2_048);
        assertEquals(1_677_721_600, request, EXACT);
        assertTrue(Math.abs(request - 1.6e9) / 1.6e9 < 0.05, "within 5% of 1.6 GB");
    }

    @Test
    void kvCacheOfTheCatalogsThirteenBillionModelIsThePagedAttentionFigure() {
        // The same worked example through a target: catalog shape opt-13b at kv_bits 16.
        ModelShape opt13b = Catalog.shipped().model("opt-13b").orElseThrow().shape();
        Footprint f = Footprints.estimate(Targets.device(opt13b, 16, 16, Targets.device(80, 0.9, 312, 2039, 0.5)),
                CallSize.of(2_000, 48));
        assertEquals(819_200, f.kvBytesPerToken().getAsLong());
        assertEquals(1_677_721_600L, f.kvCacheBytes().getAsLong());
    }

    /**
     * Source: Kaplan et al. 2020, "Scaling Laws for Neural Language Models", Table 1: a forward pass
     * costs C_forward = 2N + 2·n_layer·n_ctx·d_attn FLOPs per token. Prefill runs it for every one
     * of the I prompt tokens with n_ctx = I.
     */
    @Test
    void prefillFlopsFollowTheForwardPassOfKaplanTableOne() {
        // N = 1e9, n_layer = 24, d_attn = 2048, I = n_ctx = 1000:
        // 2 × 1e9 × 1000 = 2e12; 2 × 24 × 1000 × 1000 × 2048 = 98,304,000,000; sum 2,098,304,000,000.
        assertEquals(2_098_304_000_000.0, Formulas.prefillFlops(1e9, 24, 2048, 1000), EXACT);
        // A case small enough to check on paper: N = 10, n_layer = 2, d_attn = 4, I = 3:
        // 2 × 10 × 3 = 60; 2 × 2 × 3 × 3 × 4 = 144; sum 204.
        assertEquals(204, Formulas.prefillFlops(10, 2, 4, 3), EXACT);
    }

    /** Weight memory is parameters × bits / 8 (a fact of the trade, common practice, no source). */
    @Test
    void weightBytesScaleWithBits() {
        // 7e9 parameters × 16 bits / 8 = 14e9 bytes.
        assertEquals(14e9, Formulas.weightBytes(7e9, 16), EXACT);
        // 4 bits is a quarter of 16: 3.5e9 bytes.
        assertEquals(14e9 / 4, Formulas.weightBytes(7e9, 4), EXACT);
        // 32 bits to 4 bits is one eighth: 28e9 -> 3.5e9.
        assertEquals(Formulas.weightBytes(7e9, 32) / 8, Formulas.weightBytes(7e9, 4), EXACT);
        // Group-wise 4-bit with scales, 4.5 effective bits: 7e9 × 4.5 / 8 = 3.9375e9.
        assertEquals(3.9375e9, Formulas.weightBytes(7e9, 4.5), EXACT);
    }

    /** max_concurrent = floor((memory × usable − weights) / KV cache per request); hand-computed. */
    @Test
    void maxConcurrentFloorsWhatFitsBesideTheWeights() {
        // 16 GiB × 0.75 = 12 GiB = 12,884,901,888 bytes; minus 4e9 of weights = 8,884,901,888;
        // over 1e8 bytes per request = 88.849... -> 88.
        assertEquals(88, Formulas.maxConcurrent(16, 0.75, 4e9, 1e8));
        // Weights larger than the usable memory: nothing fits, 0 rather than a negative count.
        assertEquals(0, Formulas.maxConcurrent(8, 0.5, 5e9, 1e8));
    }

    /** prefill_ms is the larger of compute time and one read of the weights; both branches by hand. */
    @Test
    void prefillMillisTakesTheSlowerOfComputeAndWeightReads() {
        // Compute-bound: 2,098,304,000,000 FLOPs at 25 TFLOPS × 0.4 = 1e13 FLOP/s -> 0.2098304 s;
        // reading 3.5e9 bytes at 120 GB/s takes 0.0291667 s; the larger is 209.8304 ms.
        assertEquals(209.8304, Formulas.prefillMillis(2_098_304_000_000.0, 3.5e9, 25, 0.4, 120), 1e-9);
        // Bandwidth-bound: a 10-token prompt on 7e9 params, 32 layers, d_attn 4096:
        // 2 × 7e9 × 10 + 2 × 32 × 100 × 4096 = 140,026,214,400 FLOPs -> 14.0026 ms of compute, but
        // 3.5e9 bytes / 120e9 bytes/s = 29.1666... ms of weight reads, which wins.
        double flops = Formulas.prefillFlops(7e9, 32, 4096, 10);
        assertEquals(140_026_214_400.0, flops, EXACT);
        assertEquals(3.5e9 / 120e9 * 1000, Formulas.prefillMillis(flops, 3.5e9, 25, 0.4, 120), 1e-9);
    }

    /** Each decoded token reads every weight and the whole KV cache once; hand-computed. */
    @Test
    void decodeMillisPerTokenReadsWeightsAndCache() {
        // (3.5e9 + 1e8) bytes / 120e9 bytes/s = 0.03 s = 30 ms.
        assertEquals(30, Formulas.decodeMillisPerToken(3.5e9, 1e8, 120), 1e-9);
    }

    /** Cost per call and per month from per-million prices; hand-computed. */
    @Test
    void costPerCallWithAndWithoutACachedPrefix() {
        // No cache: (2000 × 2.50 + 300 × 10.00) / 1e6 = (5000 + 3000) / 1e6 = 0.008.
        assertEquals(0.008, Formulas.costPerCall(2000, 0, 300, 2.50, 0.60, 10.00), EXACT);
        // 1200 cached: (800 × 2.50 + 1200 × 0.60 + 300 × 10.00) / 1e6 = (2000 + 720 + 3000) / 1e6 = 0.00572.
        assertEquals(0.00572, Formulas.costPerCall(2000, 1200, 300, 2.50, 0.60, 10.00), EXACT);
        // A month of 20,000 calls a day: 0.008 × 20,000 × 30 = 4,800.
        assertEquals(4800, Formulas.costPerMonth(0.008, 20_000), 1e-6);
    }

    /** Prefill with the first tokens already in the KV cache, design.md "Prefix caching — self-hosted"; hand-computed. */
    @Test
    void prefillWithCachedBlocksComputesOnlyTheNewTokens() {
        ModelShape toy = new ModelShape(10, 2, 4, 1, 1, "formula", false);
        // 2 × N × (I − C) + 2 × L × (I² − C²) × width = 2 × 10 × 1 + 2 × 2 × (9 − 4) × 4 = 20 + 80 = 100.
        assertEquals(100, Formulas.prefillFlops(toy, 3, 2), EXACT);
        assertEquals(Formulas.prefillFlops(toy, 3), Formulas.prefillFlops(toy, 3, 0), EXACT);
        assertEquals(0, Formulas.prefillFlops(toy, 3, 3), EXACT);
    }

    /** The cacheable part of a static prefix, design.md "Prefix caching — hosted"; hand-computed. */
    @Test
    void cacheablePrefixStartsAtTheMinimumAndGrowsInSteps() {
        assertEquals(0, Formulas.cacheableTokens(1023, 1024, 128));
        assertEquals(1024, Formulas.cacheableTokens(1024, 1024, 128));
        assertEquals(1024, Formulas.cacheableTokens(1151, 1024, 128));
        assertEquals(1152, Formulas.cacheableTokens(1152, 1024, 128));
        // 1024 + floor((3126 − 1024) / 128) × 128 = 1024 + 16 × 128 = 3072.
        assertEquals(3072, Formulas.cacheableTokens(3126, 1024, 128));
        // Whole blocks of 16: floor(100 / 16) × 16 = 96.
        assertEquals(96, Formulas.cacheableTokens(100, 16, 16));
        assertEquals(0, Formulas.cacheableTokens(15, 16, 16));
        assertThrows(IllegalArgumentException.class, () -> Formulas.cacheableTokens(100, 0, 16));
    }

    /** h = 1 − e^(−λ × ttl), design.md "Prefix caching — hosted"; hand-computed. */
    @Test
    void hitRateFollowsTheArrivalsWithinTheTimeToLive() {
        // One call per 300 s with a 300 s entry: λ × ttl = 1, h = 1 − 1/e.
        assertEquals(1 - Math.exp(-1), Formulas.hitRate(288, 300), EXACT);
        // One call a second: practically every call hits.
        assertEquals(1, Formulas.hitRate(86_400, 300), EXACT);
        assertEquals(0, Formulas.hitRate(0, 300), EXACT);
        assertEquals(0, Formulas.hitRate(1000, 0), EXACT);
    }

    /** Cost per call with part of the cacheable prefix read and part written; hand-computed. */
    @Test
    void costPerCallSplitsTheCacheablePrefixIntoReadsAndWrites() {
        // I = 2000, C = 1024, h = 0.5, O = 300 at 3.00 in, 0.30 cached, 3.75 write, 15.00 out (invented rates):
        // (976 × 3.00 + 1024 × (0.5 × 0.30 + 0.5 × 3.75) + 300 × 15.00) / 1e6
        // = (2928 + 1024 × 2.025 + 4500) / 1e6 = (2928 + 2073.6 + 4500) / 1e6 = 0.0095016.
        assertEquals(0.0095016, Formulas.costPerCall(2000, 1024, 0.5, 300, 3.00, 0.30, 3.75, 15.00), EXACT);
        // Every cacheable token read, no premium: the same as the plain cached formula.
        assertEquals(Formulas.costPerCall(2000, 1200, 300, 2.50, 0.60, 10.00),
                Formulas.costPerCall(2000, 1200, 1.0, 300, 2.50, 0.60, 2.50, 10.00), EXACT);
        // Nothing hits: every cacheable token is written at the premium.
        assertEquals((800 * 3.00 + 1200 * 3.75 + 300 * 15.00) / 1e6,
                Formulas.costPerCall(2000, 1200, 0.0, 300, 3.00, 0.30, 3.75, 15.00), EXACT);
    }

    /** Where caching stops paying when writes carry a premium. */
    @Test
    void breakEvenTrafficMakesCachedAndUncachedCallsCostTheSame() {
        // h* = (3.75 − 3.00) / (3.75 − 0.30) = 0.2174; λ* = −ln(1 − h*) / 300 s, × 86,400 s = 70.595 calls a day.
        double breakEven = Formulas.breakEvenCallsPerDay(300, 3.00, 0.30, 3.75);
        assertEquals(70.595, breakEven, 1e-3);
        double uncached = Formulas.costPerCall(5000, 0, 200, 3.00, 0.30, 15.00);
        double atBreakEven = Formulas.costPerCall(5000, 4096, Formulas.hitRate(breakEven, 300), 200, 3.00, 0.30,
                3.75, 15.00);
        assertEquals(uncached, atBreakEven, EXACT);
        assertTrue(Formulas.costPerCall(5000, 4096, Formulas.hitRate(breakEven / 2, 300), 200, 3.00, 0.30, 3.75,
                15.00) > uncached, "below the break-even traffic caching costs more");
        // No write premium: caching never costs more, whatever the traffic.
        assertEquals(0, Formulas.breakEvenCallsPerDay(300, 2.50, 0.60, 2.50), EXACT);
        // Reads no cheaper than input: caching never pays.
        assertEquals(Double.POSITIVE_INFINITY, Formulas.breakEvenCallsPerDay(300, 2.50, 2.50, 3.00));
    }

    /**
     * Parameters from a shape, the usual count of weight matrices (common practice, no source),
     * worked by hand on a toy shape.
     */
    @Test
    void decoderParamsCountTheWeightMatrices() {
        // vocab 10, hidden 4, 2 layers, 2 heads of size 2, 1 KV head, feed-forward 8, gated, untied:
        // embeddings 10 × 4 × 2 = 80; attention 2 × 4 × (2 × 2) + 2 × 4 × (1 × 2) = 32 + 16 = 48;
        // feed-forward 3 × 4 × 8 = 96; per layer 144, two layers 288; total 368.
        assertEquals(368, Formulas.decoderParams(10, 4, 2, 2, 1, 2, 8, true, false), EXACT);
        // Tied and not gated: embeddings 40; feed-forward 2 × 4 × 8 = 64; per layer 112; total 264.
        assertEquals(264, Formulas.decoderParams(10, 4, 2, 2, 1, 2, 8, false, true), EXACT);
    }
}
