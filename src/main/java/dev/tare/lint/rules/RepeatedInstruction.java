package dev.tare.lint.rules;

import dev.tare.lint.Edit;
import dev.tare.lint.EditKind;
import dev.tare.lint.Example;
import dev.tare.lint.Finding;
import dev.tare.lint.LintContext;
import dev.tare.lint.MessageView;
import dev.tare.lint.Rewrite;
import dev.tare.lint.Rule;
import dev.tare.lint.RuleDescriptor;
import dev.tare.lint.Severity;
import dev.tare.lint.TemplateView;
import dev.tare.template.Template;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * An instruction that appears word for word earlier in the same message and the same conditional
 * branch (whitespace aside). Only sentences the structure model reads as instructions count: never
 * examples, dialogue, quotes, code, headings or XML-style sections, where repeating a line is part
 * of what the model is shown. Dropping the later copy changes the prompt's text, so it is a review
 * rewrite: the copy may be there for emphasis, or read differently where it stands.
 */
final class RepeatedInstruction implements Rule {
    static final RuleDescriptor DESCRIPTOR = RuleDescriptor.builtIn("repeated-instruction", Severity.WARNING,
            EditKind.TEXT,
            "An instruction repeated word for word within one message.",
            "The model already read the instruction; the second copy adds tokens to every call, and when the"
                    + " copies drift apart in later edits they start to contradict each other.",
            "State each instruction once, where it belongs.",
            Example.of("Ask whether the water is clear before anything else.\n\nCheck the meter.\n\n"
                            + "Ask whether the water is clear before anything else.\n\nThen close.\n",
                    "Ask whether the water is clear before anything else.\n\nCheck the meter.\n\nThen close.\n"));

    @Override
    public RuleDescriptor descriptor() {
        return DESCRIPTOR;
    }

    @Override
    public List<Finding> check(Template template, LintContext context) {
        TemplateView text = context.text(template);
        List<Finding> findings = new ArrayList<>();
        for (MessageView message : text.messages()) {
            Map<String, Sentences.Sentence> first = new HashMap<>();
            List<Sentences.Sentence> sentences = Sentences.of(message);
            for (int index = 0; index < sentences.size(); index++) {
                Sentences.Sentence sentence = sentences.get(index);
                if (!sentence.instruction() || sentence.words() < Sentences.MIN_WORDS) {
                    continue;
                }
                Sentences.Sentence earlier = first.putIfAbsent(sentence.branch() + "\u0000" + sentence.text(), sentence);
                if (earlier == null) {
                    continue;
                }
                Optional<Rewrite> rewrite = message.isProtected(sentence.start(), sentence.end()) ? Optional.empty()
                        : Sentences.removal(message.content(), sentences, index, false)
                                .filter(r -> !message.isProtected(r[0], r[1]))
                                .flatMap(r -> text.rewrite(message, new Edit(r[0], r[1], ""), context.tokenizer(template)));
                int line = text.line(message, earlier.start());
                findings.add(text.finding(DESCRIPTOR, message, sentence.start(), sentence.end(),
                        "repeats the sentence on line " + line + " word for word"
                                + (rewrite.isPresent() ? "; drop this copy after checking the prompt reads the same" : "; keep one copy"),
                        rewrite, List.of(text.related(message, earlier.start(), "first copy"))));
            }
        }
        return findings;
    }
}
