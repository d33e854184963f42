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
 * Trailing spaces and tabs. Expected texts follow design.md "Rewrites that are safe": the sequence of
 * non-whitespace characters and the line breaks are kept, code and laid-out text are untouched.
 */
class TrailingWhitespaceTest {
    private final TrailingWhitespace rule = new TrailingWhitespace();

    @Test
    void trailingSpacesAndTabsAreRemovedExactly() {
        String text = "One.  \nTwo.\t\nThree \t\nFour.\n";
        List<Finding> found = findings(rule, text);
        assertEquals(3, found.size());
        assertEquals(List.of(1, 2, 3), found.stream().map(Finding::line).toList());
        assertEquals(5, found.get(0).column());
        assertEquals("One.\nTwo.\nThree\nFour.\n", fixed(rule, text));
    }

    @Test
    void theFindingCoversTheRunAndSaysWhatItHolds() {
        List<Finding> found = findings(rule, "Be brief.  \nThen stop.\t\nWait \t\n");
        assertEquals(List.of(10, 11, 5), found.stream().map(Finding::column).toList());
        assertEquals(12, found.get(0).endColumn());
        assertEquals("2 trailing spaces at the end of the line; delete them", found.get(0).message());
        assertEquals("1 trailing tab at the end of the line; delete it", found.get(1).message());
        assertEquals("2 trailing whitespace characters at the end of the line; delete them", found.get(2).message());
    }

    @Test
    void itsRewritesAreSafe() {
        List<Finding> found = findings(rule, "Be brief.  \n");
        assertEquals(RewriteClass.SAFE, found.get(0).rewriteClass());
        assertTrue(found.get(0).rewrite().isPresent());
    }

    @Test
    void trailingWhitespaceKeepsCrlfAndALastLineWithoutBreak() {
        assertEquals("a\r\nb\r\nc", fixed(rule, "a \r\nb\t\r\nc  "));
    }

    @Test
    void trailingWhitespaceInsideFencedCodeIsLeftAlone() {
        String text = "Run this:\n```\nls -l   \n```\nDone.\n";
        assertTrue(findings(rule, text).isEmpty());
    }

    @Test
    void trailingWhitespaceInTablesAndExamplesIsLeftAlone() {
        assertTrue(findings(rule, "| plan | months |\n|---|---|\n| short | 6 |  \n").isEmpty(), "a table row");
        assertTrue(findings(rule, "Input: my bill doubled  \nOutput: billing\n").isEmpty(), "an example line");
    }

    @Test
    void cleanTextHasNoTrailingWhitespaceFinding() {
        assertTrue(findings(rule, "Clean line.\nAnother.\n").isEmpty());
    }
}
