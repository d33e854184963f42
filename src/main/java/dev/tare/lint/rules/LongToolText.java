package dev.tare.lint.rules;

import dev.tare.lint.Example;
import dev.tare.lint.Finding;
import dev.tare.lint.LintContext;
import dev.tare.lint.RuleDescriptor;
import dev.tare.lint.Severity;
import dev.tare.lint.ToolRule;
import dev.tare.template.Template;
import dev.tare.template.ToolDefinition;
import dev.tare.tokenize.Tokenizer;
import java.util.ArrayList;
import java.util.List;

/**
 * A tool or parameter description, or an enum list, larger than the limits in
 * {@code rules.limits} ({@code tool_description_tokens}, default {@value #DESCRIPTION_TOKENS};
 * {@code tool_enum_tokens}, default {@value #ENUM_TOKENS}). The defaults are common practice, no source.
 */
final class LongToolText implements ToolRule {
    static final int DESCRIPTION_TOKENS = 60;
    static final int ENUM_TOKENS = 40;

    static final RuleDescriptor DESCRIPTOR = RuleDescriptor.builtIn("long-tool-text", Severity.INFO,
            "A tool description, parameter description or enum list over its token limit.",
            "Tool definitions are sent with every call whether or not the tool is used; a long description is paid"
                    + " on calls that never touch the tool.",
            "Keep what the model needs to choose the tool and fill its arguments; move procedure into the prompt"
                    + " that runs when the tool's result comes back, and replace long enums with a described string.",
            Example.of("[{\"name\":\"report_outage\",\"description\":\"Record a customer's report of a problem with the water"
                            + " supply at their address. Use this tool whenever the customer says that there is no water, that the"
                            + " pressure is low, that the water is discoloured, that there is air in the pipes, that the water tastes"
                            + " or smells odd, or that they can see water pooling in the street outside the property.\"}]\n",
                    "[{\"name\":\"report_outage\",\"description\":\"Record a customer's report of a supply problem at an address.\"}]\n"));

    @Override
    public RuleDescriptor descriptor() {
        return DESCRIPTOR;
    }

    @Override
    public List<Finding> check(Template template, LintContext context) {
        int descriptionLimit = context.limit("tool_description_tokens", DESCRIPTION_TOKENS);
        int enumLimit = context.limit("tool_enum_tokens", ENUM_TOKENS);
        Tokenizer tokenizer = context.tokenizer(template);
        List<Finding> findings = new ArrayList<>();
        for (ToolDefinition tool : context.toolDefinitions(template)) {
            if (tool.description().isPresent()) {
                int tokens = tokenizer.count(tool.description().get());
                if (tokens > descriptionLimit) {
                    findings.add(ToolFindings.at(template, context, DESCRIPTOR, tool.line(), "tool '" + tool.name()
                            + "' has a " + tokens + "-token description, over the limit of " + descriptionLimit));
                }
            }
            for (ToolDefinition.Parameter parameter : tool.parameters()) {
                int tokens = parameter.description().map(tokenizer::count).orElse(0);
                if (tokens > descriptionLimit) {
                    findings.add(ToolFindings.at(template, context, DESCRIPTOR, parameter.line(), "parameter '"
                            + parameter.path() + "' of tool '" + tool.name() + "' has a " + tokens
                            + "-token description, over the limit of " + descriptionLimit));
                }
                int enumTokens = parameter.enumValues().isEmpty() ? 0 : tokenizer.count(String.join(",", parameter.enumValues()));
                if (enumTokens > enumLimit) {
                    findings.add(ToolFindings.at(template, context, DESCRIPTOR, parameter.line(), "parameter '"
                            + parameter.path() + "' of tool '" + tool.name() + "' lists " + parameter.enumValues().size()
                            + " values costing " + enumTokens + " tokens, over the limit of " + enumLimit));
                }
            }
        }
        return findings;
    }
}
