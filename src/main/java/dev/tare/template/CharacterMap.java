package dev.tare.template;

/**
 * Where each character of a text made from a file (a decoded string literal) is written in that
 * file. A character is one to one when the file holds exactly that character at that offset; one
 * that came from an escape, a variable or removed indentation is not, and maps to the start of what
 * it came from.
 */
public interface CharacterMap {
    /** The length of the text. */
    int length();

    /** The file offset where character {@code i} is written, or where what it came from starts. */
    int sourceOffset(int i);

    /** The file offset just past what character {@code i} came from. */
    int sourceEnd(int i);

    /** Whether character {@code i} is written in the file as itself. */
    boolean isOneToOne(int i);
}
