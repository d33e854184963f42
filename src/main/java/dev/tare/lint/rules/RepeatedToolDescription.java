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
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;

/**
 * A sentence that stands in the descriptions of two tools, or a parameter description that only
 * repeats its tool's. Every tool definition is sent with every call, so a repeat is paid each time.
 */
final class RepeatedToolDescription implements ToolRule {
    static final RuleDescriptor DESCRIPTOR = RuleDescriptor.builtIn("repeated-tool-description", Severity.WARNING,
            "A sentence repeated across tool descriptions, or a parameter description that repeats its tool's.",
            "Every definition goes out with every call: a sentence written into three tools is paid three times a call.",
            "Say it once: in the one tool it belongs to, or in the system prompt if it applies to every tool.",
            Example.of("[{\"name\":\"lookup_account\",\"description\":\"Find an account. Always confirm the customer's name first.\"},"
                            + "{\"name\":\"close_account\",\"description\":\"Close an account. Always confirm the customer's name first.\"}]\n",
                    "[{\"name\":\"lookup_account\",\"description\":\"Find an account. Always confirm the customer's name first.\"},"
                            + "{\"name\":\"close_account\",\"description\":\"Close an account.\"}]\n"));

    /** Sentences shorter than this are too generic to call a repeat ("Required."). */
    private static final int MIN_SENTENCE_CHARS = 20;

    @Override
    public RuleDescriptor descriptor() {
        return DESCRIPTOR;
    }

    @Override
    public List<Finding> check(Template template, LintContext context) {
        List<Finding> findings = new ArrayList<>();
        Map<String, String> firstTool = new HashMap<>();
        for (ToolDefinition tool : context.toolDefinitions(template)) {
            for (String sentence : sentences(tool.description().orElse(""))) {
                String key = normalise(sentence);
                String earlier = firstTool.putIfAbsent(key, tool.name());
                if (earlier != null && !earlier.equals(tool.name())) {
                    findings.add(ToolFindings.at(template, context, DESCRIPTOR, tool.line(),
                            "tool '" + tool.name() + "' repeats \"" + sentence + "\" from tool '" + earlier + "'"));
                }
            }
            Optional<String> own = tool.description().map(RepeatedToolDescription::normalise);
            for (ToolDefinition.Parameter parameter : tool.parameters()) {
                Optional<String> text = parameter.description().map(RepeatedToolDescription::normalise);
                if (own.isPresent() && text.isPresent() && text.get().length() >= MIN_SENTENCE_CHARS
                        && own.get().contains(text.get())) {
                    findings.add(ToolFindings.at(template, context, DESCRIPTOR, parameter.line(),
                            "parameter '" + parameter.path() + "' of tool '" + tool.name()
                                    + "' only repeats the tool's description"));
                }
            }
        }
        return findings;
    }

    private static List<String> sentences(String description) {
        List<String> sentences = new ArrayList<>();
        for (String part : description.split("(?<=[.!?])\\s+")) {
            if (part.strip().length() >= MIN_SENTENCE_CHARS) {
                sentences.add(part.strip());
            }
        }
        return sentences;
    }

    private static String normalise(String text) {
        return text.strip().replaceAll("\\s+", " ").toLowerCase(Locale.ROOT);
    }
}
