package dev.tare.tokenize;

import static dev.tare.tokenize.CharClass.LETTER;
import static dev.tare.tokenize.CharClass.NUMBER;
import static dev.tare.tokenize.CharClass.SPACE;
import static dev.tare.tokenize.Pretokenizer.Steps.classAt;
import static dev.tare.tokenize.Pretokenizer.Steps.next;
import static dev.tare.tokenize.Pretokenizer.Steps.run;
import static dev.tare.tokenize.Pretokenizer.Steps.runWithout;
import static dev.tare.tokenize.Pretokenizer.Steps.whitespace;

/** The splitting pattern of {@code r50k_base} and {@code p50k_base}: lower-case contractions, runs of one class. */
final class Gpt2Pieces extends Pretokenizer {
    static final String PATTERN = "'(?:[sdmt]|ll|ve|re)| ?\\p{L}+| ?\\p{N}+| ?[^\\s\\p{L}\\p{N}]+|\\s+(?!\\S)|\\s+";

    @Override
    String pattern() {
        return PATTERN;
    }

    @Override
    int pieceEnd(char[] text, int start, int length) {
        if (text[start] == '\'' && start + 1 < length) {
            char a = text[start + 1];
            if (a == 's' || a == 'd' || a == 'm' || a == 't') {
                return start + 2;
            }
            if (start + 2 < length) {
                char b = text[start + 2];
                if (a == 'l' && b == 'l' || a == 'v' && b == 'e' || a == 'r' && b == 'e') {
                    return start + 3;
                }
            }
        }
        int body = text[start] == ' ' && start + 1 < length ? start + 1 : start;
        int bits = classAt(text, body, length);
        if ((bits & LETTER) != 0) {
            return run(text, next(text, body, length), length, LETTER);
        }
        if ((bits & NUMBER) != 0) {
            return run(text, next(text, body, length), length, NUMBER);
        }
        if ((bits & SPACE) == 0) {
            return runWithout(text, body, length, SPACE | LETTER | NUMBER);
        }
        return whitespace(text, start, length, false);
    }
}
