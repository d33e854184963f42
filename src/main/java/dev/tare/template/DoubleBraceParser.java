package dev.tare.template;

import java.util.List;
import java.util.Set;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * The parser for {@code double-brace} templates (the Mustache and Jinja family): {@code {{ name }}}
 * and {@code {{{ name }}}} are variables, {@code {{> name }}} and {@code {% include "name" %}} are
 * includes, other {@code {% ... %}}, {@code {{# ... }}}, {@code {{/ ... }}}, {@code {{! ... }}} and
 * {@code {# ... #}} are tags. Text inside {@code {% raw %}...{% endraw %}} is literal.
 */
final class DoubleBraceParser extends SegmentParser {
    private static final Pattern QUOTED = Pattern.compile("\"([^\"]*)\"|'([^']*)'");
    private static final Pattern END_RAW = Pattern.compile("\\{%[-+]?\\s*endraw\\s*[-+]?%}");
    private static final Set<String> KEYWORDS = Set.of("else", "true", "false", "none", "null", "not");

    @Override
    List<Segment> parse(String text, int start, int end, Locator locator) {
        Builder out = new Builder(text, locator);
        int i = start;
        int textStart = start;
        while (i < end) {
            int open = text.indexOf('{', i);
            if (open < 0 || open + 1 >= end) {
                break;
            }
            char next = text.charAt(open + 1);
            if (next != '{' && next != '%' && next != '#') {
                i = open + 1;
                continue;
            }
            out.text(textStart, open);
            if (next == '{') {
                i = expression(text, open, end, locator, out);
            } else if (next == '%') {
                i = statement(text, open, end, locator, out);
            } else {
                int close = closing(text, open, "{#", "#}", end, locator);
                out.add(new Segment.Tag(text.substring(open, close), out.span(open, close)));
                i = close;
            }
            textStart = i;
        }
        out.text(textStart, end);
        return out.build();
    }

    private int expression(String text, int open, int end, Locator locator, Builder out) {
        boolean triple = text.startsWith("{{{", open);
        int close = triple ? closing(text, open, "{{{", "}}}", end, locator) : closing(text, open, "{{", "}}", end, locator);
        int width = triple ? 3 : 2;
        String source = text.substring(open, close);
        String inner = stripControl(source, width, source.length() - width);
        Span span = out.span(open, close);
        if (inner.startsWith(">")) {
            String name = unquote(inner.substring(1).trim());
            if (name.isEmpty()) {
                throw error(locator, open, "include '" + source + "' names no template");
            }
            out.add(new Segment.Include(name, source, span));
        } else if (inner.startsWith("&")) {
            out.add(variableOrTag(inner.substring(1).trim(), source, span));
        } else if (inner.isEmpty() || "!#/^".indexOf(inner.charAt(0)) >= 0) {
            out.add(new Segment.Tag(source, span));
        } else {
            out.add(variableOrTag(inner, source, span));
        }
        return close;
    }

    private int statement(String text, int open, int end, Locator locator, Builder out) {
        int close = closing(text, open, "{%", "%}", end, locator);
        String source = text.substring(open, close);
        String inner = stripControl(source, 2, source.length() - 2);
        String keyword = inner.substring(0, wordEnd(inner));
        Span span = out.span(open, close);
        if (keyword.equals("include")) {
            Matcher quoted = QUOTED.matcher(inner);
            if (quoted.find()) {
                String name = quoted.group(1) != null ? quoted.group(1) : quoted.group(2);
                out.add(new Segment.Include(name, source, span));
            } else {
                out.add(new Segment.Tag(source, span));
            }
            return close;
        }
        out.add(new Segment.Tag(source, span));
        if (keyword.equals("raw")) {
            Matcher endRaw = END_RAW.matcher(text).region(close, end);
            if (!endRaw.find()) {
                throw error(locator, open, "'{% raw %}' is never closed; add '{% endraw %}'");
            }
            out.text(close, endRaw.start());
            out.add(new Segment.Tag(endRaw.group(), out.span(endRaw.start(), endRaw.end())));
            return endRaw.end();
        }
        return close;
    }

    /** The offset just past the closing delimiter of the construct opened at {@code open}. */
    private static int closing(String text, int open, String opener, String closer, int end, Locator locator) {
        int close = text.indexOf(closer, open + opener.length());
        int reopened = text.indexOf(opener, open + opener.length());
        if (close < 0 || close + closer.length() > end || (reopened >= 0 && reopened < close)) {
            throw error(locator, open, "'" + opener + "' is never closed; close it with '" + closer
                    + "', or wrap literal braces in {% raw %}...{% endraw %}");
        }
        return close + closer.length();
    }

    private static Segment variableOrTag(String expression, String source, Span span) {
        String name = leadingName(expression);
        if (name == null || KEYWORDS.contains(name.toLowerCase(java.util.Locale.ROOT))) {
            return new Segment.Tag(source, span);
        }
        return new Segment.Variable(name, source, span);
    }

    /**
     * {@code s[from, to)} without whitespace-control marks ({@code -}, {@code ~}, {@code +}) and the
     * blanks around them: stripped, one mark taken off each end, stripped again. Worked out on
     * offsets so that only the result is copied.
     */
    private static String stripControl(String s, int from, int to) {
        int start = skipBlanks(s, from, to);
        int end = dropBlanks(s, start, to);
        if (start < end && "-~+".indexOf(s.charAt(start)) >= 0) {
            start++;
        }
        if (start < end && "-~+".indexOf(s.charAt(end - 1)) >= 0) {
            end--;
        }
        start = skipBlanks(s, start, end);
        return s.substring(start, dropBlanks(s, start, end));
    }

    /** The first offset in {@code [from, to)} that is not white space as {@link String#strip} sees it, else {@code to}. */
    private static int skipBlanks(String s, int from, int to) {
        while (from < to && Character.isWhitespace(s.charAt(from))) {
            from++;
        }
        return from;
    }

    /** The end of {@code s[from, to)} with trailing white space (as {@link String#strip} sees it) left off. */
    private static int dropBlanks(String s, int from, int to) {
        while (to > from && Character.isWhitespace(s.charAt(to - 1))) {
            to--;
        }
        return to;
    }

    /** The end of the statement's first word: the first character a regular expression's {@code \s} matches. */
    private static int wordEnd(String inner) {
        for (int i = 0; i < inner.length(); i++) {
            if (" \t\n\013\f\r".indexOf(inner.charAt(i)) >= 0) {
                return i;
            }
        }
        return inner.length();
    }

    private static String unquote(String name) {
        if (name.length() >= 2 && (name.startsWith("\"") && name.endsWith("\"") || name.startsWith("'") && name.endsWith("'"))) {
            return name.substring(1, name.length() - 1);
        }
        return name;
    }
}
