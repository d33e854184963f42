package dev.tare.template;

/**
 * Where a segment came from.
 *
 * @param start  offset of its first character in the text it was parsed from: the file's text for
 *               a text template, the message's content for a chat file
 * @param end    offset just past its last character, in the same text
 * @param line   1-based line of its start in the file
 * @param column 1-based column (UTF-16 code units) of its start in the file; for a chat message,
 *               as near as the YAML or JSON value allows
 */
public record Span(int start, int end, int line, int column) {
    public Span {
        if (start < 0 || end < start) {
            throw new IllegalArgumentException("bad span " + start + ".." + end);
        }
    }
}
