package dev.tare.lint;

import java.util.List;
import java.util.Optional;

/**
 * Everything a rule says about itself, declared once: the single source for {@code tare rules},
 * {@code tare explain}, SARIF rule metadata and the example tests.
 *
 * @param id       the rule's id, lower-case words joined by hyphens
 * @param summary  what it flags, in one sentence
 * @param why      why that costs tokens, money or cache space
 * @param instead  what to write instead
 * @param severity the default severity of its findings
 * @param editKind what its rewrites do to text; empty when the rule only reports
 * @param examples worked examples, at least one
 * @param origin   {@value #BUILT_IN}, or the rule pack file it came from
 */
public record RuleDescriptor(String id, String summary, String why, String instead, Severity severity,
                             Optional<EditKind> editKind, List<Example> examples, String origin) {
    /** The origin of rules compiled into Tare. */
    public static final String BUILT_IN = "built-in";

    public RuleDescriptor {
        examples = List.copyOf(examples);
        if (!id.matches("[a-z][a-z0-9]*(-[a-z0-9]+)*")) {
            throw new IllegalArgumentException("rule id must be lower-case words joined by hyphens: " + id);
        }
        if (examples.isEmpty()) {
            throw new IllegalArgumentException("rule " + id + " has no example");
        }
    }

    /** The class of the rule's rewrites, which follows from their edit kind: none, safe or review. */
    public RewriteClass rewriteClass() {
        return editKind.map(EditKind::rewriteClass).orElse(RewriteClass.NONE);
    }

    /** The same rule at another default severity. */
    public RuleDescriptor withSeverity(Severity newSeverity) {
        return new RuleDescriptor(id, summary, why, instead, newSeverity, editKind, examples, origin);
    }

    /** A descriptor of a built-in rule whose rewrites make edits of {@code editKind}. */
    public static RuleDescriptor builtIn(String id, Severity severity, EditKind editKind, String summary,
                                         String why, String instead, Example... examples) {
        return new RuleDescriptor(id, summary, why, instead, severity, Optional.of(editKind), List.of(examples), BUILT_IN);
    }

    /** A descriptor of a built-in rule that only reports. */
    public static RuleDescriptor builtIn(String id, Severity severity, String summary, String why, String instead,
                                         Example... examples) {
        return new RuleDescriptor(id, summary, why, instead, severity, Optional.empty(), List.of(examples), BUILT_IN);
    }
}
