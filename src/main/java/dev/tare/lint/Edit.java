package dev.tare.lint;

/**
 * One text edit: replace {@code [start, end)} of a text with {@code replacement}.
 *
 * @param start       offset of the first character replaced
 * @param end         offset just past the last character replaced ({@code start} for an insertion)
 * @param replacement the new text
 */
public record Edit(int start, int end, String replacement) implements Comparable<Edit> {
    public Edit {
        if (start < 0 || end < start) {
            throw new IllegalArgumentException("bad edit " + start + ".." + end);
        }
    }

    /** The edit moved by {@code delta} characters. */
    public Edit shift(int delta) {
        return new Edit(start + delta, end + delta, replacement);
    }

    @Override
    public int compareTo(Edit other) {
        int byStart = Integer.compare(start, other.start);
        return byStart != 0 ? byStart : Integer.compare(end, other.end);
    }
}
