package dev.tare.lint.rules;

import java.util.ArrayList;
import java.util.List;

/**
 * One line of a message's content.
 *
 * @param start offset of its first character
 * @param end   offset of its line break (or the end of the content)
 * @param next  offset of the next line's start
 */
record ContentLine(int start, int end, int next) {
    /** The lines of {@code text}; a line ends at {@code \n}, {@code \r\n} or a lone {@code \r}. */
    static List<ContentLine> of(String text) {
        List<ContentLine> lines = new ArrayList<>();
        int at = 0;
        while (at < text.length()) {
            ContentLine line = at(text, at);
            lines.add(line);
            at = line.next();
        }
        return lines;
    }

    /** The line of {@code text} that starts at offset {@code start}. */
    static ContentLine at(String text, int start) {
        int end = start;
        while (end < text.length() && text.charAt(end) != '\n' && text.charAt(end) != '\r') {
            end++;
        }
        int next = end;
        if (next < text.length() && text.charAt(next) == '\r') {
            next++;
        }
        if (next < text.length() && text.charAt(next) == '\n' && (next == end || text.charAt(next - 1) == '\r')) {
            next++;
        }
        return new ContentLine(start, end, next);
    }

    /** The line's text without its break. */
    String text(String content) {
        return content.substring(start, end);
    }

    /** Whether the line holds nothing but spaces and tabs. */
    boolean isBlank(String content) {
        for (int i = start; i < end; i++) {
            if (content.charAt(i) != ' ' && content.charAt(i) != '\t') {
                return false;
            }
        }
        return true;
    }

    /**
     * The runs of spaces and tabs between words of the line, as {@code {start, end}} offsets:
     * neither the indentation before the first word nor the blanks after the last.
     */
    List<int[]> blanksBetweenWords(String content) {
        List<int[]> runs = new ArrayList<>();
        int i = start;
        while (i < end && isBlank(content.charAt(i))) {
            i++;
        }
        while (i < end) {
            if (!isBlank(content.charAt(i))) {
                i++;
                continue;
            }
            int run = i;
            while (run < end && isBlank(content.charAt(run))) {
                run++;
            }
            if (run < end) {
                runs.add(new int[] {i, run});
            }
            i = run;
        }
        return runs;
    }

    private static boolean isBlank(char c) {
        return c == ' ' || c == '\t';
    }

    /** The line break as written, empty for a last line without one. */
    String lineBreak(String content) {
        return content.substring(end, next);
    }
}
