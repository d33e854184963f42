package dev.tare.lint.rules;

import dev.tare.lint.Example;
import dev.tare.lint.Finding;
import dev.tare.lint.LintContext;
import dev.tare.lint.Rule;
import dev.tare.lint.RuleDescriptor;
import dev.tare.lint.Severity;
import dev.tare.template.Template;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/** A template that is smaller than its committed baseline: worth recording, so the gain is kept. */
final class BaselineShrink implements Rule {
    static final RuleDescriptor DESCRIPTOR = RuleDescriptor.builtIn("baseline-shrink", Severity.INFO,
            "A template that shrank since its committed baseline.",
            "Until the baseline is lowered, the template may grow back to its old size without anyone noticing.",
            "Run 'tare baseline' and commit the file to keep the saving.",
            new Example("Answer billing questions.", "Answer billing questions politely, briefly and in plain words.",
                    Map.of(Example.BASELINE_TOKENS, 11)));

    @Override
    public RuleDescriptor descriptor() {
        return DESCRIPTOR;
    }

    @Override
    public List<Finding> check(Template template, LintContext context) {
        return BaselineGrowth.changes(template, context).stream().filter(change -> !change.grew())
                .map(change -> BaselineGrowth.finding(template, context, DESCRIPTOR, String.format(Locale.ROOT,
                        "shrank from %,d to %,d tokens on %s (%.1f%%); run 'tare baseline' to record it",
                        change.recorded(), change.current(), change.target(), change.percent())))
                .toList();
    }
}
