package dev.tare.config;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.TareException;
import dev.tare.footprint.Formulas;
import dev.tare.footprint.ModelShape;
import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Model shapes read from hand-written config.json files (shapes from memory of the published
 * configs, in {@code src/test/resources/dev/tare/config/shapes}), each pinned to a hand computation
 * with the paper its architecture comes from.
 */
class ArchitectureShapesTest {
    /** Parameter counts are whole matrices; a tolerance of one parameter covers floating point. */
    private static final double PARAM = 1;

    @TempDir
    Path root;

    private ModelShape fixture(String name) throws IOException {
        try (InputStream in = getClass().getResourceAsStream("/dev/tare/config/shapes/" + name)) {
            Files.write(root.resolve(name), in.readAllBytes());
        }
        return shape(name);
    }

    private ModelShape written(String json) throws IOException {
        Files.writeString(root.resolve("config.json"), json, StandardCharsets.UTF_8);
        return shape("config.json");
    }

    private ModelShape shape(String file) throws IOException {
        Path yaml = root.resolve("tare.yaml");
        Files.writeString(yaml, "targets:\n  - name: t\n    tokenizer: o200k_base\n    model: {config: " + file + "}\n",
                StandardCharsets.UTF_8);
        return ConfigLoader.load(yaml).targets().get(0).model().orElseThrow();
    }

    private TareException refused(String json) {
        return assertThrows(TareException.class, () -> written(json));
    }

    @Test
    void mixtureOfEightExpertsStoresEveryExpertAndUsesTwo() throws IOException {
        // Mixtral of Experts (Jiang et al. 2024), Table 1: dim 4096, 32 layers, 32 heads, 8 KV heads,
        // hidden_dim 14336, 8 experts, top 2; the paper states 46.7B total and 12.9B active params.
        ModelShape m = fixture("moe-8x7b.json");
        // embeddings 2 × 32,000 × 4,096 = 262,144,000 (untied)
        // attention 2 × 4096 × 4096 + 2 × 4096 × 8 × 128 = 41,943,040 per layer
        // one expert 3 × 4096 × 14,336 = 176,160,768; router 4096 × 8 = 32,768
        // total  = 262,144,000 + 32 × (41,943,040 + 8 × 176,160,768 + 32,768) = 46,702,526,464
        // active = 262,144,000 + 32 × (41,943,040 + 2 × 176,160,768 + 32,768) = 12,879,659,008
        assertEquals(46_702_526_464.0, m.paramsTotal(), PARAM);
        assertEquals(12_879_659_008.0, m.paramsActive(), PARAM);
        assertEquals(8, m.experts().count());
        assertEquals(2, m.experts().perToken());
        assertEquals(32 * 176_160_768.0, m.experts().paramsPerExpert(), PARAM);
        assertEquals(32_768, m.contextLimit().getAsInt());
        assertEquals(0, m.kv().windowedLayers(), "sliding_window: null is no window");
        // Prefill skips the embeddings (Kaplan et al. 2020): 12,879,659,008 − 262,144,000.
        assertEquals(12_617_515_008.0, m.activeNonEmbeddingParams(), PARAM);
        assertEquals(32_000.0 * 4096, m.outputParams(), PARAM);
    }

    @Test
    void latentAttentionCachesTheLatentAndTheRotaryKeyOnly() throws IOException {
        // DeepSeek-V2 paper §2.1 (and the V3 report's 61-layer shape): cache kv_lora_rank + qk_rope_head_dim
        // elements per layer, (512 + 64) × 61 × 2 B = 70,272 B per token at 16 bits.
        ModelShape m = fixture("mla-61l.json");
        assertTrue(m.kv().latent());
        assertEquals(576, m.kv().widthPerLayer());
        assertEquals(70_272, Formulas.kvBytesPerToken(m, 16), 1e-9);
        // attention per layer: q 7168 × 1536 + 1536 × 128 × 192 = 48,758,784; kv down 7168 × 576 = 4,128,768;
        // kv up 512 × 128 × 256 = 16,777,216; out 128 × 128 × 7168 = 117,440,512: 187,105,280 × 61 = 11,413,422,080
        // 3 leading dense layers: 3 × (3 × 7168 × 18,432) = 1,189,085,184
        // 58 MoE layers, expert 3 × 7168 × 2048 = 44,040,192, router 7168 × 256 = 1,835,008, 1 shared expert:
        //   total 58 × (256 + 1) × 44,040,192 + 58 × 1,835,008 = 656,569,532,416
        //   active 58 × (8 + 1) × 44,040,192 + 58 × 1,835,008 = 23,095,410,688
        // embeddings 2 × 129,280 × 7168 = 1,853,358,080
        assertEquals(671_025_397_760.0, m.paramsTotal(), PARAM);
        assertEquals(37_551_276_032.0, m.paramsActive(), PARAM);
        assertEquals(192, m.headDim(), "qk_nope_head_dim + qk_rope_head_dim");
        assertTrue(m.notes().stream().anyMatch(n -> n.startsWith("num_nextn_predict_layers")), m.notes().toString());
    }

