package dev.tare.tokenize;

/**
 * The character classes the encodings' splitting patterns use, as bits of one lookup: the Unicode
 * general categories behind {@code \p{L}}, {@code \p{N}}, {@code \p{M}} and the letter subsets, and
 * {@code \s} as Java's regular expressions define it with {@code UNICODE_CHARACTER_CLASS}
 * (separators, the controls from tab to carriage return, and next-line). Latin-1 is tabulated
 * once and other code points are classified on the way: tabulating the whole Basic Multilingual
 * Plane would cost every start, which a pre-commit hook feels, and a scan runs no faster for it.
 */
final class CharClass {
    /** {@code \p{L}}. */
    static final int LETTER = 1;
    /** {@code \p{N}}. */
    static final int NUMBER = 1 << 1;
    /** {@code \s}. */
    static final int SPACE = 1 << 2;
    /** {@code \r} or {@code \n}. */
    static final int NEWLINE = 1 << 3;
    /** {@code [\p{Lu}\p{Lt}\p{Lm}\p{Lo}\p{M}]}: the capitalised part of a word. */
    static final int UPPER_PART = 1 << 4;
    /** {@code [\p{Ll}\p{Lm}\p{Lo}\p{M}]}: the lower-case part of a word. */
    static final int LOWER_PART = 1 << 5;

    /** The class bits of the Latin-1 chars, which the splitters' loops also read directly, without a call. */
    static final byte[] LATIN_1 = new byte[0x100];

    static {
        for (int c = 0; c < LATIN_1.length; c++) {
            LATIN_1[c] = (byte) classify(c);
        }
    }

    private CharClass() {
    }

    /** The class bits of code point {@code cp}. */
    static int of(int cp) {
        return cp < LATIN_1.length ? LATIN_1[cp] : classify(cp);
    }

    private static int classify(int cp) {
        int bits = 0;
        switch (Character.getType(cp)) {
            case Character.UPPERCASE_LETTER, Character.TITLECASE_LETTER -> bits = LETTER | UPPER_PART;
            case Character.LOWERCASE_LETTER -> bits = LETTER | LOWER_PART;
            case Character.MODIFIER_LETTER, Character.OTHER_LETTER -> bits = LETTER | UPPER_PART | LOWER_PART;
            case Character.NON_SPACING_MARK, Character.ENCLOSING_MARK, Character.COMBINING_SPACING_MARK ->
                    bits = UPPER_PART | LOWER_PART;
            case Character.DECIMAL_DIGIT_NUMBER, Character.LETTER_NUMBER, Character.OTHER_NUMBER -> bits = NUMBER;
            case Character.SPACE_SEPARATOR, Character.LINE_SEPARATOR, Character.PARAGRAPH_SEPARATOR -> bits = SPACE;
            default -> bits = 0;
        }
        if ((cp >= 0x9 && cp <= 0xD) || cp == 0x85) {
            bits |= SPACE;
        }
        if (cp == '\r' || cp == '\n') {
            bits |= NEWLINE;
        }
        return bits;
    }
}
