package dev.tare.template;

import static dev.tare.template.PlaceholderSyntax.DOLLAR_BRACE;
import static dev.tare.template.PlaceholderSyntax.DOLLAR_DOUBLE_BRACE;
import static dev.tare.template.PlaceholderSyntax.DOUBLE_BRACE;
import static dev.tare.template.PlaceholderSyntax.NONE;
import static dev.tare.template.PlaceholderSyntax.SINGLE_BRACE;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.TareException;
import java.util.List;
import org.junit.jupiter.api.Test;

/** Static-token semantics of each placeholder syntax: what remains with every variable empty. */
class PlaceholderSyntaxTest {
    private static List<String> variables(PlaceholderSyntax syntax, String text) {
        return List.copyOf(Templates.text(syntax, text).variableNames());
    }

    @Test
    void doubleBraceVariablesRenderEmptyAndKeepTheirDottedNames() {
        String text = "Hi {{ customer_name }}, account {{account.id}} owes {{ bill_amount | currency }}.";
        assertEquals("Hi , account  owes .", Templates.staticText(DOUBLE_BRACE, text));
        assertEquals(List.of("customer_name", "account.id", "bill_amount"), variables(DOUBLE_BRACE, text));
    }

    @Test
    void doubleBraceTagsCommentsAndSectionsRenderToNothing() {
        String text = "A{% if x %}B{% endif %}C{# note #}D{{! hidden }}E{{# list }}F{{/ list }}G{{- trimmed -}}H";
        assertEquals("ABCDEFGH", Templates.staticText(DOUBLE_BRACE, text));
        assertEquals(List.of("trimmed"), variables(DOUBLE_BRACE, text));
    }

    @Test
    void doubleBraceTripleBracesAndLiteralsInsideRaw() {
        assertEquals(List.of("html"), variables(DOUBLE_BRACE, "{{{ html }}}"));
        assertEquals("keep {{ this }} literal", Templates.staticText(DOUBLE_BRACE, "{% raw %}keep {{ this }} literal{% endraw %}"));
        assertEquals(List.of(), variables(DOUBLE_BRACE, "{{ \"quoted literal\" }} {{ 42 }}"));
    }

    @Test
    void doubleBraceSingleBracesAreText() {
        String json = "{\"a\": {\"b\": 1}}";
        assertEquals(json, Templates.staticText(DOUBLE_BRACE, json));
    }

    @Test
    void doubleBraceUnterminatedPlaceholderNamesLineAndColumn() {
        TemplateSyntaxException e = assertThrows(TemplateSyntaxException.class,
                () -> Templates.text(DOUBLE_BRACE, "line one\nHello {{ name\nmore {{ other }}"));
        assertEquals(2, e.line());
        assertEquals(7, e.column());
        assertTrue(e.getMessage().contains("'{{' is never closed"), e.getMessage());
        assertThrows(TemplateSyntaxException.class, () -> Templates.text(DOUBLE_BRACE, "{% if x "));
        assertThrows(TemplateSyntaxException.class, () -> Templates.text(DOUBLE_BRACE, "{# open"));
        assertThrows(TemplateSyntaxException.class, () -> Templates.text(DOUBLE_BRACE, "{% raw %} never ended"));
    }

    @Test
    void singleBraceFollowsStrFormat() {
        String text = "Dear {name}, {{literal}} {amount:>10.2f} {user.city!r} {} {}";
        assertEquals("Dear , {literal}    ", Templates.staticText(SINGLE_BRACE, text));
        assertEquals(List.of("name", "amount", "user.city", "0", "1"), variables(SINGLE_BRACE, text));
        assertEquals(List.of("x"), variables(SINGLE_BRACE, "{x:{width}}"));
    }

    @Test
    void singleBraceRejectsLoneBraces() {
        assertThrows(TemplateSyntaxException.class, () -> Templates.text(SINGLE_BRACE, "a } b"));
        TemplateSyntaxException open = assertThrows(TemplateSyntaxException.class, () -> Templates.text(SINGLE_BRACE, "a {b"));
        assertEquals(3, open.column());
    }