    @Test
    void multiQueryKeepsOneKvHead() throws IOException {
        // Shazeer 2019, "Fast Transformer Decoding: One Write-Head is All You Need": one K/V head for all.
        ModelShape m = fixture("mqa-48h.json");
        assertEquals(1, m.kvHeads());
        assertEquals(48, m.heads());
        // 40 layers × 2 × 1 × 128 × 2 B = 20,480 B per token (48 heads would be 983,040)
        assertEquals(20_480, Formulas.kvBytesPerToken(m, 16), 1e-9);
        // Ungated by its type despite a GELU name, tied by its family's default:
        // 49,152 × 6144 + 40 × (2 × 6144 × 6144 + 2 × 6144 × 128 + 2 × 6144 × 24,576) = 15,464,398,848
        assertEquals(15_464_398_848.0, m.paramsTotal(), PARAM);
        assertEquals(8_192, m.contextLimit().getAsInt(), "n_positions");
        assertTrue(m.notes().isEmpty(), m.notes().toString());
    }

    @Test
    void slidingWindowKeepsItsWindowOnEveryLayer() throws IOException {
        // Mistral 7B paper (Jiang et al. 2023), rolling buffer cache of W = 4096 on every layer.
        ModelShape m = fixture("sliding-7b.json");
        assertEquals(32, m.kv().windowedLayers());
        assertEquals(4096, m.kv().window());
        // 32 layers × min(8000, 4096) × 2 × 8 × 128 × 2 B = 536,870,912 (1,048,576,000 without the window)
        assertEquals(536_870_912, Formulas.kvCacheBytes(m, 8000, 16), 1e-6);
        // below the window every token is kept: 32 × 1000 × 4096 B
        assertEquals(131_072_000, Formulas.kvCacheBytes(m, 1000, 16), 1e-6);
    }

    @Test
    void alternatingLocalAndGlobalLayersToldByTheirKeys() throws IOException {
        // A family with local (4,096-token window) and global layers in turn, told by query_pre_attn_scalar;
        // shape from memory. Half the 42 layers are windowed.
        ModelShape m = fixture("alternating-9b.json");
        assertEquals(21, m.kv().windowedLayers());
        assertEquals(256, m.headDim(), "head_dim is stated, not 3584 / 16 = 224");
        // (21 × 8000 + 21 × 4096) × 2 × 8 × 256 × 2 B = 254,016 × 8192 = 2,080,899,072 (all global: 2,752,512,000)
        assertEquals(2_080_899_072.0, Formulas.kvCacheBytes(m, 8000, 16), 1e-6);
        // GeGLU counted gated, embeddings tied by the family's keys:
        // 256,000 × 3584 + 42 × (2 × 3584 × 4096 + 2 × 3584 × 2048 + 3 × 3584 × 14,336) = 9,241,100,288
        assertEquals(9_241_100_288.0, m.paramsTotal(), PARAM);
        assertTrue(m.notes().isEmpty(), m.notes().toString());
    }

    @Test
    void layerTypeListsPatternsAndMaxWindowLayers() throws IOException {
        String common = "\"hidden_size\": 64, \"num_attention_heads\": 4, \"num_parameters\": 1000, ";
        ModelShape listed = written("{" + common + "\"num_hidden_layers\": 4, \"sliding_window\": 512, \"layer_types\":"
                + " [\"sliding_attention\", \"full_attention\", \"sliding_attention\", \"full_attention\"]}");
        assertEquals(2, listed.kv().windowedLayers());
        // one global layer in every 6: 12 − 12 / 6 = 10 windowed
        ModelShape pattern = written("{" + common + "\"num_hidden_layers\": 12, \"sliding_window\": 512,"
                + " \"sliding_window_pattern\": 6}");
        assertEquals(10, pattern.kv().windowedLayers());
        // layers from max_window_layers on are windowed when use_sliding_window is on: 8 − 6 = 2
        ModelShape fromLayer = written("{" + common + "\"num_hidden_layers\": 8, \"sliding_window\": 512,"
                + " \"use_sliding_window\": true, \"max_window_layers\": 6}");
        assertEquals(2, fromLayer.kv().windowedLayers());
        ModelShape off = written("{" + common + "\"num_hidden_layers\": 8, \"sliding_window\": 512,"
                + " \"use_sliding_window\": false, \"max_window_layers\": 6}");
        assertEquals(0, off.kv().windowedLayers());
    }

