package dev.tare.lint.rules;

import dev.tare.TareException;
import dev.tare.lint.Example;
import dev.tare.lint.Finding;
import dev.tare.lint.LintContext;
import dev.tare.lint.Rule;
import dev.tare.lint.RuleDescriptor;
import dev.tare.lint.Severity;
import dev.tare.lint.TemplateView;
import dev.tare.template.Segment;
import dev.tare.template.Template;
import java.util.List;
import java.util.Optional;

/** An include that cannot be pasted in: a missing file, a cycle, runaway nesting or a path outside the root. */
final class UnresolvedInclude implements Rule {
    static final RuleDescriptor DESCRIPTOR = RuleDescriptor.builtIn("unresolved-include", Severity.ERROR,
            "An include that cannot be resolved: the file is missing, includes form a cycle, or the path leads outside the repository.",
            "The rendered prompt is not what the template says, so the model gets broken text and no footprint of"
                    + " the template can be measured.",
            "Name a partial that exists under the partials folder (or beside the template), and break include cycles.",
            Example.of("{{> no-such-partial }}\nAnswer the question.\n", "Answer the question.\n"));

    @Override
    public RuleDescriptor descriptor() {
        return DESCRIPTOR;
    }

    @Override
    public List<Finding> check(Template template, LintContext context) {
        List<Segment.Include> includes = template.segments().stream()
                .filter(s -> s instanceof Segment.Include).map(s -> (Segment.Include) s).toList();
        if (includes.isEmpty()) {
            return List.of();
        }
        try {
            context.renderer().renderStatic(template);
            return List.of();
        } catch (TareException e) {
            Segment.Include at = includes.stream()
                    .filter(include -> e.getMessage().contains("'" + include.name() + "'")
                            || e.getMessage().contains("line " + include.span().line() + ":"))
                    .findFirst().orElse(includes.get(0));
            TemplateView text = context.text(template);
            UnsizedVariable.Location location = UnsizedVariable.locate(text, template, at);
            return List.of(text.finding(DESCRIPTOR, location.message(), location.start(), location.end(),
                    e.getMessage(), Optional.empty(), List.of()));
        }
    }
}
