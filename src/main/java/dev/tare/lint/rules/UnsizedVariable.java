package dev.tare.lint.rules;

import dev.tare.lint.Example;
import dev.tare.lint.Finding;
import dev.tare.lint.LintContext;
import dev.tare.lint.MessageView;
import dev.tare.lint.Rule;
import dev.tare.lint.RuleDescriptor;
import dev.tare.lint.Severity;
import dev.tare.lint.TemplateView;
import dev.tare.template.Segment;
import dev.tare.template.Template;
import dev.tare.template.VariableSpec;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Optional;
import java.util.Set;

/**
 * A variable the template reads (or a function call whose output it pastes in) that is declared with
 * neither a token size nor a sample, so every estimate leaves it out. Names used only in conditions
 * or passed to calls are reported too when they are not declared at all; loop variables and names
 * inside sections are local and never reported.
 */
final class UnsizedVariable implements Rule {
    static final RuleDescriptor DESCRIPTOR = RuleDescriptor.builtIn("unsized-variable", Severity.INFO,
            "A variable with neither a token size nor a sample value.",
            "Estimated tokens, budgets and costs count a variable only through its declared size or sample;"
                    + " without one the estimate silently leaves the variable out and reads low.",
            "Declare the variable in front matter with {tokens: N} or {sample: \"...\"}.",
            Example.of("Summarise {{ ticket_text }} in one line.\n",
                    "---\nvariables:\n  ticket_text: {tokens: 300}\n---\nSummarise {{ ticket_text }} in one line.\n"));

    @Override
    public RuleDescriptor descriptor() {
        return DESCRIPTOR;
    }

    @Override
    public List<Finding> check(Template template, LintContext context) {
        TemplateView text = context.text(template);
        List<Finding> findings = new ArrayList<>();
        Set<String> reported = new HashSet<>();
        for (TemplateNames.Use use : TemplateNames.of(template)) {
            if (use.local() || reported.contains(use.name())) {
                continue;
            }
            Optional<VariableSpec> spec = declaration(template, use);
            String message;
            if (use.isCallOutput() && (spec.isEmpty() || !spec.get().isSized())) {
                message = "the output of '" + use.name() + "' has neither a size nor a sample, so estimates leave it"
                        + " out; declare variables: {\"" + use.name() + "\": {tokens: N}} or {sample: \"...\"}";
            } else if (use.rendered() && (spec.isEmpty() || !spec.get().isSized())) {
                message = "'" + use.name() + "' has neither a size nor a sample, so estimates leave it out; declare"
                        + " variables: {" + use.root() + ": {tokens: N}} or {sample: \"...\"}";
            } else if (!use.rendered() && spec.isEmpty() && use.segment() instanceof Segment.Call call) {
                message = "'" + use.name() + "' is passed to '" + call.name() + "' but is not declared; declare it"
                        + " under variables (a sample or size documents the input)";
            } else if (!use.rendered() && spec.isEmpty()) {
                message = "'" + use.name() + "' decides what is sent but is not declared; declare it under variables"
                        + " (a sample or size documents the input)";
            } else {
                continue;
            }
            reported.add(use.name());
            Location at = locate(text, template, use.segment());
            findings.add(text.finding(DESCRIPTOR, at.message(), at.start(), at.end(), message, Optional.empty(), List.of()));
        }
        return findings;
    }

    private static Optional<VariableSpec> declaration(Template template, TemplateNames.Use use) {
        var declared = template.meta().variables();
        if (declared.containsKey(use.name())) {
            return Optional.of(declared.get(use.name()));
        }
        return Optional.ofNullable(declared.get(use.root()));
    }

    /** Where a segment stands, as a message and content offsets. */
    record Location(MessageView message, int start, int end) {
    }

    static Location locate(TemplateView text, Template template, Segment segment) {
        int base = template.isChat() ? 0 : template.bodyStart();
        // The segment is normally one of the messages' own: finding it by identity spares comparing
        // every segment's whole record on the way.
        for (MessageView message : text.messages()) {
            for (Segment own : message.message().segments()) {
                if (own == segment) {
                    return new Location(message, segment.span().start() - base, segment.span().end() - base);
                }
            }
        }
        for (MessageView message : text.messages()) {
            if (message.message().segments().contains(segment)) {
                return new Location(message, segment.span().start() - base, segment.span().end() - base);
            }
        }
        return new Location(text.messages().get(0), 0, 0);
    }
}
