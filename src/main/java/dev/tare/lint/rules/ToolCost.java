package dev.tare.lint.rules;

import dev.tare.footprint.CallSize;
import dev.tare.footprint.Footprint;
import dev.tare.footprint.Footprints;
import dev.tare.footprint.Framing;
import dev.tare.footprint.Target;
import dev.tare.lint.Example;
import dev.tare.lint.Finding;
import dev.tare.lint.LintContext;
import dev.tare.lint.RuleDescriptor;
import dev.tare.lint.Severity;
import dev.tare.lint.ToolRule;
import dev.tare.template.Template;
import dev.tare.template.ToolDefinition;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * What each tool definition costs per call on each target it may be sent to: its minified JSON,
 * scaled by the target's calibration, plus the target's per-tool overhead, and the price of those
 * tokens where the target has one. Informational: the cost of a tool is the case for or against it.
 */
final class ToolCost implements ToolRule {
    static final RuleDescriptor DESCRIPTOR = RuleDescriptor.builtIn("tool-cost", Severity.INFO,
            "What each tool definition costs per call on each target.",
            "A tool's definition is input on every call it is sent with, used or not.",
            "Send a tool only with the prompts that can use it, and keep its definition short.",
            Example.of("[{\"name\":\"lookup_account\",\"description\":\"Find an account.\"}]\n", "[]\n"));

    @Override
    public RuleDescriptor descriptor() {
        return DESCRIPTOR;
    }

    @Override
    public List<Finding> check(Template template, LintContext context) {
        List<Finding> findings = new ArrayList<>();
        List<Target> targets = context.targets(template);
        for (ToolDefinition tool : context.toolDefinitions(template)) {
            List<String> costs = new ArrayList<>();
            if (targets.isEmpty()) {
                costs.add(context.tokenizer(template).count(tool.json()) + " tokens on " + context.tokenizer(template).name());
            }
            for (Target target : targets) {
                int tokens = target.scaled(context.tokenizer(target).count(tool.json())) + Framing.toolTokens(target, 1);
                Footprint footprint = Footprints.estimate(target, CallSize.of(tokens, 0));
                StringBuilder cost = new StringBuilder().append(tokens).append(" tokens on ").append(target.name());
                footprint.costPerCall().ifPresent(c -> cost.append(String.format(Locale.ROOT, " (%s %.6f a call",
                        footprint.currency().orElse(""), c)));
                footprint.costPerMonth().ifPresent(c -> cost.append(String.format(Locale.ROOT, ", %s %,.2f a month",
                        footprint.currency().orElse(""), c)));
                if (footprint.costPerCall().isPresent()) {
                    cost.append(')');
                }
                if (target.isCalibrated()) {
                    cost.append(", calibrated");
                }
                costs.add(cost.toString());
            }
            findings.add(ToolFindings.at(template, context, DESCRIPTOR, tool.line(), "tool '" + tool.name()
                    + "' costs " + String.join("; ", costs) + " per call it is sent with (planning estimates)"));
        }
        return findings;
    }
}
