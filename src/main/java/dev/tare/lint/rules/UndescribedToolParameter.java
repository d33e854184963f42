package dev.tare.lint.rules;

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

/** A tool parameter without a description, which leaves the model to guess what to put there. */
final class UndescribedToolParameter implements ToolRule {
    static final RuleDescriptor DESCRIPTOR = RuleDescriptor.builtIn("undescribed-tool-parameter", Severity.INFO,
            "A tool parameter with no description.",
            "A model that guesses an argument wrongly makes a failed call and a retry, and the retry resends the whole prompt.",
            "Give the parameter a short description with an example value.",
            Example.of("[{\"name\":\"lookup_account\",\"description\":\"Find an account.\",\"parameters\":{\"type\":\"object\","
                            + "\"properties\":{\"phone\":{\"type\":\"string\"}}}}]\n",
                    "[{\"name\":\"lookup_account\",\"description\":\"Find an account.\",\"parameters\":{\"type\":\"object\","
                            + "\"properties\":{\"phone\":{\"type\":\"string\",\"description\":\"Phone on file, digits only.\"}}}}]\n"));

    @Override
    public RuleDescriptor descriptor() {
        return DESCRIPTOR;
    }

    @Override
    public List<Finding> check(Template template, LintContext context) {
        List<Finding> findings = new ArrayList<>();
        for (ToolDefinition tool : context.toolDefinitions(template)) {
            for (ToolDefinition.Parameter parameter : tool.parameters()) {
                if (parameter.description().isEmpty()) {
                    findings.add(ToolFindings.at(template, context, DESCRIPTOR, parameter.line(),
                            "parameter '" + parameter.path() + "' of tool '" + tool.name() + "' has no description"));
                }
            }
        }
        return findings;
    }
}
