package dev.tare.lint.rules;

import dev.tare.config.Glob;
import dev.tare.footprint.Estimates;
import dev.tare.footprint.Target;
import dev.tare.lint.Example;
import dev.tare.lint.Finding;
import dev.tare.lint.LintContext;
import dev.tare.lint.Rule;
import dev.tare.lint.RuleDescriptor;
import dev.tare.lint.Severity;
import dev.tare.lint.TemplateView;
import dev.tare.template.Rendering;
import dev.tare.template.Template;
import dev.tare.tokenize.Tokenizer;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalInt;
import java.util.stream.Collectors;

/**
 * A template whose estimated tokens (with its includes, samples and declared sizes, on its primary
 * tokenizer) exceed its budget: the front matter's {@code budget}, else the first matching glob of
 * {@code budgets} in {@code tare.yaml}, else the configured default.
 */
final class OverBudget implements Rule {
    static final RuleDescriptor DESCRIPTOR = RuleDescriptor.builtIn("over-budget", Severity.ERROR,
            "A template whose estimated tokens exceed its budget.",
            "The budget is the team's agreed price of the prompt; every token over it is paid on every call,"
                    + " adds prefill time and takes cache memory from other requests.",
            "Shrink the costliest sections (the message names them), or raise the budget deliberately in"
                    + " front matter or tare.yaml.",
            Example.of("---\nbudget: 5\n---\nYou answer billing questions for the water utility, politely and briefly.\n",
                    "---\nbudget: 5\n---\nAnswer billing questions.\n"));

    @Override
    public RuleDescriptor descriptor() {
        return DESCRIPTOR;
    }

    @Override
    public List<Finding> check(Template template, LintContext context) {
        OptionalInt budget = context.budget(template);
        Optional<Rendering> rendering = context.rendering(template);
        if (budget.isEmpty() || rendering.isEmpty()) {
            return List.of();
        }
        Tokenizer tokenizer = context.tokenizer(template);
        List<Target> targets = context.targets(template);
        Optional<Target> primary = targets.isEmpty() ? Optional.empty() : Optional.of(targets.get(0));
        int estimated = primary.map(target -> Estimates.estimatedTokens(target, tokenizer, rendering.get()))
                .orElseGet(() -> Estimates.estimatedTokens(tokenizer, rendering.get()));
        String calibrated = primary.filter(Target::isCalibrated)
                .map(target -> ", scaled by " + target.scale() + " for " + target.name() + ": a calibrated estimate")
                .orElse("");
        if (estimated <= budget.getAsInt()) {
            return List.of();
        }
        TemplateView text = context.text(template);
        String sections = Sections.costliest(template, context, tokenizer).stream().limit(3)
                .map(s -> s.label() + " (" + lines(s) + ") " + s.tokens())
                .collect(Collectors.joining(", "));
        String message = String.format(Locale.ROOT,
                "estimated %,d tokens on %s, over the budget of %,d (%s) by %,d; costliest sections: %s"
                        + " (token counts are planning estimates%s)",
                estimated, tokenizer.name(), budget.getAsInt(), source(template, context), estimated - budget.getAsInt(),
                sections, calibrated);
        OptionalInt line = text.metaLine("budget");
        if (line.isPresent()) {
            int start = text.lineStart(line.getAsInt());
            int end = Math.min(template.source().length(), start + "budget".length());
            return List.of(text.findingInSource(DESCRIPTOR, start, end, message));
        }
        return List.of(text.finding(DESCRIPTOR, text.messages().get(0), 0, 0, message, Optional.empty(), List.of()));
    }

    private static String lines(Sections.Section section) {
        return section.firstLine() == section.lastLine() ? "line " + section.firstLine()
                : "lines " + section.firstLine() + "-" + section.lastLine();
    }

    private static String source(Template template, LintContext context) {
        if (template.meta().budget().isPresent()) {
            return template.isDocument() ? "set in the file" : "set in front matter";
        }
        for (Map.Entry<String, Integer> entry : context.config().budgets().byGlob().entrySet()) {
            if (Glob.of(entry.getKey()).matches(template.path())) {
                return "budgets '" + entry.getKey() + "' in tare.yaml";
            }
        }
        return "budgets default in tare.yaml";
    }
}