    @Test
    void sharedExpertAndSparseStep() throws IOException {
        // 60 experts of 1408, 4 per token, one shared expert of 5632 with its 1 × 2048 gate; shape from memory.
        ModelShape m = fixture("moe-shared-60e.json");
        // per layer: attention 4 × 2048 × 2048 = 16,777,216; shared 3 × 2048 × 5632 + 2048 = 34,605,056;
        // router 2048 × 60 = 122,880; expert 3 × 2048 × 1408 = 8,650,752; embeddings 2 × 151,936 × 2048 = 622,329,856
        // total  = 622,329,856 + 24 × (16,777,216 + 34,605,056 + 122,880 + 60 × 8,650,752) = 14,315,536,384
        // active = 622,329,856 + 24 × (16,777,216 + 34,605,056 + 122,880 + 4 × 8,650,752) = 2,688,925,696
        assertEquals(14_315_536_384.0, m.paramsTotal(), PARAM);
        assertEquals(2_688_925_696.0, m.paramsActive(), PARAM);
        assertEquals(0, m.kv().windowedLayers(), "use_sliding_window: false");
    }

    @Test
    void leadingDenseLayersAndLayersWithoutExperts() throws IOException {
        // 4 layers, the first dense (first_k_dense_replace), experts on the other 3; hidden 8, ff 16, expert 4.
        ModelShape m = written("""
                {"model_type": "deepseek_v2", "hidden_size": 8, "intermediate_size": 16, "moe_intermediate_size": 4,
                 "num_hidden_layers": 4, "num_attention_heads": 2, "num_key_value_heads": 2, "vocab_size": 10,
                 "n_routed_experts": 4, "num_experts_per_tok": 1, "first_k_dense_replace": 1, "tie_word_embeddings": false}
                """);
        // embeddings 2 × 10 × 8 = 160; attention 4 × 8 × 8 = 256 per layer; dense ff 3 × 8 × 16 = 384;
        // expert 3 × 8 × 4 = 96; router 8 × 4 = 32
        // total  = 160 + 4 × 256 + 384 + 3 × (32 + 4 × 96) = 2,816
        // active = 160 + 4 × 256 + 384 + 3 × (32 + 1 × 96) = 1,952
        assertEquals(2_816, m.paramsTotal(), PARAM);
        assertEquals(1_952, m.paramsActive(), PARAM);
        assertEquals(3 * 96, m.experts().paramsPerExpert(), PARAM);
    }

    @Test
    void visionTowerIsStoredButNotActive() throws IOException {
        ModelShape m = fixture("vision-text.json");
        // text: 2 × 32,000 × 4096 + 32 × (41,943,040 + 176,160,768) = 7,241,465,856
        // vision: 24 × (4 × 1024² + 2 × 1024 × 4096) = 301,989,888 (usual block, from memory)
        assertEquals(7_241_465_856.0, m.paramsActive(), PARAM);
        assertEquals(7_241_465_856.0 + 301_989_888.0, m.paramsTotal(), PARAM);
        assertTrue(m.notes().stream().anyMatch(n -> n.startsWith("vision_config") && n.contains("params_total")),
                m.notes().toString());
    }

    @Test
    void gatedByFamilyNotByActivationName() throws IOException {
        String shape = "\"hidden_size\": 8, \"intermediate_size\": 16, \"num_hidden_layers\": 1, \"num_attention_heads\": 2,"
                + " \"vocab_size\": 10, \"tie_word_embeddings\": true, ";
        // gated: 10 × 8 + 4 × 8 × 8 + 3 × 8 × 16 = 720; ungated: 10 × 8 + 256 + 2 × 8 × 16 = 592
        assertEquals(720, written("{" + shape + "\"model_type\": \"mistral\", \"hidden_act\": \"gelu\"}").paramsTotal(), PARAM);
        assertEquals(592, written("{" + shape + "\"model_type\": \"falcon\", \"hidden_act\": \"silu\"}").paramsTotal(), PARAM);
        ModelShape unknown = written("{" + shape + "\"model_type\": \"newfamily\"}");
        assertEquals(720, unknown.paramsTotal(), PARAM);
        assertTrue(unknown.notes().stream().anyMatch(n -> n.contains("newfamily")), unknown.notes().toString());
    }

