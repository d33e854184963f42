package dev.tare.lint;

import java.util.Arrays;

/**
 * Line starts of a file's text, for turning offsets into the 1-based lines and code-point columns
 * that findings report. A line ends at {@code \n}, at {@code \r\n}, or at a lone {@code \r}.
 */
final class SourceLines {
    /** Characters between code-point checkpoints; lines shorter than this are counted directly. */
    private static final int CHECKPOINT = 4096;

    private final String text;
    private final int[] starts;
    private int[] checkpoints;

    SourceLines(String text) {
        this.text = text;
        int[] found = new int[16];
        int count = 0;
        found[count++] = 0;
        for (int i = 0; i < text.length(); i++) {
            char c = text.charAt(i);
            if (c == '\n' || (c == '\r' && (i + 1 == text.length() || text.charAt(i + 1) != '\n'))) {
                if (count == found.length) {
                    found = Arrays.copyOf(found, count * 2);
                }
                found[count++] = i + 1;
            }
        }
        this.starts = Arrays.copyOf(found, count);
    }

    private int index(int offset) {
        int found = Arrays.binarySearch(starts, offset);
        return found >= 0 ? found : -found - 2;
    }

    int line(int offset) {
        return index(clamp(offset)) + 1;
    }

    int column(int offset) {
        int at = clamp(offset);
        int start = starts[index(at)];
        if (at - start <= CHECKPOINT) {
            return text.codePointCount(start, at) + 1;
        }
        return codePointsBefore(at) - codePointsBefore(start) + 1;
    }

    /**
     * The number of code points in {@code text[0, offset)}, from the nearest checkpoint below: a
     * finding far into a very long line then costs at most {@value #CHECKPOINT} characters of
     * counting, not the line so far, and many findings on one long line stay linear.
     */
    private int codePointsBefore(int offset) {
        int[] counts = checkpoints();
        int block = offset / CHECKPOINT;
        int from = block * CHECKPOINT;
        int count = counts[block] + text.codePointCount(from, offset);
        // A surrogate pair cut by the checkpoint was counted once on each side.
        if (from > 0 && from < offset && Character.isHighSurrogate(text.charAt(from - 1))
                && Character.isLowSurrogate(text.charAt(from))) {
            count--;
        }
        return count;
    }

    /** {@code counts[b]} is the number of code points in {@code text[0, b * CHECKPOINT)}; built on first use. */
    private synchronized int[] checkpoints() {
        if (checkpoints == null) {
            int[] counts = new int[text.length() / CHECKPOINT + 1];
            for (int b = 1; b < counts.length; b++) {
                counts[b] = counts[b - 1] + text.codePointCount((b - 1) * CHECKPOINT, b * CHECKPOINT);
                int cut = (b - 1) * CHECKPOINT;
                if (cut > 0 && Character.isHighSurrogate(text.charAt(cut - 1)) && Character.isLowSurrogate(text.charAt(cut))) {
                    counts[b]--;
                }
            }
            checkpoints = counts;
        }
        return checkpoints;
    }

    /** The offset where 1-based {@code line} starts, or the end of the text past the last line. */
    int lineStart(int line) {
        return line - 1 < starts.length ? starts[Math.max(0, line - 1)] : text.length();
    }

    /** The offset of a 1-based line and 1-based column counted in UTF-16 units, as parsers report them. */
    int offset(int line, int utf16Column) {
        int start = lineStart(line);
        return Math.min(text.length(), start + Math.max(0, utf16Column - 1));
    }

    private int clamp(int offset) {
        return Math.max(0, Math.min(offset, text.length()));
    }
}
