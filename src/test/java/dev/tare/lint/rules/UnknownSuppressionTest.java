package dev.tare.lint.rules;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.lint.Example;
import dev.tare.lint.Finding;
import dev.tare.lint.LintContext;
import dev.tare.lint.RewriteClass;
import dev.tare.lint.RuleHarness;
import java.nio.file.Path;
import java.util.List;
import java.util.Set;
import org.junit.jupiter.api.Test;

/** Directives that name a rule nobody knows; the known ids are given to the context. */
class UnknownSuppressionTest {
    private final UnknownSuppression rule = new UnknownSuppression();

    @Test
    void aDirectiveNamingAnUnknownRuleIsReported() {
        List<Finding> found = check("Text. {# tare-ignore space-runs #}\nMore. {# tare-ignore space-run #}\n");
        assertEquals(1, found.size());
        assertEquals(1, found.get(0).line());
        assertEquals(10, found.get(0).column());
        assertTrue(found.get(0).message().contains("'space-runs'"));
        assertEquals(RewriteClass.NONE, found.get(0).rewriteClass());
    }

    @Test
    void eachUnknownIdOfAListIsReported() {
        List<Finding> found = check("{# tare-ignore-next-line space-run, blank-line, tabs #}\nText.\n");
        assertEquals(List.of("the directive names unknown rule 'blank-line'", "the directive names unknown rule 'tabs'"),
                found.stream().map(f -> f.message().substring(0, f.message().indexOf(", so"))).toList());
    }

    @Test
    void allAndKnownIdsAreFine() {
        assertTrue(check("Text. {# tare-ignore all #}\n{# tare-ignore-next-line blank-lines #}\nMore.\n").isEmpty());
        assertTrue(check("---\n# tare-ignore-file space-run\n---\nText.\n").isEmpty());
    }

    private List<Finding> check(String text) {
        LintContext context = LintContext.forExample(Path.of("."), Example.of("", ""), Set.of("space-run", "blank-lines"));
        return rule.check(RuleHarness.template("a.md", text), context);
    }
}
