package dev.tare.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import dev.tare.tokenize.TokenizerRegistry;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** {@code tare cost}: one footprint, a sweep, and every bad input a clear exit 2. */
class CostCommandTest {
    private static final ObjectMapper JSON = new ObjectMapper();

    @TempDir
    Path root;
    private String config;

    @BeforeEach
    void repository() throws IOException {
        // The device target is the one SweepTest works by hand: 1e9 params, 16 layers, 8 heads, 4 KV heads
        // of 64, on 4 GiB (half usable), 10 TFLOPS at 0.5, 4 GB/s.
        Path file = root.resolve("tare.yaml");
        Files.writeString(file, """
                targets:
                  - name: hosted
                    tokenizer: o200k_base
                    price: {input: 2.50, cached_input: 0.60, output: 10.00, currency: USD}
                    prefix_cache: {min_tokens: 1024, step_tokens: 128, ttl_seconds: 300}
                    calls_per_day: 20000
                    output_tokens: 300
                  - name: box
                    tokenizer: o200k_base
                    model: {params: 1e9, layers: 16, heads: 8, kv_heads: 4, head_dim: 64}
                    weight_bits: fp16
                    kv_bits: 16
                    device: {memory_gib: 4, usable_fraction: 0.5, peak_tflops: 10, bandwidth_gbps: 4, efficiency: 0.5}
                  - name: bare
                    tokenizer: o200k_base
                """, StandardCharsets.UTF_8);
        config = file.toString();
    }

    private JsonNode json(String... args) throws IOException {
        List<String> all = new ArrayList<>(List.of("cost", "--config", config, "--format", "json"));
        all.addAll(List.of(args));
        Cli.Run run = Cli.run(all.toArray(String[]::new));
        assertEquals(0, run.exitCode(), run.err());
        return JSON.readTree(run.out());
    }

    @Test
    void deviceFootprintAsJsonMatchesHandValues() throws IOException {
        JsonNode root = json("--target", "box", "--tokens", "1000", "--output-tokens", "24");
        assertEquals("tare", root.get("tool").asText());
        assertEquals("box", root.get("target").asText());
        assertEquals(1000, root.get("input_tokens").asInt());
        assertEquals(24, root.get("output_tokens").asInt());
        JsonNode f = root.get("footprint");
        // Worked in SweepTest: weights 2e9 bytes; 16,384 bytes per token; × 1,024 tokens = 16,777,216;
        // floor((2,147,483,648 − 2e9) / 16,777,216) = 8; prefill 500 ms (weight reads at 4 GB/s);
        // prefill FLOPs 2 × 1e9 × 1000 + 2 × 16 × 1000² × 512 = 2,016,384,000,000.
        assertEquals(2_000_000_000L, f.get("weight_bytes").asLong());
        assertEquals(16_384, f.get("kv_bytes_per_token").asLong());
        assertEquals(16_777_216, f.get("kv_cache_bytes").asLong());
        assertEquals(8, f.get("max_concurrent").asLong());
        assertEquals(500.0, f.get("prefill_ms").asDouble(), 1e-9);
        assertEquals(504.194304, f.get("decode_ms_per_token").asDouble(), 1e-9);
        assertEquals(2_016_384_000_000L, f.get("prefill_flops").asLong());
        assertFalse(f.has("cost_per_call"), "no price, no cost");
        assertTrue(root.get("estimate_note").asText().contains("planning estimates"));
    }

