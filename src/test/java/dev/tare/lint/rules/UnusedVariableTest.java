package dev.tare.lint.rules;

import static dev.tare.lint.RuleHarness.findings;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.lint.Finding;
import dev.tare.lint.RewriteClass;
import dev.tare.template.PlaceholderSyntax;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;

/** Declared variables nothing reads, reported at their declaration; the rule offers no rewrite. */
class UnusedVariableTest {
    private final UnusedVariable rule = new UnusedVariable();

    @Test
    void aDeclaredButUnusedVariableIsReportedAtItsDeclaration() {
        String text = "---\nvariables:\n  balance: {tokens: 5}\n  previous_balance: {tokens: 5}\n---\nDue: {{ balance | currency }}.\n";
        List<Finding> found = findings(rule, text);
        assertEquals(1, found.size());
        assertEquals(4, found.get(0).line());
        assertEquals(3, found.get(0).column());
        assertTrue(found.get(0).message().startsWith("'previous_balance' is declared but never used"));
        assertEquals(RewriteClass.NONE, found.get(0).rewriteClass());
        assertTrue(found.get(0).rewrite().isEmpty());
    }

    @Test
    void chatFileDeclarationsAreLocatedToo() {
        String text = "variables:\n  used: {tokens: 1}\n  spare: {tokens: 1}\nmessages:\n  - role: system\n    content: \"Hi {{ used }}\"\n";
        List<Finding> found = findings(rule, "x.chat.yaml", text, Map.of());
        assertEquals(1, found.size());
        assertEquals(3, found.get(0).line());
    }

    @Test
    void anInputOrSampleNothingReadsIsReportedWhereItIsGiven() {
        String text = "---\ninputs:\n  district: North Hill\n  meter: {type: string, sample: A-17}\nsample:\n  street: Elm\n"
                + "---\nuser:\nIs {{ district }} affected?\n";
        List<Finding> found = findings(rule, text);
        assertEquals(List.of(4, 6), found.stream().map(Finding::line).toList(), "meter under inputs, street under sample");
        assertTrue(found.get(1).message().startsWith("'street' is declared but never used"), found.get(1).message());
    }

    @Test
    void theWalkedListOfALoopCountsAsUsed() {
        String text = "---\nvariables:\n  readings: {tokens: 40}\n---\n{% for r in readings %}- {{ r.date }}\n{% endfor %}\n";
        assertTrue(findings(rule, text).isEmpty());
    }

    @Test
    void theListAHandlebarsEachWalksCountsAsUsed() {
        String text = "---\nvariables:\n  history: {items: 6}\n  notes: {tokens: 9}\n---\n"
                + "{{#each history}}\n- a turn\n{{/each}}\n{{#with account}}{{notes}}{{/with}}\n";
        assertTrue(findings(rule, text).isEmpty());
    }

    @Test
    void aVariableReadOnlyInAConditionOrThroughAFieldIsUsed() {
        String text = "---\nvariables:\n  vip: {}\n  account: {tokens: 9}\n---\n{% if vip %}Number {{ account.id }}.{% endif %}\n";
        assertTrue(findings(rule, text).isEmpty());
    }

    @Test
    void aCallsDeclaredOutputAndTheVariablesItIsPassedAreUsed() {
        String text = "---\nvariables:\n  weather.forecast: {tokens: 40}\n  city: {}\n  unit: {}\n  spare: {tokens: 1}\n---\n"
                + "Today: {{weather.forecast $city unit=$unit}}\n";
        List<Finding> found = findings(rule, PlaceholderSyntax.DOLLAR_DOUBLE_BRACE, text);
        assertEquals(List.of("'spare' is declared but never used; remove the declaration or use it"),
                found.stream().map(Finding::message).toList());
    }

    @Test
    void aTemplateWhoseIncludesCannotBeReadIsNotJudged() {
        // The missing partial might be the one that reads the variable.
        String text = "---\nvariables:\n  name: {tokens: 3}\n---\n{{> greeting }}\nAnswer briefly.\n";
        assertTrue(findings(rule, text).isEmpty());
    }

    @Test
    void aTemplateWithoutDeclarationsHasNothingToReport() {
        assertTrue(findings(rule, "Hello {{ name }}.\n").isEmpty());
    }
}
