package dev.tare.template;

import static dev.tare.template.PlaceholderSyntax.DOUBLE_BRACE;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * How the double-brace parser reads Jinja and Handlebars/Mustache as written: string literals,
 * filters and calls, whitespace control, standalone Mustache lines, block tags and unbalanced blocks.
 * What the blocks render to, with counts, is in {@link BlockRenderingTest}.
 */
class BlockSyntaxTest {
    private static List<String> variables(String text) {
        return List.copyOf(Templates.text(DOUBLE_BRACE, text).variableNames());
    }

    private static TemplateSyntaxException error(String text) {
        return assertThrows(TemplateSyntaxException.class, () -> Templates.text(DOUBLE_BRACE, text));
    }

    private static Control control(String text, int segment) {
        return ((Segment.Tag) Templates.text(DOUBLE_BRACE, text).segments().get(segment)).control();
    }

    @Test
    void aQuotedCloserDoesNotCloseItsConstruct() {
        String text = "Fill in {{ reading | replace(\"}}\", \"\") }} and {% if unit == \"%}\" %}the unit{% endif %}.";
        assertEquals(List.of("reading"), variables(text));
        assertEquals("Fill in  and the unit.", Templates.staticText(DOUBLE_BRACE, text));
    }

    @Test
    void aLoneStringLiteralRendersAsItsValue() {
        String text = "Write {{ '{{' }} meter_id {{ \"}}\" }} where the number goes; {{ 'it\\'s' }} fine.";
        assertEquals(List.of(), variables(text));
        assertEquals("Write {{ meter_id }} where the number goes; it's fine.", Templates.staticText(DOUBLE_BRACE, text));
        assertEquals(new Control.Literal("{{"), control(text, 1));
    }

    @Test
    void anApostropheInAPlaceholderStillReadsAsBefore() {
        // A quote left open on its line is not a string literal: the first closer ends the placeholder.
        assertEquals(List.of("customer"), variables("Hi {{ customer's }} and {{ \\'x\\' }}."));
    }

    @Test
    void filtersWithArgumentsReadTheVariableBeforeThem() {
        String text = "{{ name | default('none') }} owes {{ items | join(\", \") }} by {{ due | date(\"%d %B\") }}";
        assertEquals(List.of("name", "items", "due"), variables(text));
        assertEquals(" owes  by ", Templates.staticText(DOUBLE_BRACE, text));
    }

    @Test
    void callsReadTheirArgumentsAndMethodCallsTheirObject() {
        assertEquals(List.of("balance"), variables("{{ fmt(balance) }}"));
        assertEquals(List.of("balance"), variables("{{ money(value=balance, places=2) }}"));
        assertEquals(List.of("today"), variables("{{ today() }}"));
        assertEquals(List.of("account.notes"), variables("{{ account.notes.strip() }}"));
        assertEquals(List.of("due_date"), variables("{{formatDate due_date \"short\"}}"));
        assertEquals(List.of("reading"), variables("{{ reading if reading else 'none' }}"));
        assertEquals(List.of("x"), variables("{% import 'forms.j2' as forms %}{{ forms.field(x) }}"));
    }

    @Test
    void setAssignsAndCapturesWithoutRendering() {
        assertEquals(new Control.Assign("greeting", "\"Hello\""), control("{% set greeting = \"Hello\" %}", 0));
        Control.Open capture = (Control.Open) control("{% set signature %}Brookmere Water{% endset %}", 0);
        assertEquals(Control.Block.CAPTURE, capture.block());
        assertEquals(List.of("signature"), capture.names());
        assertEquals("Thanks.", Templates.staticText(DOUBLE_BRACE, "{% set signature %}Brookmere Water{% endset %}Thanks."));
    }

    @Test
    void macrosAndTheirCallsAreTags() {
        String text = "{% macro field(label, value='n/a') %}{{ label }}: {{ value }}{% endmacro %}{{ field('Meter', meter_id) }}";
        Control.Open macro = (Control.Open) control(text, 0);
        assertEquals(Control.Block.MACRO, macro.block());
        assertEquals("field", macro.subject());
        assertEquals(List.of("label", "value='n/a'"), macro.names());
        assertEquals(new Control.Call("field", List.of("'Meter'", "meter_id")), control(text, 5));
    }

