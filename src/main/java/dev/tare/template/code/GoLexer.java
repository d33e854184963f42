package dev.tare.template.code;

import dev.tare.template.LineIndex;
import java.nio.ByteBuffer;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;

/**
 * Go's comments and string literals: interpreted strings with their escapes (a run of {@code \x} and
 * octal escapes spells bytes, read as UTF-8), raw strings between backquotes, from which carriage
 * returns are removed as the Go specification says, and rune literals, which are never prompts.
 */
final class GoLexer extends CodeLexer {
    GoLexer(String source, LineIndex lines) {
        super(SourceView.of(source), lines);
    }

    @Override
    int special(int i) {
        char c = text.charAt(i);
        if (c == '/' && (at(i + 1, '/') || at(i + 1, '*'))) {
            return slashComment(i);
        }
        if (c == '"') {
            return interpreted(i);
        }
        if (c == '`') {
            return raw(i);
        }
        if (c == '\'') {
            return oneCharacter(i, "rune literal");
        }
        return -1;
    }

    private int raw(int i) {
        int close = text.indexOf('`', i + 1);
        if (close < 0) {
            fail(i, "the raw string opened here is never closed; close it with `");
            return length;
        }
        DecodedText out = new DecodedText();
        for (int j = i + 1; j < close; j++) {
            if (text.charAt(j) != '\r') {
                out.copied(view, j);
            }
        }
        tokens.add(CodeTokens.STRING, i, close + 1, new CodeTokens.StringLiteral(out, false));
        return close + 1;
    }

    private int interpreted(int i) {
        DecodedText out = new DecodedText();
        int j = i + 1;
        while (true) {
            if (j >= length || text.charAt(j) == '\n' || text.charAt(j) == '\r') {
                fail(i, "the string opened here is not closed before the end of its line; close it with \""
                        + " or use a raw string between backquotes");
                return length;
            }
            char c = text.charAt(j);
            if (c == '"') {
                tokens.add(CodeTokens.STRING, i, j + 1, new CodeTokens.StringLiteral(out, false));
                return j + 1;
            }
            if (c == '\\' && j + 1 < length) {
                j = escape(out, j);
            } else {
                out.copied(view, j);
                j++;
            }
        }
    }

    private int escape(DecodedText out, int j) {
        char e = text.charAt(j + 1);
        char simple = switch (e) {
            case 'a' -> '\u0007';
            case 'b' -> '\b';
            case 'f' -> '\f';
            case 'n' -> '\n';
            case 'r' -> '\r';
            case 't' -> '\t';
            case 'v' -> '\u000b';
            case '\\', '"' -> e;
            default -> 0;
        };
        if (simple != 0) {
            out.decoded(simple, j, j + 2);
            return j + 2;
        }
        if (e == 'u' || e == 'U') {
            int digits = e == 'u' ? 4 : 8;
            int value = hex(j + 2, digits);
            if (value >= 0 && value <= Character.MAX_CODE_POINT) {
                codePoint(out, value, j, j + 2 + digits);
                return j + 2 + digits;
            }
        }
        if (byteAt(j) >= 0) {
            return bytes(out, j);
        }
        out.decoded(text.charAt(j), j, j + 2);
        out.decoded(e, j, j + 2);
        return j + 2;
    }

    /** The byte a {@code \xhh} or {@code \ooo} escape at {@code j} spells, or -1. */
    private int byteAt(int j) {
        if (!at(j, '\\') || j + 1 >= length) {
            return -1;
        }
        if (text.charAt(j + 1) == 'x') {
            return hex(j + 2, 2);
        }
        if (j + 3 < length) {
            int value = 0;
            for (int k = j + 1; k <= j + 3; k++) {
                char c = text.charAt(k);
                if (c < '0' || c > '7') {
                    return -1;
                }
                value = value * 8 + c - '0';
            }
            return value <= 255 ? value : -1;
        }
        return -1;
    }

    /** A run of byte escapes, decoded together as UTF-8 and mapped to the whole run. */
    private int bytes(DecodedText out, int j) {
        ByteBuffer run = ByteBuffer.allocate(64);
        int k = j;
        int value;
        while ((value = byteAt(k)) >= 0 && run.hasRemaining()) {
            run.put((byte) value);
            k += 4;
        }
        run.flip();
        String decoded;
        try {
            decoded = StandardCharsets.UTF_8.newDecoder().onMalformedInput(CodingErrorAction.REPLACE)
                    .onUnmappableCharacter(CodingErrorAction.REPLACE).decode(run).toString();
        } catch (java.nio.charset.CharacterCodingException e) {
            decoded = "\uFFFD";
        }
        out.decoded(decoded, j, k);
        return k;
    }
}