    @Test
    void tiedEmbeddingsDefaultPerFamily() throws IOException {
        String shape = "\"hidden_size\": 8, \"intermediate_size\": 16, \"num_hidden_layers\": 1, \"num_attention_heads\": 2,"
                + " \"vocab_size\": 10, ";
        // untied adds the output layer 10 × 8 = 80: 720 + 80 = 800
        assertEquals(800, written("{" + shape + "\"model_type\": \"qwen2\"}").paramsTotal(), PARAM);
        // gpt2: ungated and tied, 10 × 8 + 4 × 8 × 8 + 2 × 8 × 16 = 592
        assertEquals(592, written("{" + shape + "\"model_type\": \"gpt2\"}").paramsTotal(), PARAM);
        ModelShape unknown = written("{" + shape + "\"model_type\": \"newfamily\"}");
        assertEquals(720, unknown.paramsTotal(), PARAM);
        assertTrue(unknown.notes().stream().anyMatch(n -> n.contains("tie_word_embeddings")), unknown.notes().toString());
    }

    @Test
    void unmodelledKeysAreNamed() throws IOException {
        ModelShape m = written("{\"hidden_size\": 64, \"num_attention_heads\": 4, \"num_hidden_layers\": 2,"
                + " \"num_parameters\": 1000, \"quantization_config\": {\"bits\": 4}, \"attention_chunk_size\": 8192,"
                + " \"rope_scaling\": null}");
        assertTrue(m.notes().stream().anyMatch(n -> n.startsWith("quantization_config")), m.notes().toString());
        assertTrue(m.notes().stream().anyMatch(n -> n.startsWith("attention_chunk_size")), m.notes().toString());
        assertFalse(m.notes().stream().anyMatch(n -> n.startsWith("rope_scaling")), "null is not in use");
    }

    @Test
    void badValuesAreOneLineWithFileLineAndKey() {
        TareException text = refused("{\n\"hidden_size\": 64, \"num_attention_heads\": 4, \"num_hidden_layers\": 2,"
                + " \"num_parameters\": 1000,\n\"sliding_window\": \"4096\"}");
        assertTrue(text.getMessage().startsWith("config.json, line 3: sliding_window: must be a whole number"),
                text.getMessage());
        TareException negative = refused("{\"hidden_size\": 64, \"num_attention_heads\": 4, \"num_hidden_layers\": 2,"
                + " \"vocab_size\": 10, \"intermediate_size\": 8, \"num_local_experts\": 4, \"num_experts_per_tok\": 2,"
                + " \"first_k_dense_replace\": -1}");
        assertTrue(negative.getMessage().contains("first_k_dense_replace: must be a whole number of at least 0"),
                negative.getMessage());
        TareException tooMany = refused("{\"hidden_size\": 64, \"num_attention_heads\": 4, \"num_hidden_layers\": 2,"
                + " \"vocab_size\": 10, \"intermediate_size\": 8, \"num_local_experts\": 4, \"num_experts_per_tok\": 5}");
        assertTrue(tooMany.getMessage().contains("num_experts_per_tok: is 5 but the model has only 4 experts"),
                tooMany.getMessage());
        TareException types = refused("{\"hidden_size\": 64, \"num_attention_heads\": 4, \"num_hidden_layers\": 2,"
                + " \"num_parameters\": 1000, \"sliding_window\": 16, \"layer_types\": [\"full_attention\"]}");
        assertTrue(types.getMessage().contains("layer_types: lists 1 layers but the model has 2"), types.getMessage());
        TareException flag = refused("{\"hidden_size\": 64, \"num_attention_heads\": 4, \"num_hidden_layers\": 2,"
                + " \"num_parameters\": 1000, \"multi_query\": \"yes\"}");
        assertTrue(flag.getMessage().contains("multi_query: must be true or false"), flag.getMessage());
        for (TareException e : new TareException[] {text, negative, tooMany, types, flag}) {
            assertFalse(e.getMessage().contains("\n"), e.getMessage());
        }
    }
}