    @Test
    void whitespaceControlTakesTheWhiteSpaceBesideIt() {
        assertEquals("Dear!", Templates.staticText(DOUBLE_BRACE, "Dear  \n {{- name -}} \n\t!"));
        assertEquals("AB\n", Templates.staticText(DOUBLE_BRACE, "A\n  {%- if late -%}  \n  B\n{%- endif %}\n"));
        assertEquals("onetwo", Templates.staticText(DOUBLE_BRACE, "one   {#- a note -#}   two"));
        assertEquals("onetwo", Templates.staticText(DOUBLE_BRACE, "one\n{{~#if x~}}\n two {{~/if}}"));
        // Without marks a Jinja tag keeps the white space around it, as Jinja does by default.
        assertEquals("A\n\n  B\n\n", Templates.staticText(DOUBLE_BRACE, "A\n{% if late %}\n  B\n{% endif %}\n"));
    }

    @Test
    void standaloneMustacheTagsTakeTheirLine() {
        String text = "Readings:\n  {{#readings}}\n- {{ value }}\n  {{/readings}}\n{{! kept out }}\nEnd\n";
        assertEquals("Readings:\n- \nEnd\n", Templates.staticText(DOUBLE_BRACE, text));
        // A tag sharing its line with other text is not standalone.
        assertEquals("Items: a.\n", Templates.staticText(DOUBLE_BRACE, "Items: {{#items}}a{{/items}}.\n"));
    }

    @Test
    void jinjaBlockTagsSayWhatTheyOpen() {
        Control.Open loop = (Control.Open) control("{% for key, value in account.items() if value %}{% endfor %}", 0);
        assertEquals(Control.Block.LOOP, loop.block());
        assertEquals(List.of("key", "value"), loop.names());
        assertEquals("account.items()", loop.subject());
        assertEquals(new Control.Middle("elif", "b"), control("{% if a %}{% elif b %}{% else %}{% endif %}", 1));
        assertEquals(new Control.Middle("else", ""), control("{% if a %}{% elif b %}{% else %}{% endif %}", 2));
        assertEquals(new Control.Close("if"), control("{% if a %}{% elif b %}{% else %}{% endif %}", 3));
        assertEquals(Control.NONE, control("{% do items.append(1) %}", 0));
    }

    @Test
    void handlebarsAndMustacheBlockTagsSayWhatTheyOpen() {
        Control.Open each = (Control.Open) control("{{#each readings as |r i|}}{{/each}}", 0);
        assertEquals(Control.Block.LOOP, each.block());
        assertEquals("readings", each.subject());
        assertEquals(List.of("r", "i"), each.names());
        assertEquals(Control.Block.CONDITION, ((Control.Open) control("{{#if a}}{{/if}}", 0)).block());
        assertEquals(Control.Block.CONDITION, ((Control.Open) control("{{#unless a}}{{/unless}}", 0)).block());
        assertEquals(Control.Block.WITH, ((Control.Open) control("{{#with account}}{{/with}}", 0)).block());
        assertEquals(Control.Block.SECTION, ((Control.Open) control("{{#readings}}{{/readings}}", 0)).block());
        assertEquals(Control.Block.INVERTED, ((Control.Open) control("{{^readings}}{{/readings}}", 0)).block());
        assertEquals(new Control.Middle("else", "b"), control("{{#if a}}{{else if b}}{{/if}}", 1));
        assertEquals(new Control.Middle("else", ""), control("{{#if a}}{{^}}{{/if}}", 1));
        assertInstanceOf(Control.Plain.class, control("{{!-- a comment with }} inside --}}", 0));
    }

