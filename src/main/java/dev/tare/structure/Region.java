package dev.tare.structure;

import java.util.Optional;

/**
 * A span of one message's text with one structural role, its conditional branch and the XML-style
 * section it stands in. The regions of a message cover its text without gaps or overlaps.
 *
 * @param start   offset of its first character in the message's content
 * @param end     offset just past its last character
 * @param role    what the text is
 * @param message the index of its message in the template, from 0
 * @param branch  the conditional branch it renders in: 0 outside every block tag, else 1 + the
 *                offset of the tag that opened the branch ({@code {% if %}}, {@code {% else %}},
 *                {@code {% for %}}, <code>{{#each}}</code>, ...)
 * @param section the innermost XML-style section around it, such as {@code example}
 */
public record Region(int start, int end, Role role, int message, int branch, Optional<String> section) {
    public Region {
        if (start < 0 || end < start) {
            throw new IllegalArgumentException("bad region " + start + ".." + end);
        }
    }

    /** Whether this region shares a character with {@code [from, to)}, or holds the insertion point {@code from == to} strictly inside. */
    public boolean overlaps(int from, int to) {
        if (from == to) {
            return from > start && from < end;
        }
        return from < end && to > start;
    }
}
