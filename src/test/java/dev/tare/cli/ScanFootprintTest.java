package dev.tare.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import dev.tare.footprint.Coverage;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** {@code tare scan} with priced and device targets: the FOOTPRINT keys in JSON, per-target sections in text. */
class ScanFootprintTest {
    @TempDir
    Path root;

    @BeforeEach
    void repository() throws IOException {
        write("tare.yaml", """
                templates: {include: ["prompts/**/*.md"]}
                targets:
                  - name: hosted
                    tokenizer: o200k_base
                    price: {input: 2.50, cached_input: 0.60, output: 10.00, currency: USD}
                    prefix_cache: {min_tokens: 1024, step_tokens: 128}
                    calls_per_day: 20000
                    output_tokens: 300
                  - name: box
                    tokenizer: r50k_base
                    model: opt-1.3b
                    weight_bits: int8
                    kv_bits: fp16
                    device: gpu-24gb
                    output_tokens: 100
                """);
        write("prompts/greet.md", "Greet the customer by name: {{name}}.\n");
        write("prompts/bill.md", "Explain the bill line by line, in plain words.\n");
    }

    @Test
    void jsonCarriesTheFootprintKeysEachTargetHasInputsFor() throws IOException {
        Cli.Run run = Cli.run("scan", root.toString(), "--format", "json");
        assertEquals(0, run.exitCode(), run.err());
        JsonNode doc = new ObjectMapper().readTree(run.out());
        assertTrue(doc.get("estimate_note").asText().contains("planning estimates"));
        for (JsonNode template : doc.get("templates")) {
            JsonNode hosted = template.get("targets").get("hosted");
            // The FOOTPRINT keys, then prefix sharing on this target with a prefix cache.
            assertEquals(List.of("input_tokens", "framing_tokens", "static_prefix_tokens", "cacheable_prefix_tokens",
                    "cache_hit_rate", "cached_input_tokens", "cost_per_call", "cost_per_month", "cost_per_month_uncached",
                    "currency", "cache_saving_per_month", "reordered_static_prefix_tokens",
                    "reordered_cache_saving_per_month"), keys(hosted));
            // The design's cost formula on the template's own counts (nothing cached below 1,024 tokens).
            assertEquals((hosted.get("input_tokens").asInt() * 2.50 + 300 * 10.00) / 1e6,
                    hosted.get("cost_per_call").asDouble(), 1e-12);
            JsonNode box = template.get("targets").get("box");
            List<String> expected = new ArrayList<>(Coverage.KEYS);
            // No price, and the catalog's opt-1.3b states no context limit.
            expected.removeAll(List.of("static_prefix_tokens", "cacheable_prefix_tokens", "cache_hit_rate",
                    "cached_input_tokens", "cost_per_call", "cost_per_month", "cost_per_month_uncached", "currency",
                    "context_limit"));
            assertEquals(expected, keys(box));
            // opt-1.3b at fp16 KV: 2 × 24 layers × 32 heads × 64 × 2 bytes = 196,608 bytes per token.
            assertEquals(196_608, box.get("kv_bytes_per_token").asLong());
            assertEquals(196_608L * (box.get("input_tokens").asInt() + 100), box.get("kv_cache_bytes").asLong());
            // 1.3e9 params at 8 bits = 1.3e9 bytes.
            assertEquals(1_300_000_000L, box.get("weight_bytes").asLong());
        }
    }

    @Test
    void textShowsOneSectionPerTargetAndSaysTheyAreEstimates() {
        Cli.Run run = Cli.run("scan", root.toString());
        assertEquals(0, run.exitCode(), run.err());
        assertTrue(run.out().contains("Cost on hosted ("), run.out());
        assertTrue(run.out().contains("COST/CALL") && run.out().contains("COST/MONTH"), run.out());
        assertTrue(run.out().contains("Device figures on box:"), run.out());
        assertTrue(run.out().contains("PREFILL MS") && run.out().contains("KV CACHE") && run.out().contains("MAX CONCURRENT"),
                run.out());
        assertTrue(run.out().contains("weights 8 bits = 1.21 GiB"), run.out());
        assertTrue(run.out().contains("planning estimates"), run.out());
        Cli.Run onlyHosted = Cli.run("scan", root.toString(), "--target", "hosted");
        assertFalse(onlyHosted.out().contains("Device figures"), onlyHosted.out());
    }

    @Test
    void unknownTargetExitsTwo() {
        Cli.Run run = Cli.run("scan", root.toString(), "--target", "laptop");
        assertEquals(2, run.exitCode());
        assertTrue(run.err().contains("unknown target 'laptop'; configured targets: hosted, box"), run.err());
    }

    private static List<String> keys(JsonNode node) {
        List<String> keys = new ArrayList<>();
        node.fieldNames().forEachRemaining(keys::add);
        return keys;
    }

    private void write(String relative, String text) throws IOException {
        Path file = root.resolve(relative);
        Files.createDirectories(file.getParent());
        Files.writeString(file, text, StandardCharsets.UTF_8);
    }
}
