package dev.tare.lint;

/**
 * A stretch of a message's text that prose rules leave alone.
 *
 * @param start offset of its first character in the message content
 * @param end   offset just past its last character
 * @param kind  what it is
 */
public record Region(int start, int end, Kind kind) {
    /** The kinds of protected text. */
    public enum Kind {
        /** A variable, include or tag as written in the template. */
        PLACEHOLDER,
        /** A fenced code block, fences included. */
        FENCED_CODE,
        /** A backtick code span. */
        INLINE_CODE,
        /** A URL. */
        URL
    }

    /** Whether this region shares at least one character with {@code [from, to)}, or holds an insertion point inside it. */
    public boolean overlaps(int from, int to) {
        if (from == to) {
            return from > start && from < end;
        }
        return from < end && to > start;
    }
}
