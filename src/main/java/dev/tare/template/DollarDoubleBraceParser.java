package dev.tare.template;

import java.util.ArrayList;
import java.util.List;

/**
 * The parser for {@code dollar-double-brace} templates: {@code {{$name}}} is a variable,
 * {@code {{fn}}}, {@code {{plugin.fn $x}}}, {@code {{fn "text"}}} and {@code {{fn key=$x}}} are
 * function calls, and a block holding only a quoted value, {@code {{ "text" }}}, is that text; such
 * templates write a literal {@code {{} as {@code {{ "{{" }}}. Quoted values may hold {@code }}} and
 * escape a quote or a backslash with a backslash. An empty block, {@code {{ }}}, is literal text.
 */
final class DollarDoubleBraceParser extends SegmentParser {
    private static final String LITERAL = "write {{ \"{{\" }} for a literal '{{'";

    @Override
    List<Segment> parse(String text, int start, int end, Locator locator) {
        Builder out = new Builder(text, locator);
        int i = start;
        int textStart = start;
        while (i < end) {
            int open = text.indexOf("{{", i);
            if (open < 0 || open + 2 > end) {
                break;
            }
            // Of a run of braces, the last two open the block and the others are text, as such
            // templates read "{{{$name}}}".
            while (open + 2 < end && text.charAt(open + 2) == '{') {
                open++;
            }
            int close = closing(text, open, end, locator);
            out.text(textStart, open);
            block(text, open, close, locator, out);
            i = close;
            textStart = i;
        }
        out.text(textStart, end);
        return out.build();
    }

    /** The offset just past the {@code }}} that closes the block opened at {@code open}, skipping quoted values. */
    private static int closing(String text, int open, int end, Locator locator) {
        int k = open + 2;
        while (k + 1 < end) {
            char c = text.charAt(k);
            if (c == '"' || c == '\'') {
                k = quoteEnd(text, k, end, locator);
            } else if (c == '}' && text.charAt(k + 1) == '}') {
                return k + 2;
            } else if (c == '{' && text.charAt(k + 1) == '{') {
                break;
            } else {
                k++;
            }
        }
        throw error(locator, open, "'{{' is never closed; close it with '}}', or " + LITERAL);
    }

    /** The offset just past the quote that closes the value opened at {@code quote}. */
    private static int quoteEnd(String text, int quote, int end, Locator locator) {
        char mark = text.charAt(quote);
        for (int k = quote + 1; k < end; k++) {
            char c = text.charAt(k);
            if (c == '\\' && k + 1 < end && isEscapable(text.charAt(k + 1))) {
                k++;
            } else if (c == mark) {
                return k + 1;
            }
        }
        throw error(locator, quote, "the quoted value is never closed; end it with " + mark
                + ", or write \\" + mark + " for a quote inside it");
    }

    private static boolean isEscapable(char c) {
        return c == '"' || c == '\'' || c == '\\';
    }

    /** Adds the segment for the block {@code text[open, close)}. */
    private static void block(String text, int open, int close, Locator locator, Builder out) {
        List<Token> tokens = tokens(text, open + 2, close - 2);
        String source = text.substring(open, close);
        if (tokens.isEmpty()) {
            out.text(open, close);
            return;
        }
        Token first = tokens.get(0);
        if (first.kind() == Kind.VALUE || first.isVariable()) {
            if (tokens.size() > 1) {
                throw error(locator, tokens.get(1).offset(), "a block that starts with " + (first.isVariable()
                        ? "a variable" : "a quoted value") + " holds nothing else; write each in a block of its own");
            }
            if (first.kind() == Kind.VALUE) {
                out.literal(open, close, first.value());
            } else {
                out.add(new Segment.Variable(variableName(first, locator), source, out.span(open, close)));
            }
            return;
        }
        if (first.kind() != Kind.WORD || !isFunctionName(first.value())
                || tokens.size() > 1 && tokens.get(1).kind() == Kind.EQUALS) {
            throw error(locator, first.offset(), "'" + source + "' is neither a variable ($name), a function call"
                    + " (name or plugin.name, then arguments) nor a quoted value; " + LITERAL);
        }
        out.add(new Segment.Call(first.value(), arguments(tokens, source, locator), source, out.span(open, close)));
    }

