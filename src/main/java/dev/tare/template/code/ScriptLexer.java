package dev.tare.template.code;

import dev.tare.template.LineIndex;
import java.util.Set;

/**
 * JavaScript's and TypeScript's comments and string literals: single and double quotes with their
 * escapes, template literals whose {@code ${...}} fields are variables (strings, comments, braces and
 * template literals inside a field are read whole), and regular expression literals, which start
 * where a value may start so that the quotes and slashes inside them open nothing. In files that may
 * hold JSX, a quote that is not closed on its line is taken as text, since JSX text is not code.
 */
final class ScriptLexer extends CodeLexer {
    /** Words after which a slash starts a regular expression rather than a division. */
    private static final Set<String> BEFORE_EXPRESSION = Set.of("return", "typeof", "instanceof", "in", "of", "new",
            "delete", "void", "throw", "case", "do", "else", "yield", "await");
    private final boolean markup;
    /** Where the line ends on which a slash opened no regular expression; no slash before it is tried again. */
    private int noRegexUntil = -1;
    /** The same for a single and a double quote left open on a line of JSX text. */
    private int noSingleQuoteUntil = -1;
    private int noDoubleQuoteUntil = -1;

    ScriptLexer(String source, LineIndex lines, boolean markup) {
        super(SourceView.of(source), lines);
        this.markup = markup;
    }

    @Override
    int start() {
        return text.startsWith("#!") ? lineEnd(0) : 0;
    }

    @Override
    int special(int i) {
        char c = text.charAt(i);
        if (c == '/' && (at(i + 1, '/') || at(i + 1, '*'))) {
            return slashComment(i);
        }
        if (c == '/' && i >= noRegexUntil && regexMayStart()) {
            return regex(i);
        }
        if (c == '\'' && i >= noSingleQuoteUntil || c == '"' && i >= noDoubleQuoteUntil) {
            return quoted(i);
        }
        if (c == '`') {
            int tag = tagStart();
            boolean raw = tag >= 0 && tokens.text(tag).equals("String") && tag + 2 == tokens.size() - 1
                    && tokens.text(tag + 2).equals("raw");
            DecodedText out = new DecodedText();
            int end = template(i, out, raw, 0);
            if (!tokens.stopped()) {
                tokens.add(CodeTokens.STRING, i, end, new CodeTokens.StringLiteral(out, true, tag));
            }
            return end;
        }
        return -1;
    }

    private boolean regexMayStart() {
        int last = tokens.size() - 1;
        while (last >= 0 && tokens.kind(last) == CodeTokens.NEWLINE) {
            last--;
        }
        if (last < 0) {
            return true;
        }
        return switch (tokens.kind(last)) {
            case CodeTokens.OP -> !(tokens.is(last, ")") || tokens.is(last, "]") || tokens.is(last, "}")
                    || tokens.is(last, "++") || tokens.is(last, "--"));
            case CodeTokens.WORD -> BEFORE_EXPRESSION.contains(tokens.text(last));
            default -> false;
        };
    }

    /** A regular expression literal, or -1 (a division) when no closing slash stands on the line. */
    private int regex(int i) {
        boolean inClass = false;
        int j = i + 1;
        while (j < length) {
            char c = text.charAt(j);
            if (c == '\n' || c == '\r' || c == '\u2028' || c == '\u2029') {
                noRegexUntil = j;
                return -1;
            }
            if (c == '\\') {
                j += 2;
                continue;
            }
            if (c == '[') {
                inClass = true;
            } else if (c == ']') {
                inClass = false;
            } else if (c == '/' && !inClass) {
                int end = j + 1;
                while (end < length && Character.isJavaIdentifierPart(text.charAt(end))) {
                    end++;
                }
                tokens.add(CodeTokens.VALUE, i, end);
                return end;
            }
            j++;
        }
        noRegexUntil = length;
        return -1;
    }

    /** The first token of a tag just before a template literal ({@code dedent}, {@code String.raw}), or -1. */
    private int tagStart() {
        int last = tokens.size() - 1;
        if (last < 0 || tokens.kind(last) != CodeTokens.WORD || BEFORE_EXPRESSION.contains(tokens.text(last))
                || tokens.text(last).equals("return")) {
            return -1;
        }
        int first = last;
        for (int steps = 0; steps < 32 && first >= 2 && tokens.is(first - 1, ".")
                && tokens.kind(first - 2) == CodeTokens.WORD; steps++) {
            first -= 2;
        }
        return first;
    }

    private int quoted(int i) {
        DecodedText out = new DecodedText();
        char quote = text.charAt(i);
        int j = i + 1;
        while (true) {
            if (j >= length || text.charAt(j) == '\n' || text.charAt(j) == '\r') {
                if (markup) {
                    if (quote == '\'') {
                        noSingleQuoteUntil = j;
                    } else {
                        noDoubleQuoteUntil = j;
                    }
                    return -1;
                }
                fail(i, "the string opened here is not closed before the end of its line; close it with " + quote);
                return length;
            }
            char c = text.charAt(j);
            if (c == quote) {
                tokens.add(CodeTokens.STRING, i, j + 1, new CodeTokens.StringLiteral(out, false));
                return j + 1;
            }
            if (c == '\\' && j + 1 < length) {
                j = escape(out, j, true);
            } else {
                out.copied(view, j);
                j++;
            }
        }
    }

