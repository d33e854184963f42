package dev.tare.lint.rules;

import dev.tare.lint.Edit;
import dev.tare.lint.Example;
import dev.tare.lint.Finding;
import dev.tare.lint.LintContext;
import dev.tare.lint.MessageText;
import dev.tare.lint.Rewrite;
import dev.tare.lint.RewriteClass;
import dev.tare.lint.Rule;
import dev.tare.lint.RuleDescriptor;
import dev.tare.lint.Severity;
import dev.tare.lint.TemplateText;
import dev.tare.template.Template;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * A sentence that appears word for word earlier in the same template (whitespace aside). Dropping the
 * later copy is safe outside code and lists, when the copy holds no placeholder, code or URL.
 */
final class RepeatedInstruction implements Rule {
    static final RuleDescriptor DESCRIPTOR = RuleDescriptor.builtIn("repeated-instruction", Severity.WARNING,
            RewriteClass.SAFE,
            "A sentence repeated word for word within one template.",
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
        TemplateText text = context.text(template);
        List<Finding> findings = new ArrayList<>();
        Map<String, Located> first = new HashMap<>();
        for (MessageText message : text.messages()) {
            List<Sentences.Sentence> sentences = Sentences.of(message);
            for (int index = 0; index < sentences.size(); index++) {
                Sentences.Sentence sentence = sentences.get(index);
                int at = index;
                if (sentence.words() < Sentences.MIN_WORDS) {
                    continue;
                }
                Located earlier = first.putIfAbsent(sentence.text(), new Located(message, sentence));
                if (earlier == null) {
                    continue;
                }
                Optional<Rewrite> rewrite = message.isProtected(sentence.start(), sentence.end()) ? Optional.empty()
                        : Sentences.removal(message.content(), sentences, at, false)
                                .filter(r -> !message.isProtected(r[0], r[1]))
                                .flatMap(r -> text.rewrite(message, List.of(new Edit(r[0], r[1], "")), context.tokenizer(template)));
                int line = text.line(earlier.message(), earlier.sentence().start());
                findings.add(text.finding(DESCRIPTOR, message, sentence.start(), sentence.end(),
                        "repeats the sentence on line " + line + " word for word"
                                + (rewrite.isPresent() ? "; drop this copy" : "; keep one copy"),
                        rewrite, List.of(text.related(earlier.message(), earlier.sentence().start(), "first copy"))));
            }
        }
        return findings;
    }

    /** A sentence and the message it stands in. */
    record Located(MessageText message, Sentences.Sentence sentence) {
    }
}
