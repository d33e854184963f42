package dev.tare.rewrite;

import dev.tare.lint.Edit;
import java.util.ArrayList;
import java.util.List;

/**
 * Chooses, among the rewrites offered in one round, a set whose edits do not overlap: rewrites are
 * taken in {@link Candidate#PRIORITY} order and one is taken only when none of its edits overlaps an
 * edit already taken. What is left out is offered again by its rule in the next round, on the new text.
 */
final class Overlaps {
    private Overlaps() {
    }

    /** The rewrites to apply this round, in priority order. */
    static List<Candidate> choose(List<Candidate> offered) {
        List<Candidate> sorted = new ArrayList<>(offered);
        sorted.sort(Candidate.PRIORITY);
        List<Candidate> chosen = new ArrayList<>();
        List<Edit> taken = new ArrayList<>();
        for (Candidate candidate : sorted) {
            if (candidate.edits().stream().noneMatch(edit -> taken.stream().anyMatch(t -> clash(edit, t)))) {
                chosen.add(candidate);
                taken.addAll(candidate.edits());
            }
        }
        return chosen;
    }

    /**
     * Whether two edits cannot both be applied: they share a character, or one is an insertion at a
     * point the other touches (where the order of the two texts would be a guess).
     */
    static boolean clash(Edit a, Edit b) {
        if (a.start() < b.end() && b.start() < a.end()) {
            return true;
        }
        boolean insertion = a.start() == a.end() || b.start() == b.end();
        return insertion && a.start() <= b.end() && b.start() <= a.end();
    }
}
