package dev.tare.app;

import dev.tare.footprint.Footprint;
import dev.tare.lint.RewriteClass;
import java.util.Comparator;
import java.util.List;
import java.util.Optional;

/**
 * Everything a report for people needs in one piece: the scan, the check of the same templates, each
 * rule's findings and savings, each target's totals, the movement since the baseline, and (when
 * asked for) each template's tokens line by line.
 *
 * @param scan         the scan
 * @param check        the rule engine's findings over the same workspace
 * @param rules        one tally per rule with findings
 * @param targets      one set of totals per selected target
 * @param baselineFile the configured baseline file, relative to the root
 * @param baseline     the comparison with that file, when it exists
 * @param lines        per measured template, its lines and their tokens; empty when not asked for
 */
public record Overview(ScanResult scan, CheckResult check, List<RuleTally> rules, List<TargetTotals> targets,
                       String baselineFile, Optional<BaselineStatus> baseline, List<TemplateLines> lines) {
    public Overview {
        rules = List.copyOf(rules);
        targets = List.copyOf(targets);
        lines = List.copyOf(lines);
    }

    /** Tokens per call that fix saves applying the rewrites of one class (a planning estimate, from a dry run). */
    public long savingTokens(RewriteClass rewriteClass) {
        return RuleTally.sumSavings(rules, rewriteClass);
    }

    /** The lines of the template at {@code path}, when they were counted. */
    public Optional<TemplateLines> linesOf(String path) {
        return lines.stream().filter(l -> l.path().equals(path)).findFirst();
    }

    /**
     * The {@code limit} costliest templates (partials left out): by cost per month summed over the
     * priced targets in the first priced target's currency, then by estimated tokens, then by path.
     * Without a priced target this is simply the most estimated tokens.
     */
    public List<ScannedTemplate> costliest(int limit) {
        Optional<String> currency = targets.stream().map(TargetTotals::currency).flatMap(Optional::stream).findFirst();
        Comparator<ScannedTemplate> order = Comparator.comparingDouble((ScannedTemplate t) -> monthlyCost(t, currency))
                .thenComparingInt(ScannedTemplate::estimatedTokens).reversed()
                .thenComparing(ScannedTemplate::path);
        return scan.templates().stream().filter(ScannedTemplate::countsInTotals).sorted(order).limit(limit).toList();
    }

    /**
     * Up to {@code limit} templates on {@code target} (partials and tool files left out) whose static
     * parts, put before their per-call parts, the prefix cache would save most on a month: the
     * largest savings first, then by path; none where nothing would be saved or no money is known.
     */
    public List<ScannedTemplate> cacheLeaders(String target, int limit) {
        return scan.templates().stream()
                .filter(t -> t.countsInTotals() && t.prefixes().containsKey(target)
                        && t.prefixes().get(target).reorderedSavingPerMonth().orElse(0) > 0)
                .sorted(Comparator.comparingDouble((ScannedTemplate t) -> t.prefixes().get(target)
                        .reorderedSavingPerMonth().getAsDouble()).reversed().thenComparing(ScannedTemplate::path))
                .limit(limit).toList();
    }

    private static double monthlyCost(ScannedTemplate template, Optional<String> currency) {
        double sum = 0;
        for (Footprint f : template.targets().values()) {
            if (f.costPerMonth().isPresent() && f.currency().equals(currency)) {
                sum += f.costPerMonth().getAsDouble();
            }
        }
        return sum;
    }
}
