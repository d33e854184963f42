package dev.tare.lint.rules;

import static dev.tare.lint.RuleHarness.findings;
import static dev.tare.lint.RuleHarness.fixed;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.lint.Finding;
import dev.tare.lint.RewriteClass;
import java.util.List;
import org.junit.jupiter.api.Test;

/** A tab between words becomes a space; indentation and tab-separated columns keep their tabs. */
class ProseTabTest {
    private final ProseTab rule = new ProseTab();

    @Test
    void tabsBetweenWordsBecomeOneSpaceButIndentationStays() {
        String text = "Check.\tThen call.\n\tIndented item\nA \t b\n";
        List<Finding> found = findings(rule, text);
        assertEquals(2, found.size());
        assertEquals("Check. Then call.\n\tIndented item\nA b\n", fixed(rule, text));
    }

    @Test
    void theFindingStandsOnTheTabAndItsRewriteIsSafe() {
        List<Finding> found = findings(rule, "Check the meter.\tThen call back.\n");
        assertEquals(1, found.size());
        assertEquals(1, found.get(0).line());
        assertEquals(17, found.get(0).column());
        assertEquals("a tab between words; use one space", found.get(0).message());
        assertEquals(RewriteClass.SAFE, found.get(0).rewriteClass());
    }

    @Test
    void aTrailingTabIsNotAProseTab() {
        assertTrue(findings(rule, "Line\t\n").isEmpty());
    }

    @Test
    void tabSeparatedColumnsAndCodeKeepTheirTabs() {
        assertTrue(findings(rule, "name\trole\nAnna\tlead\nBen\tsupport\n").isEmpty(), "tab-separated lines");
        assertTrue(findings(rule, "```\nmake\tall\n```\n").isEmpty());
    }
}
