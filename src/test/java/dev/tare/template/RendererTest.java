package dev.tare.template;

import static dev.tare.template.PlaceholderSyntax.DOLLAR_DOUBLE_BRACE;
import static dev.tare.template.PlaceholderSyntax.DOUBLE_BRACE;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.TareException;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;

/** Includes: pasted in, looked up in the partials folder, refused when cyclic, missing or outside the root. */
class RendererTest {
    private static Rendering renderStatic(Map<String, String> partials, String path, String text) {
        return Templates.renderer(DOUBLE_BRACE, partials).renderStatic(Templates.parse(DOUBLE_BRACE, path, text));
    }

    @Test
    void includesArePastedInWithTheirVariables() {
        Map<String, String> partials = Map.of(
                "partials/safety.md", "Be safe, {{ name }}.",
                "partials/voice.txt", "[voice]");
        Rendering rendering = renderStatic(partials, "prompts/a.md",
                "A {{> safety }} B {% include \"voice.txt\" %} C");
        assertEquals(List.of("A Be safe, . B [voice] C"), rendering.messages());
        assertEquals(List.of("partials/safety.md", "partials/voice.txt"), rendering.includes());
        assertEquals("partials/safety.md", rendering.variables().get(0).owner());
    }

    @Test
    void theIncludingTemplatesDeclarationsApplyInsidePartials() {
        Map<String, String> partials = Map.of("partials/p.md", "Hi {{ name }}");
        Template template = Templates.parse(DOUBLE_BRACE, "a.md", "---\nvariables: {name: {sample: Bo}}\n---\n{{> p }}!");
        assertEquals(List.of("Hi Bo!"), Templates.renderer(DOUBLE_BRACE, partials).renderWithSamples(template).messages());
    }

    @Test
    void aCallsOutputTakesTheSampleDeclaredUnderTheFunctionsFullName() {
        Template template = Templates.parse(DOLLAR_DOUBLE_BRACE, "a.md", "---\nvariables:\n  weather.forecast: {sample: sunny}"
                + "\n  city: {sample: Springfield}\n  meter: {sample: never}\n---\n{{$city}}: {{weather.forecast $city}}."
                + " {{meter.read}}");
        Rendering rendering = Templates.renderer(DOLLAR_DOUBLE_BRACE, Map.of()).renderWithSamples(template);
        assertEquals(List.of("Springfield: sunny. "), rendering.messages(),
                "a call's argument is not pasted in, and a declaration of its first part does not size it");
        assertEquals(List.of("city", "weather.forecast", "meter.read"),
                rendering.variables().stream().map(occurrence -> occurrence.part().name()).toList());
        assertTrue(rendering.variables().get(1).part() instanceof Segment.Call);
        assertTrue(rendering.variables().get(2).spec().isEmpty());
    }

    @Test
    void includesFallBackToTheIncludingFoldersFiles() {
        Rendering rendering = renderStatic(Map.of("prompts/shared.md", "S"), "prompts/a.md", "{{> shared }}");
        assertEquals(List.of("S"), rendering.messages());
    }

    @Test
    void cyclesAreRefusedWithTheChain() {
        Map<String, String> partials = Map.of("partials/a.md", "{{> b }}", "partials/b.md", "{{> a }}");
        TareException e = assertThrows(TareException.class, () -> renderStatic(partials, "t.md", "x {{> a }}"));
        assertEquals("include cycle: t.md -> partials/a.md -> partials/b.md -> partials/a.md (line 1 of partials/b.md)",
                e.getMessage());
    }

    @Test
    void namesOutsideTheRootAreRefused() {
        TareException up = assertThrows(TareException.class, () -> renderStatic(Map.of(), "t.md", "{{> ../../etc/passwd }}"));
        assertTrue(up.getMessage().contains("leads outside the scanned root"), up.getMessage());
        TareException absolute = assertThrows(TareException.class, () -> renderStatic(Map.of(), "t.md", "{% include \"/etc/passwd\" %}"));
        assertTrue(absolute.getMessage().contains("absolute path"), absolute.getMessage());
    }

    @Test
    void aMissingIncludeNamesWhatWasTried() {
        TareException e = assertThrows(TareException.class, () -> renderStatic(Map.of(), "t.md", "\n{{> nope }}"));
        assertTrue(e.getMessage().startsWith("line 2: include 'nope' names no file (tried partials/nope, partials/nope.md"),
                e.getMessage());
    }

    @Test
    void runawayDepthIsRefused() {
        java.util.Map<String, String> chain = new java.util.HashMap<>();
        for (int i = 0; i < 40; i++) {
            chain.put("partials/p" + i + ".md", "{{> p" + (i + 1) + " }}");
        }
        chain.put("partials/p40.md", "end");
        TareException e = assertThrows(TareException.class, () -> renderStatic(chain, "t.md", "{{> p0 }}"));
        assertTrue(e.getMessage().contains("nested deeper than"), e.getMessage());
    }
}
