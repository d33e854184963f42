package dev.tare.tokenize;

/**
 * Splits text into the pieces a byte-level BPE encodes one by one: the matches, one after another,
 * of the encoding's splitting pattern. An implementation walks the pattern's alternatives by hand,
 * in the pattern's order and with its backtracking, because that is several times faster than the
 * regular-expression engine and splitting is most of the cost of counting.
 * {@code PretokenizerTest} holds each one to its published pattern run by {@code java.util.regex}.
 *
 * <p>An abstract class rather than an interface: a scan counts with two encodings in one loop, and
 * there the first JIT tier calls a class's method through a table at a fixed place, where an
 * interface's takes a search through a stub on every piece.
 */
abstract class Pretokenizer {

    /** Where the piece of {@code text[0, length)} that starts at {@code start < length} ends. */
    abstract int pieceEnd(char[] text, int start, int length);

    /** The published pattern this splitter follows, for differential tests. */
    abstract String pattern();

    /**
     * Whether no piece runs into a line that starts with a visible ASCII char other than {@code /}
     * (a safe line start): true of the patterns that end a run of whitespace at its last line break
     * ({@code \s*[\r\n]+}) before they try runs that look ahead ({@code \s+(?!\S)}), and whose one
     * piece that takes in line breaks after other chars takes nothing after them but {@code /}. The
     * pieces before such a line start are then the same alone as within the text.
     */
    boolean keepsLinesApart() {
        return false;
    }

    /** Whether {@code at} is a safe line start of {@code text[0, length)}, in the sense of {@link #keepsLinesApart}. */
    static boolean isSafeLineStart(char[] text, int at, int length) {
        return at > 0 && at < length && text[at - 1] == '\n' && isSafeLineStart(text[at]);
    }

    /** Whether a line that starts with {@code c} after a line break starts at a safe line start. */
    static boolean isSafeLineStart(char c) {
        return c > ' ' && c < 0x7f && c != '/';
    }

    /** Shared steps of the patterns, on code points. */
    static final class Steps {
        private Steps() {
        }

        /** The class bits of the code point at {@code at}: small enough for the first JIT tier to inline. */
        static int classAt(char[] text, int at, int length) {
            char c = text[at];
            return c < 0x80 ? CharClass.LATIN_1[c] : classOfNonAscii(text, at, length);
        }

        private static int classOfNonAscii(char[] text, int at, int length) {
            char c = text[at];
            return Character.isHighSurrogate(c) ? CharClass.of(Character.codePointAt(text, at, length)) : CharClass.of(c);
        }

        /**
         * Where a word's letters start when it begins on ASCII: at {@code start} for a letter, one
         * further after one mark that is not a letter, number or line break ({@code [^\r\n\p{L}\p{N}]?}
         * of both patterns); -1 when the char at {@code start} is none of these or from 0x80 on. The
         * start of the splitters' fast path for words on ASCII.
         */
        static int asciiLetters(char[] text, int start, int length) {
            char c = text[start];
            if (c >= 'a' && c <= 'z' || c >= 'A' && c <= 'Z') {
                return start;
            }
            if (c >= 0x80 || c == '\r' || c == '\n' || c >= '0' && c <= '9' || start + 1 == length) {
                return -1;
            }
            return start + 1;
        }

        /**
         * The end of an ASCII word whose letters ran from {@code letters} to {@code at}, or -1 when
         * the fast path cannot settle it: no letters, or a char from 0x80 on where they stop, which may
         * be a letter or a mark that continues the word.
         */
        static int asciiWordEnd(char[] text, int letters, int at, int length) {
            return at == letters || at < length && text[at] >= 0x80 ? -1 : at;
        }

        static int next(char[] text, int at, int length) {
            return Character.isHighSurrogate(text[at]) && at + 1 < length && Character.isLowSurrogate(text[at + 1])
                    ? at + 2 : at + 1;
        }

