package dev.tare.tokenize;

import static dev.tare.tokenize.CharClass.LETTER;
import static dev.tare.tokenize.CharClass.LOWER_PART;
import static dev.tare.tokenize.CharClass.NEWLINE;
import static dev.tare.tokenize.CharClass.NUMBER;
import static dev.tare.tokenize.CharClass.SPACE;
import static dev.tare.tokenize.CharClass.UPPER_PART;
import static dev.tare.tokenize.Pretokenizer.Steps.classAt;
import static dev.tare.tokenize.Pretokenizer.Steps.contraction;
import static dev.tare.tokenize.Pretokenizer.Steps.next;
import static dev.tare.tokenize.Pretokenizer.Steps.run;
import static dev.tare.tokenize.Pretokenizer.Steps.runWithout;
import static dev.tare.tokenize.Pretokenizer.Steps.whitespace;

/** The splitting pattern of {@code o200k_base}: words split at case changes, digits in threes. */
final class O200kPieces implements Pretokenizer {
    static final String PATTERN = String.join("|",
            "[^\\r\\n\\p{L}\\p{N}]?[\\p{Lu}\\p{Lt}\\p{Lm}\\p{Lo}\\p{M}]*[\\p{Ll}\\p{Lm}\\p{Lo}\\p{M}]+(?i:'s|'t|'re|'ve|'m|'ll|'d)?",
            "[^\\r\\n\\p{L}\\p{N}]?[\\p{Lu}\\p{Lt}\\p{Lm}\\p{Lo}\\p{M}]+[\\p{Ll}\\p{Lm}\\p{Lo}\\p{M}]*(?i:'s|'t|'re|'ve|'m|'ll|'d)?",
            "\\p{N}{1,3}",
            " ?[^\\s\\p{L}\\p{N}]+[\\r\\n/]*",
            "\\s*[\\r\\n]+",
            "\\s+(?!\\S)",
            "\\s+");

    @Override
    public String pattern() {
        return PATTERN;
    }

    @Override
    public int pieceEnd(String text, int start) {
        int bits = classAt(text, start);
        int after = next(text, start);
        boolean prefix = (bits & (NEWLINE | LETTER | NUMBER)) == 0 && after < text.length();
        int end = prefix ? lowerEnding(text, after) : -1;
        if (end < 0) {
            end = lowerEnding(text, start);
        }
        if (end < 0 && prefix) {
            end = upperLed(text, after);
        }
        if (end < 0) {
            end = upperLed(text, start);
        }
        if (end >= 0) {
            return contraction(text, end);
        }
        if ((bits & NUMBER) != 0) {
            int digits = after;
            for (int i = 1; i < 3 && digits < text.length() && (classAt(text, digits) & NUMBER) != 0; i++) {
                digits = next(text, digits);
            }
            return digits;
        }
        int symbols = text.charAt(start) == ' ' && after < text.length() ? after : start;
        if ((classAt(text, symbols) & (SPACE | LETTER | NUMBER)) == 0) {
            end = runWithout(text, symbols, SPACE | LETTER | NUMBER);
            while (end < text.length() && isBreakOrSlash(text.charAt(end))) {
                end++;
            }
            return end;
        }
        return whitespace(text, start, true);
    }

    /**
     * {@code [upper part]*[lower part]+} from {@code at}, with the backtracking it implies: its end,
     * or -1 when it does not match.
     */
    private static int lowerEnding(String text, int at) {
        int upper = run(text, at, UPPER_PART);
        if (upper < text.length() && (classAt(text, upper) & LOWER_PART) != 0) {
            return run(text, upper, LOWER_PART);
        }
        // Give capitals back one at a time until one of them can stand as the lower-case part.
        for (int i = upper; i > at; ) {
            i = text.offsetByCodePoints(i, -1);
            if ((classAt(text, i) & LOWER_PART) != 0) {
                return next(text, i);
            }
        }
        return -1;
    }

    /** {@code [upper part]+[lower part]*} from {@code at}: its end, or -1. */
    private static int upperLed(String text, int at) {
        if ((classAt(text, at) & UPPER_PART) == 0) {
            return -1;
        }
        return run(text, run(text, at, UPPER_PART), LOWER_PART);
    }

    private static boolean isBreakOrSlash(char c) {
        return c == '\r' || c == '\n' || c == '/';
    }
}
