package dev.tare.lint.rules;

import dev.tare.lint.EditKind;
import dev.tare.lint.Example;
import dev.tare.lint.Finding;
import dev.tare.lint.LintContext;
import dev.tare.lint.MessageView;
import dev.tare.lint.Rule;
import dev.tare.lint.RuleDescriptor;
import dev.tare.lint.Severity;
import dev.tare.lint.TemplateView;
import dev.tare.structure.Fence;
import dev.tare.template.Template;
import java.util.ArrayList;
import java.util.List;

/**
 * Pretty-printed JSON in a fenced {@code json} block of a prompt's text. Minified, it holds the same
 * value, but the block is something the model is shown, usually an example of the output wanted, and
 * a model imitates an example's layout: so the rewrite changes what the model is told and is a
 * review rewrite. (A message that is all JSON is data, and {@link PrettyJson}'s safe rewrite.)
 */
final class PrettyJsonBlock implements Rule {
    static final RuleDescriptor DESCRIPTOR = RuleDescriptor.builtIn("pretty-json-block", Severity.INFO, EditKind.TEXT,
            "A fenced json block written pretty-printed (indented, one member per line).",
            "Indentation and line breaks are tokens paid on every call; when the block is not an example of"
                    + " the layout the reply should have, the model reads minified JSON just as well.",
            "Write the JSON on one line, without spaces between members, unless its layout is part of the example.",
            Example.of("Reply with JSON like this:\n```json\n{\n  \"intent\": \"billing\",\n  \"urgent\": false\n}\n```\n",
                    "Reply with JSON like this:\n```json\n{\"intent\":\"billing\",\"urgent\":false}\n```\n"));

    @Override
    public RuleDescriptor descriptor() {
        return DESCRIPTOR;
    }

    @Override
    public List<Finding> check(Template template, LintContext context) {
        TemplateView text = context.text(template);
        List<Finding> findings = new ArrayList<>();
        for (MessageView message : text.messages()) {
            for (Fence fence : message.fences()) {
                if (fence.closed() && fence.language().equals("json")) {
                    String lineBreak = PrettyJson.finalLineBreak(message.content(), fence.bodyStart(), fence.bodyEnd());
                    PrettyJson.minified(DESCRIPTOR, text, message, fence.bodyStart(), fence.bodyEnd(), lineBreak, context,
                            template).ifPresent(findings::add);
                }
            }
        }
        return findings;
    }
}
