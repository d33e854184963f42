package dev.tare.footprint;

import static org.junit.jupiter.api.Assertions.assertEquals;
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