    @Test
    void hostedCostWithAndWithoutACachedPrefix() throws IOException {
        // (2000 × 2.50 + 300 × 10.00) / 1e6 = 0.008; a month 0.008 × 20,000 × 30 = 4,800.
        JsonNode plain = json("--target", "hosted", "--tokens", "2000").get("footprint");
        assertEquals(0.008, plain.get("cost_per_call").asDouble(), 1e-12);
        assertEquals(4800, plain.get("cost_per_month").asDouble(), 1e-6);
        assertEquals("USD", plain.get("currency").asText());
        // A 1,200-token static prefix: C = 1024 + floor(176 / 128) × 128 = 1,152; at 20,000 calls a day the
        // entry is always warm (λ × ttl = 69.4): (848 × 2.50 + 1152 × 0.60 + 3000) / 1e6 = 0.0058112.
        JsonNode cached = json("--target", "hosted", "--tokens", "2000", "--prefix-tokens", "1200").get("footprint");
        assertEquals(1200, cached.get("static_prefix_tokens").asInt());
        assertEquals(1152, cached.get("cacheable_prefix_tokens").asInt());
        assertEquals(1.0, cached.get("cache_hit_rate").asDouble(), 1e-12);
        assertEquals(1152, cached.get("cached_input_tokens").asDouble(), 1e-9);
        assertEquals(0.0058112, cached.get("cost_per_call").asDouble(), 1e-12);
        assertEquals(4800, cached.get("cost_per_month_uncached").asDouble(), 1e-6);
        // 144 calls a day: λ × ttl = 0.5, h = 1 − e^−0.5 = 0.3935 (four places in JSON), a month of 144 calls.
        JsonNode rare = json("--target", "hosted", "--tokens", "2000", "--prefix-tokens", "1200", "--calls-per-day", "144")
                .get("footprint");
        double h = 1 - Math.exp(-0.5);
        assertEquals(0.3935, rare.get("cache_hit_rate").asDouble(), 1e-12);
        double perCall = (848 * 2.50 + 1152 * (h * 0.60 + (1 - h) * 2.50) + 3000) / 1e6;
        assertEquals(perCall, rare.get("cost_per_call").asDouble(), 1e-12);
        assertEquals(perCall * 144 * 30, rare.get("cost_per_month").asDouble(), 1e-9);
    }

    @Test
    void sweepTableInTextAndJson() throws IOException {
        Cli.Run text = Cli.run("cost", "--config", config, "--target", "box", "--tokens", "1000", "--output-tokens", "24",
                "--sweep", "weight_bits=16,8,4", "--sweep", "kv_bits=16,8");
        assertEquals(0, text.exitCode(), text.err());
        assertTrue(text.out().contains("planning estimates"), text.out());
        List<String> lines = text.out().lines().toList();
        int header = lines.indexOf(lines.stream().filter(l -> l.startsWith("WEIGHT_BITS")).findFirst().orElseThrow());
        assertTrue(lines.get(header).contains("MAX CONCURRENT") && lines.get(header).contains("PREFILL MS"));
        // Max concurrent per row, worked by hand in SweepTest: 8, 17, 68, 136, 98, 196.
        List<String> concurrency = new ArrayList<>();
        int column = lines.get(header).indexOf("MAX CONCURRENT") + "MAX CONCURRENT".length();
        for (String row : lines.subList(header + 2, header + 8)) {
            concurrency.add(row.substring(0, column).strip().replaceAll(".*\\s", ""));
        }
        assertEquals(List.of("8", "17", "68", "136", "98", "196"), concurrency);

        JsonNode root = json("--target", "box", "--tokens", "1000", "--output-tokens", "24",
                "--sweep", "weight_bits=16,8,4", "--sweep", "kv_bits=16,8");
        JsonNode rows = root.get("sweep");
        assertEquals(6, rows.size());
        assertEquals(4, rows.get(5).get("settings").get("weight_bits").asDouble());
        assertEquals(8, rows.get(5).get("settings").get("kv_bits").asDouble());
        assertEquals(196, rows.get(5).get("footprint").get("max_concurrent").asLong());
    }

    /** The FILE form measures the template on the target's tokenizer (o200k_base, checked in TiktokenReferenceTest). */
    @Test
    void templateFileIsMeasuredOnTheTargetsTokenizer() throws IOException {
        String text = "Summarize the customer's bill in two sentences.\n";
        Path file = Files.writeString(root.resolve("bill.md"), text, StandardCharsets.UTF_8);
        JsonNode result = json("--target", "hosted", file.toString());
        int expected = new TokenizerRegistry().get("o200k_base", Path.of(".")).count(text);
        assertEquals(expected, result.get("input_tokens").asInt());
        assertEquals("bill.md", result.get("path").asText());
        assertEquals(300, result.get("output_tokens").asInt(), "the target's output_tokens");
    }

