package dev.tare.lint.rules;

import static dev.tare.lint.RuleHarness.findings;
import static dev.tare.lint.RuleHarness.fixed;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.lint.Finding;
import dev.tare.lint.RewriteClass;
import java.util.List;
import org.junit.jupiter.api.Test;

/** Two spaces between words become one; indentation, layout and code keep theirs. */
class SpaceRunTest {
    private final SpaceRun rule = new SpaceRun();

    @Test
    void spaceRunsBetweenWordsBecomeOneSpace() {
        String text = "End.  Next  word.\n    indented  line\n";
        List<Finding> found = findings(rule, text);
        assertEquals(3, found.size());
        assertEquals(5, found.get(0).column());
        assertEquals("End. Next word.\n    indented line\n", fixed(rule, text));
    }

    @Test
    void theFindingNamesTheRunAndItsRewriteIsSafe() {
        List<Finding> found = findings(rule, "Reply briefly.  Then ask one question.\n");
        assertEquals(1, found.size());
        assertEquals(15, found.get(0).column());
        assertEquals(17, found.get(0).endColumn());
        assertEquals("2 spaces in a row; one is enough", found.get(0).message());
        assertEquals(RewriteClass.SAFE, found.get(0).rewriteClass());
        assertEquals("Reply briefly. Then ask one question.\n", fixed(rule, "Reply briefly.  Then ask one question.\n"));
    }

    @Test
    void aLineLaidOutWithThreeOrMoreSpacesIsLeftAlone() {
        // A run of three spaces is layout (a scale, columns, a drawing), not a typing slip.
        assertTrue(findings(rule, "Rate it:   1   2   3\n").isEmpty());
        assertTrue(findings(rule, "Name  Role\nAnna  Lead\n").isEmpty(), "gaps ending in one column line up");
        assertEquals(1, findings(rule, "Rate it:  then stop.\n").size());
    }

    @Test
    void spaceRunsInInlineCodeAndPlaceholdersAreLeftAlone() {
        assertTrue(findings(rule, "Type `a  b` exactly.\n").isEmpty());
        assertTrue(findings(rule, "Hello {{  name  }}.\n").isEmpty());
        assertTrue(findings(rule, "Leading  \n").isEmpty());
    }

    @Test
    void spaceRunsInTablesAndFencedCodeAreLeftAlone() {
        assertTrue(findings(rule, "| plan  | months |\n|---|---|\n| short  | 6 |\n").isEmpty());
        assertTrue(findings(rule, "```\nls  -l\n```\n").isEmpty());
    }

    @Test
    void aRunWithATabInItIsProseTabsNotThisRules() {
        assertTrue(findings(rule, "Check. \t Then call.\n").isEmpty());
    }
}
