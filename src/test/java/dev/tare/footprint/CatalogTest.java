package dev.tare.footprint;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/** The shipped catalog: every entry sourced, every shape consistent, computed params near the published sizes. */
class CatalogTest {
    private final Catalog catalog = Catalog.shipped();

    @Test
    void everyEntryNamesItsSourceAndIsUsable() {
        assertFalse(catalog.models().isEmpty());
        assertFalse(catalog.devices().isEmpty());
        for (Catalog.ModelEntry entry : catalog.models()) {
            ModelShape m = entry.shape();
            assertFalse(entry.source().isBlank(), entry.name());
            assertTrue(m.paramsTotal() > 0 && m.layers() > 0 && m.headDim() > 0, entry.name());
            assertEquals(0, m.heads() % m.kvHeads(), entry.name() + ": kv_heads divides heads");
        }
        for (Catalog.DeviceEntry entry : catalog.devices()) {
            Device d = entry.device();
            assertFalse(entry.source().isBlank(), entry.name());
            assertTrue(d.memoryGib().isPresent() && d.usableFraction().isPresent() && d.peakTflops().isPresent()
                    && d.bandwidthGbps().isPresent() && d.efficiency().isPresent(), entry.name() + " is complete");
            assertTrue(d.usableFraction().getAsDouble() <= 1 && d.efficiency().getAsDouble() <= 1, entry.name());
        }
    }

    /**
     * Source: Zhang et al. 2022, "OPT: Open Pre-trained Transformer Language Models", Table 1: the 13B
     * model has 40 layers, 40 heads and embedding size 5120 (from memory).
     */
    @Test
    void thirteenBillionShapeHasTheOptTableOneNumbers() {
        ModelShape m = catalog.model("opt-13b").orElseThrow().shape();
        assertEquals(40, m.layers());
        assertEquals(40, m.heads());
        assertEquals(5120, m.attentionWidth());
    }

    /**
     * Parameters computed from the shape against the sizes the releases state: 0.49B, 1.54B, 7.62B
     * and 72.7B (Yang et al. 2024, "Qwen2 Technical Report", and the model cards; from memory).
     * Hand check for qwen2-7b: embeddings 152,064 × 3,584 × 2 (untied) = 1,089,994,752; per layer
     * attention 2 × 3584 × 3584 + 2 × 3584 × 512 = 29,360,128 and feed-forward 3 × 3584 × 18,944 =
     * 203,685,888, times 28 layers = 6,525,288,448; total 7,615,283,200.
     */
    @Test
    void computedParamsAreNearTheStatedSizes() {
        assertEquals(7_615_283_200.0, catalog.model("qwen2-7b").orElseThrow().shape().paramsTotal(), 0.5);
        assertNear(0.49e9, "qwen2-0.5b");
        assertNear(1.54e9, "qwen2-1.5b");
        assertNear(7.62e9, "qwen2-7b");
        assertNear(72.7e9, "qwen2-72b");
        assertTrue(catalog.model("qwen2-7b").orElseThrow().shape().paramsComputed());
    }

    /** The current shapes: each stores what it states and keeps the KV cache its architecture keeps. */
    @Test
    void expertsLatentAttentionAndWindowsInTheCatalog() {
        // Mixtral of Experts (Jiang et al. 2024): 46.7B stored, 12.9B per token, 8 experts with 2 per token.
        ModelShape moe = catalog.model("moe-8x7b").orElseThrow().shape();
        assertEquals(46.7e9, moe.paramsTotal());
        assertEquals(12.9e9, moe.paramsActive());
        // one expert over all layers: (46.7e9 − 12.9e9) / (8 − 2) = 5.6333e9
        assertEquals(33.8e9 / 6, moe.experts().paramsPerExpert(), 1e3);
        // DeepSeek-V2 paper: a cached latent of 512 + 64 per layer, 60 layers, 2 bytes: 69,120 B per token
        ModelShape mla = catalog.model("mla-236b").orElseThrow().shape();
        assertEquals(69_120, Formulas.kvBytesPerToken(mla, 16), 1e-9);
        assertEquals(21e9, mla.paramsActive());
        // Mistral 7B paper: window 4096 on all 32 layers; 8,000 tokens keep 32 × 4096 × 4096 B = 536,870,912
        ModelShape sliding = catalog.model("sliding-7b").orElseThrow().shape();
        assertEquals(536_870_912, Formulas.kvCacheBytes(sliding, 8000, 16), 1e-6);
        // 2 × 32,000 × 4096 + 32 × (41,943,040 + 176,160,768) = 7,241,465,856
        assertEquals(7_241_465_856.0, sliding.paramsTotal(), 0.5);
        assertEquals(8192, sliding.contextLimit().getAsInt());
    }

    private void assertNear(double stated, String name) {
        double computed = catalog.model(name).orElseThrow().shape().paramsTotal();
        assertTrue(Math.abs(computed - stated) / stated < 0.01, name + ": " + computed + " vs stated " + stated);
    }
}