    @Test
    void targetWithoutInputsSaysWhichKeysAreMissing() {
        Cli.Run run = Cli.run("cost", "--config", config, "--target", "bare", "--tokens", "100");
        assertEquals(0, run.exitCode(), run.err());
        assertTrue(run.out().contains("bare: estimates tokens only; set price"), run.out());
        Cli.Run hosted = Cli.run("cost", "--config", config, "--target", "hosted", "--tokens", "100");
        assertFalse(hosted.out().contains("prefill_flops"), "a priced target is not told to add a device");
        assertTrue(hosted.out().contains("Footprint on target hosted: 100 input tokens, 300 output tokens"), hosted.out());
        Cli.Run box = Cli.run("cost", "--config", config, "--target", "box", "--tokens", "100");
        assertTrue(box.out().contains("box: no output_tokens set; calls are taken to produce no output tokens"), box.out());
        assertFalse(box.out().contains("cost_per_call"), "a device target is not told to add a price");
    }

    @Test
    void badInputsExitTwoWithOneClearLine() {
        assertUsage(Cli.run("cost", "--config", config, "--target", "nope", "--tokens", "5"),
                "unknown target 'nope'; configured targets: hosted, box, bare");
        assertUsage(Cli.run("cost", "--config", config, "--target", "box"), "give either --tokens N or a template FILE");
        assertUsage(Cli.run("cost", "--config", config, "--target", "box", "--tokens", "-3"), "--tokens must be 0 or more");
        assertUsage(Cli.run("cost", "--config", config, "--target", "box", "--tokens", "5", "--sweep", "bits=4"),
                "unknown key 'bits'");
        assertUsage(Cli.run("cost", "--config", config, "--target", "box", "--tokens", "5", "--sweep", "kv_bits=fp3"),
                "unknown precision 'fp3'");
        assertUsage(Cli.run("cost", "--config", config, "--target", "box", "--tokens", "5", "--prefix-tokens", "2"),
                "has no prefix cache");
        assertUsage(Cli.run("cost", "--config", config, "--target", "hosted", "--tokens", "5", "--prefix-tokens", "9"),
                "more than the 5 input tokens");
        assertUsage(Cli.run("cost", "--config", config, "--target", "hosted", "--tokens", "5", "--cached-tokens", "2"),
                "--cached-tokens is gone: give --prefix-tokens P");
        assertUsage(Cli.run("cost", "--config", config, "--target", "hosted", "--tokens", "5", "--calls-per-day", "-1"),
                "--calls-per-day must be 0 or more");
        assertUsage(Cli.run("cost", "--config", config, "--target", "hosted", root.resolve("none.md").toString()),
                "no such file");
    }

    @Test
    void badConfigurationExitsTwoNamingKeyAndLine() throws IOException {
        Path folder = root.resolve("bad");
        Files.createDirectories(folder.resolve("models"));
        Files.writeString(folder.resolve("models/config.json"), "{\"num_attention_heads\": 8}", StandardCharsets.UTF_8);
        String[][] cases = {
            {"model: {params: 0, layers: 2, heads: 2, head_dim: 8}",
                "line 4: targets[0].model.params: must be a number above 0 (got 0)"},
            {"model: {params: -1e9, layers: 2, heads: 2, head_dim: 8}",
                "line 4: targets[0].model.params: must be a number above 0"},
            {"model: {params: 1e9, layers: 2, heads: 6, kv_heads: 4, head_dim: 8}",
                "line 4: targets[0].model.kv_heads: kv_heads (4) must divide heads (6)"},
            {"weight_bits: int3", "line 4: targets[0].weight_bits: unknown precision 'int3'"},
            {"model: {config: models/config.json}", "models/config.json: has no layer count; add num_hidden_layers"},
        };
        for (String[] c : cases) {
            Path file = Files.writeString(folder.resolve("tare.yaml"), "targets:\n  - name: t\n    tokenizer: o200k_base\n    "
                    + c[0] + "\n", StandardCharsets.UTF_8);
            assertUsage(Cli.run("cost", "--config", file.toString(), "--target", "t", "--tokens", "5"), c[1]);
        }
        Path file = Files.writeString(folder.resolve("tare.yaml"),
                "targets:\n  - name: t\n    tokenizer: models/missing/tokenizer.json\n", StandardCharsets.UTF_8);
        assertUsage(Cli.run("scan", folder.toString()), "line 3: targets[0].tokenizer: no such file");
    }

    private static void assertUsage(Cli.Run run, String fragment) {
        assertEquals(2, run.exitCode(), run.out() + run.err());
        assertTrue(run.err().contains(fragment), run.err());
        assertFalse(run.err().contains("\tat "), "no stack trace: " + run.err());
    }
}
