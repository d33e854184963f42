package dev.tare.lint.rules;

import dev.tare.lint.Example;
import dev.tare.lint.Finding;
import dev.tare.lint.LintContext;
import dev.tare.lint.Rule;
import dev.tare.lint.RuleDescriptor;
import dev.tare.lint.Severity;
import dev.tare.lint.TemplateView;
import dev.tare.template.Rendering;
import dev.tare.template.Segment;
import dev.tare.template.Template;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.OptionalInt;
import java.util.Set;

/** A variable declared in front matter (or beside a chat file's messages) that nothing in the template reads. */
final class UnusedVariable implements Rule {
    static final RuleDescriptor DESCRIPTOR = RuleDescriptor.builtIn("unused-variable", Severity.WARNING,
            "A declared variable that the template and its includes never use.",
            "A stale declaration makes readers and estimates believe the prompt carries text it no longer"
                    + " sends; when it has a size, budgets are checked against tokens that never go out.",
            "Remove the declaration, or use the variable where it was meant to go.",
            Example.of("---\nvariables:\n  balance: {tokens: 5}\n  due_date: {tokens: 4}\n---\nThe balance is {{ balance }}.\n",
                    "---\nvariables:\n  balance: {tokens: 5}\n---\nThe balance is {{ balance }}.\n"));

    @Override
    public RuleDescriptor descriptor() {
        return DESCRIPTOR;
    }

    @Override
    public List<Finding> check(Template template, LintContext context) {
        if (template.meta().variables().isEmpty()) {
            return List.of();
        }
        Set<String> used = new HashSet<>();
        for (TemplateNames.Use use : TemplateNames.of(template)) {
            used.add(use.name());
            used.add(use.root());
        }
        Rendering rendering = context.rendering(template).orElse(null);
        if (rendering == null && template.segments().stream().anyMatch(s -> s instanceof Segment.Include)) {
            return List.of();
        }
        if (rendering != null) {
            for (Rendering.Occurrence occurrence : rendering.variables()) {
                Segment.PerCall part = occurrence.part();
                used.add(part.name());
                used.addAll(part.variableNames());
                if (part instanceof Segment.Variable variable) {
                    used.add(variable.rootName());
                }
                used.add(occurrence.input());
                used.add(occurrence.input().split("\\.", 2)[0]);
            }
            for (Rendering.Loop loop : rendering.loops()) {
                used.add(loop.iterable());
            }
        }
        TemplateView text = context.text(template);
        List<Finding> findings = new ArrayList<>();
        for (String name : template.meta().variables().keySet()) {
            if (used.contains(name)) {
                continue;
            }
            // A declaration may come from a prompt format's sample values rather than variables.
            OptionalInt line = text.metaLine("variables." + name);
            for (String key : List.of("sample.", "inputs.")) {
                line = line.isPresent() ? line : text.metaLine(key + name);
            }
            int start = line.isPresent() ? firstVisible(template.source(), text.lineStart(line.getAsInt())) : 0;
            int end = Math.min(template.source().length(), start + name.length());
            findings.add(text.findingInSource(DESCRIPTOR, start, end,
                    "'" + name + "' is declared but never used; remove the declaration or use it"));
        }
        return findings;
    }

    private static int firstVisible(String source, int lineStart) {
        int i = lineStart;
        while (i < source.length() && (source.charAt(i) == ' ' || source.charAt(i) == '\t')) {
            i++;
        }
        return i;
    }
}
