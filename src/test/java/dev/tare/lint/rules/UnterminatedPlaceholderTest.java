package dev.tare.lint.rules;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.lint.Finding;
import dev.tare.lint.RewriteClass;
import dev.tare.lint.RuleHarness;
import dev.tare.template.TemplateSyntaxException;
import java.util.List;
import org.junit.jupiter.api.Test;

/** A file the parser refuses is reported where the placeholder opens; a parsed template never is. */
class UnterminatedPlaceholderTest {
    private final UnterminatedPlaceholder rule = new UnterminatedPlaceholder();

    @Test
    void anUnterminatedPlaceholderBecomesALocatedError() {
        String text = "Fine {{ a }}\nBroken {{ b\n";
        List<Finding> found = rule.onSyntaxError("x.md", text, syntaxError(text));
        assertEquals(1, found.size());
        assertEquals(2, found.get(0).line());
        assertEquals(8, found.get(0).column());
        assertEquals(RewriteClass.NONE, found.get(0).rewriteClass());
    }

    @Test
    void theMessageLeavesThePositionToTheFinding() {
        String text = "Hello {{ customer_name, how can I help?\n";
        Finding found = rule.onSyntaxError("x.md", text, syntaxError(text)).get(0);
        assertFalse(found.message().startsWith("line "), found.message());
        assertEquals("x.md", found.path());
    }

    @Test
    void theColumnCountsCodePoints() {
        // The emoji is two UTF-16 units but one column.
        String text = "Fine.\n\uD83D\uDE42 Hello {{ name\n";
        assertEquals(9, rule.onSyntaxError("x.md", text, syntaxError(text)).get(0).column());
    }

    @Test
    void aTemplateThatParsesHasNothingToReport() {
        assertTrue(RuleHarness.findings(rule, "Hello {{ customer_name }}, how can I help?\n").isEmpty());
    }

    private static TemplateSyntaxException syntaxError(String text) {
        return assertThrows(TemplateSyntaxException.class, () -> RuleHarness.template("x.md", text),
                "the parser accepted an unterminated placeholder");
    }
}