    @Test
    void dollarBraceVariablesAndEscapes() {
        String text = "Hi ${name}, price ${ order.total } and \\${kept} {{not a var}}";
        assertEquals("Hi , price  and ${kept} {{not a var}}", Templates.staticText(DOLLAR_BRACE, text));
        assertEquals(List.of("name", "order.total"), variables(DOLLAR_BRACE, text));
        assertThrows(TemplateSyntaxException.class, () -> Templates.text(DOLLAR_BRACE, "${open"));
    }

    private static List<Segment.Call> calls(String text) {
        return Templates.text(DOLLAR_DOUBLE_BRACE, text).segments().stream()
                .filter(segment -> segment instanceof Segment.Call).map(segment -> (Segment.Call) segment).toList();
    }

    private static TemplateSyntaxException dollarDoubleBraceError(String text) {
        return assertThrows(TemplateSyntaxException.class, () -> Templates.text(DOLLAR_DOUBLE_BRACE, text));
    }

    @Test
    void dollarDoubleBraceVariablesRenderEmptyAndLoseTheirDollar() {
        String text = "Hi {{$customer_name}}, from {{ $city }} and {{\n  $district\n}}.";
        assertEquals("Hi , from  and .", Templates.staticText(DOLLAR_DOUBLE_BRACE, text));
        assertEquals(List.of("customer_name", "city", "district"), variables(DOLLAR_DOUBLE_BRACE, text));
    }

    @Test
    void dollarDoubleBraceCallsAreNotVariablesButReadTheVariablesTheyArePassed() {
        String text = "Now: {{time.now}}. Forecast: {{ weather.forecast $city }}. Notes: {{summarize input=$notes"
                + " style='brief'}}. {{ quote \"tap water\" }} {{ meter.read $account unit = $unit }}";
        assertEquals("Now: . Forecast: . Notes: .  ", Templates.staticText(DOLLAR_DOUBLE_BRACE, text));
        assertEquals(List.of("time.now", "weather.forecast", "summarize", "quote", "meter.read"),
                calls(text).stream().map(Segment.Call::name).toList());
        assertEquals(List.of(List.of(), List.of("city"), List.of("notes"), List.of(), List.of("account", "unit")),
                calls(text).stream().map(Segment.Call::arguments).toList());
        assertEquals(List.of("city", "notes", "account", "unit"), variables(DOLLAR_DOUBLE_BRACE, text));
    }

    @Test
    void dollarDoubleBraceQuotedValuesMayHoldClosingBracesAndEscapedQuotes() {
        String text = "A{{ format template=\"}} {{ and \\\" \" $x }}B";
        List<Segment.Call> calls = calls(text);
        assertEquals(1, calls.size());
        assertEquals("{{ format template=\"}} {{ and \\\" \" $x }}", calls.get(0).source());
        assertEquals(List.of("x"), calls.get(0).arguments());
        assertEquals("AB", Templates.staticText(DOLLAR_DOUBLE_BRACE, text));
    }

    @Test
    void dollarDoubleBraceValueBlocksAreLiteralText() {
        assertEquals("Write {{$name}} as is.",
                Templates.staticText(DOLLAR_DOUBLE_BRACE, "Write {{ \"{{\" }}$name{{ '}}' }} as is."));
        assertEquals("say \"hi\" and it's", Templates.staticText(DOLLAR_DOUBLE_BRACE, "{{ \"say \\\"hi\\\"\" }} and {{'it\\'s'}}"));
        assertEquals(List.of(), variables(DOLLAR_DOUBLE_BRACE, "{{ '$not_a_variable' }}"));
    }

    @Test
    void dollarDoubleBraceOuterBracesEmptyBlocksAndLoneClosersAreText() {
        assertEquals("{} and {{ }} and }} and {", Templates.staticText(DOLLAR_DOUBLE_BRACE, "{{{$x}}} and {{ }} and }} and {"));
        assertEquals(List.of("x"), variables(DOLLAR_DOUBLE_BRACE, "{{{$x}}} and {{ }}"));
        String json = "{\"a\": {\"b\": 1}}";
        assertEquals(json, Templates.staticText(DOLLAR_DOUBLE_BRACE, json));
    }

