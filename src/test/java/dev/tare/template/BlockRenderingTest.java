package dev.tare.template;

import static dev.tare.template.PlaceholderSyntax.DOUBLE_BRACE;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.TareException;
import dev.tare.footprint.Estimates;
import dev.tare.tokenize.Tokenizer;
import dev.tare.tokenize.TokenizerRegistry;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;

/**
 * What Jinja and Handlebars/Mustache blocks render to, and so what they count. Each case states the
 * text expected with every variable empty and with samples, and checks the counts of the rendering
 * against the tokenizer's count of that text (what {@code tare count} says of it), declared token
 * sizes added once per occurrence.
 */
class BlockRenderingTest {
    private static final Tokenizer TOKENIZER = new TokenizerRegistry().get("o200k_base", Path.of("."));

    private static RenderedPath render(String text, Renderer.Path path) {
        return Templates.renderer(DOUBLE_BRACE, Map.of()).render(Templates.text(DOUBLE_BRACE, text), path);
    }

    /**
     * Checks one path: its texts, and its static and estimated counts against the counts of those texts.
     *
     * @param declared the tokens declared for variables without samples, summed over their occurrences
     */
    private static RenderedPath assertPath(String template, Renderer.Path path, String empty, String samples, int declared) {
        RenderedPath rendered = render(template, path);
        assertEquals(List.of(empty), rendered.empty().messages());
        assertEquals(List.of(samples), rendered.samples().messages());
        assertEquals(TOKENIZER.count(empty), Estimates.tokens(TOKENIZER, rendered.empty()));
        assertEquals(TOKENIZER.count(samples) + declared, Estimates.estimatedTokens(TOKENIZER, rendered.samples()));
        return rendered;
    }

    private static List<String> inputs(Rendering rendering) {
        return rendering.variables().stream().map(Rendering.Occurrence::input).toList();
    }

    @Test
    void aLoopCountsItsBodyOncePerDeclaredItem() {
        String template = "---\nvariables:\n  history: {items: 3, tokens: 12}\n  customer: {sample: \"Ana Ruiz\"}\n---\n"
                + "Earlier messages with {{ customer }}:\n{% for turn in history %}\n- {{ turn.role }}: {{ turn.text }}\n"
                + "{% endfor %}\nAnswer the last one.\n";
        String turn = "\n- : \n";
        RenderedPath path = assertPath(template, Renderer.Path.LONGEST,
                "Earlier messages with :\n" + turn.repeat(3) + "\nAnswer the last one.\n",
                "Earlier messages with Ana Ruiz:\n" + turn.repeat(3) + "\nAnswer the last one.\n", 3 * 2 * 12);
        assertEquals(List.of(new Rendering.Loop("turn", "history", 3, true, "t.md", 7)), path.samples().loops());
        assertEquals(List.of("customer", "history.role", "history.text", "history.role", "history.text", "history.role",
                "history.text"), inputs(path.samples()));
        assertFalse(path.branched());
    }

    @Test
    void aLoopWithoutDeclaredItemsCountsItsBodyOnceAndSaysSo() {
        String template = "Questions:\n{% for q in triage_questions %}- {{ q }}\n{% endfor %}";
        RenderedPath path = assertPath(template, Renderer.Path.LONGEST, "Questions:\n- \n", "Questions:\n- \n", 0);
        assertEquals(List.of(new Rendering.Loop("q", "triage_questions", 1, false, "t.md", 2)), path.empty().loops());
        assertEquals(List.of("triage_questions"), inputs(path.empty()));
    }

    @Test
    void aLoopExpectedToBeEmptyRendersItsElse() {
        String template = "---\nvariables:\n  readings: {items: 0}\n---\n"
                + "{% for r in readings %}{{ r.value }} CCF{% else %}No readings on file.{% endfor %}";
        assertPath(template, Renderer.Path.LONGEST, "No readings on file.", "No readings on file.", 0);
    }

    @Test
    void ifElifElseTakesTheLongestBranchOrTheShortest() {
        String template = "---\nvariables:\n  area: {tokens: 3}\n---\n"
                + "{% if outage %}Crews are repairing a main in {{ area }} and expect to restore water by evening."
                + "{% elif boil_notice %}A boil-water notice is in force.{% else %}No known problems.{% endif %}\n";
        String longest = "Crews are repairing a main in  and expect to restore water by evening.\n";
        RenderedPath path = assertPath(template, Renderer.Path.LONGEST, longest, longest, 3);
        assertTrue(path.branched());
        assertPath(template, Renderer.Path.SHORTEST, "No known problems.\n", "No known problems.\n", 0);
    }

    @Test
    void anIfWithoutElseIsEmptyOnTheShortestPath() {
        String template = "Be brief.{% if hardship %} Offer the 18-month plan.{% endif %}";
        assertPath(template, Renderer.Path.LONGEST, "Be brief. Offer the 18-month plan.", "Be brief. Offer the 18-month plan.", 0);
        assertPath(template, Renderer.Path.SHORTEST, "Be brief.", "Be brief.", 0);
    }

