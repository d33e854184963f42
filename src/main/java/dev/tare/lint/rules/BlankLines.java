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

/** Two or more blank lines in a row (three or more line breaks), outside fenced code. */
final class BlankLines implements Rule {
    static final RuleDescriptor DESCRIPTOR = RuleDescriptor.builtIn("blank-lines", Severity.WARNING, EditKind.WHITESPACE,
            "Two or more blank lines in a row.",
            "One blank line already separates paragraphs; every further line break is a token sent on every"
                    + " call that tells the model nothing.",
            "Separate paragraphs with a single blank line, and end the text with a single line break.",
            Example.of("Greet the customer.\n\n\n\nAsk for the account number.\n",
                    "Greet the customer.\n\nAsk for the account number.\n"));

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
            List<ContentLine> lines = ContentLine.of(content);
            int i = 0;
            while (i < lines.size()) {
                if (!lines.get(i).isBlank(content)) {
                    i++;
                    continue;
                }
                int first = i;
                while (i < lines.size() && lines.get(i).isBlank(content)) {
                    i++;
                }
                int count = i - first;
                int start = lines.get(first).start();
                int end = lines.get(i - 1).next();
                boolean atStart = first == 0;
                boolean atEnd = i == lines.size();
                if (count < 2 || !message.allowsWhitespaceEdit(start, end)) {
                    continue;
                }
                String replacement = atStart || atEnd ? "" : lines.get(first).lineBreak(content);
                String where = atStart ? " at the start" : atEnd ? " at the end" : "";
                findings.add(text.edit(DESCRIPTOR, message, start, end, replacement,
                        count + " blank lines in a row" + where + "; " + (replacement.isEmpty() ? "remove them" : "keep one"),
                        context.tokenizer(template)));
            }
        }
        return findings;
    }
}
