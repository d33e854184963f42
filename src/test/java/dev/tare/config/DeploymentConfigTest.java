package dev.tare.config;

import dev.tare.footprint.Target;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.TareException;
import dev.tare.footprint.Device;
import dev.tare.footprint.ModelShape;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** A target's model, precisions and device in tare.yaml: inline, from the catalog, from a model config.json. */
class DeploymentConfigTest {
    @TempDir
    Path root;

    private Target only(String targetYaml) throws IOException {
        return load(targetYaml).targets().get(0);
    }

    private TareConfig load(String targetYaml) throws IOException {
        Path file = root.resolve("tare.yaml");
        Files.writeString(file, "targets:\n" + targetYaml, StandardCharsets.UTF_8);
        return ConfigLoader.load(file);
    }

    private void write(String relative, String text) throws IOException {
        Path file = root.resolve(relative);
        Files.createDirectories(file.getParent());
        Files.writeString(file, text, StandardCharsets.UTF_8);
    }

    private TareException refused(String targetYaml) {
        return assertThrows(TareException.class, () -> load(targetYaml));
    }

    @Test
    void inlineModelPrecisionNamesAndDevice() throws IOException {
        Target t = only("""
                  - name: laptop
                    tokenizer: o200k_base
                    model: {params: 3.8e9, layers: 32, heads: 32, kv_heads: 8, head_dim: 96}
                    weight_bits: 4.5
                    kv_bits: fp16
                    device: {memory_gib: 16, usable_fraction: 0.75, peak_tflops: 25, bandwidth_gbps: 120, efficiency: 0.4}
                """);
        ModelShape m = t.model().orElseThrow();
        assertEquals(3.8e9, m.paramsTotal());
        assertEquals(32, m.layers());
        assertEquals(8, m.kvHeads());
        assertEquals(96, m.headDim());
        assertFalse(m.paramsComputed());
        assertEquals(4.5, t.weightBits().getAsDouble());
        assertEquals(16, t.kvBits().getAsDouble());
        Device d = t.device().orElseThrow();
        assertEquals(16, d.memoryGib().getAsDouble());
        assertEquals(0.4, d.efficiency().getAsDouble());
    }

    @Test
    void inlineModelWithoutKvHeadsUsesOneKvHeadPerHead() throws IOException {
        ModelShape m = only("""
                  - name: t
                    tokenizer: o200k_base
                    model: {params: 1e9, layers: 16, heads: 16, head_dim: 64}
                """).model().orElseThrow();
        assertEquals(16, m.kvHeads());
    }

    @Test
    void catalogNamesWithOverrides() throws IOException {
        TareConfig config = load("""
                  - name: a
                    tokenizer: o200k_base
                    model: qwen2-7b
                    weight_bits: int4
                    kv_bits: int8
                    device: gpu-24gb
                  - name: b
                    tokenizer: o200k_base
                    model: {catalog: qwen2-7b, kv_heads: 7}
                    device: {catalog: gpu-24gb, memory_gib: 48}
                """);
        Target a = config.targets().get(0);
        assertEquals("catalog model qwen2-7b", a.model().orElseThrow().origin());
        assertEquals(4, a.model().orElseThrow().kvHeads());
        assertEquals(4, a.weightBits().getAsDouble());
        assertEquals(8, a.kvBits().getAsDouble());
        assertEquals(24, a.device().orElseThrow().memoryGib().getAsDouble());
        Target b = config.targets().get(1);
        assertEquals(7, b.model().orElseThrow().kvHeads());
        assertEquals(28, b.model().orElseThrow().heads());
        assertTrue(b.model().orElseThrow().origin().endsWith("with overrides"));
        assertEquals(48, b.device().orElseThrow().memoryGib().getAsDouble());
        assertEquals(1008, b.device().orElseThrow().bandwidthGbps().getAsDouble());
    }

    @Test
    void modelConfigFileStatingParams() throws IOException {
        write("models/m/config.json", """
                {"num_hidden_layers": 24, "num_attention_heads": 16, "num_key_value_heads": 4,
                 "hidden_size": 2048, "num_parameters": 1234567890}
                """);
        ModelShape m = only("""
                  - name: t
                    tokenizer: o200k_base
                    model: {config: models/m/config.json}
                """).model().orElseThrow();
        assertEquals(1_234_567_890, m.paramsTotal());
        assertFalse(m.paramsComputed());
        assertEquals(24, m.layers());
        assertEquals(4, m.kvHeads());
        // No head_dim in the file: hidden size 2048 / 16 heads = 128.
        assertEquals(128, m.headDim());
    }

