package dev.tare.template;

import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * The parser for {@code double-brace} templates (the Mustache, Handlebars and Jinja family), read
 * as written: <code>{{ name }}</code> and <code>{{{ name }}}</code> are variables, <code>{{> name }}</code>
 * and {@code {% include "name" %}} are includes, and every other <code>{% ... %}</code>,
 * <code>{{# ... }}</code>, <code>{{^ ... }}</code>, <code>{{/ ... }}</code>, <code>{{! ... }}</code> and
 * {@code {# ... #}} is a tag whose {@link Control} says what it renders: loops, conditionals,
 * sections, {@code set}, macros and their calls, string literals. Text inside
 * {@code {% raw %}...{% endraw %}} is literal. A quoted <code>}}</code> or {@code %}} does not close
 * its construct. Whitespace control ({@code -} in Jinja, {@code ~} in Handlebars) and Mustache's
 * standalone lines (a block or comment tag alone on its line takes the line with it) are applied to
 * the rendered text of the neighbouring text segments. Blocks must be balanced.
 */
final class DoubleBraceParser extends SegmentParser {
    private static final Pattern QUOTED = Pattern.compile("\"([^\"]*)\"|'([^']*)'");
    private static final Pattern LONG_COMMENT_END = Pattern.compile("--~?}}");
    private static final Pattern END_RAW = Pattern.compile("\\{%[-+]?\\s*endraw\\s*[-+]?%}");
    private static final Pattern MACRO = Pattern.compile("\\{%[-+]?\\s*macro\\s+([\\p{L}_][\\p{L}\\p{N}_]*)");
    private static final Pattern IMPORT_AS = Pattern.compile("\\{%[-+]?\\s*import\\s[^%]*?\\sas\\s+([\\p{L}_][\\p{L}\\p{N}_]*)");
    private static final Pattern FROM_IMPORT = Pattern.compile("\\{%[-+]?\\s*from\\s[^%]*?\\simport\\s+([^%]*?)\\s*[-+]?%}");
    private static final Pattern FOR = Pattern.compile("^(.+?)\\s+in\\s+(.+?)(?:\\s+if\\s+.*?)?(?:\\s+recursive)?$", Pattern.DOTALL);
    private static final Pattern BLOCK_PARAMS = Pattern.compile("^(.*?)\\s+as\\s+\\|([^|]*)\\|$", Pattern.DOTALL);
    /** Jinja's paired statements, closed by {@code end} and the keyword. */
    static final Set<String> JINJA_BLOCKS = Set.of("for", "if", "macro", "call", "filter", "set", "block", "with",
            "autoescape", "trans");

    /** How much white space a construct takes from the text beside it. */
    private enum Strip { NONE, LINE, ALL }

    @Override
    List<Segment> parse(String text, int start, int end, Locator locator) {
        List<Segment> segments = new Run(text, start, end, locator).parse();
        Blocks.check(segments);
        return segments;
    }

    /** The state of one parse: the parser itself is shared by every thread. */
    private static final class Run {
        private final String text;
        private final int start;
        private final int end;
        private final Locator locator;
        private final Builder out;
        private final Set<String> macros;
        private final Set<String> imported;
        /** Where the text not yet added starts. */
        private int textStart;
        /** Whether the previous construct takes the white space after it. */
        private boolean stripNext;

        Run(String text, int start, int end, Locator locator) {
            this.text = text;
            this.start = start;
            this.end = end;
            this.locator = locator;
            this.out = new Builder(text, locator);
            Set<String> statements = statementWords(text, start, end);
            this.macros = statements.contains("macro") ? names(MACRO, text, start, end) : Set.of();
            this.imported = statements.contains("import") || statements.contains("from")
                    ? importedNames(text, start, end) : Set.of();
            this.textStart = start;
        }

        List<Segment> parse() {
            int i = start;
            while (i < end) {
                int open = text.indexOf('{', i);
                if (open < 0 || open + 1 >= end) {
                    break;
                }
                char next = text.charAt(open + 1);
                if (next == '{') {
                    i = expression(open);
                } else if (next == '%') {
                    i = statement(open);
                } else if (next == '#') {
                    i = comment(open);
                } else {
                    i = open + 1;
                }
            }
            textBefore(end, Strip.NONE);
            return out.build();
        }

        private int comment(int open) {
            int close = closing(open, "{#", "#}", false);
            add(open, close, new Segment.Tag(text.substring(open, close), out.span(open, close)),
                    marked(open + 2, '-') ? Strip.ALL : Strip.NONE, marked(close - 3, '-'));
            return textStart;
        }

        private int expression(int open) {
            boolean triple = text.startsWith("{{{", open);
            int marks = open + 2 < end && text.charAt(open + 2) == '~' ? open + 3 : open + 2;
            if (!triple && text.startsWith("!", marks)) {
                return handlebarsComment(open, marks);
            }
            int close = triple ? closing(open, "{{{", "}}}", true) : closing(open, "{{", "}}", true);
            int width = triple ? 3 : 2;
            String source = text.substring(open, close);
            String inner = stripControl(source, width, source.length() - width);
            Span span = out.span(open, close);
            boolean stripBefore = marked(open + width, '-') || marked(open + width, '~');
            boolean stripAfter = marked(close - width - 1, '-') || marked(close - width - 1, '~');
            Segment segment;
            if (inner.startsWith(">")) {
                String name = unquote(inner.substring(1).trim());
                if (name.isEmpty()) {
                    throw error(locator, open, "include '" + source + "' names no template");
                }
                segment = new Segment.Include(name, source, span);
            } else if (inner.startsWith("&")) {
                segment = value(inner.substring(1).trim(), source, span);
            } else if (inner.startsWith("#") || inner.startsWith("^") || inner.startsWith("/")
                    || inner.equals("else") || inner.startsWith("else ")) {
                segment = new Segment.Tag(source, span, handlebarsBlock(inner));
                Strip before = stripBefore ? Strip.ALL : standalone(open, close) ? Strip.LINE : Strip.NONE;
                add(open, close, segment, before, stripAfter);
                return textStart;
            } else if (inner.isEmpty()) {
                segment = new Segment.Tag(source, span);
            } else {
                segment = value(inner, source, span);
            }
            add(open, close, segment, stripBefore ? Strip.ALL : Strip.NONE, stripAfter);
            return textStart;
        }

        /** <code>{{! comment }}</code>, or <code>{{!-- comment --}}</code>, which may hold <code>}}</code>. */
        private int handlebarsComment(int open, int bang) {
            int close;
            if (text.startsWith("!--", bang)) {
                Matcher closer = LONG_COMMENT_END.matcher(text).region(bang + 3, end);
                if (!closer.find()) {
                    throw error(locator, open, "'{{!--' is never closed; end the comment with '--}}'");
                }
                close = closer.end();
            } else {
                close = closing(open, "{{", "}}", false);
            }
            Segment.Tag tag = new Segment.Tag(text.substring(open, close), out.span(open, close));
            boolean stripBefore = bang > open + 2;
            add(open, close, tag, stripBefore ? Strip.ALL : standalone(open, close) ? Strip.LINE : Strip.NONE,
                    marked(close - 3, '~'));
            return textStart;
        }

        private int statement(int open) {
            int close = closing(open, "{%", "%}", true);
            String source = text.substring(open, close);
            String inner = stripControl(source, 2, source.length() - 2);
            int wordEnd = wordEnd(inner);
            String keyword = inner.substring(0, wordEnd);
            String rest = inner.substring(wordEnd).strip();
            Span span = out.span(open, close);
            Strip before = marked(open + 2, '-') ? Strip.ALL : Strip.NONE;
            boolean after = marked(close - 3, '-');
            if (keyword.equals("include")) {
                Matcher quoted = QUOTED.matcher(inner);
                Segment segment = quoted.find()
                        ? new Segment.Include(quoted.group(1) != null ? quoted.group(1) : quoted.group(2), source, span)
                        : new Segment.Tag(source, span);
                add(open, close, segment, before, after);
                return textStart;
            }
            if (keyword.equals("raw")) {
                return raw(open, close, source, span, before, after);
            }
            add(open, close, new Segment.Tag(source, span, jinjaStatement(keyword, rest)), before, after);
            return textStart;
        }

        private int raw(int open, int close, String source, Span span, Strip before, boolean after) {
            Matcher endRaw = END_RAW.matcher(text).region(close, end);
            if (!endRaw.find()) {
                throw error(locator, open, "'{% raw %}' is never closed; add '{% endraw %}'");
            }
            add(open, close, new Segment.Tag(source, span), before, after);
            int endOpen = endRaw.start();
            Strip endBefore = marked(endOpen + 2, '-') ? Strip.ALL : Strip.NONE;
            add(endOpen, endRaw.end(), new Segment.Tag(endRaw.group(), out.span(endOpen, endRaw.end())), endBefore,
                    marked(endRaw.end() - 3, '-'));
            return textStart;
        }

        /**
         * Adds the text before {@code open}, stripped as the construct and the one before it ask,
         * then the construct's segment, and notes how it strips the text after it.
         */
        private void add(int open, int close, Segment segment, Strip before, boolean stripAfter) {
            textBefore(open, before);
            out.add(segment);
            textStart = close;
            stripNext = stripAfter;
            if (!stripAfter && before == Strip.LINE) {
                int lineEnd = lineEnd(close);
                if (lineEnd > close) {
                    out.literal(close, lineEnd, "");
                }
                textStart = lineEnd;
            }
        }

        private void textBefore(int to, Strip strip) {
            int from = textStart;
            if (stripNext) {
                int kept = from;
                while (kept < to && Character.isWhitespace(text.charAt(kept))) {
                    kept++;
                }
                if (kept > from) {
                    out.literal(from, kept, "");
                }
                from = kept;
            }
            int cut = to;
            if (strip == Strip.ALL) {
                while (cut > from && Character.isWhitespace(text.charAt(cut - 1))) {
                    cut--;
                }
            } else if (strip == Strip.LINE) {
                while (cut > from && (text.charAt(cut - 1) == ' ' || text.charAt(cut - 1) == '\t')) {
                    cut--;
                }
            }
            out.text(from, cut);
            if (cut < to) {
                out.literal(cut, to, "");
            }
        }

        /**
         * Whether the Mustache tag {@code text[open, close)} stands alone on its line: only spaces
         * and tabs before it since the line's start (with no other construct there) and after it
         * up to the line break.
         */
        private boolean standalone(int open, int close) {
            int lineStart = open;
            while (lineStart > textStart && (text.charAt(lineStart - 1) == ' ' || text.charAt(lineStart - 1) == '\t')) {
                lineStart--;
            }
            boolean begins = lineStart == start || text.charAt(lineStart - 1) == '\n' || text.charAt(lineStart - 1) == '\r';
            if (!begins || lineStart < textStart) {
                return false;
            }
            int after = close;
            while (after < end && (text.charAt(after) == ' ' || text.charAt(after) == '\t')) {
                after++;
            }
            return after == end || text.charAt(after) == '\n' || text.charAt(after) == '\r';
        }

        /** The offset past the spaces, tabs and line break after {@code from}. */
        private int lineEnd(int from) {
            int at = from;
            while (at < end && (text.charAt(at) == ' ' || text.charAt(at) == '\t')) {
                at++;
            }
            if (at < end && text.charAt(at) == '\r') {
                at++;
            }
            if (at < end && text.charAt(at) == '\n') {
                at++;
            }
            return at;
        }

        private boolean marked(int at, char mark) {
            return at >= start && at < end && text.charAt(at) == mark;
        }

        /**
         * The offset just past the closing delimiter of the construct opened at {@code open}. With
         * {@code quotes}, a closer inside a string literal does not count; a literal left open on
         * its line falls back to the first closer, as a construct without literals is read.
         */
        private int closing(int open, String opener, String closer, boolean quotes) {
            int from = open + opener.length();
            if (quotes) {
                for (int i = from; i < end; i++) {
                    char c = text.charAt(i);
                    if (c == '\\') {
                        i++;
                    } else if (c == '\'' || c == '"') {
                        int after = Expression.literalEnd(text, i, end);
                        if (after < 0) {
                            break;
                        }
                        i = after - 1;
                    } else if (text.startsWith(closer, i) && i + closer.length() <= end) {
                        return i + closer.length();
                    } else if (text.startsWith(opener, i)) {
                        throw unclosed(open, opener, closer);
                    }
                }
            }
            int close = text.indexOf(closer, from);
            int reopened = text.indexOf(opener, from);
            if (close < 0 || close + closer.length() > end || (reopened >= 0 && reopened < close)) {
                throw unclosed(open, opener, closer);
            }
            return close + closer.length();
        }

        private TemplateSyntaxException unclosed(int open, String opener, String closer) {
            return error(locator, open, "'" + opener + "' is never closed; close it with '" + closer
                    + "', or wrap literal braces in {% raw %}...{% endraw %}");
        }

        /** A <code>{{ ... }}</code> that prints something: a variable, a literal, a macro call, or nothing known. */
        private Segment value(String expression, String source, Span span) {
            String literal = Expression.literal(expression);
            if (literal != null) {
                return new Segment.Tag(source, span, new Control.Literal(literal));
            }
            String callee = SegmentParser.leadingName(expression);
            if (callee != null && macros.contains(callee)) {
                int paren = skipBlanks(expression, callee.length(), expression.length());
                if (paren < expression.length() && expression.charAt(paren) == '(') {
                    return new Segment.Tag(source, span, new Control.Call(callee, Expression.arguments(expression, paren)));
                }
            }
            String name = Expression.variable(expression, imported);
            return name == null ? new Segment.Tag(source, span) : new Segment.Variable(name, source, span);
        }
    }

    /** What a Handlebars or Mustache block tag does: <code>{{#each}}</code>, <code>{{^x}}</code>, <code>{{/x}}</code>, <code>{{else}}</code>. */
    private static Control handlebarsBlock(String inner) {
        if (inner.startsWith("/")) {
            return new Control.Close(firstWord(inner.substring(1).strip()));
        }
        if (inner.startsWith("else")) {
            String condition = inner.substring(4).strip();
            return new Control.Middle("else", condition.startsWith("if ") ? condition.substring(3).strip() : condition);
        }
        String rest = inner.substring(1).strip();
        if (inner.startsWith("^")) {
            return rest.isEmpty() ? new Control.Middle("else", "")
                    : new Control.Open(Control.Block.INVERTED, firstWord(rest), rest, List.of(), List.of());
        }
        if (rest.startsWith("*")) {
            return new Control.Open(Control.Block.HIDDEN, firstWord(rest.substring(1).strip()), "", List.of(), List.of());
        }
        if (rest.startsWith(">")) {
            String partial = unquote(firstWord(rest.substring(1).strip()));
            return new Control.Open(Control.Block.SCOPE, partial, partial, List.of(), List.of());
        }
        String keyword = firstWord(rest);
        String arguments = rest.substring(keyword.length()).strip();
        List<String> params = List.of();
        Matcher blockParams = BLOCK_PARAMS.matcher(arguments);
        if (blockParams.matches()) {
            arguments = blockParams.group(1).strip();
            params = Expression.words(blockParams.group(2).strip()).stream().filter(w -> !w.isEmpty()).toList();
        }
        return switch (keyword) {
            case "each" -> new Control.Open(Control.Block.LOOP, keyword, arguments, params, List.of());
            case "if", "unless" -> new Control.Open(Control.Block.CONDITION, keyword, arguments, List.of(), List.of());
            case "with" -> new Control.Open(Control.Block.WITH, keyword, arguments, params, List.of());
            default -> arguments.isEmpty()
                    ? new Control.Open(Control.Block.SECTION, keyword, keyword, params, List.of())
                    : new Control.Open(Control.Block.CONDITION, keyword, arguments, List.of(), List.of());
        };
    }

    /** What a Jinja statement other than {@code include} and {@code raw} does. */
    private static Control jinjaStatement(String keyword, String rest) {
        switch (keyword) {
            case "for" -> {
                Matcher loop = FOR.matcher(rest);
                if (!loop.matches()) {
                    return new Control.Open(Control.Block.LOOP, keyword, rest, List.of(), List.of());
                }
                List<String> names = new ArrayList<>();
                for (String name : loop.group(1).replace("(", " ").replace(")", " ").split(",")) {
                    if (!name.isBlank()) {
                        names.add(name.strip());
                    }
                }
                return new Control.Open(Control.Block.LOOP, keyword, loop.group(2).strip(), names, List.of());
            }
            case "if" -> {
                return new Control.Open(Control.Block.CONDITION, keyword, rest, List.of(), List.of());
            }
            case "elif", "pluralize" -> {
                return new Control.Middle(keyword, rest);
            }
            case "else" -> {
                return new Control.Middle(keyword, "");
            }
            case "set" -> {
                int equals = Expression.topLevelEquals(rest);
                String target = SegmentParser.leadingName(equals < 0 ? rest : rest.substring(0, equals).strip());
                if (equals >= 0) {
                    return new Control.Assign(target == null ? "" : target, rest.substring(equals + 1).strip());
                }
                return new Control.Open(Control.Block.CAPTURE, keyword, "", target == null ? List.of() : List.of(target),
                        List.of());
            }
            case "macro" -> {
                String name = SegmentParser.leadingName(rest);
                int paren = rest.indexOf('(');
                List<String> params = paren < 0 ? List.of() : Expression.arguments(rest, paren);
                return new Control.Open(Control.Block.MACRO, keyword, name == null ? "" : name, params, List.of());
            }
            case "call" -> {
                String call = rest;
                if (call.startsWith("(")) {
                    int close = call.indexOf(')');
                    call = close < 0 ? "" : call.substring(close + 1).strip();
                }
                String name = SegmentParser.leadingName(call);
                int paren = call.indexOf('(');
                List<String> arguments = paren < 0 ? List.of() : Expression.arguments(call, paren);
                return new Control.Open(Control.Block.CALL, keyword, name == null ? "" : name, List.of(), arguments);
            }
            case "with" -> {
                List<String> assignments = rest.isEmpty() ? List.of() : Expression.arguments("(" + rest + ")", 0);
                return new Control.Open(Control.Block.SCOPE, keyword, "", assignments, List.of());
            }
            case "filter", "block", "autoescape", "trans" -> {
                return new Control.Open(Control.Block.SCOPE, keyword, rest, List.of(), List.of());
            }
            default -> {
                if (keyword.startsWith("end") && JINJA_BLOCKS.contains(keyword.substring(3))) {
                    return new Control.Close(keyword.substring(3));
                }
                return Control.NONE;
            }
        }
    }

    /** Names the text defines with a pattern whose first group is the name. */
    private static Set<String> names(Pattern pattern, String text, int start, int end) {
        Set<String> names = new HashSet<>();
        Matcher matcher = pattern.matcher(text).region(start, end);
        while (matcher.find()) {
            names.add(matcher.group(1));
        }
        return names;
    }

    /**
     * The first word of each statement tag in {@code text[start, end)}, after {@code {%} and any
     * whitespace control: most templates have no macro or import, so the tags are looked at, all in
     * one pass, before any pattern runs over the whole text.
     */
    private static Set<String> statementWords(String text, int start, int end) {
        Set<String> words = new HashSet<>();
        for (int open = text.indexOf("{%", start); open >= 0 && open < end; open = text.indexOf("{%", open + 2)) {
            int at = open + 2;
            if (at < end && "-+".indexOf(text.charAt(at)) >= 0) {
                at++;
            }
            while (at < end && Character.isWhitespace(text.charAt(at))) {
                at++;
            }
            int wordEnd = at;
            while (wordEnd < end && Character.isLetter(text.charAt(wordEnd))) {
                wordEnd++;
            }
            words.add(text.substring(at, wordEnd));
        }
        return words;
    }

    /** The names {@code {% import ... as m %}} and {@code {% from ... import a, b as c %}} bind. */
    private static Set<String> importedNames(String text, int start, int end) {
        Set<String> names = names(IMPORT_AS, text, start, end);
        for (String list : names(FROM_IMPORT, text, start, end)) {
            for (String item : list.split(",")) {
                String[] words = item.strip().split("\\s+");
                names.add(words[words.length - 1]);
            }
        }
        return names;
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

    private static String firstWord(String s) {
        int end = 0;
        while (end < s.length() && !Character.isWhitespace(s.charAt(end))) {
            end++;
        }
        return s.substring(0, end);
    }

    private static String unquote(String name) {
        if (name.length() >= 2 && (name.startsWith("\"") && name.endsWith("\"") || name.startsWith("'") && name.endsWith("'"))) {
            return name.substring(1, name.length() - 1);
        }
        return name;
    }
}
