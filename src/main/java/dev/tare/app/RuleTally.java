package dev.tare.app;

import dev.tare.lint.Finding;
import dev.tare.lint.RewriteClass;
import dev.tare.lint.Severity;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * One rule's findings in a check, summed: how many, in how many files, and the tokens its offered
 * rewrites would save per call (a planning estimate, summed over rewrites measured one by one).
 *
 * @param rule         the rule's id
 * @param severity     the severity of its findings, as configured
 * @param rewriteClass the class of the rule's rewrites
 * @param findings     how many findings it has
 * @param files        in how many distinct files
 * @param rewrites     how many of them offer a rewrite
 * @param savingTokens the tokens those rewrites save, summed
 */
public record RuleTally(String rule, Severity severity, RewriteClass rewriteClass, int findings, int files,
                        int rewrites, long savingTokens) {

    /** One tally per rule with findings, loudest severity first, then most findings, then by id. */
    public static List<RuleTally> of(CheckResult check) {
        Map<String, List<Finding>> byRule = new LinkedHashMap<>();
        for (Finding finding : check.findings()) {
            byRule.computeIfAbsent(finding.rule(), id -> new ArrayList<>()).add(finding);
        }
        List<RuleTally> tallies = new ArrayList<>();
        byRule.forEach((id, found) -> tallies.add(of(id, found)));
        tallies.sort(Comparator.comparing(RuleTally::severity).reversed()
                .thenComparing(Comparator.comparingInt(RuleTally::findings).reversed())
                .thenComparing(RuleTally::rule));
        return List.copyOf(tallies);
    }

    /** Tokens saved by every rule's rewrites of one class, summed. */
    public static long sumSavings(List<RuleTally> tallies, RewriteClass rewriteClass) {
        return tallies.stream().filter(t -> t.rewriteClass() == rewriteClass).mapToLong(RuleTally::savingTokens).sum();
    }

    private static RuleTally of(String id, List<Finding> found) {
        int files = (int) found.stream().map(Finding::path).distinct().count();
        int rewrites = (int) found.stream().filter(f -> f.rewrite().isPresent()).count();
        long saving = found.stream().mapToLong(Finding::savingTokens).sum();
        Finding first = found.get(0);
        return new RuleTally(id, first.severity(), first.rewriteClass(), found.size(), files, rewrites, saving);
    }
}