    /**
     * A file in the layout of a published small open-weight model's config.json without a parameter
     * count: params are computed from the shape. By hand (the usual weight-matrix count, common
     * practice): embeddings 151,936 × 896 (tied) = 136,134,656; per layer attention 2 × 896 × 896 +
     * 2 × 896 × 128 = 1,835,008 and gated feed-forward 3 × 896 × 4,864 = 13,074,432, × 24 layers =
     * 357,826,560; total 493,961,216.
     */
    @Test
    void modelConfigFileWithoutParamsComputesThem() throws IOException {
        write("models/small/config.json", """
                {"architectures": ["ForCausalLM"], "hidden_act": "silu", "hidden_size": 896,
                 "intermediate_size": 4864, "num_attention_heads": 14, "num_hidden_layers": 24,
                 "num_key_value_heads": 2, "tie_word_embeddings": true, "vocab_size": 151936}
                """);
        ModelShape m = only("""
                  - name: t
                    tokenizer: o200k_base
                    model: {config: models/small/config.json, layers: 24}
                """).model().orElseThrow();
        assertEquals(493_961_216, m.paramsTotal(), 0.5);
        assertTrue(m.paramsComputed());
        assertEquals(64, m.headDim());
        assertEquals(2, m.kvHeads());
    }

    @Test
    void modelConfigFileWithNestedTextSection() throws IOException {
        write("models/v/config.json", """
                {"vision_config": {"hidden_size": 1024},
                 "text_config": {"num_hidden_layers": 8, "num_attention_heads": 8, "head_dim": 32, "n_params": 5000}}
                """);
        ModelShape m = only("""
                  - name: t
                    tokenizer: o200k_base
                    model: {config: models/v/config.json}
                """).model().orElseThrow();
        assertEquals(8, m.layers());
        assertEquals(32, m.headDim());
        assertEquals(5000, m.paramsTotal());
    }

    @Test
    void zeroOrNegativeParamsAreRefusedNamingKeyAndLine() {
        TareException zero = refused("""
                  - name: t
                    tokenizer: o200k_base
                    model:
                      params: 0
                      layers: 2
                      heads: 2
                      head_dim: 2
                """);
        assertTrue(zero.getMessage().contains("tare.yaml, line 5: targets[0].model.params: must be a number above 0"),
                zero.getMessage());
        TareException negative = refused("""
                  - name: t
                    tokenizer: o200k_base
                    model: {params: -7e9, layers: 2, heads: 2, head_dim: 2}
                """);
        assertTrue(negative.getMessage().contains("line 4") && negative.getMessage().contains("model.params"),
                negative.getMessage());
    }

    @Test
    void kvHeadsThatDoNotDivideHeadsAreRefused() {
        TareException e = refused("""
                  - name: t
                    tokenizer: o200k_base
                    model: {params: 1e9, layers: 2, heads: 32, kv_heads: 5, head_dim: 64}
                """);
        assertTrue(e.getMessage().contains("line 4") && e.getMessage().contains("targets[0].model.kv_heads")
                && e.getMessage().contains("must divide heads (32)"), e.getMessage());
    }

    @Test
    void unknownOrOutOfRangePrecisionIsRefused() {
        TareException name = refused("""
                  - name: t
                    tokenizer: o200k_base
                    weight_bits: fp12
                """);
        assertTrue(name.getMessage().contains("line 4: targets[0].weight_bits: unknown precision 'fp12'"),
                name.getMessage());
        TareException range = refused("""
                  - name: t
                    tokenizer: o200k_base
                    kv_bits: 0.5
                """);
        assertTrue(range.getMessage().contains("targets[0].kv_bits") && range.getMessage().contains("out of range"),
                range.getMessage());
    }

    @Test
    void missingTokenizerFileIsRefusedNamingTheKey() {
        TareException e = refused("""
                  - name: t
                    tokenizer: models/none/tokenizer.json
                """);
        assertTrue(e.getMessage().contains("line 3: targets[0].tokenizer: no such file")
                && e.getMessage().contains("models/none/tokenizer.json"), e.getMessage());
    }

