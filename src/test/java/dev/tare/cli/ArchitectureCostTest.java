package dev.tare.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * {@code tare cost} on hand-written config.json files of today's architectures (shapes from memory of
 * the published configs): the issue's figures within 1.5%, load, and the cautions.
 */
class ArchitectureCostTest {
    private static final ObjectMapper JSON = new ObjectMapper();
    private static final double WITHIN = 0.015;
    private static final List<String> SHAPES = List.of("moe-8x7b", "mla-61l", "mqa-48h", "sliding-7b", "alternating-9b",
            "dense-8b");

    @TempDir
    Path root;
    private String config;

    @BeforeEach
    void repository() throws IOException {
        StringBuilder yaml = new StringBuilder("templates: {include: [\"*.md\"]}\ntargets:\n");
        for (String shape : SHAPES) {
            try (InputStream in = getClass().getResourceAsStream("/dev/tare/config/shapes/" + shape + ".json")) {
                Files.write(root.resolve(shape + ".json"), in.readAllBytes());
            }
            // 80 GiB, 90% usable, 312 TFLOPS at 0.5, 2039 GB/s: the catalog's gpu-80gb class values
            yaml.append("  - name: ").append(shape).append("\n    tokenizer: o200k_base\n    model: {config: ")
                    .append(shape).append(".json}\n    weight_bits: 16\n    kv_bits: 16\n    device: gpu-80gb\n");
        }
        Path file = root.resolve("tare.yaml");
        Files.writeString(file, yaml.toString(), StandardCharsets.UTF_8);
        config = file.toString();
    }

    private Cli.Run run(String... args) {
        List<String> all = new ArrayList<>(List.of("cost", "--config", config));
        all.addAll(List.of(args));
        Cli.Run run = Cli.run(all.toArray(String[]::new));
        assertEquals(0, run.exitCode(), run.err());
        return run;
    }

    private JsonNode footprint(String... args) throws IOException {
        List<String> all = new ArrayList<>(List.of(args));
        all.addAll(List.of("--format", "json"));
        return JSON.readTree(run(all.toArray(String[]::new)).out()).get("footprint");
    }

    private static void near(double expected, double actual, String what) {
        assertTrue(Math.abs(actual - expected) <= WITHIN * expected, what + ": " + actual + " vs " + expected);
    }

    @Test
    void theIssuesFiguresAt8000TokensAnd16Bits() throws IOException {
        // Mixtral of Experts (Jiang et al. 2024): 46.7e9 params (93 GB at 2 B), 12.9e9 active
        JsonNode moe = footprint("--target", "moe-8x7b", "--tokens", "8000");
        near(46.7e9, moe.get("params_total").asDouble(), "params_total");
        near(12.9e9, moe.get("params_active").asDouble(), "params_active");
        near(93.4e9, moe.get("weight_bytes").asDouble(), "weight_bytes");
        assertEquals(0, moe.get("max_concurrent").asLong(), "93 GB of weights do not fit 80 GiB × 0.9");
        // DeepSeek-V2/V3 papers: (512 + 64) × 61 × 2 B = 70,272 B per token
        near(70_272, footprint("--target", "mla-61l", "--tokens", "8000").get("kv_bytes_per_token").asDouble(), "MLA");
        // Shazeer 2019: one KV head, 40 × 2 × 128 × 2 B = 20,480 B per token
        near(20_480, footprint("--target", "mqa-48h", "--tokens", "8000").get("kv_bytes_per_token").asDouble(), "MQA");
        // Mistral 7B paper: 32 × 4096 tokens × 4096 B = 536,870,912 B on 8,000 tokens
        near(536_870_912, footprint("--target", "sliding-7b", "--tokens", "8000").get("kv_cache_bytes").asDouble(),
                "sliding window");
        // alternating local (4,096) and global layers: (21 × 8000 + 21 × 4096) × 8192 B = 2.08e9
        near(2.08e9, footprint("--target", "alternating-9b", "--tokens", "8000").get("kv_cache_bytes").asDouble(),
                "alternating");
    }

