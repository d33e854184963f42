package dev.tare.lint.rules;

import static dev.tare.lint.RuleHarness.findings;
import static dev.tare.lint.RuleHarness.fixed;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/** JSON minification; equality of the two sides is checked with Jackson 2.21 trees, independently of the rule. */
class PrettyJsonTest {
    private final PrettyJson rule = new PrettyJson();

    @Test
    void aFencedBlockInsideProseIsNotThisRulesToMinify() {
        assertTrue(findings(rule, "Example:\n```json\n{\n  \"a\": 1\n}\n```\n").isEmpty());
    }

    @Test
    void placeholdersInsideStringsSurvive() {
        assertEquals("{\"name\":\"{{ customer_name }}\"}", fixed(rule, "{\n  \"name\": \"{{ customer_name }}\"\n}"));
    }

    @Test
    void itsRewritesAreSafeJsonLayout() {
        assertEquals(java.util.Optional.of(dev.tare.lint.EditKind.JSON_LAYOUT), PrettyJson.DESCRIPTOR.editKind());
    }

    @Test
    void theFindingCoversTheJsonAndOffersASafeRewrite() {
        java.util.List<dev.tare.lint.Finding> found = findings(rule, "\n{\n  \"intent\": \"billing\",\n  \"urgent\": false\n}\n");
        assertEquals(1, found.size());
        assertEquals(2, found.get(0).line());
        assertEquals(1, found.get(0).column());
        assertTrue(found.get(0).message().startsWith("pretty-printed JSON over 3 lines; the same JSON minified fits on one"
                + " and saves "), found.get(0).message());
        assertEquals(dev.tare.lint.RewriteClass.SAFE, found.get(0).rewriteClass());
        assertEquals("\n{\"intent\":\"billing\",\"urgent\":false}\n",
                fixed(rule, "\n{\n  \"intent\": \"billing\",\n  \"urgent\": false\n}\n"));
    }

    @Test
    void aMessageThatIsOnlyJsonIsMinifiedToo() {
        assertEquals("{\"ok\":true}", fixed(rule, "{\n  \"ok\": true\n}"));
    }

    @Test
    void minifiedInvalidAndDuplicateKeyMessagesAreLeftAlone() {
        assertTrue(findings(rule, "{\"a\":1}").isEmpty());
        assertTrue(findings(rule, "{\n  \"a\": 1,\n}").isEmpty());
        assertTrue(findings(rule, "{\n  \"a\": 1,\n  \"a\": 2\n}").isEmpty());
    }
}