    /** Reads a template literal opened at {@code i} into {@code out}; returns the offset after it. */
    private int template(int i, DecodedText out, boolean raw, int depth) {
        if (depth >= MAX_NESTING) {
            fail(i, "template literals nest too deeply here");
            return length;
        }
        int j = i + 1;
        while (true) {
            if (j >= length) {
                fail(i, "the template literal opened here is never closed; close it with `");
                return length;
            }
            char c = text.charAt(j);
            if (c == '`') {
                return j + 1;
            }
            if (c == '\\' && j + 1 < length) {
                if (raw) {
                    out.copied(view, j);
                    j = text.charAt(j + 1) == '\r' ? lineBreak(out, j + 1) : copyOne(out, j + 1);
                } else {
                    j = escape(out, j, false);
                }
            } else if (c == '$' && at(j + 1, '{')) {
                int close = fieldEnd(j + 2, depth);
                if (close < 0) {
                    return length;
                }
                String name = PythonLexer.collapse(text.substring(j + 2, close));
                String shown = text.substring(j, close + 1);
                out.variable(shown, name.isEmpty() ? shown : name, view.from(j), view.to(close));
                j = close + 1;
            } else if (c == '\r') {
                j = lineBreak(out, j);
            } else {
                out.copied(view, j);
                j++;
            }
        }
    }

    private int copyOne(DecodedText out, int j) {
        out.copied(view, j);
        return j + 1;
    }

    /** The offset of the brace that closes a {@code ${} field whose expression starts at {@code j}; -1 if none. */
    private int fieldEnd(int j, int depth) {
        int braces = 0;
        int k = j;
        while (k < length) {
            char c = text.charAt(k);
            if (c == '{') {
                braces++;
            } else if (c == '}') {
                if (braces == 0) {
                    return k;
                }
                braces--;
            } else if (c == '`') {
                k = template(k, new DecodedText(), false, depth + 1);
                if (tokens.stopped()) {
                    return -1;
                }
                continue;
            } else if (c == '\'' || c == '"') {
                k = skipQuoted(k);
                if (k < 0) {
                    return -1;
                }
                continue;
            } else if (c == '/' && at(k + 1, '/')) {
                k = lineEnd(k);
                continue;
            } else if (c == '/' && at(k + 1, '*')) {
                int close = text.indexOf("*/", k + 2);
                k = close < 0 ? length : close + 2;
                continue;
            }
            k++;
        }
        fail(j - 2, "the template literal field opened here is never closed; close it with }");
        return -1;
    }

    private int skipQuoted(int i) {
        char quote = text.charAt(i);
        for (int k = i + 1; k < length; k++) {
            char c = text.charAt(k);
            if (c == '\\') {
                k++;
            } else if (c == quote) {
                return k + 1;
            } else if (c == '\n' || c == '\r') {
                break;
            }
        }
        fail(i, "the string opened here is not closed before the end of its line; close it with " + quote);
        return -1;
    }

    /** Decodes the escape at {@code j}; legacy octal escapes only in quoted strings, as the language allows. */
    private int escape(DecodedText out, int j, boolean octal) {
        char e = text.charAt(j + 1);
        switch (e) {
            case '\n', '\u2028', '\u2029':
                return j + 2;
            case '\r':
                return at(j + 2, '\n') ? j + 3 : j + 2;
            case 'b':
                out.decoded('\b', j, j + 2);
                return j + 2;
            case 'f':
                out.decoded('\f', j, j + 2);
                return j + 2;
            case 'n':
                out.decoded('\n', j, j + 2);
                return j + 2;
            case 'r':
                out.decoded('\r', j, j + 2);
                return j + 2;
            case 't':
                out.decoded('\t', j, j + 2);
                return j + 2;
            case 'v':
                out.decoded('\u000b', j, j + 2);
                return j + 2;
            case 'x': {
                int value = hex(j + 2, 2);
                if (value >= 0) {
                    codePoint(out, value, j, j + 4);
                    return j + 4;
                }
                break;
            }
            case 'u': {
                if (at(j + 2, '{')) {
                    int k = j + 3;
                    long value = 0;
                    while (k < length && k < j + 12 && Character.digit(text.charAt(k), 16) >= 0 && text.charAt(k) <= 'f') {
                        value = value * 16 + Character.digit(text.charAt(k), 16);
                        k++;
                    }
                    if (k > j + 3 && at(k, '}') && value <= Character.MAX_CODE_POINT) {
                        codePoint(out, (int) value, j, k + 1);
                        return k + 1;
                    }
                    break;
                }
                int value = hex(j + 2, 4);
                if (value >= 0) {
                    codePoint(out, value, j, j + 6);
                    return j + 6;
                }
                break;
            }
            default:
                boolean nul = e == '0' && !(j + 2 < length && Character.isDigit(text.charAt(j + 2)));
                if (e >= '0' && e <= '7' && (octal || nul)) {
                    int limit = e <= '3' ? j + 4 : j + 3;
                    int k = j + 1;
                    int value = 0;
                    while (k < length && k < limit && text.charAt(k) >= '0' && text.charAt(k) <= '7') {
                        value = value * 8 + text.charAt(k) - '0';
                        k++;
                    }
                    codePoint(out, value, j, k);
                    return k;
                }
                out.decoded(e, j, j + 2);
                return j + 2;
        }
        out.decoded(e, j, j + 2);
        return j + 2;
    }
}
