package dev.tare.template;

import static dev.tare.template.PlaceholderSyntax.DOUBLE_BRACE;
import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.List;
import java.util.Random;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;

/** The pieces the parsers share: leading names and the collecting of text segments. */
class SegmentParserTest {
    /** The definition {@link SegmentParser#leadingName} follows, as the pattern it replaced. */
    private static final Pattern NAME = Pattern.compile("[\\p{L}_$][\\p{L}\\p{N}_$]*(?:\\.[\\p{L}_$][\\p{L}\\p{N}_$]*)*");

    private static String byPattern(String expression) {
        Matcher matcher = NAME.matcher(expression);
        return matcher.lookingAt() ? matcher.group() : null;
    }

    @Test
    void leadingNamesAsThePatternFindsThem() {
        assertEquals("account.id", SegmentParser.leadingName("account.id | upper"));
        assertEquals("a.b", SegmentParser.leadingName("a.b."));
        assertEquals("a", SegmentParser.leadingName("a..b"));
        assertEquals("_x1$", SegmentParser.leadingName("_x1$(y)"));
        assertEquals(null, SegmentParser.leadingName("1abc"));
        assertEquals(null, SegmentParser.leadingName(""));
        // A letter outside the Basic Multilingual Plane, written as a surrogate pair.
        assertEquals("\uD835\uDC4E\u0663", SegmentParser.leadingName("\uD835\uDC4E\u0663 x"));
    }

    @Test
    void leadingNamesAgreeWithThePatternOnRandomExpressions() {
        // Letters, digits of several scripts, a letter number, marks, a lone surrogate and punctuation.
        String[] pieces = {"a", "Z", "_", "$", ".", " ", "1", "\u0663", "\u2167", "\u00b2", "\u00e9", "\u4e2d",
            "\u0301", "\uD835\uDC4E", "\uD835\uDFCE", "\uD800", "-", "|", "(", "\u02b0"};
        Random random = new Random(11);
        for (int round = 0; round < 20_000; round++) {
            StringBuilder expression = new StringBuilder();
            int length = random.nextInt(8);
            for (int i = 0; i < length; i++) {
                expression.append(pieces[random.nextInt(pieces.length)]);
            }
            String s = expression.toString();
            assertEquals(byPattern(s), SegmentParser.leadingName(s), s);
        }
    }

    @Test
    void textRunsJoinWhetherTheyTouchOrNot() {
        String source = "abcdefghij";
        SegmentParser.Builder out = new SegmentParser.Builder(source, LineIndex.of(source));
        out.text(0, 2);
        out.text(2, 4);
        out.text(5, 6);
        out.add(new Segment.Tag("x", new Span(6, 7, 1, 7)));
        out.text(7, 8);
        out.literal(8, 9, "{");
        out.text(9, 10);
        out.add(new Segment.Tag("y", new Span(10, 10, 1, 11)));
        out.literal(10, 10, "");
        out.text(10, 10);
        List<Segment> segments = out.build();
        assertEquals(List.of(
                new Segment.Text("abcdf", new Span(0, 6, 1, 1)),
                new Segment.Tag("x", new Span(6, 7, 1, 7)),
                new Segment.Text("h{j", new Span(7, 10, 1, 8)),
                new Segment.Tag("y", new Span(10, 10, 1, 11)),
                new Segment.Text("", new Span(10, 10, 1, 11))), segments);
    }

    @Test
    void whitespaceControlAndUnusualBlanks() {
        String text = "{{-\u2003name\u2003-}}{{~ ~}}{{+}}{{ - }}{%\u000binclude 'p.md' %}{%- raw\t-%}{{ x }}{% endraw %}";
        Template template = Templates.text(DOUBLE_BRACE, text);
        assertEquals(List.of("name"), List.copyOf(template.variableNames()));
        List<Segment> segments = template.messages().get(0).segments();
        String include = "{%\u000binclude 'p.md' %}";
        int at = text.indexOf(include);
        assertEquals(new Segment.Include("p.md", include, new Span(at, at + include.length(), 1, at + 1)), segments.get(4));
        assertEquals(new Segment.Tag("{%- raw\t-%}", new Span(at + include.length(), text.indexOf("{{ x"), 1,
                at + include.length() + 1)), segments.get(5));
        assertEquals("{{ x }}", ((Segment.Text) segments.get(6)).text());
        assertEquals(8, segments.size());
    }
}