    @Test
    void dollarDoubleBraceUnclosedBlocksNameLineAndColumn() {
        TemplateSyntaxException unclosed = dollarDoubleBraceError("line one\nHello {{$name\nmore text");
        assertEquals(2, unclosed.line());
        assertEquals(7, unclosed.column());
        assertTrue(unclosed.getMessage().contains("'{{' is never closed"), unclosed.getMessage());
        assertTrue(unclosed.getMessage().contains("{{ \"{{\" }}"), unclosed.getMessage());
        TemplateSyntaxException reopened = dollarDoubleBraceError("a {{$a and {{$b}}");
        assertEquals(1, reopened.line());
        assertEquals(3, reopened.column());
        TemplateSyntaxException quote = dollarDoubleBraceError("x\n  {{ fn 'open }}");
        assertEquals(2, quote.line());
        assertEquals(9, quote.column());
        assertTrue(quote.getMessage().contains("quoted value is never closed"), quote.getMessage());
    }

    @Test
    void dollarDoubleBraceMalformedBlocksNameLineAndColumn() {
        TemplateSyntaxException noName = dollarDoubleBraceError("x {{$}}");
        assertEquals(5, noName.column());
        assertTrue(noName.getMessage().contains("'$' is not a variable"), noName.getMessage());
        TemplateSyntaxException twoVariables = dollarDoubleBraceError("{{$a $b}}");
        assertEquals(6, twoVariables.column());
        TemplateSyntaxException bareWord = dollarDoubleBraceError("ok\n{{ fn city }}");
        assertEquals(2, bareWord.line());
        assertEquals(7, bareWord.column());
        assertTrue(bareWord.getMessage().contains("'city' in '{{ fn city }}' is not an argument"), bareWord.getMessage());
        TemplateSyntaxException namedFirst = dollarDoubleBraceError("{{ style='brief' }}");
        assertEquals(4, namedFirst.column());
        assertThrows(TemplateSyntaxException.class, () -> Templates.text(DOLLAR_DOUBLE_BRACE, "{{ fn key= }}"));
        assertThrows(TemplateSyntaxException.class, () -> Templates.text(DOLLAR_DOUBLE_BRACE, "{{ .fn }}"));
        assertThrows(TemplateSyntaxException.class, () -> Templates.text(DOLLAR_DOUBLE_BRACE, "{{ a.b.c }}"));
        assertThrows(TemplateSyntaxException.class, () -> Templates.text(DOLLAR_DOUBLE_BRACE, "{{ fn $a-b }}"));
    }

    @Test
    void dollarDoubleBraceSegmentsCoverTheBody() {
        Template template = Templates.text(DOLLAR_DOUBLE_BRACE,
                "---\nbudget: 10\n---\nA {{$x}} {{ \"{{\" }} {{ fn $y }} {{{$z}}} {{ }}");
        StringBuilder rebuilt = new StringBuilder();
        for (Segment segment : template.segments()) {
            rebuilt.append(template.source(), segment.span().start(), segment.span().end());
        }
        assertEquals(template.source().substring(template.bodyStart()), rebuilt.toString());
        Segment.Call call = (Segment.Call) template.segments().stream().filter(s -> s instanceof Segment.Call)
                .findFirst().orElseThrow();
        assertEquals(4, call.span().line());
        assertEquals(21, call.span().column());
    }

    @Test
    void noneKeepsEveryCharacter() {
        String text = "{{ a }} {b} ${c} {% d %}";
        assertEquals(text, Templates.staticText(NONE, text));
        assertEquals(List.of(), variables(NONE, text));
    }

    @Test
    void segmentsCoverTheBodyAndKnowTheirPositions() {
        Template template = Templates.text(DOUBLE_BRACE, "---\nbudget: 10\n---\nab\ncd {{ x }} e");
        List<Segment> segments = template.segments();
        Segment.Variable variable = (Segment.Variable) segments.get(1);
        assertEquals(5, variable.span().line());
        assertEquals(4, variable.span().column());
        assertEquals("{{ x }}", template.source().substring(variable.span().start(), variable.span().end()));
        StringBuilder rebuilt = new StringBuilder();
        for (Segment segment : segments) {
            rebuilt.append(template.source(), segment.span().start(), segment.span().end());
        }
        assertEquals(template.source().substring(template.bodyStart()), rebuilt.toString());
    }

    @Test
    void unknownSyntaxNamesTheChoices() {
        TareException e = assertThrows(TareException.class, () -> PlaceholderSyntax.fromLabel("curly"));
        assertTrue(e.getMessage().contains("double-brace, single-brace, dollar-brace, dollar-double-brace, none"),
                e.getMessage());
    }
}
