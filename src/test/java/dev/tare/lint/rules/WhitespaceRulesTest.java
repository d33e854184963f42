package dev.tare.lint.rules;

import static dev.tare.lint.RuleHarness.findings;
import static dev.tare.lint.RuleHarness.fixed;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.lint.Finding;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * The whitespace rules. Expected texts follow design.md "Rewrites that are safe": the sequence of
 * non-whitespace characters and paragraph breaks are kept, code is untouched.
 */
class WhitespaceRulesTest {
    private final TrailingWhitespace trailing = new TrailingWhitespace();
    private final BlankLines blank = new BlankLines();
    private final SpaceRun spaces = new SpaceRun();
    private final ProseTab tabs = new ProseTab();

    @Test
    void trailingSpacesAndTabsAreRemovedExactly() {
        String text = "One.  \nTwo.\t\nThree \t\nFour.\n";
        List<Finding> found = findings(trailing, text);
        assertEquals(3, found.size());
        assertEquals(List.of(1, 2, 3), found.stream().map(Finding::line).toList());
        assertEquals(5, found.get(0).column());
        assertEquals("One.\nTwo.\nThree\nFour.\n", fixed(trailing, text));
    }

    @Test
    void trailingWhitespaceKeepsCrlfAndALastLineWithoutBreak() {
        assertEquals("a\r\nb\r\nc", fixed(trailing, "a \r\nb\t\r\nc  "));
    }

    @Test
    void trailingWhitespaceInsideFencedCodeIsLeftAlone() {
        String text = "Run this:\n```\nls -l   \n```\nDone.\n";
        assertTrue(findings(trailing, text).isEmpty());
    }

    @Test
    void cleanTextHasNoTrailingWhitespaceFinding() {
        assertTrue(findings(trailing, "Clean line.\nAnother.\n").isEmpty());
    }

    @Test
    void runsOfBlankLinesCollapseToOne() {
        String text = "A.\n\n\nB.\n\n\n\n\nC.\n\nD.\n";
        List<Finding> found = findings(blank, text);
        assertEquals(2, found.size());
        assertEquals(2, found.get(0).line());
        assertEquals(5, found.get(1).line());
        assertEquals("A.\n\nB.\n\nC.\n\nD.\n", fixed(blank, text));
    }

    @Test
    void blankLinesHoldingOnlySpacesCountAndTheFileEndKeepsOneBreak() {
        assertEquals("A.\n\nB.\n", fixed(blank, "A.\n  \n\t\n\nB.\n\n\n"));
    }

    @Test
    void blankLinesAtTheVeryStartAreRemoved() {
        assertEquals("A.\n", fixed(blank, "\n\n\nA.\n"));
        assertEquals("A.\n", fixed(blank, " \n\n\nA.\n"));
    }

    @Test
    void blankLinesKeepCrlfLineEndings() {
        assertEquals("A.\r\n\r\nB.\r\n", fixed(blank, "A.\r\n\r\n\r\n\r\nB.\r\n"));
    }

    @Test
    void oneBlankLineAndFencedBlankLinesAreFine() {
        assertTrue(findings(blank, "A.\n\nB.\n").isEmpty());
        assertTrue(findings(blank, "```\na\n\n\n\nb\n```\n").isEmpty());
    }

    @Test
    void spaceRunsBetweenWordsBecomeOneSpace() {
        String text = "End.  Next  word.\n    indented  line\n";
        List<Finding> found = findings(spaces, text);
        assertEquals(3, found.size());
        assertEquals(5, found.get(0).column());
        assertEquals("End. Next word.\n    indented line\n", fixed(spaces, text));
    }

    @Test
    void aLineLaidOutWithThreeOrMoreSpacesIsLeftAlone() {
        // A run of three spaces is layout (a scale, columns, a drawing), not a typing slip.
        assertTrue(findings(spaces, "Rate it:   1   2   3\n").isEmpty());
        assertTrue(findings(spaces, "Name  Role\nAnna  Lead\n").isEmpty(), "gaps ending in one column line up");
        assertEquals(1, findings(spaces, "Rate it:  then stop.\n").size());
    }

    @Test
    void spaceRunsInInlineCodeAndPlaceholdersAreLeftAlone() {
        assertTrue(findings(spaces, "Type `a  b` exactly.\n").isEmpty());
        assertTrue(findings(spaces, "Hello {{  name  }}.\n").isEmpty());
        assertTrue(findings(spaces, "Leading  \n").isEmpty());
    }

    @Test
    void tabsBetweenWordsBecomeOneSpaceButIndentationStays() {
        String text = "Check.\tThen call.\n\tIndented item\nA \t b\n";
        List<Finding> found = findings(tabs, text);
        assertEquals(2, found.size());
        assertEquals("Check. Then call.\n\tIndented item\nA b\n", fixed(tabs, text));
    }

    @Test
    void aTrailingTabIsNotAProseTab() {
        assertTrue(findings(tabs, "Line\t\n").isEmpty());
    }
}
