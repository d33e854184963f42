package dev.tare.template;

import static dev.tare.template.PlaceholderSyntax.DOLLAR_BRACE;
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
        assertTrue(e.getMessage().contains("double-brace, single-brace, dollar-brace, none"), e.getMessage());
    }
}
