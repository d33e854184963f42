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

/** Two or more spaces between words of a prose line (indentation is left alone). */
final class SpaceRun implements Rule {
    static final RuleDescriptor DESCRIPTOR = RuleDescriptor.builtIn("space-run", Severity.WARNING, EditKind.WHITESPACE,
            "Two or more spaces between words inside a line of prose.",
            "Tokenizers give runs of spaces tokens of their own, so double spaces after full stops or for"
                    + " alignment are paid for on every call without changing what the model reads.",
            "Put one space between words and after sentence ends.",
            Example.of("Reply briefly.  Then ask one question.\n", "Reply briefly. Then ask one question.\n"));

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
                for (int[] run : line.blanksBetweenWords(content)) {
                    // A run with a tab in it is prose-tab's; this rule takes runs of spaces only.
                    boolean spacesOnly = content.substring(run[0], run[1]).indexOf('\t') < 0;
                    if (spacesOnly && run[1] - run[0] >= 2 && message.allowsWhitespaceEdit(run[0], run[1])) {
                        findings.add(text.edit(DESCRIPTOR, message, run[0], run[1], " ",
                                (run[1] - run[0]) + " spaces in a row; one is enough", context.tokenizer(template)));
                    }
                }
            }
        }
        return findings;
    }
}
