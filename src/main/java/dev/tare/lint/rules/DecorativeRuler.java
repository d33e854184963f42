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

/**
 * A line that is only a long run of one of {@code = - * # _} (five or more, spaces between allowed):
 * a ruler drawn for people. The short form keeps a Markdown break ({@code ---}, {@code ***},
 * {@code ___}) or a setext underline ({@code ===}).
 */
final class DecorativeRuler implements Rule {
    /** Shorter runs are Markdown's own rules and underlines. */
    static final int MIN_RUN = 5;

    static final RuleDescriptor DESCRIPTOR = RuleDescriptor.builtIn("decorative-ruler", Severity.WARNING,
            EditKind.TEXT,
            "A line drawn with a long run of =, -, *, # or _ as a visual ruler.",
            "Long rulers are for human eyes; the model gets the same break from three characters, and runs of"
                    + " symbols tokenize poorly, so every extra character can be paid for on every call.",
            "Use a three-character break such as --- (or === under a heading), or a Markdown heading.",
            Example.of("Rules\n\n**********\n\nBe brief.\n", "Rules\n\n***\n\nBe brief.\n"));

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
                String stripped = line.text(content).strip();
                if (!isRuler(stripped)) {
                    continue;
                }
                int start = line.start() + line.text(content).indexOf(stripped.charAt(0));
                int end = start + stripped.length();
                if (message.isProtected(start, end)) {
                    continue;
                }
                String shortForm = shortForm(stripped.charAt(0));
                findings.add(text.edit(DESCRIPTOR, message, start, end, shortForm,
                        "a " + stripped.replace(" ", "").length() + "-character '" + stripped.charAt(0)
                                + "' ruler; '" + shortForm + "' separates just as well",
                        context.tokenizer(template)));
            }
        }
        return findings;
    }

    private static boolean isRuler(String line) {
        if (line.isEmpty() || "=-*#_".indexOf(line.charAt(0)) < 0) {
            return false;
        }
        char mark = line.charAt(0);
        int marks = 0;
        for (int i = 0; i < line.length(); i++) {
            char c = line.charAt(i);
            if (c == mark) {
                marks++;
            } else if (c != ' ') {
                return false;
            }
        }
        return marks >= MIN_RUN;
    }

    private static String shortForm(char mark) {
        return switch (mark) {
            case '=' -> "===";
            case '*' -> "***";
            case '_' -> "___";
            default -> "---";
        };
    }
}
