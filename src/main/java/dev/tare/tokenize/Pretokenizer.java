package dev.tare.tokenize;

/**
 * Splits text into the pieces a byte-level BPE encodes one by one: the matches, one after another,
 * of the encoding's splitting pattern. An implementation walks the pattern's alternatives by hand,
 * in the pattern's order and with its backtracking, because that is several times faster than the
 * regular-expression engine and splitting is most of the cost of counting.
 * {@code PretokenizerTest} holds each one to its published pattern run by {@code java.util.regex}.
 */
interface Pretokenizer {

    /** Where the piece that starts at {@code start} ends; {@code start < text.length()}. */
    int pieceEnd(String text, int start);

    /** The published pattern this splitter follows, for differential tests. */
    String pattern();

    /** Shared steps of the patterns, on code points. */
    final class Steps {
        private Steps() {
        }

        static int classAt(String text, int at) {
            return CharClass.of(text.codePointAt(at));
        }

        static int next(String text, int at) {
            return at + Character.charCount(text.codePointAt(at));
        }

        /** The end of the run of code points having any of {@code bits}, from {@code at}. */
        static int run(String text, int at, int bits) {
            int n = text.length();
            while (at < n) {
                int cp = text.codePointAt(at);
                if ((CharClass.of(cp) & bits) == 0) {
                    break;
                }
                at += Character.charCount(cp);
            }
            return at;
        }

        /** The end of the run of code points having none of {@code bits}, from {@code at}. */
        static int runWithout(String text, int at, int bits) {
            int n = text.length();
            while (at < n) {
                int cp = text.codePointAt(at);
                if ((CharClass.of(cp) & bits) != 0) {
                    break;
                }
                at += Character.charCount(cp);
            }
            return at;
        }

        /**
         * {@code \s*[\r\n]+|\s+(?!\S)|\s+} at a whitespace character: through the last line break of
         * the whitespace run; else the run less its last character when something else follows and
         * the run is longer than one; else the run. {@code withLineBreaks} is false for patterns
         * without the first alternative.
         */
        static int whitespace(String text, int start, boolean withLineBreaks) {
            int end = run(text, start, CharClass.SPACE);
            if (withLineBreaks) {
                for (int i = end - 1; i >= start; i--) {
                    char c = text.charAt(i);
                    if (c == '\r' || c == '\n') {
                        return i + 1;
                    }
                }
            }
            if (end == text.length() || end - start == 1) {
                return end;
            }
            // Every whitespace character is in the Basic Multilingual Plane: one char back is one code point.
            return end - 1;
        }

        /**
         * {@code (?i:'s|'t|'re|'ve|'m|'ll|'d)} at {@code at}: its end, or {@code at} when it does not
         * match. Case is compared as Java's Unicode-aware case-insensitive matching does.
         */
        static int contraction(String text, int at) {
            int n = text.length();
            if (at + 1 >= n || text.charAt(at) != '\'') {
                return at;
            }
            char a = text.charAt(at + 1);
            if (is(a, 's') || is(a, 't')) {
                return at + 2;
            }
            if (at + 2 < n) {
                char b = text.charAt(at + 2);
                if ((is(a, 'r') || is(a, 'v')) && is(b, 'e') || is(a, 'l') && is(b, 'l')) {
                    return at + 3;
                }
            }
            if (is(a, 'm') || is(a, 'd')) {
                return at + 2;
            }
            return at;
        }

        private static boolean is(char c, char lower) {
            return c == lower || lower == Character.toLowerCase(Character.toUpperCase(c));
        }
    }
}
