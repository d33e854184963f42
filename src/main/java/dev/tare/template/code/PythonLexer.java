package dev.tare.template.code;

import dev.tare.template.LineIndex;
import java.util.Locale;
import java.util.Set;

/**
 * Python's comments and string literals: quotes and triple quotes, the prefixes r, u, b, f and t in
 * any case and order Python allows, escapes (octal, hexadecimal, named and Unicode escapes, line
 * continuations), and f-string fields with their conversions, format specs and
 * nested strings, each field a variable named by its expression. Byte strings are read and skipped.
 */
final class PythonLexer extends CodeLexer {
    private static final Set<String> PREFIXES = Set.of("r", "u", "b", "f", "t", "br", "rb", "fr", "rf", "tr", "rt");

    PythonLexer(String source, LineIndex lines) {
        super(SourceView.of(source), lines);
    }

    @Override
    int special(int i) {
        char c = text.charAt(i);
        if (c == '#') {
            return lineComment(i, 1);
        }
        if (c == '\\' && (at(i + 1, '\n') || at(i + 1, '\r'))) {
            return at(i + 1, '\r') && at(i + 2, '\n') ? i + 3 : i + 2;
        }
        if (c == '\'' || c == '"') {
            return literal(i, i, "");
        }
        return -1;
    }

    @Override
    int word(int i) {
        int j = wordEnd(i);
        if (j - i <= 2 && j < length && (text.charAt(j) == '\'' || text.charAt(j) == '"')) {
            String prefix = text.substring(i, j).toLowerCase(Locale.ROOT);
            if (PREFIXES.contains(prefix)) {
                return literal(i, j, prefix);
            }
        }
        tokens.add(CodeTokens.WORD, i, j);
        return j;
    }

    private int literal(int start, int quote, String prefix) {
        DecodedText out = new DecodedText();
        int end = string(start, quote, prefix, out, 0);
        if (tokens.stopped()) {
            return length;
        }
        if (prefix.indexOf('b') >= 0) {
            tokens.add(CodeTokens.VALUE, start, end);
        } else {
            boolean interpolated = prefix.indexOf('f') >= 0 || prefix.indexOf('t') >= 0;
            tokens.add(CodeTokens.STRING, start, end, new CodeTokens.StringLiteral(out, interpolated));
        }
        return end;
    }

    /** Reads the string whose quote is at {@code q} into {@code out}; returns the offset after it. */
    private int string(int start, int q, String prefix, DecodedText out, int depth) {
        boolean raw = prefix.indexOf('r') >= 0;
        boolean fields = prefix.indexOf('f') >= 0 || prefix.indexOf('t') >= 0;
        boolean bytes = prefix.indexOf('b') >= 0;
        char quote = text.charAt(q);
        String three = String.valueOf(quote).repeat(3);
        boolean triple = text.startsWith(three, q);
        int i = q + (triple ? 3 : 1);
        while (true) {
            if (i >= length) {
                fail(start, (triple ? "the triple-quoted string" : "the string") + " opened here is never closed;"
                        + " close it with " + (triple ? three : String.valueOf(quote)));
                return length;
            }
            char c = text.charAt(i);
            if (c == quote && (!triple || text.startsWith(three, i))) {
                return i + (triple ? 3 : 1);
            }
            if ((c == '\n' || c == '\r') && !triple) {
                fail(start, "the string opened here is not closed before the end of its line; close it with "
                        + quote + " or use a triple-quoted string");
                return length;
            }
            if (c == '\\' && i + 1 < length) {
                i = raw ? rawEscape(out, i) : escape(out, i, bytes);
            } else if (fields && c == '{') {
                if (at(i + 1, '{')) {
                    out.decoded('{', view.from(i), view.to(i + 1));
                    i += 2;
                } else {
                    i = field(out, i, quote, triple, depth);
                    if (tokens.stopped()) {
                        return length;
                    }
                }
            } else if (fields && c == '}' && at(i + 1, '}')) {
                out.decoded('}', view.from(i), view.to(i + 1));
                i += 2;
            } else if (c == '\r') {
                i = lineBreak(out, i);
            } else {
                out.copied(view, i);
                i++;
            }
        }
    }

