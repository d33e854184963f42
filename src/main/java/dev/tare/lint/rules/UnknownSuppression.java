package dev.tare.lint.rules;

import dev.tare.lint.Example;
import dev.tare.lint.Finding;
import dev.tare.lint.LintContext;
import dev.tare.lint.Rule;
import dev.tare.lint.RuleDescriptor;
import dev.tare.lint.Severity;
import dev.tare.lint.Suppressions;
import dev.tare.lint.TemplateView;
import dev.tare.template.Template;
import java.util.ArrayList;
import java.util.List;

/** An inline {@code tare-ignore} directive that names a rule Tare does not know, so it silences nothing. */
final class UnknownSuppression implements Rule {
    static final RuleDescriptor DESCRIPTOR = RuleDescriptor.builtIn("unknown-suppression", Severity.WARNING,
            "A tare-ignore directive that names an unknown rule.",
            "A misspelt directive silences nothing, so the finding it was meant for still fails the check, or"
                    + " the directive lingers as dead text that may be sent to the model.",
            "Spell the rule id as 'tare rules' lists it, or remove the directive.",
            Example.of("Be brief. {# tare-ignore trailing-space #}\n", "Be brief. {# tare-ignore trailing-whitespace #}\n"));

    @Override
    public RuleDescriptor descriptor() {
        return DESCRIPTOR;
    }

    @Override
    public List<Finding> check(Template template, LintContext context) {
        TemplateView text = context.text(template);
        List<Finding> findings = new ArrayList<>();
        for (Suppressions.Directive directive : Suppressions.of(text).directives()) {
            for (String id : directive.ids()) {
                if (!id.equals("all") && !context.ruleIds().contains(id)) {
                    findings.add(text.findingInSource(DESCRIPTOR, directive.offset(), directive.offset() + "tare-ignore".length(),
                            "the directive names unknown rule '" + id + "', so it silences nothing; 'tare rules' lists every rule"));
                }
            }
        }
        return findings;
    }
}
