package dev.tare.lint.rules;

import dev.tare.footprint.Estimates;
import dev.tare.footprint.Target;
import dev.tare.lint.Baseline;
import dev.tare.lint.BaselineChange;
import dev.tare.lint.BaselineComparison;
import dev.tare.lint.Example;
import dev.tare.lint.Finding;
import dev.tare.lint.LintContext;
import dev.tare.lint.Rule;
import dev.tare.lint.RuleDescriptor;
import dev.tare.lint.Severity;
import dev.tare.lint.TemplateView;
import dev.tare.template.Rendering;
import dev.tare.template.Template;
import dev.tare.template.TemplateKind;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.TreeMap;

/**
 * A template whose estimated tokens on a target grew beyond {@code baseline.tolerance_percent} of
 * the committed baseline ({@code tare baseline} writes it). Only runs when the baseline file exists.
 * Templates that shrank are reported by {@link BaselineShrink}.
 */
final class BaselineGrowth implements Rule {
    static final RuleDescriptor DESCRIPTOR = RuleDescriptor.builtIn("baseline-growth", Severity.ERROR,
            "A template that grew beyond the tolerance over its committed baseline.",
            "A prompt that grows is paid for on every call from then on; the baseline makes growth a decision"
                    + " taken in review rather than an accident.",
            "Shrink the template back, or accept the growth by running 'tare baseline' and committing the file.",
            new Example("You answer billing questions for the city water utility, politely and briefly, in plain words.",
                    "Answer billing questions politely, briefly and in plain words.", Map.of(Example.BASELINE_TOKENS, 11)));

    @Override
    public RuleDescriptor descriptor() {
        return DESCRIPTOR;
    }

    @Override
    public List<Finding> check(Template template, LintContext context) {
        return changes(template, context).stream().filter(BaselineChange::overTolerance)
                .map(change -> finding(template, context, DESCRIPTOR, String.format(Locale.ROOT,
                        "grew from %,d to %,d tokens on %s (%+.1f%%, over the %s%% tolerance of the baseline);"
                                + " token counts are planning estimates",
                        change.recorded(), change.current(), change.target(), change.percent(),
                        trim(context.config().baseline().tolerancePercent()))))
                .toList();
    }

    /** The template's counts that moved since the baseline, on each of its targets. */
    static List<BaselineChange> changes(Template template, LintContext context) {
        Optional<Map<String, Integer>> recorded = context.recordedTokens(template);
        Optional<Rendering> rendering = context.rendering(template);
        if (recorded.isEmpty() || rendering.isEmpty() || template.kind() == TemplateKind.PARTIAL) {
            return List.of();
        }
        Map<String, Integer> now = new TreeMap<>();
        List<Target> targets = context.targets(template);
        if (targets.isEmpty()) {
            now.put(context.tokenizer(template).name(), Estimates.estimatedTokens(context.tokenizer(template), rendering.get()));
        }
        for (Target target : targets) {
            now.put(target.name(), Estimates.estimatedTokens(target, context.tokenizer(target), rendering.get()));
        }
        return new ArrayList<>(BaselineComparison.compare(new Baseline(Map.of(template.key(), recorded.get())),
                new Baseline(Map.of(template.key(), now)),
                context.config().baseline().tolerancePercent()));
    }

    static Finding finding(Template template, LintContext context, RuleDescriptor rule, String message) {
        TemplateView text = context.text(template);
        return text.finding(rule, text.messages().get(0), 0, 0, message, Optional.empty(), List.of());
    }

    private static String trim(double value) {
        return value == Math.rint(value) ? String.valueOf((long) value) : String.valueOf(value);
    }
}
