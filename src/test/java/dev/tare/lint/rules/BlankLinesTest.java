package dev.tare.lint.rules;

import static dev.tare.lint.RuleHarness.findings;
import static dev.tare.lint.RuleHarness.fixed;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.lint.Finding;
import dev.tare.lint.RewriteClass;
import java.util.List;
import org.junit.jupiter.api.Test;

/** Runs of blank lines: one blank line between paragraphs is kept, none at the start or end of the text. */
class BlankLinesTest {
    private final BlankLines rule = new BlankLines();

    @Test
    void runsOfBlankLinesCollapseToOne() {
        String text = "A.\n\n\nB.\n\n\n\n\nC.\n\nD.\n";
        List<Finding> found = findings(rule, text);
        assertEquals(2, found.size());
        assertEquals(2, found.get(0).line());
        assertEquals(5, found.get(1).line());
        assertEquals("A.\n\nB.\n\nC.\n\nD.\n", fixed(rule, text));
    }

    @Test
    void theMessageCountsTheLinesAndSaysWhereTheyAre() {
        List<Finding> found = findings(rule, "\n\nGreet the customer.\n\n\n\nAsk for the account number.\n\n\n");
        assertEquals(List.of(1, 4, 8), found.stream().map(Finding::line).toList());
        assertEquals("2 blank lines in a row at the start; remove them", found.get(0).message());
        assertEquals("3 blank lines in a row; keep one", found.get(1).message());
        assertEquals("2 blank lines in a row at the end; remove them", found.get(2).message());
    }

    @Test
    void itsRewritesAreSafe() {
        List<Finding> found = findings(rule, "Greet the customer.\n\n\n\nAsk for the account number.\n");
        assertEquals(RewriteClass.SAFE, found.get(0).rewriteClass());
        assertEquals("Greet the customer.\n\nAsk for the account number.\n",
                fixed(rule, "Greet the customer.\n\n\n\nAsk for the account number.\n"));
    }

    @Test
    void blankLinesHoldingOnlySpacesCountAndTheFileEndKeepsOneBreak() {
        assertEquals("A.\n\nB.\n", fixed(rule, "A.\n  \n\t\n\nB.\n\n\n"));
    }

    @Test
    void blankLinesAtTheVeryStartAreRemoved() {
        assertEquals("A.\n", fixed(rule, "\n\n\nA.\n"));
        assertEquals("A.\n", fixed(rule, " \n\n\nA.\n"));
    }

    @Test
    void blankLinesKeepCrlfLineEndings() {
        assertEquals("A.\r\n\r\nB.\r\n", fixed(rule, "A.\r\n\r\n\r\n\r\nB.\r\n"));
    }

    @Test
    void oneBlankLineAndFencedBlankLinesAreFine() {
        assertTrue(findings(rule, "A.\n\nB.\n").isEmpty());
        assertTrue(findings(rule, "```\na\n\n\n\nb\n```\n").isEmpty());
    }

    @Test
    void blankLinesInsideARawSectionAreSentAsWritten() {
        assertTrue(findings(rule, "{% raw %}\nA {{ literal }}\n\n\n\nB\n{% endraw %}\n").isEmpty());
    }
}
