package dev.tare.lint.rules;

import dev.tare.lint.Edit;
import dev.tare.lint.EditKind;
import dev.tare.lint.Example;
import dev.tare.lint.Finding;
import dev.tare.lint.LintContext;
import dev.tare.lint.MessageText;
import dev.tare.lint.RewriteClass;
import dev.tare.lint.Rule;
import dev.tare.lint.RuleDescriptor;
import dev.tare.lint.Severity;
import dev.tare.lint.TemplateText;
import dev.tare.template.Template;
import java.util.ArrayList;
import java.util.List;

/** Two or more spaces between words of a prose line (indentation is left alone). */
final class SpaceRun implements Rule {
    static final RuleDescriptor DESCRIPTOR = RuleDescriptor.builtIn("space-run", Severity.WARNING, RewriteClass.SAFE,
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
    public EditKind editKind() {
        return EditKind.WHITESPACE;
    }

    @Override
    public List<Finding> check(Template template, LintContext context) {
        TemplateText text = context.text(template);
        List<Finding> findings = new ArrayList<>();
        for (MessageText message : text.messages()) {
            String content = message.content();
            for (Line line : Line.of(content)) {
                int i = line.start();
                while (i < line.end() && (content.charAt(i) == ' ' || content.charAt(i) == '\t')) {
                    i++;
                }
                while (i < line.end()) {
                    if (content.charAt(i) != ' ') {
                        i++;
                        continue;
                    }
                    int run = i;
                    while (run < line.end() && content.charAt(run) == ' ') {
                        run++;
                    }
                    boolean inside = run < line.end() && content.charAt(run) != '\t' && content.charAt(i - 1) != '\t';
                    if (run - i >= 2 && inside && !message.isProtected(i, run)) {
                        findings.add(text.finding(DESCRIPTOR, message, i, run,
                                (run - i) + " spaces in a row; one is enough",
                                text.rewrite(message, List.of(new Edit(i, run, " ")), context.tokenizer(template)),
                                List.of()));
                    }
                    i = run;
                }
            }
        }
        return findings;
    }
}
