package dev.tare.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import dev.tare.tokenize.Tokenizer;
import dev.tare.tokenize.TokenizerRegistry;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Tool files sent with templates, and a hand-set scale, flowing into every figure and marked as calibrated. */
class ToolsAndCalibrationTest {
    private static final String TOOL = "{\"name\":\"lookup_account\",\"description\":\"Find an account.\",\"parameters\":{\"type\":\"object\"}}";
    private static final String BODY = "Answer billing questions for the water utility.\n";

    @TempDir
    Path root;
    private final Tokenizer o200k = new TokenizerRegistry().get("o200k_base", Path.of("."));

    @BeforeEach
    void repository() throws Exception {
        Files.createDirectories(root.resolve("prompts"));
        Files.createDirectories(root.resolve("tools"));
        Files.writeString(root.resolve("tools/account.tools.json"), "[\n  " + TOOL + ",\n  " + TOOL.replace("lookup", "close") + "\n]\n");
        Files.writeString(root.resolve("prompts/a.md"), "---\ntools: [tools/account.tools.json]\nbudget: 5\n---\n" + BODY);
    }

    private JsonNode scan(String targets) throws Exception {
        Files.writeString(root.resolve("tare.yaml"), "templates: {include: [\"prompts/*.md\", \"tools/*.tools.json\"]}\n" + targets);
        Cli.Run run = Cli.run("scan", root.toString(), "--format", "json");
        assertEquals(0, run.exitCode(), run.err());
        return new ObjectMapper().readTree(run.out());
    }

    private static JsonNode template(JsonNode scan, String path) {
        for (JsonNode template : scan.get("templates")) {
            if (template.get("path").asText().equals(path)) {
                return template;
            }
        }
        throw new AssertionError(path + " not in " + scan);
    }

    @Test
    void toolFilesAreTheirOwnKindAndCountInTheTemplatesSentWithThem() throws Exception {
        JsonNode scan = scan("targets:\n  - {name: t, tokenizer: o200k_base, tool_overhead_tokens: 7}\n");
        int toolTokens = o200k.count(TOOL) + o200k.count(TOOL.replace("lookup", "close"));
        JsonNode tools = template(scan, "tools/account.tools.json");
        assertEquals("tools", tools.get("kind").asText());
        assertEquals(toolTokens, tools.get("static_tokens").asInt());
        assertEquals(toolTokens + 2 * 7, tools.get("targets").get("t").get("input_tokens").asInt());
        assertEquals(2 * 7, tools.get("targets").get("t").get("framing_tokens").asInt());
        JsonNode prompt = template(scan, "prompts/a.md");
        assertEquals(o200k.count(BODY) + toolTokens + 2 * 7, prompt.get("targets").get("t").get("input_tokens").asInt());
        assertEquals(1, scan.get("totals").get("templates").asInt(), "the tool file is not a call of its own");
        assertEquals(o200k.count(BODY), scan.get("totals").get("estimated_tokens").asInt());
    }

    @Test
    void aScaleFlowsIntoCostKvCacheAndBudgetAndIsMarked() throws Exception {
        String device = "    model: {params: 1.0e9, layers: 10, heads: 8, kv_heads: 8, head_dim: 64}\n    weight_bits: 16\n    kv_bits: 16\n"
                + "    device: {memory_gib: 8, usable_fraction: 0.5, peak_tflops: 10, bandwidth_gbps: 100, efficiency: 0.5}\n";
        JsonNode scan = scan("targets:\n  - name: t\n    tokenizer: o200k_base\n    scale: 1.5\n"
                + "    price: {input: 1.0, output: 2.0}\n    calls_per_day: 1000\n" + device);
        int counted = o200k.count(BODY) + o200k.count(TOOL) + o200k.count(TOOL.replace("lookup", "close"));
        JsonNode footprint = template(scan, "prompts/a.md").get("targets").get("t");
        int input = (int) Math.round(1.5 * o200k.count(BODY)) + (int) Math.round(1.5 * (counted - o200k.count(BODY)));
        assertEquals(input, footprint.get("input_tokens").asInt());
        assertTrue(footprint.get("calibrated").asBoolean());
        assertEquals(input * 1.0 / 1e6, footprint.get("cost_per_call").asDouble(), 1e-12, "cost = I × input price / 1e6");
        // kv_bytes_per_token = 2 × L × Hkv × D × bits / 8 = 2 × 10 × 8 × 64 × 2 = 20,480 bytes; O = 0.
        assertEquals(20_480L * input, footprint.get("kv_cache_bytes").asLong());

        Cli.Run text = Cli.run("scan", root.toString());
        assertTrue(text.out().contains("calibrated estimate: counts scaled by 1.5"), text.out());
        Cli.Run check = Cli.run("check", root.toString(), "--format", "sarif");
        assertEquals(1, check.exitCode());
        assertTrue(check.out().contains("scaled by 1.5 for t: a calibrated estimate"), "the budget finding in SARIF is marked");
    }

    @Test
    void aMissingToolFileSkipsTheTemplateWithItsReason() throws Exception {
        Files.writeString(root.resolve("prompts/a.md"), "---\ntools: [tools/none.tools.json]\n---\n" + BODY);
        JsonNode scan = scan("");
        assertFalse(scan.get("skipped").isEmpty());
        assertTrue(scan.get("skipped").get(0).get("reason").asText().contains("names tool file 'tools/none.tools.json', which does not exist"));
    }
}
