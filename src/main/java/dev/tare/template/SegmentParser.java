package dev.tare.template;

import java.util.ArrayList;
import java.util.List;

/** Splits text into segments for one placeholder syntax. */
abstract class SegmentParser {
    /** The Unicode categories of {@code \p{L}}: the letters that may start a name. */
    private static final int LETTERS = 1 << Character.UPPERCASE_LETTER | 1 << Character.LOWERCASE_LETTER
            | 1 << Character.TITLECASE_LETTER | 1 << Character.MODIFIER_LETTER | 1 << Character.OTHER_LETTER;
    /** The categories of {@code \p{N}}, which may follow the first character. */
    private static final int NUMBERS = 1 << Character.DECIMAL_DIGIT_NUMBER | 1 << Character.LETTER_NUMBER
            | 1 << Character.OTHER_NUMBER;

    abstract List<Segment> parse(String text, int start, int end, Locator locator);

    /**
     * The leading dotted name of an expression ({@code account.id}, {@code items}): what the pattern
     * {@code [\p{L}_$][\p{L}\p{N}_$]*(?:\.[\p{L}_$][\p{L}\p{N}_$]*)*} matches at its start, or
     * null when it starts with anything else. Written out by hand because it runs for every
     * placeholder of every template, where a new matcher for each showed in profiles of the scan.
     */
    static String leadingName(String expression) {
        int end = identifierEnd(expression, 0);
        if (end < 0) {
            return null;
        }
        while (end < expression.length() && expression.charAt(end) == '.') {
            int next = identifierEnd(expression, end + 1);
            if (next < 0) {
                break;
            }
            end = next;
        }
        return expression.substring(0, end);
    }

    /** The end of the identifier starting at {@code from}, or -1 when none starts there. */
    private static int identifierEnd(String text, int from) {
        if (from >= text.length() || !isNameChar(text.codePointAt(from), LETTERS)) {
            return -1;
        }
        int at = from + Character.charCount(text.codePointAt(from));
        while (at < text.length()) {
            int codePoint = text.codePointAt(at);
            if (!isNameChar(codePoint, LETTERS | NUMBERS)) {
                break;
            }
            at += Character.charCount(codePoint);
        }
        return at;
    }

    private static boolean isNameChar(int codePoint, int categories) {
        return codePoint == '_' || codePoint == '$' || (categories & 1 << Character.getType(codePoint)) != 0;
    }

    static TemplateSyntaxException error(Locator locator, int offset, String problem) {
        return new TemplateSyntaxException(locator.line(offset), locator.column(offset), problem);
    }

    /**
     * Collects segments, merging adjacent text. A run of text that is one stretch of the source (by
     * far the most common) becomes one {@code substring} when it ends; only a run holding an escape
     * or joined from separate stretches is built up in a {@code StringBuilder}. The parsers run on
     * every template of a scan, and copying each run three times (out as a substring, into the
     * builder, out of it) was a good part of their time.
     */
    static final class Builder {
        private final String text;
        private final Locator locator;
        private final List<Segment> segments = new ArrayList<>();
        private final StringBuilder pending = new StringBuilder();
        /** Whether the pending run is {@code text[pendingStart, pendingEnd)} as written, not yet in {@link #pending}. */
        private boolean verbatim;
        private int pendingStart = -1;
        private int pendingEnd = -1;

        Builder(String text, Locator locator) {
            this.text = text;
            this.locator = locator;
        }

        /** Adds source {@code text[from, to)} as literal text rendering to itself. */
        void text(int from, int to) {
            if (from >= to) {
                return;
            }
            if (pendingStart < 0) {
                pendingStart = from;
                pendingEnd = to;
                verbatim = true;
            } else if (verbatim && from == pendingEnd) {
                pendingEnd = to;
            } else {
                literal(from, to, text.substring(from, to));
            }
        }

        /** Adds source {@code text[from, to)} as literal text rendering to {@code rendered}. */
        void literal(int from, int to, String rendered) {
            if (pendingStart < 0) {
                pendingStart = from;
            } else if (verbatim) {
                pending.append(text, pendingStart, pendingEnd);
            }
            verbatim = false;
            pending.append(rendered);
            pendingEnd = to;
        }

        void add(Segment segment) {
            flush();
            segments.add(segment);
        }

        Span span(int from, int to) {
            return locator.span(from, to);
        }

        List<Segment> build() {
            flush();
            return segments;
        }

        private void flush() {
            if (pendingStart >= 0) {
                String rendered = verbatim ? text.substring(pendingStart, pendingEnd) : pending.toString();
                segments.add(new Segment.Text(rendered, locator.span(pendingStart, pendingEnd)));
                pending.setLength(0);
                pendingStart = -1;
            }
        }
    }
}
