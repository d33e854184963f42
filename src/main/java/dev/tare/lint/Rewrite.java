package dev.tare.lint;

import java.util.ArrayList;
import java.util.List;

/**
 * A rule's proposed change: non-overlapping edits of the template file's text (offsets in
 * {@link dev.tare.template.Template#source()}) and the tokens it saves, measured with the template's
 * tokenizer. A rewrite is data; rules never write files.
 *
 * @param edits        the edits, sorted and non-overlapping
 * @param savingTokens tokens saved per call (a planning estimate; may be zero or negative)
 */
public record Rewrite(List<Edit> edits, int savingTokens) {
    public Rewrite {
        List<Edit> sorted = new ArrayList<>(edits);
        sorted.sort(null);
        for (int i = 1; i < sorted.size(); i++) {
            if (sorted.get(i).start() < sorted.get(i - 1).end()) {
                throw new IllegalArgumentException("overlapping edits " + sorted.get(i - 1) + " and " + sorted.get(i));
            }
        }
        edits = List.copyOf(sorted);
    }

    /** {@code text} with every edit applied. */
    public String applyTo(String text) {
        return apply(text, edits);
    }

    /** {@code text} with sorted, non-overlapping {@code edits} applied. */
    public static String apply(String text, List<Edit> edits) {
        StringBuilder out = new StringBuilder(text.length());
        int at = 0;
        for (Edit edit : edits) {
            out.append(text, at, edit.start()).append(edit.replacement());
            at = edit.end();
        }
        return out.append(text, at, text.length()).toString();
    }
}
