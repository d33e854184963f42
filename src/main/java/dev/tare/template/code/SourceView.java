package dev.tare.template.code;

/**
 * The text a lexer reads, and where each of its characters stands in the file. For most languages the
 * two are the same; Java turns its Unicode escapes (a backslash, one or more u's and four hex digits) into characters before anything
 * else (JLS §3.3), so its lexer reads the translated text and maps each character back to its escape.
 */
final class SourceView {
    private final String text;
    /** For each character of {@code text}, and one past the end, its offset in the file; null when the same. */
    private final int[] starts;
    /** For each character of {@code text}, whether the file holds that very character there. */
    private final boolean[] direct;

    private SourceView(String text, int[] starts, boolean[] direct) {
        this.text = text;
        this.starts = starts;
        this.direct = direct;
    }

    /** A view that is the file's text itself. */
    static SourceView of(String source) {
        return new SourceView(source, null, null);
    }

    /**
     * The file's text with Java's Unicode escapes translated. A backslash starts one only when an even
     * number of backslashes stands before it, and a character an escape produced starts no other
     * escape (JLS §3.3); several u's after the backslash still make one escape.
     */
    static SourceView javaUnicode(String source) {
        if (source.indexOf("\\u") < 0) {
            return of(source);
        }
        StringBuilder text = new StringBuilder(source.length());
        int[] starts = new int[source.length() + 1];
        boolean[] direct = new boolean[source.length()];
        int backslashes = 0;
        int i = 0;
        while (i < source.length()) {
            char c = source.charAt(i);
            if (c == '\\' && backslashes % 2 == 0 && i + 1 < source.length() && source.charAt(i + 1) == 'u') {
                int j = i + 1;
                while (j < source.length() && source.charAt(j) == 'u') {
                    j++;
                }
                int value = hex4(source, j);
                if (value >= 0) {
                    starts[text.length()] = i;
                    text.append((char) value);
                    i = j + 4;
                    backslashes = 0;
                    continue;
                }
            }
            backslashes = c == '\\' ? backslashes + 1 : 0;
            starts[text.length()] = i;
            direct[text.length()] = true;
            text.append(c);
            i++;
        }
        starts[text.length()] = source.length();
        return new SourceView(text.toString(), java.util.Arrays.copyOf(starts, text.length() + 1),
                java.util.Arrays.copyOf(direct, text.length()));
    }

    private static int hex4(String source, int at) {
        if (at + 4 > source.length()) {
            return -1;
        }
        int value = 0;
        for (int k = at; k < at + 4; k++) {
            int digit = source.charAt(k) > 'f' ? -1 : Character.digit(source.charAt(k), 16);
            if (digit < 0) {
                return -1;
            }
            value = value * 16 + digit;
        }
        return value;
    }

    String text() {
        return text;
    }

    int length() {
        return text.length();
    }

    char charAt(int i) {
        return text.charAt(i);
    }

    /** The file offset of character {@code i} (of the end, for {@code i == length()}). */
    int from(int i) {
        return starts == null ? i : starts[i];
    }

    /** The file offset just past character {@code i}. */
    int to(int i) {
        return starts == null ? i + 1 : starts[i + 1];
    }

    /** Whether character {@code i} is written in the file as itself, not as an escape. */
    boolean direct(int i) {
        return direct == null || direct[i];
    }
}