        /**
         * The end of the run of code points having any of {@code bits}, from {@code at}: the runs of
         * letters, numbers and word parts that words are made of, the hottest loop of counting. ASCII
         * chars take a loop of their own, which tests one bit of a table entry and nothing else (Latin-1
         * as a whole in that loop measured slower).
         */
        static int run(char[] text, int at, int length, int bits) {
            byte[] latin1 = CharClass.LATIN_1;
            while (at < length) {
                char c = text[at];
                if (c >= 0x80) {
                    return runWhile(text, at, length, bits, bits);
                }
                if ((latin1[c] & bits) == 0) {
                    return at;
                }
                at++;
            }
            return at;
        }

        /** The end of the run of code points having none of {@code bits}, from {@code at}. */
        static int runWithout(char[] text, int at, int length, int bits) {
            return runWhile(text, at, length, bits, 0);
        }

        /**
         * The end of the run of code points whose class bits, masked by {@code mask}, are nonzero when
         * {@code wanted} is: one loop for both kinds of run, reading a char at a time and joining a
         * surrogate pair only where one stands.
         */
        private static int runWhile(char[] text, int at, int length, int mask, int wanted) {
            boolean want = wanted != 0;
            byte[] latin1 = CharClass.LATIN_1;
            while (at < length) {
                char c = text[at];
                if (c < 0x80) {
                    if (((latin1[c] & mask) != 0) != want) {
                        break;
                    }
                    at++;
                    continue;
                }
                int bits;
                int width = 1;
                if (Character.isHighSurrogate(c) && at + 1 < length && Character.isLowSurrogate(text[at + 1])) {
                    bits = CharClass.of(Character.toCodePoint(c, text[at + 1]));
                    width = 2;
                } else {
                    bits = CharClass.of(c);
                }
                if (((bits & mask) != 0) != want) {
                    break;
                }
                at += width;
            }
            return at;
        }

        /** {@code \p{N}{1,3}} after the number that ends at {@code after}: at most two more numbers. */
        static int threeDigits(char[] text, int after, int length) {
            int end = after;
            for (int i = 1; i < 3 && end < length && (classAt(text, end, length) & CharClass.NUMBER) != 0; i++) {
                end = next(text, end, length);
            }
            return end;
        }

        /**
         * {@code " ?[^\s\p{L}\p{N}]+"} at {@code start}, then any run of the characters in
         * {@code trailing}: its end, or -1 when no symbol follows the optional space.
         */
        static int symbols(char[] text, int start, int length, String trailing) {
            int first = text[start] == ' ' && start + 1 < length ? start + 1 : start;
            int others = CharClass.SPACE | CharClass.LETTER | CharClass.NUMBER;
            if ((classAt(text, first, length) & others) != 0) {
                return -1;
            }
            int end = runWithout(text, first, length, others);
            while (end < length && trailing.indexOf(text[end]) >= 0) {
                end++;
            }
            return end;
        }

        /**
         * {@code \s*[\r\n]+|\s+(?!\S)|\s+} at a whitespace character: through the last line break of
         * the whitespace run; else the run less its last character when something else follows and
         * the run is longer than one; else the run. {@code withLineBreaks} is false for patterns
         * without the first alternative.
         */
        static int whitespace(char[] text, int start, int length, boolean withLineBreaks) {
            int end = run(text, start, length, CharClass.SPACE);
            if (withLineBreaks) {
                for (int i = end - 1; i >= start; i--) {
                    char c = text[i];
                    if (c == '\r' || c == '\n') {
                        return i + 1;
                    }
                }
            }
            if (end == length || end - start == 1) {
                return end;
            }
            // Every whitespace character is in the Basic Multilingual Plane: one char back is one code point.
            return end - 1;
        }

        /**
         * {@code (?i:'s|'t|'re|'ve|'m|'ll|'d)} at {@code at}: its end, or {@code at} when it does not
         * match. Case is compared as Java's Unicode-aware case-insensitive matching does.
         */
        static int contraction(char[] text, int at, int length) {
            if (at + 1 >= length || text[at] != '\'') {
                return at;
            }
            char a = text[at + 1];
            if (is(a, 's') || is(a, 't')) {
                return at + 2;
            }
            if (at + 2 < length) {
                char b = text[at + 2];
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
