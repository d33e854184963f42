package dev.tare.lint.rules;

import static dev.tare.lint.RuleHarness.findings;
import static dev.tare.lint.RuleHarness.fixed;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.lint.Finding;
import dev.tare.lint.RewriteClass;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;

/** A JSON tool file minified whole; the message says how the file is laid out, in words that fit it. */
class PrettyToolFileTest {
    private final PrettyToolFile rule = new PrettyToolFile();

    @Test
    void anIndentedFileIsCountedInLines() {
        List<Finding> found = findings(rule, "tools/lookup.json",
                "[\n  {\"name\": \"lookup\", \"description\": \"Finds an account.\"}\n]\n", Map.of());
        assertEquals(1, found.size());
        assertTrue(found.get(0).message().startsWith("tool file laid out over 3 lines; "), found.get(0).message());
    }

    @Test
    void theFileIsMinifiedWholeBySafeRewrite() {
        String text = "[\n  {\"name\": \"lookup\", \"description\": \"Finds an account.\"}\n]\n";
        List<Finding> found = findings(rule, "tools/lookup.json", text, Map.of());
        assertEquals(1, found.get(0).line());
        assertEquals(RewriteClass.SAFE, found.get(0).rewriteClass());
        assertEquals("[{\"name\":\"lookup\",\"description\":\"Finds an account.\"}]\n", fixed(rule, "tools/lookup.json", text));
    }

    @Test
    void aYamlToolFileIsNotThisRulesToMinify() {
        assertEquals(List.of(), findings(rule, "tools/lookup.yaml",
                "tools:\n  - name: lookup\n    description: Finds an account.\n", Map.of()));
    }

    @Test
    void aOneLineFileWithSpacesSaysSo() {
        List<Finding> found = findings(rule, "tools/lookup.json",
                "[{\"name\": \"lookup\", \"description\": \"Finds an account.\"}]\n", Map.of());
        assertEquals(1, found.size());
        assertTrue(found.get(0).message().startsWith("tool file written with spaces between its JSON tokens; "),
                found.get(0).message());
    }

    @Test
    void aMinifiedFileIsNotFlagged() {
        assertEquals(List.of(), findings(rule, "tools/lookup.json",
                "[{\"name\":\"lookup\",\"description\":\"Finds an account.\"}]\n", Map.of()));
    }
}