    /** In a raw string a backslash keeps itself and the character after it, which then closes nothing. */
    private int rawEscape(DecodedText out, int i) {
        out.copied(view, i);
        if (text.charAt(i + 1) == '\r') {
            return lineBreak(out, i + 1);
        }
        out.copied(view, i + 1);
        return i + 2;
    }

    private int escape(DecodedText out, int i, boolean bytes) {
        char e = text.charAt(i + 1);
        switch (e) {
            case '\n':
                return i + 2;
            case '\r':
                return at(i + 2, '\n') ? i + 3 : i + 2;
            case '\\', '\'', '"':
                out.decoded(e, i, i + 2);
                return i + 2;
            case 'a':
                out.decoded('\u0007', i, i + 2);
                return i + 2;
            case 'b':
                out.decoded('\b', i, i + 2);
                return i + 2;
            case 'f':
                out.decoded('\f', i, i + 2);
                return i + 2;
            case 'n':
                out.decoded('\n', i, i + 2);
                return i + 2;
            case 'r':
                out.decoded('\r', i, i + 2);
                return i + 2;
            case 't':
                out.decoded('\t', i, i + 2);
                return i + 2;
            case 'v':
                out.decoded('\u000b', i, i + 2);
                return i + 2;
            case 'x':
                return numeric(out, i, 2, 2);
            case 'u':
                return bytes ? unknown(out, i) : numeric(out, i, 2, 4);
            case 'U':
                return bytes ? unknown(out, i) : numeric(out, i, 2, 8);
            case 'N':
                return bytes ? unknown(out, i) : named(out, i);
            default:
                if (e >= '0' && e <= '7') {
                    int j = i + 1;
                    int value = 0;
                    while (j < length && j < i + 4 && text.charAt(j) >= '0' && text.charAt(j) <= '7') {
                        value = value * 8 + text.charAt(j) - '0';
                        j++;
                    }
                    codePoint(out, value, i, j);
                    return j;
                }
                return unknown(out, i);
        }
    }

    private int numeric(DecodedText out, int i, int skip, int digits) {
        int value = hex(i + skip, digits);
        if (value < 0 || value > Character.MAX_CODE_POINT) {
            return unknown(out, i);
        }
        codePoint(out, value, i, i + skip + digits);
        return i + skip + digits;
    }

    private int named(DecodedText out, int i) {
        int close = -1;
        for (int k = i + 3; at(i + 2, '{') && k < Math.min(length, i + 100) && close < 0; k++) {
            if (text.charAt(k) == '}') {
                close = k;
            }
        }
        if (close < 0) {
            return unknown(out, i);
        }
        try {
            codePoint(out, Character.codePointOf(text.substring(i + 3, close)), i, close + 1);
            return close + 1;
        } catch (IllegalArgumentException e) {
            return unknown(out, i);
        }
    }

    /** An escape Python does not know keeps its backslash; neither character is one to one. */
    private int unknown(DecodedText out, int i) {
        out.decoded(text.charAt(i), i, i + 2);
        if (text.charAt(i + 1) == '\r') {
            return lineBreak(out, i + 1);
        }
        out.decoded(text.charAt(i + 1), i, i + 2);
        return i + 2;
    }