    /** The variables a call passes: each {@code $name}, alone or as a named argument's value. */
    private static List<String> arguments(List<Token> tokens, String source, Locator locator) {
        List<String> names = new ArrayList<>();
        int k = 1;
        while (k < tokens.size()) {
            Token token = tokens.get(k);
            if (token.kind() == Kind.WORD && !token.isVariable() && k + 2 < tokens.size()
                    && tokens.get(k + 1).kind() == Kind.EQUALS) {
                token = tokens.get(k + 2);
                k += 2;
                if (token.kind() == Kind.EQUALS || token.kind() == Kind.WORD && !token.isVariable()) {
                    throw notAnArgument(token, source, locator);
                }
            } else if (token.kind() != Kind.VALUE && !token.isVariable()) {
                throw notAnArgument(token, source, locator);
            }
            if (token.isVariable()) {
                names.add(variableName(token, locator));
            }
            k++;
        }
        return names;
    }

    private static TemplateSyntaxException notAnArgument(Token token, String source, Locator locator) {
        return error(locator, token.offset(), "'" + token.value() + "' in '" + source + "' is not an argument; pass"
                + " a variable ($name), a quoted value (\"text\"), or name=$value");
    }

    private static String variableName(Token token, Locator locator) {
        String name = token.value().substring(1);
        if (name.isEmpty() || !name.chars().allMatch(DollarDoubleBraceParser::isNameChar)) {
            throw error(locator, token.offset(), "'" + token.value() + "' is not a variable: after '$' write a name"
                    + " of letters, digits and underscores");
        }
        return name;
    }

    /** A function name: letters, digits and underscores, with at most one dot between a plugin's name and the function's. */
    private static boolean isFunctionName(String word) {
        int dot = word.indexOf('.');
        if (dot != word.lastIndexOf('.') || dot == 0 || dot == word.length() - 1) {
            return false;
        }
        return word.chars().allMatch(c -> c == '.' || isNameChar(c));
    }

    private static boolean isNameChar(int c) {
        return c >= 'a' && c <= 'z' || c >= 'A' && c <= 'Z' || c >= '0' && c <= '9' || c == '_';
    }

    /**
     * The tokens of a block's inside {@code text[from, to)}: words, quoted values (with their escapes
     * read) and the {@code =} of named arguments, each with its offset.
     */
    private static List<Token> tokens(String text, int from, int to) {
        List<Token> tokens = new ArrayList<>();
        int k = from;
        while (k < to) {
            char c = text.charAt(k);
            if (Character.isWhitespace(c)) {
                k++;
            } else if (c == '=') {
                tokens.add(new Token(Kind.EQUALS, "=", k));
                k++;
            } else if (c == '"' || c == '\'') {
                StringBuilder value = new StringBuilder();
                int at = k + 1;
                while (text.charAt(at) != c) {
                    if (text.charAt(at) == '\\' && isEscapable(text.charAt(at + 1))) {
                        at++;
                    }
                    value.append(text.charAt(at));
                    at++;
                }
                tokens.add(new Token(Kind.VALUE, value.toString(), k));
                k = at + 1;
            } else {
                int at = k;
                while (at < to && !Character.isWhitespace(text.charAt(at)) && "='\"".indexOf(text.charAt(at)) < 0) {
                    at++;
                }
                tokens.add(new Token(Kind.WORD, text.substring(k, at), k));
                k = at;
            }
        }
        return tokens;
    }

    private enum Kind { WORD, VALUE, EQUALS }

    /** One token of a block: its kind, its text (a value's with escapes read) and its offset in the source. */
    private record Token(Kind kind, String value, int offset) {
        boolean isVariable() {
            return kind == Kind.WORD && value.startsWith("$");
        }
    }
}
