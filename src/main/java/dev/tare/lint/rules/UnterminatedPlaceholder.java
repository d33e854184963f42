package dev.tare.lint.rules;

import dev.tare.lint.Example;
import dev.tare.lint.Finding;
import dev.tare.lint.LintContext;
import dev.tare.lint.RewriteClass;
import dev.tare.lint.RuleDescriptor;
import dev.tare.lint.Severity;
import dev.tare.lint.SyntaxErrorRule;
import dev.tare.template.Template;
import dev.tare.template.TemplateSyntaxException;
import java.util.List;
import java.util.Optional;

/**
 * A placeholder, tag or include that is opened and never closed (or another placeholder the parser
 * cannot read). Such a file cannot be parsed, so this rule speaks for it through
 * {@link #onSyntaxError}; parsed templates never have one.
 */
final class UnterminatedPlaceholder implements SyntaxErrorRule {
    static final RuleDescriptor DESCRIPTOR = RuleDescriptor.builtIn("unterminated-placeholder", Severity.ERROR,
            "A placeholder, tag or include that is opened but never closed.",
            "The template engine will fail on it or send the braces and everything after them literally, so"
                    + " the model gets broken text; no token count of the file can be trusted either.",
            "Close the placeholder, or write literal braces the way the placeholder syntax allows (for"
                    + " double-brace templates, inside {% raw %}...{% endraw %}).",
            Example.of("Hello {{ customer_name, how can I help?\n", "Hello {{ customer_name }}, how can I help?\n"));

    @Override
    public RuleDescriptor descriptor() {
        return DESCRIPTOR;
    }

    @Override
    public List<Finding> check(Template template, LintContext context) {
        return List.of();
    }

    @Override
    public List<Finding> onSyntaxError(String path, String source, TemplateSyntaxException error) {
        String problem = error.getMessage().replaceFirst("^line \\d+, column \\d+: ", "");
        int column = SyntaxErrorRule.codePointColumn(source, error.line(), error.column());
        return List.of(new Finding(path, error.line(), column, error.line(), column + 1,
                DESCRIPTOR.id(), DESCRIPTOR.severity(), problem, RewriteClass.NONE, Optional.empty(), List.of()));
    }
}
