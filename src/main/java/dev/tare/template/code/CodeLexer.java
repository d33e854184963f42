package dev.tare.template.code;

import dev.tare.template.LineIndex;

/**
 * The part every language's lexer shares: a single pass over the text that turns words, numbers,
 * operators and line breaks into tokens and leaves comments and literals to the language. A
 * construct left open ends the pass with a reason naming its line; nothing here throws.
 */
abstract class CodeLexer {
    /** How deep fields inside string fields may nest before the lexer gives up on the file. */
    static final int MAX_NESTING = 64;
    private static final String[] OPERATORS = {
        ">>>=", "===", "!==", "**=", "//=", ">>=", "<<=", ">>>", "...", "??=", "&&=", "||=", "&^=",
        "==", "!=", "<=", ">=", "=>", ":=", "+=", "-=", "*=", "/=", "%=", "&=", "|=", "^=", "@=", "++", "--",
        "&&", "||", "??", "?.", "::", "->", "<-", "**", "<<", ">>", "&^"};
    /** {@link Character#isJavaIdentifierPart} of each ASCII char, looked up once: the test of every char of every word. */
    private static final boolean[] ASCII_WORD_PART = asciiWordPart();
    /** The chars that stand second in some operator of {@link #OPERATORS}. */
    private static final String SECOND_CHARS = secondChars();

    final SourceView view;
    final String text;
    final int length;
    final CodeTokens tokens;
    private final LineIndex lines;

    CodeLexer(SourceView view, LineIndex lines) {
        this.view = view;
        this.text = view.text();
        this.length = text.length();
        this.tokens = new CodeTokens(view);
        this.lines = lines;
    }

    /** Lexes the whole text, or up to the first construct left open. */
    final CodeTokens run() {
        int i = start();
        while (i < length && !tokens.stopped()) {
            int next = next(i);
            i = Math.max(next, i + 1);
        }
        return tokens;
    }

    /** Where lexing starts: past a leading {@code #!} line, for languages that allow one. */
    int start() {
        return 0;
    }

    private int next(int i) {
        char c = text.charAt(i);
        if (c == '\n') {
            tokens.add(CodeTokens.NEWLINE, i, i + 1);
            return i + 1;
        }
        if (c == '\r') {
            int end = i + 1 < length && text.charAt(i + 1) == '\n' ? i + 2 : i + 1;
            tokens.add(CodeTokens.NEWLINE, i, end);
            return end;
        }
        if (c == ' ' || c == '\t' || c == '\f' || c == '\u000b') {
            return i + 1;
        }
        int special = special(i);
        if (special >= 0) {
            return special;
        }
        if (Character.isJavaIdentifierStart(c) || (c >= 0x80 && Character.isLetter(c))) {
            return word(i);
        }
        if (c >= '0' && c <= '9' || c == '.' && i + 1 < length && Character.isDigit(text.charAt(i + 1))) {
            int j = i + 1;
            while (j < length && (Character.isLetterOrDigit(text.charAt(j)) || text.charAt(j) == '_'
                    || text.charAt(j) == '.' && j + 1 < length && Character.isDigit(text.charAt(j + 1)))) {
                j++;
            }
            tokens.add(CodeTokens.VALUE, i, j);
            return j;
        }
        return operator(i);
    }

    /** Lexes a comment, a literal or anything else the language reads its own way at {@code i}; -1 if none. */
    abstract int special(int i);

    /** Lexes a word at {@code i}; a language may override this to read string prefixes. */
    int word(int i) {
        int j = wordEnd(i);
        tokens.add(CodeTokens.WORD, i, j);
        return j;
    }

    final int wordEnd(int i) {
        int j = i + 1;
        while (j < length) {
            char c = text.charAt(j);
            if (c < 0x80 ? !ASCII_WORD_PART[c] : !Character.isJavaIdentifierPart(c) && !Character.isLetterOrDigit(c)) {
                break;
            }
            j++;
        }
        return j;
    }

    int operator(int i) {
        // Most operators are one char: only a char that can continue one is worth the list.
        if (i + 1 >= length || SECOND_CHARS.indexOf(text.charAt(i + 1)) < 0) {
            tokens.add(CodeTokens.OP, i, i + 1);
            return i + 1;
        }
        char first = text.charAt(i);
        for (String op : OPERATORS) {
            if (op.charAt(0) == first && text.startsWith(op, i) && allows(op)) {
                tokens.add(CodeTokens.OP, i, i + op.length());
                return i + op.length();
            }
        }
        tokens.add(CodeTokens.OP, i, i + 1);
        return i + 1;
    }

