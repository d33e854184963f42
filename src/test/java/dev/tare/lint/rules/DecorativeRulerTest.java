package dev.tare.lint.rules;

import static dev.tare.lint.RuleHarness.findings;
import static dev.tare.lint.RuleHarness.fixed;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.lint.Finding;
import dev.tare.lint.RewriteClass;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * Rulers. Short forms keep the Markdown meaning: CommonMark 0.31.2 §4.1 (thematic breaks are three or
 * more of -, * or _) and §4.3 (a line of = under text is a setext heading underline).
 */
class DecorativeRulerTest {
    private final DecorativeRuler rule = new DecorativeRuler();

    @Test
    void longRulersAreShortenedForReview() {
        String text = "Title\n==========\n\n----------\n\n* * * * * *\n\n##########\n\n__________\n";
        List<Finding> found = findings(rule, text);
        assertEquals(5, found.size());
        assertTrue(found.stream().allMatch(f -> f.rewriteClass() == RewriteClass.REVIEW));
        assertEquals("Title\n===\n\n---\n\n***\n\n---\n\n___\n", fixed(rule, text));
    }

    @Test
    void theFindingStandsOnTheRulerAndNamesItsShortForm() {
        List<Finding> found = findings(rule, "Rules\n\n  **********\n\nBe brief.\n");
        assertEquals(1, found.size());
        assertEquals(3, found.get(0).line());
        assertEquals(3, found.get(0).column());
        assertEquals(13, found.get(0).endColumn());
        assertEquals("a 10-character '*' ruler; '***' separates just as well", found.get(0).message());
    }

    @Test
    void shortBreaksTextAndCodeAreNotRulers() {
        assertTrue(findings(rule, "Text\n\n---\n***\n=== a ===\nA ==== B\n```\n==========\n```\n").isEmpty());
    }
}
