package dev.tare.lint.rules;

import static dev.tare.lint.RuleHarness.findings;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.config.ConfigLoader;
import dev.tare.config.TareConfig;
import dev.tare.lint.Finding;
import dev.tare.lint.RewriteClass;
import dev.tare.tokenize.Tokenizer;
import dev.tare.tokenize.TokenizerRegistry;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Budgets from front matter or tare.yaml; expected counts come from the tokenizer itself. */
class OverBudgetTest {
    private static final String RULES = "Never promise a refund or a repair time. ";

    private final OverBudget rule = new OverBudget();
    private final Tokenizer o200k = new TokenizerRegistry().get("o200k_base", Path.of("."));

    @Test
    void overBudgetNamesTokensBudgetAndCostliestSections() {
        String body = "# Intro\nShort.\n\n# Rules\n" + RULES.repeat(5) + "\n\n# End\nBye.\n";
        String text = "---\nbudget: 20\n---\n" + body;
        List<Finding> found = findings(rule, text);
        assertEquals(1, found.size());
        assertEquals(2, found.get(0).line());
        assertEquals(1, found.get(0).column());
        String message = found.get(0).message();
        int expected = o200k.count(body);
        assertTrue(message.startsWith("estimated " + expected + " tokens on o200k_base, over the budget of 20"
                + " (set in front matter) by " + (expected - 20)), message);
        assertTrue(message.indexOf("'Rules'") < message.indexOf("'Intro'"), message);
        assertTrue(message.contains("'Rules' (lines 7-9)"), message);
        assertTrue(message.contains("planning estimates"), message);
        assertEquals(RewriteClass.NONE, found.get(0).rewriteClass());
    }

    @Test
    void withinBudgetOrWithoutOneThereIsNoFinding() {
        assertTrue(findings(rule, "---\nbudget: 50\n---\nShort text.\n").isEmpty());
        assertTrue(findings(rule, "No budget anywhere.\n").isEmpty());
    }

    @Test
    void aChatFileStatesItsBudgetBesideItsMessages() {
        String text = "budget: 5\nmessages:\n  - role: system\n    content: \"" + RULES.repeat(2).strip() + "\"\n";
        List<Finding> found = findings(rule, "a.chat.yaml", text, java.util.Map.of());
        assertEquals(1, found.size());
        assertEquals(1, found.get(0).line());
        assertTrue(found.get(0).message().contains("(set in the file)"), found.get(0).message());
    }

    @Test
    void aBudgetFromTareYamlIsNamedByItsGlob(@TempDir Path dir) throws IOException {
        Files.writeString(dir.resolve("tare.yaml"), "budgets: {default: 1000, \"prompts/long/**\": 5}\n");
        TareConfig config = ConfigLoader.load(dir.resolve("tare.yaml"));
        String text = RULES.repeat(2);
        List<Finding> found = findings(rule, "prompts/long/a.md", text, config);
        assertEquals(1, found.size());
        assertEquals(1, found.get(0).line());
        assertTrue(found.get(0).message().contains("over the budget of 5 (budgets 'prompts/long/**' in tare.yaml)"),
                found.get(0).message());
        assertTrue(findings(rule, "prompts/b.md", text, config).isEmpty(), "the default of 1000 holds");
    }

    @Test
    void theDefaultBudgetAppliesToTemplatesButNotToPartials(@TempDir Path dir) throws IOException {
        Files.writeString(dir.resolve("tare.yaml"), "budgets: {default: 5}\n");
        TareConfig config = ConfigLoader.load(dir.resolve("tare.yaml"));
        String text = RULES.repeat(2);
        List<Finding> found = findings(rule, "prompts/a.md", text, config);
        assertEquals(1, found.size());
        assertTrue(found.get(0).message().contains("(budgets default in tare.yaml)"), found.get(0).message());
        assertTrue(findings(rule, "prompts/partials/rules.md", text, config).isEmpty());
    }
}
