package dev.tare.tokenize;

import static dev.tare.tokenize.CharClass.LETTER;
import static dev.tare.tokenize.CharClass.NEWLINE;
import static dev.tare.tokenize.CharClass.NUMBER;
import static dev.tare.tokenize.CharClass.SPACE;
import static dev.tare.tokenize.Pretokenizer.Steps.classAt;
import static dev.tare.tokenize.Pretokenizer.Steps.contraction;
import static dev.tare.tokenize.Pretokenizer.Steps.next;
import static dev.tare.tokenize.Pretokenizer.Steps.run;
import static dev.tare.tokenize.Pretokenizer.Steps.runWithout;
import static dev.tare.tokenize.Pretokenizer.Steps.whitespace;

/** The splitting pattern of {@code cl100k_base}: contractions, words with one leading mark, digits in threes. */
final class Cl100kPieces implements Pretokenizer {
    static final String PATTERN = "(?i:'s|'t|'re|'ve|'m|'ll|'d)|[^\\r\\n\\p{L}\\p{N}]?\\p{L}+|\\p{N}{1,3}"
            + "| ?[^\\s\\p{L}\\p{N}]+[\\r\\n]*|\\s*[\\r\\n]+|\\s+(?!\\S)|\\s+";

    @Override
    public String pattern() {
        return PATTERN;
    }

    @Override
    public int pieceEnd(char[] text, int start, int length) {
        int end = contraction(text, start, length);
        if (end > start) {
            return end;
        }
        int bits = classAt(text, start, length);
        int after = next(text, start, length);
        if ((bits & (NEWLINE | LETTER | NUMBER)) == 0 && after < length && (classAt(text, after, length) & LETTER) != 0) {
            return run(text, after, length, LETTER);
        }
        if ((bits & LETTER) != 0) {
            return run(text, after, length, LETTER);
        }
        if ((bits & NUMBER) != 0) {
            int digits = after;
            for (int i = 1; i < 3 && digits < length && (classAt(text, digits, length) & NUMBER) != 0; i++) {
                digits = next(text, digits, length);
            }
            return digits;
        }
        int symbols = text[start] == ' ' && after < length ? after : start;
        if ((classAt(text, symbols, length) & (SPACE | LETTER | NUMBER)) == 0) {
            end = runWithout(text, symbols, length, SPACE | LETTER | NUMBER);
            while (end < length && (text[end] == '\r' || text[end] == '\n')) {
                end++;
            }
            return end;
        }
        return whitespace(text, start, length, true);
    }
}
