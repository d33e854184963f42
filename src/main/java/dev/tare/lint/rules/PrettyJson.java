package dev.tare.lint.rules;

import com.fasterxml.jackson.databind.JsonNode;
import dev.tare.lint.Edit;
import dev.tare.lint.EditKind;
import dev.tare.lint.Example;
import dev.tare.lint.Finding;
import dev.tare.lint.LintContext;
import dev.tare.lint.MessageView;
import dev.tare.lint.Rule;
import dev.tare.lint.RuleDescriptor;
import dev.tare.lint.Severity;
import dev.tare.lint.StrictJson;
import dev.tare.lint.TemplateView;
import dev.tare.structure.Region;
import dev.tare.structure.Role;
import dev.tare.template.Template;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

/**
 * A message that is nothing but pretty-printed JSON: a payload the model reads as data, whose layout
 * tells it nothing. The rewrite is the same value minified, and it is offered only after both sides
 * are parsed (strictly: duplicate keys and trailing text refused, numbers kept exact) and found to be
 * equal JSON trees, and every placeholder inside is kept in order. JSON shown inside prose is
 * {@link PrettyJsonBlock}'s.
 */
final class PrettyJson implements Rule {
    static final RuleDescriptor DESCRIPTOR = RuleDescriptor.builtIn("pretty-json", Severity.WARNING, EditKind.JSON_LAYOUT,
            "A message that is all JSON, written pretty-printed (indented, one member per line).",
            "Indentation and line breaks are tokens; a model reads minified JSON just as well, so the layout"
                    + " is paid for on every call.",
            "Write the JSON on one line, without spaces between members.",
            Example.of("{\n  \"intent\": \"billing\",\n  \"urgent\": false\n}\n",
                    "{\"intent\":\"billing\",\"urgent\":false}\n"));

    @Override
    public RuleDescriptor descriptor() {
        return DESCRIPTOR;
    }


    @Override
    public List<Finding> check(Template template, LintContext context) {
        TemplateView text = context.text(template);
        List<Finding> findings = new ArrayList<>();
        for (MessageView message : text.messages()) {
            String content = message.content();
            String stripped = content.strip();
            if (message.fences().isEmpty() && (stripped.startsWith("{") || stripped.startsWith("["))) {
                int start = content.indexOf(stripped.charAt(0));
                minified(DESCRIPTOR, text, message, start, start + stripped.length(), "", context, template)
                        .ifPresent(findings::add);
            }
        }
        return findings;
    }

    /**
     * A finding of {@code rule} offering {@code [start, end)} of the message minified (followed by
     * {@code lineBreak}), when that text is pretty-printed JSON.
     */
    static Optional<Finding> minified(RuleDescriptor rule, TemplateView text, MessageView message, int start, int end,
                                      String lineBreak, LintContext context, Template template) {
        String json = message.content().substring(start, end);
        if (json.strip().isEmpty() || !json.contains("\n")) {
            return Optional.empty();
        }
        Optional<String> minified = minify(json);
        if (minified.isEmpty() || !keepsPlaceholders(message, start, end, minified.get())) {
            return Optional.empty();
        }
        String replacement = minified.get() + lineBreak;
        if (replacement.equals(json)) {
            return Optional.empty();
        }
        int lines = (int) json.chars().filter(c -> c == '\n').count();
        var rewrite = text.rewrite(message, new Edit(start, end, replacement), context.tokenizer(template));
        return Optional.of(text.finding(rule, message, start, end,
                "pretty-printed JSON over " + lines + " lines; the same JSON minified fits on one"
                        + rewrite.map(r -> " and saves " + r.savingTokens() + " tokens").orElse(""),
                rewrite, List.of()));
    }

    /** The minified form of {@code json}, when it parses and the minified text parses to an equal tree. */
    static Optional<String> minify(String json) {
        Optional<JsonNode> tree = StrictJson.tree(json);
        if (tree.isEmpty()) {
            return Optional.empty();
        }
        String minified = StrictJson.minified(tree.get());
        return StrictJson.tree(minified).equals(tree) ? Optional.of(minified) : Optional.empty();
    }

    /** Whether every placeholder inside {@code [start, end)} appears, in order, in the minified text. */
    private static boolean keepsPlaceholders(MessageView message, int start, int end, String minified) {
        String content = message.content();
        int at = 0;
        for (Region region : message.touching(start, end, Role.PLACEHOLDER)) {
            if (region.start() < start || region.end() > end) {
                continue;
            }
            int found = minified.indexOf(content.substring(region.start(), region.end()), at);
            if (found < 0) {
                return false;
            }
            at = found + (region.end() - region.start());
        }
        return true;
    }

    static String finalLineBreak(String content, int start, int end) {
        if (end - start >= 2 && content.startsWith("\r\n", end - 2)) {
            return "\r\n";
        }
        return end > start && (content.charAt(end - 1) == '\n' || content.charAt(end - 1) == '\r')
                ? String.valueOf(content.charAt(end - 1)) : "";
    }
}
