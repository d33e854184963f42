package dev.tare.source;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import dev.tare.TareException;
import java.util.OptionalInt;
import org.junit.jupiter.api.Test;

/**
 * What Tare relies on when it reads YAML and JSON: the tree of a chat file or front matter, the line
 * and column of every value (validation messages name them), and refusals that name the line.
 */
class YamlDocumentTest {
    private static final String CHAT = "# A chat file.\n"
            + "variables:\n"
            + "  sailing.departs_at: {tokens: 459}\n"
            + "  tier: {sample: \"gold tier \u2728\", tokens: 3}\n"
            + "messages:\n"
            + "  - role: system\n"
            + "    content: |\n"
            + "      Hello {{ name }}: \u26f4\ufe0f\n"
            + "\n"
            + "      # not a comment\n"
            + "        indented more\n"
            + "  - role: user\n"
            + "    content: |-\n"
            + "      Hi\n"
            + "\n"
            + "tools: [a.md, \"b c\"]\n"
            + "budget: 500\n";

    @Test
    void readsAChatFileWithItsLiteralBlocksAsWritten() {
        JsonNode root = YamlDocument.parseYaml(CHAT).root();
        assertEquals(459, root.get("variables").get("sailing.departs_at").get("tokens").asInt());
        assertEquals("gold tier \u2728", root.get("variables").get("tier").get("sample").asText());
        JsonNode messages = root.get("messages");
        assertEquals("Hello {{ name }}: \u26f4\ufe0f\n\n# not a comment\n  indented more\n", messages.get(0).get("content").asText());
        assertEquals("Hi", messages.get(1).get("content").asText());
        assertEquals("b c", root.get("tools").get(1).asText());
        assertTrue(root.get("budget").isIntegralNumber());
    }

    @Test
    void remembersTheLineAndColumnOfEveryValue() {
        YamlDocument document = YamlDocument.parseYaml(CHAT);
        assertEquals(OptionalInt.of(3), document.line("variables.sailing.departs_at"));
        assertEquals(OptionalInt.of(3), document.line("variables.sailing.departs_at.tokens"));
        assertEquals(OptionalInt.of(6), document.line("messages[0].role"));
        assertEquals(OptionalInt.of(11), document.column("messages[0].role"));
        assertEquals(OptionalInt.of(7), document.line("messages[0].content"));
        assertEquals(OptionalInt.of(12), document.line("messages[1].role"));
        assertEquals(OptionalInt.of(16), document.line("tools[1]"));
        assertEquals(OptionalInt.of(15), document.column("tools[1]"));
        assertEquals(OptionalInt.empty(), document.line("messages[2]"));
    }

    @Test
    void remembersLocationsInJsonToo() {
        YamlDocument document = YamlDocument.parseJson("{\n  \"messages\": [\n    {\"role\": \"user\"}\n  ]\n}\n");
        assertEquals(OptionalInt.of(3), document.line("messages[0].role"));
        assertEquals(OptionalInt.of(14), document.column("messages[0].role"));
    }

    @Test
    void readsAnEmptyDocumentAsMissing() {
        assertTrue(YamlDocument.parseYaml("").root().isMissingNode());
        assertTrue(YamlDocument.parseYaml("# only a comment\n").root().isMissingNode());
    }

    @Test
    void keepsQuotedTimesAndWordsAsText() {
        JsonNode root = YamlDocument.parseYaml("departs: \"21:50\"\nname: 'it''s'\ncode: \"007\"\n").root();
        assertEquals("21:50", root.get("departs").asText());
        assertEquals("it's", root.get("name").asText());
        assertTrue(root.get("code").isTextual());
    }

    @Test
    void refusesADuplicateKeyNamingItsLine() {
        String message = refusal("a: 1\nb: 2\na: 3\n");
        assertTrue(message.startsWith("line 3, column "), message);
        assertTrue(message.contains("'a'"), message);
        assertTrue(refusal("{\"a\": 1,\n \"a\": 2}").startsWith("line 2, "), "JSON as well");
    }

    @Test
    void refusesAliasesRatherThanReadingTheAnchorsName() {
        String message = refusal("base: &b hello\ncopy: *b\n");
        assertEquals("line 2: YAML aliases (*b) are not supported; write the value out in full", message);
    }

    /** The root is level 0; a value may stand {@value YamlDocument#MAX_DEPTH} levels below it, no deeper. */
    @Test
    void refusesNestingDeeperThanTheLimit() {
        int levels = YamlDocument.MAX_DEPTH + 1;
        assertEquals(levels, depth(YamlDocument.parseYaml("[".repeat(levels) + "]".repeat(levels)).root()));
        String message = refusal("[".repeat(levels + 1) + "]".repeat(levels + 1));
        assertEquals("line 1: nested deeper than " + YamlDocument.MAX_DEPTH + " levels", message);
    }

    @Test
    void namesTheLineAndColumnOfASyntaxErrorOnOneLine() {
        String message = refusal("a: 1\nb: [x, y\nc: 2\n");
        assertTrue(message.matches("line \\d+, column \\d+: [^\\n]+"), message);
        String json = assertThrows(TareException.class, () -> YamlDocument.parseJson("{\"a\": 1,\n}")).getMessage();
        assertTrue(json.startsWith("line 2, column 1: "), json);
    }

    private static String refusal(String text) {
        return assertThrows(TareException.class, () -> YamlDocument.parseYaml(text)).getMessage();
    }

    private static int depth(JsonNode node) {
        int deepest = 0;
        for (JsonNode child : node) {
            deepest = Math.max(deepest, depth(child));
        }
        return node.isContainerNode() ? deepest + 1 : 0;
    }

    private static String problem(String yaml) {
        return assertThrows(TareException.class, () -> YamlDocument.parseYaml(yaml)).getMessage();
    }

    /** Syntax errors name the line and column where the problem is, in plain words, with what to do. */
    @Test
    void syntaxErrorsArePlainWordsAtTheRightPlace() {
        assertEquals("line 2, column 1: a tab character; YAML indents with spaces, so replace the tab with spaces",
                problem("templates:\n\tinclude: [a]\n"));
        assertEquals("line 3, column 1: a list in [ ] is not closed (opened on line 2), or an item in it needs"
                + " quotes; close it with ]", problem("templates:\n  include: [a, b\n"));
        assertEquals("line 2, column 1: a mapping in { } is not closed (opened on line 1), or a value in it needs"
                + " quotes; close it with }", problem("a: {b: 1\n"));
        assertEquals("line 3, column 1: a quoted text is never closed (opened on line 1); end it with the same quote",
                problem("a: \"x\nb: 2\n"));
        assertEquals("line 1, column 5: a ':' where no key can start; put text that holds ': ' in quotes",
                problem("a: b: c\n"));
        assertEquals("line 2, column 2: the key 'a' appears twice in one mapping; keep one", problem("a: 1\na: 2\n"));
        assertTrue(problem("a: @x\n").startsWith("line 1, column 4: the character '@' cannot start a value"),
                problem("a: @x\n"));
    }

    @Test
    void jsonErrorsNameWhereTheUnclosedListBegan() {
        String message = assertThrows(TareException.class, () -> YamlDocument.parseJson("{\"messages\": [}")).getMessage();
        assertEquals("line 1, column 15: Unexpected close marker '}': expected ']' (opened on line 1); fix the syntax there",
                message);
    }
}
