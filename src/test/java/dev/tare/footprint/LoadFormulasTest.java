package dev.tare.footprint;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.OptionalDouble;
import org.junit.jupiter.api.Test;

/** Prefill without embeddings, windows, experts under load and the decode step at batch B, by hand. */
class LoadFormulasTest {
    /**
     * A dense 8B shape with grouped-query attention (Ainslie et al. 2023), from memory: 32 layers, 32 heads,
     * 8 KV heads of 128, hidden 4096, feed-forward 14,336 gated, vocabulary 128,256, untied.
     * embeddings 2 × 128,256 × 4096 = 1,050,673,152; layers 32 × (41,943,040 + 176,160,768) = 6,979,321,856.
     */
    static ModelShape dense8b() {
        return new ShapeBuilder().attention(32, 32, 8, 128).params(8_029_995_008.0, 8_029_995_008.0, true)
                .embeddings(1_050_673_152.0, 525_336_576.0).contextLimit(8192).build();
    }

    /** The 8×7B mixture of Mixtral of Experts (Jiang et al. 2024), as ArchitectureShapesTest computes it. */
    static ModelShape moe8x7b() {
        return new ShapeBuilder().attention(32, 32, 8, 128).params(46_702_526_464.0, 12_879_659_008.0, true)
                .embeddings(262_144_000.0, 131_072_000.0).experts(8, 2, 32 * 176_160_768.0).build();
    }

    private static Target onGpu(ModelShape model, int concurrency, double bandwidthEfficiency) {
        // 80 GiB, 90% usable, 312 TFLOPS at 0.5 in prefill, 2039 GB/s: the catalog's gpu-80gb class values
        Device gpu = new Device("test", OptionalDouble.of(80), OptionalDouble.of(0.9), OptionalDouble.of(312),
                OptionalDouble.of(2039), OptionalDouble.of(0.5), OptionalDouble.of(bandwidthEfficiency));
        return Targets.device(model, 16, 16, gpu).withConcurrency(concurrency);
    }

    @Test
    void prefillCountsNonEmbeddingParamsAndTheOutputLayerOnce() {
        // Kaplan et al. 2020, Table 1: 2N + 2·n_layer·n_ctx·d_attn per token, N without embeddings.
        ModelShape m = new ShapeBuilder().attention(2, 2, 2, 4).params(1000, 1000, false).embeddings(200, 100).build();
        // 2 × 800 × 10 + 10 × (2 × 8 × 2 layers × 10) + 2 × 100 = 16,000 + 3,200 + 200 = 19,400
        assertEquals(19_400, Formulas.prefillFlops(m, 10), 1e-9);
        assertEquals(0, Formulas.prefillFlops(m, 0), 1e-9);
    }

    @Test
    void windowedLayersAttendOverTheirWindowOnly() {
        // Mistral 7B paper: a token on a windowed layer attends to at most W tokens.
        ModelShape m = new ShapeBuilder().attention(4, 2, 2, 4).params(0, 0, false).window(2, 100).build();
        // width 8; 2 global layers × 1000 + 2 windowed × 100 = 2,200 token-layers; × 2 × 8 = 35,200
        assertEquals(35_200, Formulas.attentionFlopsPerToken(m, 1000), 1e-9);
        // KV: (2 × 1000 + 2 × 100) × 2 × 2 × 4 elements × 2 B = 2,200 × 32 = 70,400
        assertEquals(70_400, Formulas.kvCacheBytes(m, 1000, 16), 1e-9);
    }

    @Test
    void expertsTouchedByABatchUnderUniformRouting() {
        // E × (1 − (1 − k/E)^B), from memory: 8 × (1 − 0.75^4) = 8 × 0.68359375 = 5.46875
        assertEquals(2, Formulas.expertsTouched(8, 2, 1), 1e-12);
        assertEquals(5.46875, Formulas.expertsTouched(8, 2, 4), 1e-12);
        assertEquals(8, Formulas.expertsTouched(8, 2, 1000), 1e-9);
        // Mixtral at B = 4: 12,879,659,008 + 5,637,144,576 × (5.46875 − 2) = 32,433,504,256
        assertEquals(32_433_504_256.0, Formulas.paramsRead(moe8x7b(), 4), 1);
        assertEquals(12_879_659_008.0, Formulas.paramsRead(moe8x7b(), 1), 1);
    }

