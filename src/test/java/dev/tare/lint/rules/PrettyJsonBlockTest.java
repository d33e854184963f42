package dev.tare.lint.rules;

import static dev.tare.lint.RuleHarness.findings;
import static dev.tare.lint.RuleHarness.fixed;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.ObjectMapper;
import org.junit.jupiter.api.Test;

/**
 * Minifying fenced json blocks, a review rewrite; equality of the two sides is checked with Jackson
 * trees, independently of the rule.
 */
class PrettyJsonBlockTest {
    private final PrettyJsonBlock rule = new PrettyJsonBlock();

    @Test
    void aPrettyFencedJsonBlockIsMinifiedExactly() throws Exception {
        String text = "Example:\n```json\n{\n  \"a\": 1,\n  \"b\": [true, null, \"x y\"],\n  \"c\": {\"d\": 1.50}\n}\n```\nEnd.\n";
        String expected = "Example:\n```json\n{\"a\":1,\"b\":[true,null,\"x y\"],\"c\":{\"d\":1.50}}\n```\nEnd.\n";
        var found = findings(rule, text);
        assertEquals(1, found.size());
        assertEquals(3, found.get(0).line());
        assertTrue(found.get(0).message().startsWith("pretty-printed JSON over 5 lines;"), found.get(0).message());
        assertEquals(expected, fixed(rule, text));
        ObjectMapper mapper = new ObjectMapper();
        String before = text.substring(text.indexOf("{"), text.lastIndexOf("}") + 1);
        String after = expected.substring(expected.indexOf("{"), expected.lastIndexOf("}") + 1);
        assertEquals(mapper.readTree(before), mapper.readTree(after));
    }

    @Test
    void placeholdersInsideStringsSurvive() {
        String text = "```json\n{\n  \"name\": \"{{ customer_name }}\"\n}\n```\n";
        assertEquals("```json\n{\"name\":\"{{ customer_name }}\"}\n```\n", fixed(rule, text));
    }

    @Test
    void aMessageThatIsOnlyJsonIsNotThisRulesToMinify() {
        assertTrue(findings(rule, "{\n  \"ok\": true\n}").isEmpty());
    }

    @Test
    void itsRewritesAreReviewRewrites() {
        assertEquals(dev.tare.lint.RewriteClass.REVIEW, PrettyJsonBlock.DESCRIPTOR.rewriteClass());
    }

    @Test
    void minifiedInvalidDuplicateKeyAndOtherLanguagesAreLeftAlone() {
        assertTrue(findings(rule, "```json\n{\"a\":1}\n```\n").isEmpty());
        assertTrue(findings(rule, "```json\n{\n  \"a\": 1,\n}\n```\n").isEmpty());
        assertTrue(findings(rule, "```json\n{\n  \"a\": 1,\n  \"a\": 2\n}\n```\n").isEmpty());
        assertTrue(findings(rule, "```python\n{\n  \"a\": 1\n}\n```\n").isEmpty());
        assertTrue(findings(rule, "```json\n{\n  \"n\": {{ count }}\n}\n```\n").isEmpty());
    }
}
