package dev.tare.lint.rules;

import static dev.tare.lint.RuleHarness.findings;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.lint.Finding;
import dev.tare.lint.RewriteClass;
import dev.tare.lint.RuleHarness;
import dev.tare.template.Template;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;

/** Includes that cannot be pasted in are errors at the include. */
class UnresolvedIncludeTest {
    private final UnresolvedInclude rule = new UnresolvedInclude();

    @Test
    void anIncludeThatCannotBeResolvedIsAnError() {
        List<Finding> found = findings(rule, "Intro.\n{{> missing }}\n");
        assertEquals(1, found.size());
        assertEquals(2, found.get(0).line());
        assertEquals(RewriteClass.NONE, found.get(0).rewriteClass());
        assertTrue(findings(rule, "No includes.\n").isEmpty());
    }

    @Test
    void theMissingOneOfSeveralIncludesIsTheOneReported() {
        Template greeting = RuleHarness.template("prompts/partials/greeting.md", "Hello.\n");
        Template template = RuleHarness.template("prompts/a.md", "{{> greeting }}\nAnswer briefly. {{> rules }}\n");
        List<Finding> found = rule.check(template, RuleHarness.withPartials(List.of(template, greeting), Map.of()));
        assertEquals(1, found.size());
        assertEquals(2, found.get(0).line());
        assertEquals(17, found.get(0).column());
        assertTrue(found.get(0).message().contains("'rules'"), found.get(0).message());
    }

    @Test
    void anIncludeCycleIsReported() {
        Template loop = RuleHarness.template("prompts/partials/loop.md", "Again {{> loop }}\n");
        Template template = RuleHarness.template("prompts/a.md", "Start.\n{{> loop }}\n");
        List<Finding> found = rule.check(template, RuleHarness.withPartials(List.of(template, loop), Map.of()));
        assertEquals(1, found.size());
        assertEquals(2, found.get(0).line());
    }

    @Test
    void includesThatResolveAreFine() {
        Template greeting = RuleHarness.template("prompts/partials/greeting.md", "Hello.\n");
        Template template = RuleHarness.template("prompts/a.md", "{{> greeting }}\nAnswer briefly.\n");
        assertTrue(rule.check(template, RuleHarness.withPartials(List.of(template, greeting), Map.of())).isEmpty());
    }
}
