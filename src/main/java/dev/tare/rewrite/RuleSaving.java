package dev.tare.rewrite;

import dev.tare.lint.RewriteClass;
import java.util.LinkedHashMap;
import java.util.Map;

/**
 * What one rule's rewrites did to one file (or, summed, to all files): how many were applied and
 * the tokens they saved on each tokenizer. The saving of each round is measured rule by rule as the
 * rules' edits are applied in priority order, so the savings of all rules add up to the file's total.
 *
 * @param rule         the rule's id
 * @param rewriteClass safe or review
 * @param rewrites     how many of its rewrites were applied, over all rounds
 * @param files        how many files they changed
 * @param saved        tokens saved by tokenizer name (negative when they cost more), in tokenizer order
 */
public record RuleSaving(String rule, RewriteClass rewriteClass, int rewrites, int files, Map<String, Integer> saved) {
    public RuleSaving {
        saved = java.util.Collections.unmodifiableMap(new LinkedHashMap<>(saved));
    }

    /** This and {@code other} (of the same rule) together. */
    public RuleSaving plus(RuleSaving other) {
        Map<String, Integer> sum = new LinkedHashMap<>(saved);
        other.saved().forEach((tokenizer, tokens) -> sum.merge(tokenizer, tokens, Integer::sum));
        return new RuleSaving(rule, rewriteClass, rewrites + other.rewrites(), files + other.files(), sum);
    }
}