    @Test
    void modelConfigFileWithoutNeededKeysIsRefused() throws IOException {
        write("models/a/config.json", "{\"num_attention_heads\": 8, \"hidden_size\": 512}");
        TareException layers = refused("""
                  - name: t
                    tokenizer: o200k_base
                    model: {config: models/a/config.json}
                """);
        assertTrue(layers.getMessage().contains("models/a/config.json: has no layer count; add num_hidden_layers"),
                layers.getMessage());
        write("models/b/config.json", "{\"num_hidden_layers\": 4, \"num_attention_heads\": 8, \"hidden_size\": 512}");
        TareException vocab = refused("""
                  - name: t
                    tokenizer: o200k_base
                    model: {config: models/b/config.json}
                """);
        assertTrue(vocab.getMessage().contains("models/b/config.json: has no vocabulary size")
                && vocab.getMessage().contains("vocab_size"), vocab.getMessage());
        write("models/c/config.json", "{\"num_hidden_layers\": \"four\"}");
        TareException type = refused("""
                  - name: t
                    tokenizer: o200k_base
                    model: {config: models/c/config.json}
                """);
        assertTrue(type.getMessage().contains("models/c/config.json, line 1: num_hidden_layers: must be a whole number"),
                type.getMessage());
        TareException missing = refused("""
                  - name: t
                    tokenizer: o200k_base
                    model: {config: models/none/config.json}
                """);
        assertTrue(missing.getMessage().contains("targets[0].model.config") && missing.getMessage().contains("no such file"),
                missing.getMessage());
    }

    @Test
    void otherModelAndDeviceMistakesNameTheKey() {
        assertTrue(refused("""
                  - name: t
                    tokenizer: o200k_base
                    model: no-such-model
                """).getMessage().contains("targets[0].model: unknown catalog model 'no-such-model'"));
        assertTrue(refused("""
                  - name: t
                    tokenizer: o200k_base
                    model: {params: 1e9, layer: 2, heads: 2, head_dim: 2}
                """).getMessage().contains("targets[0].model.layer: unknown key; did you mean 'layers'?"));
        assertTrue(refused("""
                  - name: t
                    tokenizer: o200k_base
                    model: {params: 1e9, heads: 2, head_dim: 2}
                """).getMessage().contains("targets[0].model: has no layers"));
        assertTrue(refused("""
                  - name: t
                    tokenizer: o200k_base
                    device: {catalog: laptop-16gb, usable_fraction: 1.5}
                """).getMessage().contains("targets[0].device.usable_fraction: must be a fraction above 0 and at most 1"));
        assertTrue(refused("""
                  - name: t
                    tokenizer: o200k_base
                    device: toaster
                """).getMessage().contains("targets[0].device: unknown catalog device 'toaster'"));
    }
    @Test
    void inlineShapesStateExpertsActiveParamsWindowsAndLatentWidth() throws IOException {
        Target t = only("""
                  - name: t
                    tokenizer: o200k_base
                    concurrency: 16
                    model: {params: 46.7e9, params_active: 12.9e9, experts: 8, experts_per_token: 2, layers: 32,
                            heads: 32, kv_heads: 8, head_dim: 128, window: 4096, windowed_layers: 16,
                            kv_latent_width: 576, context_limit: 32768}
                    device: {catalog: gpu-80gb, bandwidth_efficiency: 0.8}
                """);
        ModelShape m = t.model().orElseThrow();
        assertEquals(46.7e9, m.paramsTotal());
        assertEquals(12.9e9, m.paramsActive());
        // one expert over all layers: (46.7e9 − 12.9e9) / (8 − 2)
        assertEquals(33.8e9 / 6, m.experts().paramsPerExpert(), 1e3);
        assertEquals(16, m.kv().windowedLayers());
        assertEquals(4096, m.kv().window());
        assertEquals(576, m.kv().widthPerLayer());
        assertTrue(m.kv().latent());
        assertEquals(32768, m.contextLimit().getAsInt());
        assertEquals(16, t.batch());
        assertEquals(0.8, t.device().orElseThrow().bandwidthEfficiency().getAsDouble());
    }

    @Test
    void inlineShapeMistakesNameTheKey() {
        assertTrue(refused("""
                  - name: t
                    tokenizer: o200k_base
                    model: {params: 1e9, params_active: 2e9, layers: 2, heads: 2, head_dim: 2}
                """).getMessage().contains("targets[0].model.params_active: is more than params"));
        assertTrue(refused("""
                  - name: t
                    tokenizer: o200k_base
                    model: {params: 1e9, experts: 4, experts_per_token: 5, layers: 2, heads: 2, head_dim: 2}
                """).getMessage().contains("experts_per_token at most experts (got 5 of 4)"));
        assertTrue(refused("""
                  - name: t
                    tokenizer: o200k_base
                    model: {params: 1e9, window: 64, windowed_layers: 3, layers: 2, heads: 2, head_dim: 2}
                """).getMessage().contains("targets[0].model.windowed_layers: 3 windowed layers is more than the 2 layers"));
        assertTrue(refused("""
                  - name: t
                    tokenizer: o200k_base
                    concurrency: 0
                """).getMessage().contains("targets[0].concurrency: must be a whole number of at least 1"));
    }
}
