package dev.tare.structure;

/**
 * A fenced code block of a message.
 *
 * @param start        offset of the opening fence line
 * @param end          offset just past the closing fence line (or the end of the content when unclosed)
 * @param bodyStart    offset of the first line inside the fences
 * @param bodyEnd      offset just past the last line inside the fences
 * @param info         the info string after the opening fence, such as {@code json}; empty when none
 * @param closed       whether a closing fence was found
 */
public record Fence(int start, int end, int bodyStart, int bodyEnd, String info, boolean closed) {
    /** The first word of the info string, lower-cased: the block's language. */
    public String language() {
        String first = info.strip().split("[\\s{]", 2)[0];
        return first.toLowerCase(java.util.Locale.ROOT);
    }
}
