package dev.tare.template.code;

import dev.tare.template.LineIndex;

/**
 * Java's comments and string literals, read after its Unicode escapes are translated: strings with
 * their escapes ({@code \s}, octal), text blocks with incidental white space removed and then escapes
 * interpreted, as the Java Language Specification says (§3.10.6, {@link TextBlock}), and character
 * literals, which are never prompts.
 */
final class JavaLexer extends CodeLexer {
    JavaLexer(String source, LineIndex lines) {
        super(SourceView.javaUnicode(source), lines);
    }

    @Override
    int special(int i) {
        char c = text.charAt(i);
        if (c == '/' && (at(i + 1, '/') || at(i + 1, '*'))) {
            return slashComment(i);
        }
        if (c == '"' && text.startsWith("\"\"\"", i)) {
            return textBlock(i);
        }
        if (c == '"') {
            return string(i);
        }
        if (c == '\'') {
            return oneCharacter(i, "character literal");
        }
        return -1;
    }

    private int string(int i) {
        DecodedText raw = new DecodedText();
        int j = i + 1;
        while (true) {
            if (j >= length || text.charAt(j) == '\n' || text.charAt(j) == '\r') {
                fail(i, "the string opened here is not closed before the end of its line; close it with \""
                        + " or use a text block");
                return length;
            }
            char c = text.charAt(j);
            if (c == '"') {
                tokens.add(CodeTokens.STRING, i, j + 1, new CodeTokens.StringLiteral(unescape(raw), false));
                return j + 1;
            }
            raw.copied(view, j);
            if (c == '\\' && j + 1 < length && text.charAt(j + 1) != '\n' && text.charAt(j + 1) != '\r') {
                raw.copied(view, j + 1);
                j++;
            }
            j++;
        }
    }

    private int textBlock(int i) {
        int j = i + 3;
        while (j < length && (text.charAt(j) == ' ' || text.charAt(j) == '\t' || text.charAt(j) == '\f')) {
            j++;
        }
        if (j >= length || text.charAt(j) != '\n' && text.charAt(j) != '\r') {
            fail(i, "a text block's opening \"\"\" must end its line; start the text on the next line");
            return length;
        }
        j = at(j, '\r') && at(j + 1, '\n') ? j + 2 : j + 1;
        DecodedText content = new DecodedText();
        while (true) {
            if (j >= length) {
                fail(i, "the text block opened here is never closed; close it with \"\"\"");
                return length;
            }
            char c = text.charAt(j);
            if (text.startsWith("\"\"\"", j)) {
                DecodedText value = unescape(TextBlock.stripIndent(content));
                tokens.add(CodeTokens.STRING, i, j + 3, new CodeTokens.StringLiteral(value, false));
                return j + 3;
            }
            if (c == '\r') {
                j = lineBreak(content, j);
            } else if (c == '\\' && j + 1 < length) {
                content.copied(view, j);
                j = text.charAt(j + 1) == '\r' ? lineBreak(content, j + 1) : copy(content, j + 1);
            } else {
                j = copy(content, j);
            }
        }
    }

    private int copy(DecodedText out, int j) {
        out.copied(view, j);
        return j + 1;
    }

    /**
     * Interprets the escapes of {@code raw} as {@code String.translateEscapes} does: the simple ones,
     * {@code \s} (a space), octal escapes, and a backslash before a line break, which joins the lines.
     * An escape the language does not know keeps its two characters, neither one to one.
     */
    static DecodedText unescape(DecodedText raw) {
        DecodedText out = new DecodedText();
        int n = raw.length();
        int k = 0;
        while (k < n) {
            char c = raw.charAt(k);
            if (c != '\\' || k + 1 >= n) {
                out.copy(raw, k);
                k++;
                continue;
            }
            char e = raw.charAt(k + 1);
            out.usePiece(raw.pieceAt(k));
            char simple = switch (e) {
                case 'b' -> '\b';
                case 't' -> '\t';
                case 'n' -> '\n';
                case 'f' -> '\f';
                case 'r' -> '\r';
                case 's' -> ' ';
                case '"', '\'', '\\' -> e;
                default -> 0;
            };
            if (simple != 0) {
                out.decoded(simple, raw.from(k), raw.to(k + 1));
                k += 2;
            } else if (e == '\n') {
                k += 2;
            } else if (e >= '0' && e <= '7') {
                int limit = e <= '3' ? k + 4 : k + 3;
                int j = k + 1;
                int value = 0;
                while (j < n && j < limit && raw.charAt(j) >= '0' && raw.charAt(j) <= '7') {
                    value = value * 8 + raw.charAt(j) - '0';
                    j++;
                }
                out.decoded((char) value, raw.from(k), raw.to(j - 1));
                k = j;
            } else {
                out.copyInexact(raw, k);
                out.copyInexact(raw, k + 1);
                k += 2;
            }
        }
        return out;
    }
}