    /**
     * An f-string field opened at {@code open}: the expression up to a top-level {@code !}
     * conversion, {@code :} format spec, {@code =} or the closing brace. Strings inside it are read
     * whole, so their braces and quotes do not end the field.
     */
    private int field(DecodedText out, int open, char quote, boolean triple, int depth) {
        if (depth >= MAX_NESTING) {
            fail(open, "f-string fields nest too deeply here");
            return length;
        }
        int j = open + 1;
        int exprEnd = -1;
        int brackets = 0;
        while (true) {
            if (j >= length) {
                fail(open, "the f-string field opened here is never closed; close it with }");
                return length;
            }
            char c = text.charAt(j);
            if ((c == '\n' || c == '\r') && !triple && brackets == 0) {
                fail(open, "the f-string field opened here is not closed before the end of its line; close it with }");
                return length;
            }
            if (c == '\'' || c == '"') {
                int prefixStart = j;
                while (prefixStart > open + 1 && Character.isLetter(text.charAt(prefixStart - 1)) && j - prefixStart < 2) {
                    prefixStart--;
                }
                String prefix = text.substring(prefixStart, j).toLowerCase(Locale.ROOT);
                if (!PREFIXES.contains(prefix) || prefixStart > open + 1
                        && Character.isJavaIdentifierPart(text.charAt(prefixStart - 1))) {
                    prefix = "";
                }
                j = string(j, j, prefix, new DecodedText(), depth + 1);
                if (tokens.stopped()) {
                    return length;
                }
                continue;
            }
            if (c == '(' || c == '[' || c == '{') {
                brackets++;
            } else if ((c == ')' || c == ']') && brackets > 0) {
                brackets--;
            } else if (c == '}') {
                if (brackets > 0) {
                    brackets--;
                } else {
                    return closeField(out, open, exprEnd < 0 ? j : exprEnd, j + 1);
                }
            } else if (brackets == 0 && exprEnd < 0 && c == '!' && !at(j + 1, '=')) {
                exprEnd = j;
            } else if (brackets == 0 && c == ':') {
                int close = formatSpec(open, j + 1, triple);
                if (close < 0) {
                    return length;
                }
                return closeField(out, open, exprEnd < 0 ? j : exprEnd, close + 1);
            } else if (brackets == 0 && exprEnd < 0 && c == '=' && !at(j + 1, '=') && selfDocumenting(open, j)) {
                exprEnd = j;
            }
            j++;
        }
    }

    /** Whether {@code =} at {@code j} ends the expression ({@code {name=}}), not part of an operator. */
    private boolean selfDocumenting(int open, int j) {
        char before = j > open + 1 ? text.charAt(j - 1) : ' ';
        if (before == '=' || before == '!' || before == '<' || before == '>') {
            return false;
        }
        int k = j + 1;
        while (k < length && (text.charAt(k) == ' ' || text.charAt(k) == '\t')) {
            k++;
        }
        return k < length && (text.charAt(k) == '}' || text.charAt(k) == '!' || text.charAt(k) == ':');
    }

    /** The offset of the brace that closes a format spec starting at {@code j}, whose own fields nest. */
    private int formatSpec(int open, int j, boolean triple) {
        int nested = 0;
        for (int k = j; k < length; k++) {
            char c = text.charAt(k);
            if ((c == '\n' || c == '\r') && !triple) {
                break;
            }
            if (c == '{') {
                nested++;
            } else if (c == '}') {
                if (nested == 0) {
                    return k;
                }
                nested--;
            }
        }
        fail(open, "the format spec of the f-string field opened here is never closed; close it with }");
        return -1;
    }

    private int closeField(DecodedText out, int open, int exprEnd, int end) {
        String name = collapse(text.substring(open + 1, exprEnd));
        String shown = text.substring(open, end);
        out.variable(shown, name.isEmpty() ? shown : name, view.from(open), view.to(end - 1));
        return end;
    }

    /** An expression's text with each run of white space made one space. */
    static String collapse(String expression) {
        StringBuilder out = new StringBuilder(expression.length());
        boolean space = false;
        for (int k = 0; k < expression.length(); k++) {
            char c = expression.charAt(k);
            if (Character.isWhitespace(c)) {
                space = out.length() > 0;
            } else {
                if (space) {
                    out.append(' ');
                    space = false;
                }
                out.append(c);
            }
        }
        return out.toString();
    }
}