    @Test
    void anUnclosedBlockNamesItsOpeningTagAndTheCloserToAdd() {
        TemplateSyntaxException e = error("Intro\n\n  {% for item in history %}\n- {{ item }}\n");
        assertEquals(3, e.line());
        assertEquals(3, e.column());
        assertEquals("line 3, column 3: '{% for item in history %}' is never closed; add '{% endfor %}' where its"
                + " body ends", e.getMessage());
        TemplateSyntaxException each = error("{{#each readings}}\n- {{this}}\n");
        assertEquals("line 1, column 1: '{{#each readings}}' is never closed; add '{{/each}}' where its body ends",
                each.getMessage());
    }

    @Test
    void aCloserForAnotherBlockNamesTheBlockStillOpen() {
        TemplateSyntaxException e = error("{% for r in readings %}\n{% if r.estimated %}\nEstimated.\n{% endfor %}");
        assertEquals(4, e.line());
        assertEquals(1, e.column());
        assertEquals("line 4, column 1: '{% endfor %}' cannot close '{% if r.estimated %}' (line 2, column 1);"
                + " close that block first with '{% endif %}'", e.getMessage());
        TemplateSyntaxException hb = error("{{#each readings}}{{#if estimated}}E{{/each}}");
        assertTrue(hb.getMessage().contains("'{{/each}}' cannot close '{{#if estimated}}'"), hb.getMessage());
        TemplateSyntaxException section = error("{{#readings}}x{{/reading}}");
        assertTrue(section.getMessage().startsWith("line 1, column 15: '{{/reading}}' closes no open block (the innermost"
                + " is '{{#readings}}', line 1, column 1, which '{{/readings}}' closes)"), section.getMessage());
    }

    @Test
    void strayClosersAndMiddlesAreErrors() {
        TemplateSyntaxException close = error("Text\n{% endif %}");
        assertEquals("line 2, column 1: '{% endif %}' closes no open block; remove it, or open it with"
                + " '{% if ... %}'", close.getMessage());
        TemplateSyntaxException middle = error("A {% else %} B");
        assertEquals("line 1, column 3: '{% else %}' stands outside any block; remove it, or put it between"
                + " '{% if ... %}' and '{% endif %}'", middle.getMessage());
        TemplateSyntaxException hb = error("A {{else}} B");
        assertTrue(hb.getMessage().contains("put it between '{{#if ...}}' and '{{/if}}'"), hb.getMessage());
        TemplateSyntaxException elif = error("{% for r in readings %}{% elif x %}{% endfor %}");
        assertTrue(elif.getMessage().startsWith("line 1, column 24: '{% elif x %}' cannot stand in"
                + " '{% for r in readings %}'"), elif.getMessage());
        TemplateSyntaxException late = error("{% if a %}A{% else %}B{% elif c %}C{% endif %}");
        assertTrue(late.getMessage().contains("comes after the plain else of '{% if a %}'"), late.getMessage());
        TemplateSyntaxException family = error("{% if a %}A{{/if}}");
        assertTrue(family.getMessage().contains("'{{/if}}' closes no open block"), family.getMessage());
    }

    @Test
    void aBlockErrorInAChatMessageNamesTheMessage() {
        String chat = "messages:\n  - role: system\n    content: |\n      Intro\n      {% if vip %}\n      Priority.\n";
        dev.tare.TareException e = assertThrows(dev.tare.TareException.class,
                () -> Templates.parse(DOUBLE_BRACE, "p.chat.yaml", chat));
        assertTrue(e.getMessage().endsWith(": '{% if vip %}' is never closed; add '{% endif %}' where its body ends"
                + " (in messages[0].content)"), e.getMessage());
    }

    @Test
    void segmentsStillCoverTheSourceWhenWhiteSpaceIsTaken() {
        String text = "A  {%- if x -%}\n  B {{~ y ~}}  C\n  {{#z}}\nD\n  {{/z}}\n{%- endif %}\n";
        Template template = Templates.text(DOUBLE_BRACE, text);
        StringBuilder rebuilt = new StringBuilder();
        for (Segment segment : template.segments()) {
            rebuilt.append(text, segment.span().start(), segment.span().end());
        }
        assertEquals(text, rebuilt.toString());
        assertEquals("ABC\nD\n\n", Templates.staticText(DOUBLE_BRACE, text));
    }
}