    @Test
    void aDense8bModelAt203ConcurrentRequests() throws IOException {
        // 16.06 GB of weights + 203 × 2,300 tokens × 131,072 B = 77.3 GB per step; / 2039 GB/s = 37.9 ms
        JsonNode f = footprint("--target", "dense-8b", "--tokens", "2000", "--output-tokens", "300",
                "--concurrency", "203");
        assertEquals(203, f.get("max_concurrent").asLong());
        assertEquals(203, f.get("concurrency").asInt());
        near(77e9, f.get("decode_bytes_per_step").asDouble(), "step reads");
        near(38, f.get("decode_ms_per_token").asDouble(), "step time");
        near(203 * 1000 / 37.9, f.get("tokens_per_second_total").asDouble(), "tokens per second");
        assertTrue(f.has("time_to_first_token_ms") && f.has("end_to_end_ms"), f.toString());
        // batch 1: 16.06 GB + 0.30 GB read per token, 8.0 ms, labelled as batch 1 in text
        near(8.0, footprint("--target", "dense-8b", "--tokens", "2000", "--output-tokens", "300")
                .get("decode_ms_per_token").asDouble(), "batch-1 step");
        String text = run("--target", "dense-8b", "--tokens", "2000", "--output-tokens", "300").out();
        assertTrue(text.contains("per output token, batch 1"), text);
        assertTrue(text.contains("planning estimates"), text);
    }

    @Test
    void aSweepTo3BitWeightsCarriesTheQualityCaution() {
        String out = run("--target", "dense-8b", "--tokens", "2000", "--sweep", "weight_bits=16,8,3").out();
        assertTrue(out.contains("quality is not"), out);
        assertTrue(out.contains("Quality after quantizing must be measured on your own tasks"), out);
        String noLowBits = run("--target", "dense-8b", "--tokens", "2000", "--sweep", "weight_bits=16,8").out();
        assertTrue(noLowBits.contains("quality is not"), "every sweep says quality is not estimated");
        assertFalse(noLowBits.contains("Quality after quantizing"), noLowBits);
        // a sweep of load on a mixture of experts says how the experts read per step are estimated
        String load = run("--target", "moe-8x7b", "--tokens", "2000", "--sweep", "concurrency=1,16",
                "--sweep", "weight_bits=4.5").out();
        assertTrue(load.contains("uniform routing") && load.contains("from memory"), load);
        assertFalse(load.contains("do not fit in the device's usable memory"), "rows decide what fits: " + load);
    }

    @Test
    void twentyThousandTokensOnAn8192TokenModelWarn() throws IOException {
        String out = run("--target", "dense-8b", "--tokens", "20000").out();
        assertTrue(out.contains("20,000 input + 0 output = 20,000 tokens exceed the model's context of 8,192 tokens"),
                out);
        JsonNode f = footprint("--target", "dense-8b", "--tokens", "20000");
        assertEquals(8192, f.get("context_limit").asInt());
        assertTrue(f.get("exceeds_context").asBoolean());
        assertFalse(footprint("--target", "dense-8b", "--tokens", "8000").has("exceeds_context"));
    }

    @Test
    void scanWarnsOfACallOverTheContext() throws IOException {
        Files.writeString(root.resolve("long.md"), "Never promise a refund or a repair time. ".repeat(1000),
                StandardCharsets.UTF_8);
        Cli.Run scan = Cli.run("scan", root.toString(), "--config", config, "--target", "dense-8b");
        assertEquals(0, scan.exitCode(), scan.err());
        assertTrue(scan.out().contains("long.md on dense-8b: "), scan.out());
        assertTrue(scan.out().contains("exceed the model's context of 8,192 tokens"), scan.out());
    }

    @Test
    void badConcurrencyIsAUsageError() {
        Cli.Run run = Cli.run("cost", "--config", config, "--target", "dense-8b", "--tokens", "10", "--concurrency", "0");
        assertEquals(2, run.exitCode());
        assertTrue(run.err().contains("--concurrency must be 1 or more"), run.err());
    }
    @Test
    void scanAndTargetsCarryTheQuantizationCaution() throws IOException {
        Files.writeString(root.resolve("tare.yaml"), "templates: {include: [\"*.md\"]}\ntargets:\n  - name: low\n"
                + "    tokenizer: o200k_base\n    model: {config: dense-8b.json}\n    weight_bits: int3-g32\n"
                + "    kv_bits: 16\n    device: gpu-80gb\n", StandardCharsets.UTF_8);
        Files.writeString(root.resolve("short.md"), "Answer billing questions.\n", StandardCharsets.UTF_8);
        Cli.Run scan = Cli.run("scan", root.toString(), "--config", config);
        assertEquals(0, scan.exitCode(), scan.err());
        assertTrue(scan.out().contains("Quality after quantizing must be measured on your own tasks"), scan.out());
        Cli.Run json = Cli.run("scan", root.toString(), "--config", config, "--format", "json");
        assertTrue(JSON.readTree(json.out()).get("cautions").toString().contains("Quality after quantizing"), json.out());
        Cli.Run targets = Cli.run("targets", "--config", config);
        assertTrue(targets.out().contains("Quality after quantizing"), targets.out());
    }
}
