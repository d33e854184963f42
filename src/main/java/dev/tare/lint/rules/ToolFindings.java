package dev.tare.lint.rules;

import dev.tare.lint.Finding;
import dev.tare.lint.LintContext;
import dev.tare.lint.Rewrite;
import dev.tare.lint.RuleDescriptor;
import dev.tare.lint.TemplateView;
import dev.tare.template.Template;
import java.util.List;
import java.util.Optional;

/** Findings on a line of a tool file, where tool rules point: a tool's or a parameter's line. */
final class ToolFindings {
    private ToolFindings() {
    }

    static Finding at(Template template, LintContext context, RuleDescriptor rule, int line, String message) {
        return at(template, context, rule, line, message, Optional.empty());
    }

    static Finding at(Template template, LintContext context, RuleDescriptor rule, int line, String message,
                      Optional<Rewrite> rewrite) {
        TemplateView text = context.text(template);
        int start = text.lineStart(line);
        int end = template.source().indexOf('\n', start);
        end = end < 0 ? template.source().length() : end;
        Finding located = text.findingInSource(rule, start, Math.max(start, end), message);
        return new Finding(located.path(), located.line(), located.column(), located.endLine(), located.endColumn(),
                located.rule(), located.severity(), message, rule.rewriteClass(), rewrite, List.of());
    }
}
