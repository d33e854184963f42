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

/** A tab between words of a prose line; leading tabs (indentation) and trailing ones are other matters. */
final class ProseTab implements Rule {
    static final RuleDescriptor DESCRIPTOR = RuleDescriptor.builtIn("prose-tab", Severity.WARNING, EditKind.WHITESPACE,
            "A tab between words of a line of prose.",
            "A tab inside prose usually costs a token of its own where a space would merge with the next word.",
            "Use a single space.",
            Example.of("Check the meter.\tThen call back.\n", "Check the meter. Then call back.\n"));

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
                    boolean tab = content.substring(run[0], run[1]).indexOf('\t') >= 0;
                    if (tab && message.allowsWhitespaceEdit(run[0], run[1])) {
                        findings.add(text.edit(DESCRIPTOR, message, run[0], run[1], " ", "a tab between words; use one space",
                                context.tokenizer(template)));
                    }
                }
            }
        }
        return findings;
    }
}
