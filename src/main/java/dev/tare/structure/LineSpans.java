package dev.tare.structure;

import java.util.Arrays;

/** The lines of a text as offsets; a line ends at {@code \n}, {@code \r\n} or a lone {@code \r}, as Markdown reads them. */
final class LineSpans {
    private final String text;
    private final int[] starts;
    private final int[] ends;
    private final int count;

    LineSpans(String text) {
        this.text = text;
        int[] s = new int[16];
        int[] e = new int[16];
        int n = 0;
        int at = 0;
        while (at < text.length()) {
            int end = at;
            while (end < text.length() && text.charAt(end) != '\n' && text.charAt(end) != '\r') {
                end++;
            }
            if (n == s.length) {
                s = Arrays.copyOf(s, n * 2);
                e = Arrays.copyOf(e, n * 2);
            }
            s[n] = at;
            e[n] = end;
            n++;
            at = end < text.length() && text.charAt(end) == '\r' && end + 1 < text.length() && text.charAt(end + 1) == '\n'
                    ? end + 2 : end + 1;
        }
        this.starts = s;
        this.ends = e;
        this.count = n;
    }

    int count() {
        return count;
    }

    /** Offset of the first character of line {@code i} (0-based). */
    int start(int i) {
        return starts[i];
    }

    /** Offset of line {@code i}'s line break, or the end of the text. */
    int end(int i) {
        return ends[i];
    }

    /** Offset of the line after line {@code i}, or the end of the text. */
    int next(int i) {
        return i + 1 < count ? starts[i + 1] : text.length();
    }

    String text(int i) {
        return text.substring(starts[i], ends[i]);
    }

    boolean isBlank(int i) {
        for (int k = starts[i]; k < ends[i]; k++) {
            char c = text.charAt(k);
            if (c != ' ' && c != '\t') {
                return false;
            }
        }
        return true;
    }

    /** The line holding offset {@code offset} (the last line for the end of the text). */
    int lineOf(int offset) {
        int found = Arrays.binarySearch(starts, 0, count, offset);
        return found >= 0 ? found : Math.max(0, -found - 2);
    }
}
