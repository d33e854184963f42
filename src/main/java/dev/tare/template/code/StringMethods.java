package dev.tare.template.code;

import java.util.ArrayList;
import java.util.List;
import java.util.function.IntPredicate;

/**
 * What the usual calls that tidy a prompt do to its decoded text: stripping white space from its ends
 * (each language's own idea of white space), Python's {@code textwrap.dedent} and
 * {@code inspect.cleandoc}. A variable counts as text that is not white space. Where indentation is
 * removed, line breaks are no longer one to one, since joining lines would change what is removed.
 */
final class StringMethods {
    /** What counts as white space for each language's strip or trim. */
    enum Space {
        /** Python's {@code str.isspace}. */
        PYTHON(c -> Character.isWhitespace(c) || c == 0x85 || c == 0xa0 || c == 0x2007 || c == 0x202f),
        /** JavaScript's white space and line terminators. */
        SCRIPT(c -> c == '\t' || c == '\n' || c == 0x0b || c == '\f' || c == '\r' || c == 0xfeff || c == 0x2028
                || c == 0x2029 || Character.getType(c) == Character.SPACE_SEPARATOR),
        /** Java's {@code String.strip}: {@code Character.isWhitespace}. */
        JAVA(Character::isWhitespace),
        /** Java's {@code String.trim}: every character up to the space. */
        JAVA_TRIM(c -> c <= ' '),
        /** Go's {@code unicode.IsSpace}. */
        GO(c -> c == '\t' || c == '\n' || c == 0x0b || c == '\f' || c == '\r' || c == 0x85 || c == 0x2028
                || c == 0x2029 || Character.getType(c) == Character.SPACE_SEPARATOR);

        private final IntPredicate test;

        Space(IntPredicate test) {
            this.test = test;
        }

        boolean test(char c) {
            return test.test(c);
        }
    }

    private StringMethods() {
    }

    /** {@code text} with the white space at its start ({@code leading}) and/or end ({@code trailing}) removed. */
    static DecodedText strip(DecodedText text, Space space, boolean leading, boolean trailing) {
        int start = 0;
        int end = text.length();
        while (leading && start < end && text.variableAt(start) < 0 && space.test(text.charAt(start))) {
            start++;
        }
        while (trailing && end > start && text.variableAt(end - 1) < 0 && space.test(text.charAt(end - 1))) {
            end--;
        }
        DecodedText out = new DecodedText();
        for (int k = start; k < end; k++) {
            out.copy(text, k);
        }
        return out;
    }

    /**
     * Python's {@code textwrap.dedent}: lines of only spaces and tabs emptied, then the spaces and tabs
     * that lead every other line removed.
     */
    static DecodedText dedent(DecodedText text) {
        List<int[]> lines = lines(text);
        String margin = null;
        for (int[] line : lines) {
            int first = line[0];
            while (first < line[1] && isBlankChar(text, first)) {
                first++;
            }
            if (first == line[1]) {
                continue;
            }
            String indent = text.text(line[0], first);
            if (margin == null || margin.startsWith(indent)) {
                margin = indent;
            } else if (!indent.startsWith(margin)) {
                int common = 0;
                while (common < margin.length() && margin.charAt(common) == indent.charAt(common)) {
                    common++;
                }
                margin = margin.substring(0, common);
            }
        }
        int cut = margin == null ? 0 : margin.length();
        DecodedText out = new DecodedText();
        for (int i = 0; i < lines.size(); i++) {
            int[] line = lines.get(i);
            int first = line[0];
            while (first < line[1] && isBlankChar(text, first)) {
                first++;
            }
            if (first < line[1]) {
                for (int k = line[0] + cut; k < line[1]; k++) {
                    out.copy(text, k);
                }
            }
            lineBreak(text, line, out, cut > 0);
        }
        return out;
    }

    /**
     * Python's {@code inspect.cleandoc}: tabs expanded, the first line's leading white space removed,
     * the least indentation of the other non-blank lines removed from each of them, and blank lines at
     * the start and end dropped.
     */
    static DecodedText cleandoc(DecodedText original) {
        DecodedText text = expandTabs(original);
        List<int[]> lines = lines(text);
        int margin = Integer.MAX_VALUE;
        for (int i = 1; i < lines.size(); i++) {
            int[] line = lines.get(i);
            int first = line[0];
            while (first < line[1] && text.variableAt(first) < 0 && Space.PYTHON.test(text.charAt(first))) {
                first++;
            }
            if (first < line[1]) {
                margin = Math.min(margin, first - line[0]);
            }
        }
        List<int[]> kept = new ArrayList<>();
        for (int i = 0; i < lines.size(); i++) {
            int[] line = lines.get(i);
            int from = line[0];
            if (i == 0) {
                while (from < line[1] && text.variableAt(from) < 0 && Space.PYTHON.test(text.charAt(from))) {
                    from++;
                }
            } else if (margin < Integer.MAX_VALUE) {
                from = Math.min(line[1], line[0] + margin);
            }
            kept.add(new int[] {from, line[1], line[2]});
        }
        int first = 0;
        int last = kept.size() - 1;
        while (last >= 0 && kept.get(last)[0] == kept.get(last)[1]) {
            last--;
        }
        while (first <= last && kept.get(first)[0] == kept.get(first)[1]) {
            first++;
        }
        DecodedText out = new DecodedText();
        for (int i = first; i <= last; i++) {
            int[] line = kept.get(i);
            for (int k = line[0]; k < line[1]; k++) {
                out.copy(text, k);
            }
            if (i < last) {
                out.copyInexact(text, line[2]);
            }
        }
        return out;
    }

    /** Tabs as the spaces {@code str.expandtabs} makes of them (to the next multiple of 8), none one to one. */
    private static DecodedText expandTabs(DecodedText text) {
        DecodedText out = new DecodedText();
        int column = 0;
        for (int k = 0; k < text.length(); k++) {
            char c = text.charAt(k);
            if (c == '\t' && text.variableAt(k) < 0) {
                int spaces = 8 - column % 8;
                out.usePiece(text.pieceAt(k));
                out.decoded(" ".repeat(spaces), text.from(k), text.to(k));
                column += spaces;
                continue;
            }
            out.copy(text, k);
            column = c == '\n' || c == '\r' ? 0 : column + 1;
        }
        return out;
    }

    private static boolean isBlankChar(DecodedText text, int k) {
        return text.variableAt(k) < 0 && (text.charAt(k) == ' ' || text.charAt(k) == '\t');
    }

    private static void lineBreak(DecodedText text, int[] line, DecodedText out, boolean inexact) {
        if (line[2] >= 0) {
            if (inexact) {
                out.copyInexact(text, line[2]);
            } else {
                out.copy(text, line[2]);
            }
        }
    }

    /** Each line as {start, end, offset of its {@code \n} or -1}. */
    private static List<int[]> lines(DecodedText text) {
        List<int[]> lines = new ArrayList<>();
        int start = 0;
        int n = text.length();
        for (int k = 0; k <= n; k++) {
            if (k == n || text.charAt(k) == '\n' && text.variableAt(k) < 0) {
                lines.add(new int[] {start, k, k < n ? k : -1});
                start = k + 1;
            }
        }
        return lines;
    }
}
