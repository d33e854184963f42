package dev.tare.template;

import java.util.List;

/**
 * The parser for {@code single-brace} templates, as Python's {@code str.format} reads them:
 * {@code {name}}, {@code {name!r:>10}} and {@code {}} are variables; {@code {{} and {@code }}} are
 * literal braces; a lone {@code }} is an error, as it is there.
 */
final class SingleBraceParser extends SegmentParser {
    @Override
    List<Segment> parse(String text, int start, int end, Locator locator) {
        Builder out = new Builder(text, locator);
        int autoNumber = 0;
        int i = start;
        int textStart = start;
        while (i < end) {
            char c = text.charAt(i);
            if (c != '{' && c != '}') {
                i++;
                continue;
            }
            out.text(textStart, i);
            if (i + 1 < end && text.charAt(i + 1) == c) {
                out.literal(i, i + 2, String.valueOf(c));
                i += 2;
            } else if (c == '}') {
                throw error(locator, i, "single '}' outside a placeholder; write '}}' for a literal brace");
            } else {
                int close = closing(text, i, end, locator);
                String source = text.substring(i, close);
                String field = source.substring(1, source.length() - 1);
                String name = fieldName(field);
                if (name.isEmpty()) {
                    name = String.valueOf(autoNumber++);
                }
                out.add(new Segment.Variable(name, source, out.span(i, close)));
                i = close;
            }
            textStart = i;
        }
        out.text(textStart, end);
        return out.build();
    }

    /** Past the '}' matching the '{' at {@code open}; a format spec may nest one level of fields. */
    private static int closing(String text, int open, int end, Locator locator) {
        int depth = 0;
        for (int k = open; k < end; k++) {
            char c = text.charAt(k);
            if (c == '{') {
                depth++;
            } else if (c == '}') {
                depth--;
                if (depth == 0) {
                    return k + 1;
                }
            } else if (c == '\n' && depth == 1) {
                break;
            }
        }
        throw error(locator, open, "'{' is never closed; close it with '}', or write '{{' for a literal brace");
    }

    private static String fieldName(String field) {
        int cut = field.length();
        for (int k = 0; k < field.length(); k++) {
            char c = field.charAt(k);
            if (c == '!' || c == ':' || c == '[') {
                cut = k;
                break;
            }
        }
        String head = field.substring(0, cut).strip();
        String name = leadingName(head);
        return name != null ? name : head;
    }
}
