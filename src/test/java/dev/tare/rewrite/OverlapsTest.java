package dev.tare.rewrite;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.lint.Edit;
import dev.tare.lint.EditKind;
import dev.tare.lint.RewriteClass;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import org.junit.jupiter.api.Test;

/** Overlapping rewrites are resolved by the documented priority, whatever order the rules offered them in. */
class OverlapsTest {
    private static Candidate candidate(String rule, RewriteClass rewriteClass, Edit... edits) {
        return new Candidate(rule, rewriteClass, EditKind.TEXT, List.of(edits));
    }

    @Test
    void safeRewritesWinOverReviewOnesWhateverTheRuleId() {
        Candidate review = candidate("a-review-rule", RewriteClass.REVIEW, new Edit(0, 5, "x"));
        Candidate safe = candidate("z-safe-rule", RewriteClass.SAFE, new Edit(3, 8, "y"));
        assertEquals(List.of(safe), Overlaps.choose(List.of(review, safe)));
    }

    @Test
    void amongSafeRewritesTheRuleIdThenThePositionDecides() {
        Candidate later = candidate("blank-lines", RewriteClass.SAFE, new Edit(4, 9, ""));
        Candidate earlier = candidate("blank-lines", RewriteClass.SAFE, new Edit(2, 6, ""));
        Candidate other = candidate("space-run", RewriteClass.SAFE, new Edit(0, 3, " "));
        assertEquals(List.of(earlier), Overlaps.choose(List.of(later, other, earlier)));
    }

    @Test
    void theChoiceDoesNotDependOnTheOrderOffered() {
        List<Candidate> offered = new ArrayList<>(List.of(
                candidate("trailing-whitespace", RewriteClass.SAFE, new Edit(10, 12, "")),
                candidate("space-run", RewriteClass.SAFE, new Edit(11, 14, " ")),
                candidate("blank-lines", RewriteClass.SAFE, new Edit(12, 20, "\n")),
                candidate("costly-character", RewriteClass.REVIEW, new Edit(0, 1, "-")),
                candidate("prose-tab", RewriteClass.SAFE, new Edit(1, 2, " "), new Edit(30, 31, " "))));
        List<Candidate> expected = Overlaps.choose(offered);
        for (int i = 0; i < 20; i++) {
            Collections.shuffle(offered, new java.util.Random(i));
            assertEquals(expected, Overlaps.choose(offered));
        }
    }

    @Test
    void aRewriteIsTakenWholeOrNotAtAll() {
        Candidate twoEdits = candidate("b-rule", RewriteClass.SAFE, new Edit(0, 2, ""), new Edit(10, 12, ""));
        Candidate blocking = candidate("a-rule", RewriteClass.SAFE, new Edit(11, 13, ""));
        assertEquals(List.of(blocking), Overlaps.choose(List.of(twoEdits, blocking)));
    }

    @Test
    void adjacentEditsBothApplyButAnInsertionAtAnEditsEdgeClashes() {
        assertFalse(Overlaps.clash(new Edit(0, 3, ""), new Edit(3, 5, " ")), "adjacent replacements");
        assertTrue(Overlaps.clash(new Edit(0, 3, ""), new Edit(2, 5, " ")), "shared character");
        assertTrue(Overlaps.clash(new Edit(3, 3, "x"), new Edit(3, 5, " ")), "insertion at the start of an edit");
        assertTrue(Overlaps.clash(new Edit(5, 5, "x"), new Edit(3, 5, " ")), "insertion at the end of an edit");
        assertTrue(Overlaps.clash(new Edit(4, 4, "x"), new Edit(4, 4, "y")), "two insertions at one point");
        assertFalse(Overlaps.clash(new Edit(6, 6, "x"), new Edit(3, 5, " ")), "insertion elsewhere");
    }
}
