package dev.tare.lint;

/**
 * Another place a finding refers to, such as the first copy of a repeated sentence.
 *
 * @param path    the path relative to the scanned root, with {@code /}
 * @param line    1-based line
 * @param column  1-based column, in Unicode code points
 * @param message what the place is
 */
public record Related(String path, int line, int column, String message) {
}