    @Test
    void decodeStepOfADense8bModelAt203ConcurrentRequests() {
        // 2,000 input + 300 output tokens; 131,072 B of KV per token (2 × 32 × 8 × 128 × 2 B) × 2,300 = 301,465,600
        Footprint f = Footprints.estimate(onGpu(dense8b(), 203, 1), CallSize.of(2000, 300));
        assertEquals(301_465_600, f.kvCacheBytes().getAsLong());
        // floor((80 × 2^30 × 0.9 − 16,059,990,016) / 301,465,600) = floor(61,249,421,312 / 301,465,600) = 203
        assertEquals(203, f.maxConcurrent().getAsLong());
        Footprint.Load load = f.load().orElseThrow();
        // weights 16,059,990,016 + 203 × 301,465,600 = 77,257,506,816 B read per step
        assertEquals(77_257_506_816L, load.decodeBytesPerStep().getAsLong());
        // 77,257,506,816 / 2039e9 s = 37.8899 ms (compute, 203 × 15,612,248,064 FLOP / 156e12, is 20.3 ms)
        double step = 77_257_506_816.0 / 2039e9 * 1000;
        assertEquals(step, f.decodeMillisPerToken().getAsDouble(), 1e-9);
        assertEquals(37.89, step, 0.01);
        assertEquals(1000 / step, load.tokensPerSecond().getAsDouble(), 1e-9);
        assertEquals(203 * 1000 / step, load.tokensPerSecondTotal().getAsDouble(), 1e-6);
        // prefill 2 × 6,979,321,856 × 2000 + 2000 × 2 × 4096 × 32 × 2000 + 2 × 525,336,576 = 28,966,914,097,152 FLOP;
        // 203 of them queued on 312e12 × 0.5 FLOP/s
        double ttft = 203 * 28_966_914_097_152.0 / 156e12 * 1000;
        assertEquals(28_966_914_097_152.0, f.prefillFlops().getAsDouble(), 1);
        assertEquals(ttft, load.timeToFirstTokenMillis().getAsDouble(), 1e-6);
        assertEquals(ttft + 300 * step, load.endToEndMillis().getAsDouble(), 1e-6);
        // at batch 1 the step reads the weights and one cache: (16,059,990,016 + 301,465,600) / 2039e9 = 8.02 ms
        Footprint one = Footprints.estimate(onGpu(dense8b(), 1, 1), CallSize.of(2000, 300));
        assertEquals(16_361_455_616.0 / 2039e9 * 1000, one.decodeMillisPerToken().getAsDouble(), 1e-9);
        assertEquals(1, one.load().orElseThrow().concurrency());
    }

    @Test
    void bandwidthEfficiencySlowsEveryRead() {
        Footprint f = Footprints.estimate(onGpu(dense8b(), 1, 0.8), CallSize.of(2000, 300));
        assertEquals(16_361_455_616.0 / (2039e9 * 0.8) * 1000, f.decodeMillisPerToken().getAsDouble(), 1e-9);
    }

    @Test
    void mixtureOfExpertsStoresEveryExpert() {
        Footprint f = Footprints.estimate(onGpu(moe8x7b(), 1, 1), CallSize.of(8000, 0));
        // 46,702,526,464 × 2 B = 93,405,052,928: more than an 80 GB card holds
        assertEquals(93_405_052_928L, f.weightBytes().getAsLong());
        assertEquals(0, f.maxConcurrent().getAsLong());
        assertEquals(12_879_659_008.0, f.load().orElseThrow().paramsActive(), 1);
        assertTrue(Cautions.of(onGpu(moe8x7b(), 1, 1), f).stream().anyMatch(l -> l.contains("do not fit")));
    }

    @Test
    void lowBitsAndLongCallsCarryCautions() {
        assertTrue(Cautions.lowPrecision(OptionalDouble.of(3), OptionalDouble.of(16)));
        assertTrue(Cautions.lowPrecision(OptionalDouble.of(16), OptionalDouble.of(4)));
        assertFalse(Cautions.lowPrecision(OptionalDouble.of(4), OptionalDouble.of(8)));
        Target target = onGpu(dense8b(), 1, 1);
        // 20,000 + 300 = 20,300 tokens on an 8,192-token context: over by 12,108
        List<String> lines = Cautions.of(target, Footprints.estimate(target, CallSize.of(20_000, 300)));
        assertTrue(lines.stream().anyMatch(l -> l.contains("20,300 tokens exceed the model's context of 8,192 tokens"
                + " by 12,108")), lines.toString());
        assertTrue(Cautions.of(target, Footprints.estimate(target, CallSize.of(7_000, 300))).isEmpty());
    }
}
