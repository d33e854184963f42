package dev.tare.tokenize;

import static dev.tare.tokenize.CharClass.LETTER;
import static dev.tare.tokenize.CharClass.LOWER_PART;
import static dev.tare.tokenize.CharClass.NEWLINE;
import static dev.tare.tokenize.CharClass.NUMBER;
import static dev.tare.tokenize.CharClass.UPPER_PART;
import static dev.tare.tokenize.Pretokenizer.Steps.asciiLetters;
import static dev.tare.tokenize.Pretokenizer.Steps.asciiWordEnd;
import static dev.tare.tokenize.Pretokenizer.Steps.classAt;
import static dev.tare.tokenize.Pretokenizer.Steps.contraction;
import static dev.tare.tokenize.Pretokenizer.Steps.next;
import static dev.tare.tokenize.Pretokenizer.Steps.run;
import static dev.tare.tokenize.Pretokenizer.Steps.symbols;
import static dev.tare.tokenize.Pretokenizer.Steps.threeDigits;
import static dev.tare.tokenize.Pretokenizer.Steps.whitespace;

/** The splitting pattern of {@code o200k_base}: words split at case changes, digits in threes. */
final class O200kPieces extends Pretokenizer {
    static final String PATTERN = String.join("|",
            "[^\\r\\n\\p{L}\\p{N}]?[\\p{Lu}\\p{Lt}\\p{Lm}\\p{Lo}\\p{M}]*[\\p{Ll}\\p{Lm}\\p{Lo}\\p{M}]+(?i:'s|'t|'re|'ve|'m|'ll|'d)?",
            "[^\\r\\n\\p{L}\\p{N}]?[\\p{Lu}\\p{Lt}\\p{Lm}\\p{Lo}\\p{M}]+[\\p{Ll}\\p{Lm}\\p{Lo}\\p{M}]*(?i:'s|'t|'re|'ve|'m|'ll|'d)?",
            "\\p{N}{1,3}",
            " ?[^\\s\\p{L}\\p{N}]+[\\r\\n/]*",
            "\\s*[\\r\\n]+",
            "\\s+(?!\\S)",
            "\\s+");

    @Override
    String pattern() {
        return PATTERN;
    }

    @Override
    boolean keepsLinesApart() {
        return true;
    }

    @Override
    int pieceEnd(char[] text, int start, int length) {
        int word = asciiWord(text, start, length);
        if (word >= 0) {
            return contraction(text, word, length);
        }
        int bits = classAt(text, start, length);
        int after = next(text, start, length);
        boolean prefix = (bits & (NEWLINE | LETTER | NUMBER)) == 0 && after < length;
        int end = prefix ? lowerEnding(text, after, length) : -1;
        if (end < 0) {
            end = lowerEnding(text, start, length);
        }
        if (end < 0 && prefix) {
            end = upperLed(text, after, length);
        }
        if (end < 0) {
            end = upperLed(text, start, length);
        }
        if (end >= 0) {
            return contraction(text, end, length);
        }
        if ((bits & NUMBER) != 0) {
            return threeDigits(text, after, length);
        }
        end = symbols(text, start, length, "\r\n/");
        return end >= 0 ? end : whitespace(text, start, length, true);
    }

    /**
     * The piece most of English text is made of, on ASCII alone: an optional mark, then capitals,
     * then small letters, ending before an ASCII char that is none of them (or at the end). Where
     * the first two alternatives would match, they match this: on ASCII the capitals are the upper
     * part and the small letters the lower part, and the backtracking of {@link #lowerEnding} finds
     * no capital that can stand as a small letter. Its end, before any contraction, or -1 (see
     * {@link Pretokenizer.Steps#asciiWordEnd}). A cold scan spent a sixth of its CPU in this splitter
     * before.
     */
    private static int asciiWord(char[] text, int start, int length) {
        int letters = asciiLetters(text, start, length);
        if (letters < 0) {
            return -1;
        }
        int at = letters;
        while (at < length && text[at] >= 'A' && text[at] <= 'Z') {
            at++;
        }
        while (at < length && text[at] >= 'a' && text[at] <= 'z') {
            at++;
        }
        return asciiWordEnd(text, letters, at, length);
    }

    /**
     * {@code [upper part]*[lower part]+} from {@code at}, with the backtracking it implies: its end,
     * or -1 when it does not match.
     */
    private static int lowerEnding(char[] text, int at, int length) {
        int upper = run(text, at, length, UPPER_PART);
        if (upper < length && (classAt(text, upper, length) & LOWER_PART) != 0) {
            return run(text, upper, length, LOWER_PART);
        }
        // Give capitals back one at a time until one of them can stand as the lower-case part.
        for (int i = upper; i > at; ) {
            i = Character.offsetByCodePoints(text, 0, length, i, -1);
            if ((classAt(text, i, length) & LOWER_PART) != 0) {
                return next(text, i, length);
            }
        }
        return -1;
    }

    /** {@code [upper part]+[lower part]*} from {@code at}: its end, or -1. */
    private static int upperLed(char[] text, int at, int length) {
        if ((classAt(text, at, length) & UPPER_PART) == 0) {
            return -1;
        }
        return run(text, run(text, at, length, UPPER_PART), length, LOWER_PART);
    }

}
