package dev.tare.template;

import java.util.List;

/** The parser for syntax {@code none}: everything is text. */
final class LiteralParser extends SegmentParser {
    @Override
    List<Segment> parse(String text, int start, int end, Locator locator) {
        Builder out = new Builder(text, locator);
        out.text(start, end);
        return out.build();
    }
}
