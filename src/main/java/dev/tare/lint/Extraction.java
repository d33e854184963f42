package dev.tare.lint;

import java.util.List;
import java.util.Optional;

/**
 * A rewrite across files that a {@link CrossTemplateRule} offers: text that several templates hold
 * moved into one partial, each copy replaced with an include of it. Like any rewrite it is data: the
 * rewrite engine applies it, verifies that every changed template renders exactly as before, and
 * writes it, or refuses it with a reason.
 *
 * @param rule    the rule's id
 * @param partial the partial's path relative to the root, with {@code /}
 * @param created the text of the partial when it is a new file; empty when an existing partial
 *                already holds the text
 * @param copies  the copies to replace, sorted by path and position
 * @param refused the copies that are left as they are, each with the reason
 * @param tokens  the tokens of the moved text (a planning estimate), to order extractions by
 */
public record Extraction(String rule, String partial, Optional<String> created, List<Copy> copies,
                         List<Refusal> refused, int tokens) {
    public Extraction {
        copies = List.copyOf(copies);
        refused = List.copyOf(refused);
    }

    /**
     * One copy and the edit of its file that replaces it with the include.
     *
     * @param path the file's path relative to the root
     * @param line the 1-based line the copy starts on
     * @param edit the edit of the file's text (offsets in the file's text, without a byte-order mark)
     */
    public record Copy(String path, int line, Edit edit) {
    }

    /**
     * A copy left as it is.
     *
     * @param path   the file's path relative to the root
     * @param line   the 1-based line the copy starts on
     * @param reason why, in one sentence that says what to do
     */
    public record Refusal(String path, int line, String reason) {
    }

    /** The distinct files whose copies are replaced, in path order. */
    public List<String> paths() {
        return copies.stream().map(Copy::path).distinct().sorted().toList();
    }
}
