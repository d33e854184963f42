package dev.tare.lint;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.lint.rules.BuiltInRules;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;

/**
 * Findings in chat files point at the file's own lines and columns, and rewrites are offered only
 * where the edit can be written into the JSON or YAML string exactly (RFC 8259 §7 for JSON string
 * escapes; YAML 1.2.2 §8.1.2 for literal block scalars).
 */
class ChatRewriteTest {
    private static Rule rule(String id) {
        return BuiltInRules.all().stream().filter(r -> r.descriptor().id().equals(id)).findFirst().orElseThrow();
    }

    @Test
    void jsonStringsAreFollowedThroughEscapes() {
        String json = "{\"messages\": [{\"role\": \"system\", \"content\": \"Line one.\\nSay \\\"hi\\\".  Then stop.\"}]}";
        List<Finding> found = RuleHarness.findings(rule("space-run"), "a.chat.json", json, Map.of());
        assertEquals(1, found.size());
        assertEquals(1, found.get(0).line());
        assertEquals(json.indexOf(".  Then") + 2, found.get(0).column());
        assertEquals(json.replace(".  Then", ". Then"), RuleHarness.fixed(rule("space-run"), "a.chat.json", json));
    }

    @Test
    void anEditAcrossAnEscapeIsNotOffered() {
        String json = "{\"messages\": [{\"role\": \"system\", \"content\": \"Check.\\tThen call.\"}]}";
        List<Finding> found = RuleHarness.findings(rule("prose-tab"), "a.chat.json", json, Map.of());
        assertEquals(1, found.size());
        assertTrue(found.get(0).rewrite().isEmpty());
    }

    @Test
    void literalBlocksAreRewrittenInPlace() {
        String yaml = "messages:\n  - role: system\n    content: |\n      First line.  \n      Second  line.\n\n\n\n      Third.\n";
        assertEquals("messages:\n  - role: system\n    content: |\n      First line.\n      Second  line.\n\n\n\n      Third.\n",
                RuleHarness.fixed(rule("trailing-whitespace"), "a.chat.yaml", yaml));
        assertEquals("messages:\n  - role: system\n    content: |\n      First line.  \n      Second line.\n\n\n\n      Third.\n",
                RuleHarness.fixed(rule("space-run"), "a.chat.yaml", yaml));
        assertEquals("messages:\n  - role: system\n    content: |\n      First line.  \n      Second  line.\n\n      Third.\n",
                RuleHarness.fixed(rule("blank-lines"), "a.chat.yaml", yaml));
        List<Finding> found = RuleHarness.findings(rule("space-run"), "a.chat.yaml", yaml, Map.of());
        assertEquals(5, found.get(0).line());
        assertEquals(13, found.get(0).column());
    }

    @Test
    void doubleQuotedYamlIsRewrittenAndPlainScalarsAreOnlyLocated() {
        String quoted = "messages:\n  - role: user\n    content: \"Hi  there {{ name }}\"\n";
        assertEquals("messages:\n  - role: user\n    content: \"Hi there {{ name }}\"\n",
                RuleHarness.fixed(rule("space-run"), "a.chat.yaml", quoted));
        String plain = "messages:\n  - role: user\n    content: Hi  there\n";
        List<Finding> found = RuleHarness.findings(rule("space-run"), "a.chat.yaml", plain, Map.of());
        assertEquals(1, found.size());
        assertEquals(3, found.get(0).line());
        assertEquals(16, found.get(0).column());
        assertTrue(found.get(0).rewrite().isEmpty());
    }

    @Test
    void aToolFileIsLocatedAtTheToolButNeverRewritten() {
        // A tool's text is its definition re-serialized, so an offset in it is not an offset in the file.
        String tools = "[\n  {\n    \"name\": \"lookup\",\n    \"description\": \"Look up  the account.\",\n"
                + "    \"parameters\": {\"type\": \"object\", \"properties\": {}}\n  }\n]\n";
        List<Finding> found = RuleHarness.findings(rule("space-run"), "tools/t.json", tools, Map.of());
        assertEquals(1, found.size());
        assertEquals(2, found.get(0).line(), "the line where the tool's definition starts");
        assertTrue(found.get(0).rewrite().isEmpty());
    }
}
