package dev.tare.tokenize;

import static dev.tare.tokenize.CharClass.LETTER;
import static dev.tare.tokenize.CharClass.NEWLINE;
import static dev.tare.tokenize.CharClass.NUMBER;
import static dev.tare.tokenize.Pretokenizer.Steps.asciiLetters;
import static dev.tare.tokenize.Pretokenizer.Steps.asciiWordEnd;
import static dev.tare.tokenize.Pretokenizer.Steps.classAt;
import static dev.tare.tokenize.Pretokenizer.Steps.contraction;
import static dev.tare.tokenize.Pretokenizer.Steps.next;
import static dev.tare.tokenize.Pretokenizer.Steps.run;
import static dev.tare.tokenize.Pretokenizer.Steps.symbols;
import static dev.tare.tokenize.Pretokenizer.Steps.threeDigits;
import static dev.tare.tokenize.Pretokenizer.Steps.whitespace;

/** The splitting pattern of {@code cl100k_base}: contractions, words with one leading mark, digits in threes. */
final class Cl100kPieces extends Pretokenizer {
    static final String PATTERN = "(?i:'s|'t|'re|'ve|'m|'ll|'d)|[^\\r\\n\\p{L}\\p{N}]?\\p{L}+|\\p{N}{1,3}"
            + "| ?[^\\s\\p{L}\\p{N}]+[\\r\\n]*|\\s*[\\r\\n]+|\\s+(?!\\S)|\\s+";

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
        if (text[start] == '\'') {
            int end = contraction(text, start, length);
            if (end > start) {
                return end;
            }
        }
        int word = asciiWord(text, start, length);
        if (word >= 0) {
            return word;
        }
        int bits = classAt(text, start, length);
        int after = next(text, start, length);
        // A letter, or one mark that is not a letter, number or line break before a letter: a word.
        if ((bits & LETTER) != 0
                || (bits & (NEWLINE | NUMBER)) == 0 && after < length && (classAt(text, after, length) & LETTER) != 0) {
            return run(text, after, length, LETTER);
        }
        if ((bits & NUMBER) != 0) {
            return threeDigits(text, after, length);
        }
        int end = symbols(text, start, length, "\r\n");
        return end >= 0 ? end : whitespace(text, start, length, true);
    }

    /**
     * A word on ASCII alone: an optional mark, then letters, ending before an ASCII char that is
     * not a letter (or at the end). Its end, or -1 (see {@link Pretokenizer.Steps#asciiWordEnd}).
     */
    private static int asciiWord(char[] text, int start, int length) {
        int letters = asciiLetters(text, start, length);
        if (letters < 0) {
            return -1;
        }
        int at = letters;
        while (at < length && (text[at] | 0x20) >= 'a' && (text[at] | 0x20) <= 'z') {
            at++;
        }
        return asciiWordEnd(text, letters, at, length);
    }
}
