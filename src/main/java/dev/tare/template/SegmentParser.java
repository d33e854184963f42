package dev.tare.template;

import java.util.ArrayList;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/** Splits text into segments for one placeholder syntax. */
abstract class SegmentParser {
    /** A dotted identifier path at the start of an expression: {@code account.id}, {@code items}. */
    private static final Pattern NAME = Pattern.compile("[\\p{L}_$][\\p{L}\\p{N}_$]*(?:\\.[\\p{L}_$][\\p{L}\\p{N}_$]*)*");

    abstract List<Segment> parse(String text, int start, int end, Locator locator);

    /** The leading dotted name of an expression, or null when it starts with anything else. */
    static String leadingName(String expression) {
        Matcher matcher = NAME.matcher(expression);
        return matcher.lookingAt() ? matcher.group() : null;
    }

    static TemplateSyntaxException error(Locator locator, int offset, String problem) {
        return new TemplateSyntaxException(locator.line(offset), locator.column(offset), problem);
    }

    /** Collects segments, merging adjacent text. */
    static final class Builder {
        private final String text;
        private final Locator locator;
        private final List<Segment> segments = new ArrayList<>();
        private final StringBuilder pending = new StringBuilder();
        private int pendingStart = -1;
        private int pendingEnd = -1;

        Builder(String text, Locator locator) {
            this.text = text;
            this.locator = locator;
        }

        /** Adds source {@code text[from, to)} as literal text rendering to itself. */
        void text(int from, int to) {
            if (from < to) {
                literal(from, to, text.substring(from, to));
            }
        }

        /** Adds source {@code text[from, to)} as literal text rendering to {@code rendered}. */
        void literal(int from, int to, String rendered) {
            if (pendingStart < 0) {
                pendingStart = from;
            }
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
                segments.add(new Segment.Text(pending.toString(), locator.span(pendingStart, pendingEnd)));
                pending.setLength(0);
                pendingStart = -1;
            }
        }
    }
}