    @Test
    void aDeclaredSizeWeighsInTheChoiceAndTheStaticTextFollowsIt() {
        // The document's 400 declared tokens outweigh the fallback sentence, so the longest path takes
        // the first branch; its static text is then empty, and the estimate is the static text plus 400.
        String template = "---\nvariables:\n  document: {tokens: 400}\n---\n"
                + "{% if document %}{{ document }}{% else %}No document was attached to this request.{% endif %}";
        assertPath(template, Renderer.Path.LONGEST, "", "", 400);
        assertPath(template, Renderer.Path.SHORTEST, "No document was attached to this request.",
                "No document was attached to this request.", 0);
    }

    @Test
    void setAssignsCapturesAndAliases() {
        String template = "---\nvariables:\n  customer: {sample: \"Ana\"}\n---\n"
                + "{% set team = \"the Brookmere Water team\" %}{% set who = customer.name %}"
                + "{% set signature %}Kind regards,\n{{ team }}{% endset %}Dear {{ who }},\nYour meter was read.\n{{ signature }}";
        RenderedPath path = assertPath(template, Renderer.Path.LONGEST,
                "Dear ,\nYour meter was read.\nKind regards,\nthe Brookmere Water team",
                "Dear Ana,\nYour meter was read.\nKind regards,\nthe Brookmere Water team", 0);
        assertEquals(List.of("customer.name"), inputs(path.samples()));
    }

    @Test
    void aMacroRendersWhereItIsCalledWithItsArguments() {
        String template = "---\nvariables:\n  account_id: {sample: \"A-1001\"}\n  due_date: {tokens: 4}\n---\n"
                + "{% macro field(label, value, unit='') %}{{ label }}: {{ value }}{{ unit }}\n{% endmacro %}"
                + "Account details:\n{{ field(\"Account\", account_id) }}{{ field(\"Due\", due_date) }}"
                + "{{ field('Usage', unit=' CCF', value='12') }}";
        RenderedPath path = assertPath(template, Renderer.Path.LONGEST,
                "Account details:\nAccount: \nDue: \nUsage: 12 CCF\n",
                "Account details:\nAccount: A-1001\nDue: \nUsage: 12 CCF\n", 4);
        assertEquals(List.of("account_id", "due_date"), inputs(path.samples()));
        assertPath("{% macro box() %}[{{ caller() }}]{% endmacro %}{% call box() %}inside{% endcall %}",
                Renderer.Path.LONGEST, "[inside]", "[inside]", 0);
        // A macro that calls itself renders its body once.
        assertPath("{% macro again() %}x{{ again() }}{% endmacro %}{{ again() }}", Renderer.Path.LONGEST, "x", "x", 0);
    }

    @Test
    void whitespaceControlChangesTheCount() {
        String template = "---\nvariables:\n  name: {sample: \"Ana\"}\n---\nDear  \n {{- name -}} \n\t!\n"
                + "{%- if late %}\n  Late.\n  {%- endif %}";
        assertPath(template, Renderer.Path.LONGEST, "Dear!\n  Late.", "DearAna!\n  Late.", 0);
    }

    @Test
    void stringLiteralsRenderAsTheirValues() {
        assertPath("Write {{ '{{' }} meter_id {{ '}}' }} in the form.", Renderer.Path.LONGEST,
                "Write {{ meter_id }} in the form.", "Write {{ meter_id }} in the form.", 0);
    }

    @Test
    void filtersAndCallsRenderTheirVariable() {
        String template = "---\nvariables:\n  name: {sample: \"Ana\"}\n  items: {sample: \"bill, meter\"}\n---\n"
                + "{{ name | default('none') }} asked about {{ items | join(\", \") }} on {{ fmt(when) }}.";
        RenderedPath path = assertPath(template, Renderer.Path.LONGEST, " asked about  on .",
                "Ana asked about bill, meter on .", 0);
        assertEquals(List.of("name", "items", "when"), inputs(path.samples()));
    }

    @Test
    void eachCountsItsBodyPerItemAndItsElseWhenEmpty() {
        String each = "{{#each readings}}\n- {{date}}: {{value}} CCF\n{{else}}\nNo readings on file.\n{{/each}}\n";
        RenderedPath path = assertPath("---\nvariables:\n  readings: {items: 2, tokens: 3}\n---\n" + each,
                Renderer.Path.LONGEST, "- :  CCF\n- :  CCF\n", "- :  CCF\n- :  CCF\n", 2 * 2 * 3);
        assertEquals(List.of("readings.date", "readings.value", "readings.date", "readings.value"), inputs(path.samples()));
        assertEquals(List.of(new Rendering.Loop("this", "readings", 2, true, "t.md", 5)), path.samples().loops());
        assertPath("---\nvariables:\n  readings: {items: 0}\n---\n" + each, Renderer.Path.LONGEST,
                "No readings on file.\n", "No readings on file.\n", 0);
        RenderedPath params = assertPath("---\nvariables:\n  readings: {items: 2, sample: \"7\"}\n---\n"
                + "{{#each readings as |r|}}{{r.value}};{{/each}}", Renderer.Path.LONGEST, ";;", "7;7;", 0);
        assertEquals("r", params.samples().loops().get(0).variable());
    }

