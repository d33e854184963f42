package dev.tare.rewrite;

import dev.tare.lint.Edit;
import dev.tare.lint.EditKind;
import dev.tare.lint.RewriteClass;
import java.util.Comparator;
import java.util.List;

/**
 * One rewrite a rule offered for a file in one round, with what the engine needs to order it
 * against the others and to verify its result.
 *
 * @param rule         the rule's id
 * @param rewriteClass safe or review
 * @param kind         what the rule's rewrites change
 * @param edits        the edits of the file's text, sorted and non-overlapping, applied together or not at all
 */
record Candidate(String rule, RewriteClass rewriteClass, EditKind kind, List<Edit> edits) {
    /**
     * The priority among overlapping rewrites: safe before review, then by rule id, then by position
     * in the file (first edit's start, then last edit's end), then by replacement text so that the
     * order is total.
     */
    static final Comparator<Candidate> PRIORITY = Comparator
            .comparingInt((Candidate c) -> c.rewriteClass() == RewriteClass.SAFE ? 0 : 1)
            .thenComparing(Candidate::rule)
            .thenComparingInt(Candidate::start)
            .thenComparingInt(Candidate::end)
            .thenComparing(Candidate::replacements);

    Candidate {
        edits = List.copyOf(edits);
        if (edits.isEmpty()) {
            throw new IllegalArgumentException("a rewrite without edits");
        }
    }

    int start() {
        return edits.get(0).start();
    }

    int end() {
        return edits.get(edits.size() - 1).end();
    }

    private String replacements() {
        StringBuilder out = new StringBuilder();
        for (Edit edit : edits) {
            out.append(edit.start()).append(':').append(edit.end()).append(':').append(edit.replacement()).append('\u0000');
        }
        return out.toString();
    }
}
