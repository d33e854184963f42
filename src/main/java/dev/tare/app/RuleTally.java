package dev.tare.app;

import dev.tare.lint.Finding;
import dev.tare.rewrite.FileFix;
import dev.tare.rewrite.RuleSaving;
import dev.tare.lint.RewriteClass;
import dev.tare.lint.Severity;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * One rule's findings in a check, summed: how many, in how many files, and the tokens its rewrites
 * save per call when fix applies them (a planning estimate, from a dry run of fix).
 *
 * @param rule         the rule's id
 * @param severity     the severity of its findings, as configured
 * @param rewriteClass the class of the rule's rewrites
 * @param findings     how many findings it has
 * @param files        in how many distinct files
 * @param rewrites     how many of them offer a rewrite
 * @param savingTokens the tokens fix saves applying those rewrites, each file on its own tokenizer
 */
public record RuleTally(String rule, Severity severity, RewriteClass rewriteClass, int findings, int files,
                        int rewrites, long savingTokens) {

    /**
     * One tally per rule with findings, loudest severity first, then most findings, then by id, each
     * with the tokens its rewrites save when fix applies them ({@code planned}, a dry run): on each
     * file's own tokenizer (its first target's), summed over files.
     */
    public static List<RuleTally> of(CheckResult check, FixResult planned) {
        Map<String, Long> saved = new java.util.HashMap<>();
        for (FileFix file : planned.applied()) {
            String tokenizer = file.tokens().get(0).tokenizer();
            for (RuleSaving saving : file.rules()) {
                saved.merge(saving.rule(), (long) saving.saved().getOrDefault(tokenizer, 0), Long::sum);
            }
        }
        Map<String, List<Finding>> byRule = new LinkedHashMap<>();
        for (Finding finding : check.findings()) {
            byRule.computeIfAbsent(finding.rule(), id -> new ArrayList<>()).add(finding);
        }
        List<RuleTally> tallies = new ArrayList<>();
        byRule.forEach((id, found) -> tallies.add(of(id, found, saved.getOrDefault(id, 0L))));
        tallies.sort(Comparator.comparing(RuleTally::severity).reversed()
                .thenComparing(Comparator.comparingInt(RuleTally::findings).reversed())
                .thenComparing(RuleTally::rule));
        return List.copyOf(tallies);
    }

    /** Tokens saved by every rule's rewrites of one class, summed. */
    public static long sumSavings(List<RuleTally> tallies, RewriteClass rewriteClass) {
        return tallies.stream().filter(t -> t.rewriteClass() == rewriteClass).mapToLong(RuleTally::savingTokens).sum();
    }

    private static RuleTally of(String id, List<Finding> found, long saving) {
        int files = (int) found.stream().map(Finding::path).distinct().count();
        int rewrites = (int) found.stream().filter(f -> f.rewrite().isPresent()).count();
        Finding first = found.get(0);
        return new RuleTally(id, first.severity(), first.rewriteClass(), found.size(), files, rewrites, saving);
    }
}