    private static boolean[] asciiWordPart() {
        boolean[] part = new boolean[0x80];
        for (char c = 0; c < 0x80; c++) {
            part[c] = Character.isJavaIdentifierPart(c);
        }
        return part;
    }

    private static String secondChars() {
        StringBuilder chars = new StringBuilder();
        for (String op : OPERATORS) {
            if (chars.indexOf(op.substring(1, 2)) < 0) {
                chars.append(op.charAt(1));
            }
        }
        return chars.toString();
    }

    /** Whether the language has the operator {@code op}; all by default. */
    boolean allows(String op) {
        return true;
    }

    /** A comment from {@code start} to {@code end}, whose text is {@code [textStart, textEnd)}. */
    final void comment(int start, int end, int textStart, int textEnd) {
        tokens.comments.add(new CodeTokens.Comment(start, end, text.substring(textStart, Math.max(textStart, textEnd))));
    }

    /** Skips a {@code //} comment at {@code i}; returns the end of its line. */
    final int lineComment(int i, int markerLength) {
        int end = lineEnd(i);
        comment(i, end, i + markerLength, end);
        return end;
    }

    /** Skips a block comment opened at {@code i}, or stops the file when it is never closed. */
    final int blockComment(int i, String what) {
        int close = text.indexOf("*/", i + 2);
        if (close < 0) {
            fail(i, what + " opened here is never closed with */");
            return length;
        }
        comment(i, close + 2, i + 2, close);
        return close + 2;
    }

    final int lineEnd(int i) {
        int j = i;
        while (j < length && text.charAt(j) != '\n' && text.charAt(j) != '\r') {
            j++;
        }
        return j;
    }

    /** Ends the file's extraction at view offset {@code at}, saying where and what. */
    /** The {@code //} or {@code /*} comment of the C family that starts at {@code i}: the offset past it. */
    final int slashComment(int i) {
        return at(i + 1, '/') ? lineComment(i, 2) : blockComment(i, "the comment");
    }

    /**
     * Skips a quoted character (Java's character literal, Go's rune), never part of a prompt, to its
     * closing quote on the same line; {@code what} names it in the reason when it is not closed.
     */
    final int oneCharacter(int i, String what) {
        for (int j = i + 1; j < length; j++) {
            char c = text.charAt(j);
            if (c == '\\') {
                j++;
            } else if (c == '\'') {
                tokens.add(CodeTokens.VALUE, i, j + 1);
                return j + 1;
            } else if (c == '\n' || c == '\r') {
                break;
            }
        }
        fail(i, "the " + what + " opened here is not closed before the end of its line; close it with '");
        return length;
    }

    final void fail(int at, String message) {
        int offset = view.from(Math.min(at, length));
        tokens.stop("line " + lines.line(offset) + ", column " + lines.column(offset) + ": " + message
                + "; Tare reads no further string literals in this file");
    }

    /** Appends the line break at {@code i} ({@code \r\n}, {@code \r} or {@code \n}) as {@code \n}; returns its end. */
    final int lineBreak(DecodedText out, int i) {
        if (text.charAt(i) == '\n') {
            out.copied(view, i);
            return i + 1;
        }
        int end = i + 1 < length && text.charAt(i + 1) == '\n' ? i + 2 : i + 1;
        out.decoded('\n', view.from(i), view.to(end - 1));
        return end;
    }

    /** The value of {@code count} hex digits at {@code at}, or -1 when they are not all there. */
    final int hex(int at, int count) {
        if (at + count > length) {
            return -1;
        }
        int value = 0;
        for (int k = at; k < at + count; k++) {
            int digit = Character.digit(text.charAt(k), 16);
            if (digit < 0 || text.charAt(k) > 'f') {
                return -1;
            }
            value = value * 16 + digit;
        }
        return value;
    }

    /** Appends a code point decoded from the escape at view {@code [start, end)}. */
    final void codePoint(DecodedText out, int codePoint, int start, int end) {
        out.decoded(new String(Character.toChars(codePoint)), view.from(start), view.to(end - 1));
    }

    /** Appends the characters of view {@code [start, end)} as they are written, one to one where direct. */
    final void copied(DecodedText out, int start, int end) {
        for (int k = start; k < end; k++) {
            out.copied(view, k);
        }
    }

    final boolean at(int i, char c) {
        return i < length && text.charAt(i) == c;
    }
}
