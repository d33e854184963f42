package dev.tare.lint.rules;

import static dev.tare.lint.RuleHarness.findings;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.config.ConfigLoader;
import dev.tare.config.TareConfig;
import dev.tare.lint.Finding;
import dev.tare.lint.RewriteClass;
import dev.tare.tokenize.Tokenizer;
import dev.tare.tokenize.TokenizerRegistry;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** What each tool costs per call: its minified JSON counted by the tokenizer itself, plus a target's overhead. */
class ToolCostTest {
    private static final String LOOKUP = "{\"name\":\"lookup_account\",\"description\":\"Find an account.\"}";
    private static final String CLOSE = "{\"name\":\"close_account\",\"description\":\"Close an account for good.\"}";

    private final ToolCost rule = new ToolCost();
    private final Tokenizer o200k = new TokenizerRegistry().get("o200k_base", Path.of("."));

    @Test
    void eachToolIsReportedOnItsLineWithItsTokens() {
        String text = "[\n  " + LOOKUP + ",\n  " + CLOSE + "\n]\n";
        List<Finding> found = findings(rule, "tools/accounts.json", text, Map.of());
        assertEquals(List.of(2, 3), found.stream().map(Finding::line).toList());
        assertEquals("tool 'lookup_account' costs " + o200k.count(LOOKUP)
                + " tokens on o200k_base per call it is sent with (planning estimates)", found.get(0).message());
        assertEquals(RewriteClass.NONE, found.get(0).rewriteClass());
    }

    @Test
    void theToolIsCountedMinifiedHoweverItIsWritten() {
        String pretty = "[\n  {\n    \"name\": \"lookup_account\",\n    \"description\": \"Find an account.\"\n  }\n]\n";
        assertTrue(findings(rule, "tools/a.json", pretty, Map.of()).get(0).message()
                .contains("costs " + o200k.count(LOOKUP) + " tokens on o200k_base"));
    }

    @Test
    void aTargetAddsItsOverheadAndPricesTheTokens(@TempDir Path dir) throws IOException {
        Files.writeString(dir.resolve("tare.yaml"), "targets:\n  - name: hosted\n    tokenizer: o200k_base\n"
                + "    tool_overhead_tokens: 7\n    price: {input: 2.0, output: 8.0}\n    calls_per_day: 1000\n");
        TareConfig config = ConfigLoader.load(dir.resolve("tare.yaml"));
        List<Finding> found = findings(rule, "tools/a.json", "[" + LOOKUP + "]\n", config);
        int tokens = o200k.count(LOOKUP) + 7;
        String message = found.get(0).message();
        assertTrue(message.startsWith("tool 'lookup_account' costs " + tokens + " tokens on hosted (USD "
                + String.format(Locale.ROOT, "%.6f", tokens * 2.0 / 1_000_000) + " a call, USD "), message);
        assertTrue(message.contains(" a month)"), message);
    }

    @Test
    void aPromptHasNoToolsToCost() {
        assertTrue(findings(rule, "Find an account.\n").isEmpty());
    }
}
