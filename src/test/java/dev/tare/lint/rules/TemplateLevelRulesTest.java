package dev.tare.lint.rules;

import static dev.tare.lint.RuleHarness.findings;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.lint.Example;
import dev.tare.lint.Finding;
import dev.tare.tokenize.Tokenizer;
import dev.tare.tokenize.TokenizerRegistry;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;

/** Budget, cache order, unterminated placeholders and unresolved includes. */
class TemplateLevelRulesTest {
    private final Tokenizer o200k = new TokenizerRegistry().get("o200k_base", Path.of("."));

    @Test
    void overBudgetNamesTokensBudgetAndCostliestSections() {
        String body = "# Intro\nShort.\n\n# Rules\n" + "Never promise a refund or a repair time. ".repeat(5) + "\n\n# End\nBye.\n";
        String text = "---\nbudget: 20\n---\n" + body;
        List<Finding> found = findings(new OverBudget(), text);
        assertEquals(1, found.size());
        assertEquals(2, found.get(0).line());
        String message = found.get(0).message();
        int expected = o200k.count(body);
        assertTrue(message.startsWith("estimated " + expected + " tokens on o200k_base, over the budget of 20"), message);
        assertTrue(message.indexOf("'Rules'") < message.indexOf("'Intro'"), message);
        assertTrue(message.contains("planning estimates"), message);
    }

    @Test
    void withinBudgetOrWithoutOneThereIsNoFinding() {
        assertTrue(findings(new OverBudget(), "---\nbudget: 50\n---\nShort text.\n").isEmpty());
        assertTrue(findings(new OverBudget(), "No budget anywhere.\n").isEmpty());
    }

    @Test
    void aVariableAheadOfTheStaticPartBreaksThePrefixCache() {
        String text = "Today is {{ date }}.\n" + "Answer water billing questions briefly and politely. ".repeat(6);
        List<Finding> found = findings(new CacheOrder(), "a.md", text, Map.of(Example.PREFIX_CACHE_MIN_TOKENS, 32));
        assertEquals(1, found.size());
        assertEquals(10, found.get(0).column());
        int total = o200k.count(text.replace("{{ date }}", ""));
        assertTrue(found.get(0).message().contains("every call would start with the same " + total + " tokens"),
                found.get(0).message());
    }

    @Test
    void aVariableInsideAnIncludeAheadOfTheStaticPartCountsAsTheScanCountsIt() {
        // The scan's cached tokens stop at the first variable wherever it stands, includes pasted in
        // (overlap.LeadingText); the rule measures the same leading text, so a greeting partial with a
        // name in it breaks the prefix even though the template's own first variable comes last.
        String body = "{{> greeting }}\n" + "Answer water billing questions briefly and politely. ".repeat(6)
                + "\nToday is {{ date }}.\n";
        dev.tare.template.Template partial = dev.tare.lint.RuleHarness.template("prompts/partials/greeting.md",
                "Hello {{ name }}.\n");
        dev.tare.template.Template template = dev.tare.lint.RuleHarness.template("prompts/a.md", body);
        dev.tare.template.Renderer renderer = new dev.tare.template.Renderer(new dev.tare.template.PartialDirectory(
                "prompts/partials", path -> path.equals(partial.path()) ? java.util.Optional.of(partial)
                : java.util.Optional.empty()));
        dev.tare.lint.LintContext context = dev.tare.lint.LintContext.forExample(Path.of("."),
                new Example(body, body, Map.of(Example.PREFIX_CACHE_MIN_TOKENS, 32)), java.util.Set.of(),
                List.of(template, partial), renderer);
        List<Finding> found = new CacheOrder().check(template, context);
        assertEquals(1, found.size());
        assertEquals(1, found.get(0).column());
        assertTrue(found.get(0).message().startsWith("'{{> greeting }}' brings in per-call text after only "
                + o200k.count("Hello ") + " leading static tokens"), found.get(0).message());
    }

    @Test
    void aVariableAfterTheStaticPartOrAShortTemplateIsFine() {
        String late = "Answer water billing questions briefly and politely. ".repeat(6) + "\nToday is {{ date }}.\n";
        assertTrue(findings(new CacheOrder(), "a.md", late, Map.of(Example.PREFIX_CACHE_MIN_TOKENS, 32)).isEmpty());
        assertTrue(findings(new CacheOrder(), "a.md", "Hi {{ name }}.\n", Map.of(Example.PREFIX_CACHE_MIN_TOKENS, 32)).isEmpty());
    }

    @Test
    void anUnterminatedPlaceholderBecomesALocatedError() {
        UnterminatedPlaceholder rule = new UnterminatedPlaceholder();
        try {
            dev.tare.lint.RuleHarness.template("x.md", "Fine {{ a }}\nBroken {{ b\n");
            throw new AssertionError("the parser accepted an unterminated placeholder");
        } catch (dev.tare.template.TemplateSyntaxException e) {
            List<Finding> found = rule.onSyntaxError("x.md", "Fine {{ a }}\nBroken {{ b\n", e);
            assertEquals(1, found.size());
            assertEquals(2, found.get(0).line());
            assertEquals(8, found.get(0).column());
        }
    }

    @Test
    void anIncludeThatCannotBeResolvedIsAnError() {
        List<Finding> found = findings(new UnresolvedInclude(), "Intro.\n{{> missing }}\n");
        assertEquals(1, found.size());
        assertEquals(2, found.get(0).line());
        assertTrue(findings(new UnresolvedInclude(), "No includes.\n").isEmpty());
    }

    @Test
    void aDirectiveNamingAnUnknownRuleIsReported() {
        java.util.Set<String> known = java.util.Set.of("space-run");
        dev.tare.lint.Rule rule = new UnknownSuppression();
        dev.tare.template.Template template = dev.tare.lint.RuleHarness.template("a.md",
                "Text. {# tare-ignore space-runs #}\nMore. {# tare-ignore space-run #}\n");
        dev.tare.lint.LintContext context = dev.tare.lint.LintContext.forExample(Path.of("."),
                Example.of("", ""), known);
        List<Finding> found = rule.check(template, context);
        assertEquals(1, found.size());
        assertEquals(1, found.get(0).line());
        assertTrue(found.get(0).message().contains("'space-runs'"));
    }
}
