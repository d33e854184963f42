package dev.tare.lint.rules;

import static dev.tare.lint.RuleHarness.findings;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.lint.Finding;
import java.util.List;
import org.junit.jupiter.api.Test;

/** The variable rules: unsized, unused, loop-local names. */
class VariableRulesTest {
    private final UnsizedVariable unsized = new UnsizedVariable();
    private final UnusedVariable unused = new UnusedVariable();

    @Test
    void anUndeclaredOrUnsizedVariableIsReportedOnce() {
        String text = "---\nvariables:\n  a: {tokens: 3}\n  b: {}\n---\n{{ a }} {{ b }} {{ c.d }} {{ c.d }}\n";
        List<Finding> found = findings(unsized, text);
        assertEquals(List.of("'b'", "'c.d'"), found.stream().map(f -> f.message().split(" ")[0]).toList());
        assertEquals(6, found.get(0).line());
        assertEquals(9, found.get(0).column());
    }

    @Test
    void loopVariablesAreLocalAndTheWalkedListCountsAsUsed() {
        String text = "---\nvariables:\n  readings: {tokens: 40}\n---\n{% for r in readings %}- {{ r.date }}\n{% endfor %}\n";
        assertTrue(findings(unsized, text).isEmpty());
        assertTrue(findings(unused, text).isEmpty());
    }

    @Test
    void aConditionNameThatIsNotDeclaredIsReported() {
        List<Finding> found = findings(unsized, "{% if hardship_flag and not closed %}Offer a plan.{% endif %}\n");
        assertEquals(2, found.size());
        assertTrue(found.stream().anyMatch(f -> f.message().startsWith("'hardship_flag' decides what is sent")));
        assertTrue(found.stream().anyMatch(f -> f.message().startsWith("'closed' decides what is sent")));
    }

    @Test
    void aDeclaredButUnusedVariableIsReportedAtItsDeclaration() {
        String text = "---\nvariables:\n  balance: {tokens: 5}\n  previous_balance: {tokens: 5}\n---\nDue: {{ balance | currency }}.\n";
        List<Finding> found = findings(unused, text);
        assertEquals(1, found.size());
        assertEquals(4, found.get(0).line());
        assertEquals(3, found.get(0).column());
        assertTrue(found.get(0).message().startsWith("'previous_balance' is declared but never used"));
    }

    @Test
    void chatFileDeclarationsAreLocatedToo() {
        String text = "variables:\n  used: {tokens: 1}\n  spare: {tokens: 1}\nmessages:\n  - role: system\n    content: \"Hi {{ used }}\"\n";
        List<Finding> found = findings(unused, "x.chat.yaml", text, java.util.Map.of());
        assertEquals(1, found.size());
        assertEquals(3, found.get(0).line());
    }
}
