package dev.tare.rewrite;

import dev.tare.lint.Edit;
import dev.tare.lint.EditKind;
import java.util.ArrayList;
import java.util.List;

/**
 * Where every character of a file's rewritten text came from: copied from the original text (and
 * from which offset), or written by which rule's edit; and which rule removed each character of the
 * original that is gone. Kept across the rounds of a fix, so that the invariants can be checked
 * between the original and the final text while telling apart what each kind of rule was allowed to
 * change.
 */
final class Trace {
    /** The rule an applied edit came from, and what that rule's rewrites may change. */
    record Author(String rule, EditKind kind) {
    }

    /** One edit of a text with its author. */
    record AuthoredEdit(Edit edit, Author author) {
    }

    /**
     * A whitespace rule's edit that did not keep the non-whitespace characters it replaced.
     *
     * @param rule         the rule
     * @param character    the first character removed, or written in place of another
     * @param originalLine the 1-based line of the original text the edit stood on (or near)
     * @param removed      whether that character was removed (else written)
     */
    record Breach(String rule, char character, int originalLine, boolean removed) {
    }

    private final String original;
    private final List<Author> authors = new ArrayList<>();
    private final int[] removedBy;
    private final List<Breach> breaches = new ArrayList<>();
    private String current;
    /** Per character of the current text: its offset in the original (at least 0), or -1 - the index of its author. */
    private int[] origin;

    Trace(String original) {
        this.original = original;
        this.current = original;
        this.removedBy = new int[original.length()];
        java.util.Arrays.fill(removedBy, -1);
        this.origin = new int[original.length()];
        for (int i = 0; i < origin.length; i++) {
            origin[i] = i;
        }
    }

    /** Follows one round of edits of the current text (sorted, non-overlapping) and returns the new text. */
    String apply(List<AuthoredEdit> edits) {
        StringBuilder text = new StringBuilder(current.length());
        int[] next = new int[current.length() + edits.stream().mapToInt(e -> e.edit().replacement().length()).sum()];
        int length = 0;
        int at = 0;
        for (AuthoredEdit authored : edits) {
            Edit edit = authored.edit();
            for (int i = at; i < edit.start(); i++) {
                next[length++] = origin[i];
            }
            text.append(current, at, edit.start());
            int author = authorIndex(authored.author());
            for (int i = edit.start(); i < edit.end(); i++) {
                if (origin[i] >= 0) {
                    removedBy[origin[i]] = author;
                }
            }
            for (int i = 0; i < edit.replacement().length(); i++) {
                next[length++] = -1 - author;
            }
            if (authored.author().kind() == EditKind.WHITESPACE) {
                noteWhitespaceBreach(authored.author(), current.substring(edit.start(), edit.end()), edit);
            }
            text.append(edit.replacement());
            at = edit.end();
        }
        for (int i = at; i < current.length(); i++) {
            next[length++] = origin[i];
        }
        text.append(current, at, current.length());
        origin = java.util.Arrays.copyOf(next, length);
        current = text.toString();
        return current;
    }

    private int authorIndex(Author author) {
        int index = authors.indexOf(author);
        if (index < 0) {
            authors.add(author);
            index = authors.size() - 1;
        }
        return index;
    }

    /** Notes where a whitespace rule's edit does not keep the non-whitespace characters it replaces. */
    private void noteWhitespaceBreach(Author author, String removed, Edit edit) {
        String was = nonWhitespace(removed);
        String is = nonWhitespace(edit.replacement());
        if (was.equals(is)) {
            return;
        }
        int same = 0;
        while (same < was.length() && same < is.length() && was.charAt(same) == is.charAt(same)) {
            same++;
        }
        boolean removes = same < was.length();
        char c = removes ? was.charAt(same) : is.charAt(same);
        breaches.add(new Breach(author.rule(), c, lineOf(original, nearestOriginal(edit.start())), removes));
    }

    private static String nonWhitespace(String text) {
        StringBuilder out = new StringBuilder();
        for (int i = 0; i < text.length(); i++) {
            if (!Character.isWhitespace(text.charAt(i))) {
                out.append(text.charAt(i));
            }
        }
        return out.toString();
    }

    private int nearestOriginal(int currentOffset) {
        for (int i = Math.min(currentOffset, origin.length - 1); i >= 0; i--) {
            if (origin[i] >= 0) {
                return origin[i];
            }
        }
        return 0;
    }

    /** The original text. */
    String original() {
        return original;
    }

    /** The text after every round so far. */
    String current() {
        return current;
    }

    /** Whether the current text is exactly the original's copied characters and the edits' written ones, in order. */
    boolean consistent() {
        if (origin.length != current.length()) {
            return false;
        }
        int last = -1;
        for (int i = 0; i < origin.length; i++) {
            if (origin[i] >= 0) {
                if (origin[i] <= last || current.charAt(i) != original.charAt(origin[i])) {
                    return false;
                }
                last = origin[i];
            }
        }
        return true;
    }

    /** The offset in the original of the current text's character at {@code i}, or -1 when an edit wrote it. */
    int originOf(int i) {
        return origin[i] >= 0 ? origin[i] : -1;
    }

    /** Whether the original's character at {@code i} was removed by a rule whose rewrites may change more than whitespace. */
    boolean removedByTextRule(int i) {
        return removedBy[i] >= 0 && authors.get(removedBy[i]).kind() != EditKind.WHITESPACE;
    }

    /** Whether the current text's character at {@code i} was written by a rule whose rewrites may change more than whitespace. */
    boolean writtenByTextRule(int i) {
        return origin[i] < 0 && authors.get(-1 - origin[i]).kind() != EditKind.WHITESPACE;
    }

    /** Every edit of a whitespace rule that changed the non-whitespace characters, in the order they were applied. */
    List<Breach> breaches() {
        return List.copyOf(breaches);
    }

    /** The 1-based line of {@code offset} in {@code text}. */
    static int lineOf(String text, int offset) {
        int line = 1;
        int end = Math.min(offset, text.length());
        for (int i = 0; i < end; i++) {
            char c = text.charAt(i);
            if (c == '\n' || (c == '\r' && (i + 1 >= text.length() || text.charAt(i + 1) != '\n'))) {
                line++;
            }
        }
        return line;
    }
}
