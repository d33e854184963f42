package dev.tare.template;

import java.util.List;

/**
 * The parser for {@code dollar-brace} templates: {@code ${name}} is a variable ({@code ${expr}}
 * without a leading name is a tag), and {@code \$}{@code {} is a literal {@code $}{@code {}.
 */
final class DollarBraceParser extends SegmentParser {
    @Override
    List<Segment> parse(String text, int start, int end, Locator locator) {
        Builder out = new Builder(text, locator);
        int i = start;
        int textStart = start;
        while (i < end) {
            int open = text.indexOf("${", i);
            if (open < 0 || open + 2 > end) {
                break;
            }
            if (open > start && text.charAt(open - 1) == '\\') {
                out.text(textStart, open - 1);
                out.literal(open - 1, open + 2, "${");
                i = open + 2;
                textStart = i;
                continue;
            }
            out.text(textStart, open);
            int close = closing(text, open, end, locator);
            String source = text.substring(open, close);
            String inner = source.substring(2, source.length() - 1).strip();
            String name = leadingName(inner);
            Span span = out.span(open, close);
            out.add(name == null ? new Segment.Tag(source, span) : new Segment.Variable(name, source, span));
            i = close;
            textStart = i;
        }
        out.text(textStart, end);
        return out.build();
    }

    private static int closing(String text, int open, int end, Locator locator) {
        int depth = 0;
        for (int k = open + 1; k < end; k++) {
            char c = text.charAt(k);
            if (c == '{') {
                depth++;
            } else if (c == '}' && --depth == 0) {
                return k + 1;
            } else if (c == '\n') {
                break;
            }
        }
        throw error(locator, open, "'${' is never closed; close it with '}', or write '\\${' for a literal");
    }
}
