package dev.tare.lint.rules;

import static dev.tare.lint.RuleHarness.findings;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.lint.Finding;
import dev.tare.lint.RewriteClass;
import dev.tare.template.PlaceholderSyntax;
import java.util.List;
import org.junit.jupiter.api.Test;

/** Variables that estimates cannot count: read but unsized, or deciding what is sent but undeclared. */
class UnsizedVariableTest {
    private final UnsizedVariable rule = new UnsizedVariable();

    @Test
    void anUndeclaredOrUnsizedVariableIsReportedOnce() {
        String text = "---\nvariables:\n  a: {tokens: 3}\n  b: {}\n---\n{{ a }} {{ b }} {{ c.d }} {{ c.d }}\n";
        List<Finding> found = findings(rule, text);
        assertEquals(List.of("'b'", "'c.d'"), found.stream().map(f -> f.message().split(" ")[0]).toList());
        assertEquals(6, found.get(0).line());
        assertEquals(9, found.get(0).column());
    }

    @Test
    void theMessageSaysHowToDeclareTheSizeAndNoRewriteIsOffered() {
        List<Finding> found = findings(rule, "Summarise {{ ticket_text }} in one line.\n");
        assertEquals(1, found.size());
        assertEquals(11, found.get(0).column());
        assertEquals(28, found.get(0).endColumn());
        assertTrue(found.get(0).message().endsWith("declare variables: {ticket_text: {tokens: N}} or {sample: \"...\"}"),
                found.get(0).message());
        assertEquals(RewriteClass.NONE, found.get(0).rewriteClass());
    }

    @Test
    void aSizeOrASampleOnTheVariableOrItsRootIsEnough() {
        assertTrue(findings(rule, "---\nvariables:\n  name: {sample: \"Ann\"}\n---\nHi {{ name }}.\n").isEmpty());
        assertTrue(findings(rule, "---\nvariables:\n  account: {tokens: 9}\n---\nNumber {{ account.id }}.\n").isEmpty());
    }

    @Test
    void loopVariablesAreLocal() {
        String text = "---\nvariables:\n  readings: {tokens: 40}\n---\n{% for r in readings %}- {{ r.date }}\n{% endfor %}\n";
        assertTrue(findings(rule, text).isEmpty());
    }

    @Test
    void aConditionNameThatIsNotDeclaredIsReported() {
        List<Finding> found = findings(rule, "{% if hardship_flag and not closed %}Offer a plan.{% endif %}\n");
        assertEquals(2, found.size());
        assertTrue(found.stream().anyMatch(f -> f.message().startsWith("'hardship_flag' decides what is sent")));
        assertTrue(found.stream().anyMatch(f -> f.message().startsWith("'closed' decides what is sent")));
    }

    @Test
    void aHandlebarsBlockReportsTheNameItReadsNotItsHelper() {
        List<Finding> found = findings(rule, "{{#if overdue}}Offer a plan.{{else if paused}}Wait.{{/if}}"
                + "{{#each readings}}- {{value}}\n{{/each}}\n");
        assertEquals(List.of("'overdue'", "'paused'", "'readings'"),
                found.stream().map(f -> f.message().split(" ")[0]).toList());
    }

    @Test
    void aCallsOutputIsSizedOnlyUnderTheFunctionsFullNameAndItsArgumentsMustBeDeclared() {
        String text = "---\nvariables:\n  city: {sample: Springfield}\n  weather: {tokens: 9}\n---\n"
                + "{{$city}}: {{weather.forecast $city}} {{summarize input=$notes}}\n";
        List<String> messages = findings(rule, PlaceholderSyntax.DOLLAR_DOUBLE_BRACE, text).stream()
                .map(Finding::message).toList();
        assertEquals(List.of(
                "the output of 'weather.forecast' has neither a size nor a sample, so estimates leave it out; declare"
                        + " variables: {\"weather.forecast\": {tokens: N}} or {sample: \"...\"}",
                "'notes' is passed to 'summarize' but is not declared; declare it under variables (a sample or size"
                        + " documents the input)",
                "the output of 'summarize' has neither a size nor a sample, so estimates leave it out; declare"
                        + " variables: {\"summarize\": {tokens: N}} or {sample: \"...\"}"), messages);
    }

    @Test
    void aSizedCallWithDeclaredArgumentsIsNotReported() {
        String text = "---\nvariables:\n  weather.forecast: {tokens: 40}\n  city: {}\n---\nToday: {{weather.forecast $city}}\n";
        assertTrue(findings(rule, PlaceholderSyntax.DOLLAR_DOUBLE_BRACE, text).isEmpty());
    }

    @Test
    void aDeclaredConditionNameNeedsNoSize() {
        assertTrue(findings(rule, "---\nvariables:\n  vip: {}\n---\n{% if vip %}Offer a plan.{% endif %}\n").isEmpty());
    }
}