    @Test
    void ifElseAndUnlessTakeTheLongestBranchOrTheShortest() {
        String ifElse = "{{#if overdue}}Your bill is overdue.{{else}}Your bill is paid.{{/if}}";
        assertPath(ifElse, Renderer.Path.LONGEST, "Your bill is overdue.", "Your bill is overdue.", 0);
        assertPath(ifElse, Renderer.Path.SHORTEST, "Your bill is paid.", "Your bill is paid.", 0);
        String chain = "{{#if a}}One.{{else if b}}Two and more.{{else}}{{/if}}";
        assertPath(chain, Renderer.Path.LONGEST, "Two and more.", "Two and more.", 0);
        assertPath(chain, Renderer.Path.SHORTEST, "", "", 0);
        String unless = "Bill ready.{{#unless paperless}} A paper copy follows by post.{{/unless}}";
        assertPath(unless, Renderer.Path.LONGEST, "Bill ready. A paper copy follows by post.",
                "Bill ready. A paper copy follows by post.", 0);
        assertPath(unless, Renderer.Path.SHORTEST, "Bill ready.", "Bill ready.", 0);
    }

    @Test
    void withReadsItsValuesNamesInsideItsBody() {
        String template = "---\nvariables:\n  account: {tokens: 5}\n---\n"
                + "{{#with account}}Account {{number}} at {{address}}.{{else}}No account.{{/with}}";
        RenderedPath path = assertPath(template, Renderer.Path.LONGEST, "Account  at .", "Account  at .", 10);
        assertEquals(List.of("account.number", "account.address"), inputs(path.samples()));
        assertPath(template, Renderer.Path.SHORTEST, "No account.", "No account.", 0);
    }

    @Test
    void mustacheSectionsAndInvertedSections() {
        String template = "---\nvariables:\n  alerts: {items: 2, sample: \"Main break on Elm St\"}\n---\n"
                + "Alerts:\n{{#alerts}}\n* {{.}}\n{{/alerts}}\n{{^alerts}}\nNo alerts.\n{{/alerts}}\n";
        RenderedPath path = assertPath(template, Renderer.Path.LONGEST, "Alerts:\n* \n* \nNo alerts.\n",
                "Alerts:\n* Main break on Elm St\n* Main break on Elm St\nNo alerts.\n", 0);
        assertEquals(List.of("alerts", "alerts"), inputs(path.samples()));
        assertPath(template, Renderer.Path.SHORTEST, "Alerts:\n", "Alerts:\n", 0);
    }

    @Test
    void aLoopInsideAnIncludeAndAnIncludeInsideALoop() {
        Map<String, String> partials = Map.of("partials/turn.md", "- {{ turn.text }}\n");
        Template template = Templates.parse(DOUBLE_BRACE, "t.md",
                "---\nvariables:\n  history: {items: 2, sample: \"Hi\"}\n---\n{% for turn in history %}{% include 'turn.md' %}{% endfor %}");
        Rendering rendering = Templates.renderer(DOUBLE_BRACE, partials).renderWithSamples(template);
        assertEquals(List.of("- Hi\n- Hi\n"), rendering.messages());
        assertEquals(List.of("partials/turn.md", "partials/turn.md"), rendering.includes());
    }

    @Test
    void theLeadingTextEndsAtTheFirstVariableOrBranch() {
        Rendering branch = render("Rules first.\n{% if vip %}Priority.{% endif %} Hello {{ name }}.", Renderer.Path.LONGEST).samples();
        assertEquals(List.of("Rules first.\n"), branch.leading());
        Rendering variable = render("Rules first. Hello {{ name }}.", Renderer.Path.LONGEST).samples();
        assertEquals(List.of("Rules first. Hello "), variable.leading());
        Rendering set = render("{% set a = 'A' %}{{ a }} is static.", Renderer.Path.LONGEST).samples();
        assertEquals(List.of("A is static."), set.leading());
    }

    @Test
    void aLoopThatWouldFillTheMemoryIsRefused() {
        String template = "---\nvariables:\n  pages: {items: 10000}\n  lines: {items: 10000}\n---\n"
                + "{% for p in pages %}{% for l in lines %}A line of the report.\n{% endfor %}{% endfor %}";
        TareException e = assertThrows(TareException.class, () -> render(template, Renderer.Path.LONGEST));
        assertTrue(e.getMessage().contains("declare fewer items"), e.getMessage());
    }

    @Test
    void itemsAreDeclaredAsAWholeNumber() {
        Template template = Templates.text(DOUBLE_BRACE, "---\nvariables:\n  history: {items: 6, tokens: 40}\n---\nx");
        assertEquals(java.util.OptionalInt.of(6), template.meta().variables().get("history").items());
        TareException e = assertThrows(TareException.class,
                () -> Templates.text(DOUBLE_BRACE, "---\nvariables:\n  history: {items: -2}\n---\nx"));
        assertEquals("front matter, line 3: items must be a whole number of loop iterations from 0 to 10000 (got -2)",
                e.getMessage());
    }
}
