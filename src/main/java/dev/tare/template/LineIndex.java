package dev.tare.template;

import java.util.Arrays;

/**
 * Line starts of a text, for turning offsets into 1-based lines and columns. A line ends at
 * {@code \n}; a {@code \r} before it belongs to the line, and a lone {@code \r} also ends one.
 */
public final class LineIndex implements Locator {
    private final int[] starts;
    private final int lineBase;
    private final int firstColumnBase;

    private LineIndex(int[] starts, int lineBase, int firstColumnBase) {
        this.starts = starts;
        this.lineBase = lineBase;
        this.firstColumnBase = firstColumnBase;
    }

    /** An index of {@code text} where offset 0 is line 1, column 1. */
    public static LineIndex of(String text) {
        return of(text, 1, 1);
    }

    /** An index of {@code text} whose first character stands at {@code line}, {@code column} of a file. */
    public static LineIndex of(String text, int line, int column) {
        return new LineIndex(text.indexOf('\r') < 0 ? newlineStarts(text) : anyBreakStarts(text), line, column);
    }

    /**
     * Line starts of a text without {@code \r}. {@code String.indexOf} runs over the string's own
     * bytes, which the first JIT tier (the launcher's for a scan) does several times faster than a
     * loop of {@code charAt}, each of which checks its index and, on a UTF-16 string, its coder.
     */
    private static int[] newlineStarts(String text) {
        int[] starts = new int[16];
        int count = 1;
        for (int at = text.indexOf('\n'); at >= 0; at = text.indexOf('\n', at + 1)) {
            if (count == starts.length) {
                starts = Arrays.copyOf(starts, count * 2);
            }
            starts[count++] = at + 1;
        }
        return Arrays.copyOf(starts, count);
    }

    /** Line starts of any text: {@code \r\n}, {@code \n} and a lone {@code \r} each end a line. */
    public static int[] anyBreakStarts(String text) {
        int[] starts = new int[16];
        int count = 1;
        for (int i = 0; i < text.length(); i++) {
            char c = text.charAt(i);
            boolean ends = c == '\n' || (c == '\r' && (i + 1 == text.length() || text.charAt(i + 1) != '\n'));
            if (ends) {
                if (count == starts.length) {
                    starts = Arrays.copyOf(starts, count * 2);
                }
                starts[count++] = i + 1;
            }
        }
        return Arrays.copyOf(starts, count);
    }

    /** The offsets where the indexed text's lines start, the first being 0. */
    int[] starts() {
        return starts.clone();
    }

    private int lineIndex(int offset) {
        int found = Arrays.binarySearch(starts, offset);
        return found >= 0 ? found : -found - 2;
    }

    @Override
    public int line(int offset) {
        return lineBase + lineIndex(offset);
    }

    @Override
    public int column(int offset) {
        int index = lineIndex(offset);
        int column = offset - starts[index] + 1;
        return index == 0 ? column + firstColumnBase - 1 : column;
    }
}
