package dev.tare.tokenize;

import java.util.SplittableRandom;

/**
 * Test helper: random strings drawn from the characters that decide where the encodings split:
 * every letter category (including letters outside the Basic Multilingual Plane), marks, the three
 * kinds of numbers, each kind of whitespace, line breaks, apostrophes before contraction letters in
 * both cases (and the letters that fold to them), symbols, emoji, a format character and a lone
 * surrogate. Seeded, so a failure names a string that can be reproduced.
 */
final class TrickyText {
    private static final String[] ALPHABET = {
        "a", "b", "e", "z", "A", "Q", "s", "t", "r", "v", "l", "m", "d", "S", "T", "R", "V", "L", "M", "D", "E",
        "\u017F", "\u212A", "\u0130", "\u0131", "é", "É", "ß", "\u01C5", "\u02B0", "\u3005", "中", "あ", "ا",
        "\u0301", "\u0300", "\u0903", "\u20DD",
        "0", "7", "9", "\u0663", "\u216B", "\u00BD", "\u00B2",
        " ", " ", " ", "\t", "\n", "\r", "\r\n", "\u000B", "\u000C", "\u001C", "\u0085", "\u00A0", "\u2028",
        "\u2029", "\u3000", "\u2003",
        "'", "'", "\u2019", "!", "?", ".", ",", ":", "/", "(", ")", "{", "}", "<", ">", "\"", "#", "-", "_",
        "=", "*", "$", "@", "`", "|", "\\",
        "\uD83D\uDE00", "\uD835\uDC00", "\uD835\uDC4E", "\uD83D\uDC69\u200D\uD83D\uDCBB", "\u200D", "\uFEFF", "\uD800",
    };
    private static final String[] WORDS = {
        "the", "The", "HELLO", "don't", "DON'T", "we're", "they'VE", "I'll", "'s", "ſ", "x'd", "JSONSchema",
        "camelCase", "snake_case", "naïve", "ÉCOLE", "2026", "12345678", "3.14", "  ", "\n\n", " \n ", "/path/to",
        "<|endoftext|>", "```json", "{{ name }}", "    indented", "...", "—", "Straße",
    };

    private TrickyText() {
    }

    /** A string of up to {@code maxParts} characters and words. */
    static String next(SplittableRandom random, int maxParts) {
        int parts = random.nextInt(maxParts + 1);
        StringBuilder text = new StringBuilder();
        for (int i = 0; i < parts; i++) {
            if (random.nextInt(4) == 0) {
                text.append(WORDS[random.nextInt(WORDS.length)]);
            } else {
                text.append(ALPHABET[random.nextInt(ALPHABET.length)]);
            }
        }
        return text.toString();
    }
}
