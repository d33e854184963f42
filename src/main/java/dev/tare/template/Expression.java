package dev.tare.template;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Set;

/**
 * Reads the expressions inside double-brace tags far enough to measure them: string literals, the
 * variable an expression reads (through filters, calls and Handlebars helpers), and argument lists.
 */
final class Expression {
    /** Words that lead an expression naming no variable (compared in lower case). */
    private static final Set<String> KEYWORDS = Set.of("else", "true", "false", "none", "null", "not");
    /** Words that may follow a variable in a Jinja expression, so that what follows is no helper argument. */
    private static final Set<String> OPERATOR_WORDS = Set.of("if", "else", "and", "or", "in", "is", "not");

    private Expression() {
    }

    /** Whether {@code name} is a keyword rather than a variable. */
    static boolean isKeyword(String name) {
        return KEYWORDS.contains(name.toLowerCase(Locale.ROOT));
    }

    /**
     * The offset just past the string literal whose opening quote stands at {@code at}, or -1 when it
     * is not closed before {@code end} or before a line break (a literal that runs on is read as
     * text, not searched for to the end of the file).
     */
    static int literalEnd(String text, int at, int end) {
        char quote = text.charAt(at);
        for (int i = at + 1; i < end; i++) {
            char c = text.charAt(i);
            if (c == '\\') {
                i++;
            } else if (c == quote) {
                return i + 1;
            } else if (c == '\n' || c == '\r') {
                return -1;
            }
        }
        return -1;
    }

    /** The value of an expression that is one string literal ({@code '{{'}, {@code "a \"b\""}), or null. */
    static String literal(String expression) {
        String e = expression.strip();
        if (e.length() < 2 || (e.charAt(0) != '\'' && e.charAt(0) != '"') || literalEnd(e, 0, e.length()) != e.length()) {
            return null;
        }
        StringBuilder value = new StringBuilder(e.length());
        for (int i = 1; i < e.length() - 1; i++) {
            char c = e.charAt(i);
            if (c == '\\' && i + 1 < e.length() - 1) {
                char next = e.charAt(++i);
                value.append(next == 'n' ? '\n' : next == 't' ? '\t' : next);
            } else {
                value.append(c);
            }
        }
        return value.toString();
    }

    /**
     * The dotted name of the variable an expression reads, or null when it reads none:
     * {@code name} for {@code name | default('none')}; {@code x} for a function call {@code fmt(x)}
     * (the function's name when no argument is a variable: {@code today()}); {@code a.b} for a
     * method call {@code a.b.upper()}; {@code due} for a Handlebars helper {@code formatDate due "short"};
     * {@code this} for Mustache's {@code .}.
     *
     * @param imported names bound to imported templates, whose calls read only their arguments
     */
    static String variable(String expression, Set<String> imported) {
        String e = expression.strip();
        if (e.equals(".")) {
            return "this";
        }
        String name = SegmentParser.leadingName(e);
        if (name == null || isKeyword(name)) {
            return null;
        }
        int at = skipBlanks(e, name.length());
        if (at < e.length() && e.charAt(at) == '(') {
            boolean bare = name.indexOf('.') < 0;
            if (bare || imported.contains(root(name))) {
                String argument = firstVariable(arguments(e, at), imported);
                return argument != null ? argument : bare ? name : null;
            }
            return name.substring(0, name.lastIndexOf('.'));
        }
        if (at > name.length() && at < e.length() && startsArgument(e.charAt(at))) {
            List<String> words = words(e.substring(at));
            if (!OPERATOR_WORDS.contains(words.get(0))) {
                String argument = firstVariable(words, imported);
                return argument != null ? argument : name;
            }
        }
        return name;
    }

    /** The first part of a dotted name. */
    static String root(String name) {
        int dot = name.indexOf('.');
        return dot < 0 ? name : name.substring(0, dot);
    }

