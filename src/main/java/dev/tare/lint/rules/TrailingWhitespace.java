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
import dev.tare.template.Template;
import java.util.ArrayList;
import java.util.List;

/** Spaces and tabs at the end of a prose line. */
final class TrailingWhitespace implements Rule {
    static final RuleDescriptor DESCRIPTOR = RuleDescriptor.builtIn("trailing-whitespace", Severity.WARNING,
            EditKind.WHITESPACE,
            "Spaces or tabs at the end of a line of prose.",
            "The model never needs them, yet they are sent and paid for on every call, and they can keep the"
                    + " line break after them from merging with neighbouring text into one token.",
            "End the line at its last visible character.",
            Example.of("Answer in one short paragraph.  \nThen stop.\t\n", "Answer in one short paragraph.\nThen stop.\n"));

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
            for (ContentLine line : ContentLine.of(content)) {
                int start = line.end();
                while (start > line.start() && (content.charAt(start - 1) == ' ' || content.charAt(start - 1) == '\t')) {
                    start--;
                }
                if (start == line.end() || !message.allowsWhitespaceEdit(start, line.end())) {
                    continue;
                }
                int width = line.end() - start;
                findings.add(text.edit(DESCRIPTOR, message, start, line.end(), "",
                        width + " trailing " + describe(content, start, line.end())
                                + " at the end of the line; delete " + (width == 1 ? "it" : "them"),
                        context.tokenizer(template)));
            }
        }
        return findings;
    }

    private static String describe(String content, int start, int end) {
        boolean tabs = content.substring(start, end).indexOf('\t') >= 0;
        boolean spaces = content.substring(start, end).indexOf(' ') >= 0;
        int width = end - start;
        if (tabs && spaces) {
            return "whitespace characters";
        }
        return tabs ? (width == 1 ? "tab" : "tabs") : (width == 1 ? "space" : "spaces");
    }
}