    /**
     * The arguments of the parenthesised list opening at {@code e[open]}, split at top-level commas
     * and stripped; to the end of {@code e} when the list is not closed.
     */
    static List<String> arguments(String e, int open) {
        List<String> arguments = new ArrayList<>();
        int depth = 0;
        int from = open + 1;
        for (int i = open + 1; i < e.length(); i++) {
            char c = e.charAt(i);
            if (c == '\'' || c == '"') {
                int after = literalEnd(e, i, e.length());
                i = (after < 0 ? e.length() : after) - 1;
            } else if (c == '(' || c == '[' || c == '{') {
                depth++;
            } else if ((c == ')' || c == ']' || c == '}') && depth > 0) {
                depth--;
            } else if (c == ')') {
                add(arguments, e.substring(from, i));
                return arguments;
            } else if (c == ',' && depth == 0) {
                add(arguments, e.substring(from, i));
                from = i + 1;
            }
        }
        add(arguments, e.substring(Math.min(from, e.length())));
        return arguments;
    }

    /**
     * The value of a keyword argument {@code name=value} (or {@code name: value}), else the argument
     * itself; a comparison {@code a == b} is not a keyword argument.
     */
    static String argumentValue(String argument) {
        int equals = topLevelEquals(argument);
        return equals < 0 ? argument : argument.substring(equals + 1).strip();
    }

    /** The name of a keyword argument, or null for a positional one. */
    static String argumentName(String argument) {
        int equals = topLevelEquals(argument);
        if (equals < 0) {
            return null;
        }
        String name = argument.substring(0, equals).strip();
        return SegmentParser.leadingName(name) != null && SegmentParser.leadingName(name).equals(name) ? name : null;
    }

    /** The offset of a lone {@code =} outside quotes and brackets, or -1. */
    static int topLevelEquals(String s) {
        int depth = 0;
        for (int i = 0; i < s.length(); i++) {
            char c = s.charAt(i);
            if (c == '\'' || c == '"') {
                int after = literalEnd(s, i, s.length());
                if (after < 0) {
                    return -1;
                }
                i = after - 1;
            } else if (c == '(' || c == '[' || c == '{') {
                depth++;
            } else if (c == ')' || c == ']' || c == '}') {
                depth--;
            } else if (c == '=' && depth == 0) {
                boolean comparison = i + 1 < s.length() && s.charAt(i + 1) == '='
                        || i > 0 && "=!<>".indexOf(s.charAt(i - 1)) >= 0;
                if (!comparison) {
                    return i;
                }
                i++;
            }
        }
        return -1;
    }

    /** Blank-separated words, keeping quoted text and bracketed groups whole. */
    static List<String> words(String s) {
        List<String> words = new ArrayList<>();
        int i = 0;
        while (i < s.length()) {
            i = skipBlanks(s, i);
            if (i >= s.length()) {
                break;
            }
            int start = i;
            int depth = 0;
            while (i < s.length() && (depth > 0 || !Character.isWhitespace(s.charAt(i)))) {
                char c = s.charAt(i);
                if (c == '\'' || c == '"') {
                    int after = literalEnd(s, i, s.length());
                    i = after < 0 ? s.length() : after;
                    continue;
                }
                if (c == '(') {
                    depth++;
                } else if (c == ')' && depth > 0) {
                    depth--;
                }
                i++;
            }
            words.add(s.substring(start, i));
        }
        if (words.isEmpty()) {
            words.add("");
        }
        return words;
    }

    private static String firstVariable(List<String> arguments, Set<String> imported) {
        for (String argument : arguments) {
            String value = argumentValue(argument);
            if (value.startsWith("(") && value.endsWith(")")) {
                // A Handlebars subexpression, (lookup person "name"): its own helper and arguments.
                value = value.substring(1, value.length() - 1);
            }
            String name = variable(value, imported);
            if (name != null && !name.equals("this")) {
                return name;
            }
        }
        return null;
    }

    private static boolean startsArgument(char c) {
        return Character.isLetterOrDigit(c) || c == '_' || c == '\'' || c == '"' || c == '(' || c == '@';
    }

    private static void add(List<String> arguments, String argument) {
        String stripped = argument.strip();
        if (!stripped.isEmpty()) {
            arguments.add(stripped);
        }
    }

    private static int skipBlanks(String s, int from) {
        while (from < s.length() && Character.isWhitespace(s.charAt(from))) {
            from++;
        }
        return from;
    }
}
