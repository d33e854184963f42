package dev.tare.app;

import dev.tare.footprint.Price;
import dev.tare.footprint.Footprint;
import dev.tare.footprint.Target;
import dev.tare.lint.Baseline;
import dev.tare.overlap.PrefixShare;
import dev.tare.template.TemplateKind;
import dev.tare.workspace.SkippedFile;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;

/**
 * Everything a scan found, ready for a report.
 *
 * @param root      the scanned root, as the user named it
 * @param tokenizer the primary tokenizer, which the top-level static and estimated counts use
 * @param targets   the selected target names, in order
 * @param templates every template measured, sorted by path
 * @param skipped   every file found but not measured, with its reason, sorted by path
 * @param targetConfigs the selected targets' configurations, in the order of {@code targets}
 */
public record ScanResult(String root, String tokenizer, List<String> targets, List<ScannedTemplate> templates,
                         List<SkippedFile> skipped, List<Target> targetConfigs) {
    public ScanResult {
        targets = List.copyOf(targets);
        templates = List.copyOf(templates);
        skipped = List.copyOf(skipped);
        targetConfigs = List.copyOf(targetConfigs);
    }

    /** A result whose targets are known by name only. */
    public ScanResult(String root, String tokenizer, List<String> targets, List<ScannedTemplate> templates,
                      List<SkippedFile> skipped) {
        this(root, tokenizer, targets, templates, skipped, List.of());
    }

    /** How templates may be ordered in a report. */
    public enum Order {
        /** Most estimated tokens first. */
        TOKENS,
        /** Most input tokens on the first target first (the cost driver); by tokens without targets. */
        COST,
        /** By path. */
        PATH
    }

    /** The templates in the given order; ties by path. */
    public List<ScannedTemplate> templatesIn(Order order) {
        Comparator<ScannedTemplate> byPath = Comparator.comparing(ScannedTemplate::path);
        Comparator<ScannedTemplate> comparator = switch (order) {
            case PATH -> byPath;
            case TOKENS -> Comparator.comparingInt(ScannedTemplate::estimatedTokens).reversed().thenComparing(byPath);
            case COST -> Comparator.comparingLong(this::costDriver).reversed().thenComparing(byPath);
        };
        return templates.stream().sorted(comparator).toList();
    }

    private long costDriver(ScannedTemplate template) {
        if (targets.isEmpty()) {
            return template.estimatedTokens();
        }
        var footprint = template.targets().get(targets.get(0));
        return footprint == null ? 0 : footprint.inputTokens();
    }

    /** Sums over the templates that count toward totals (not partials, not tool files). */
    public Totals totals() {
        int count = 0;
        long staticTokens = 0;
        long estimatedTokens = 0;
        long shortestEstimatedTokens = 0;
        Map<String, Long> inputByTarget = new LinkedHashMap<>();
        targets.forEach(name -> inputByTarget.put(name, 0L));
        for (ScannedTemplate template : templates) {
            if (!template.countsInTotals()) {
                continue;
            }
            count++;
            staticTokens += template.staticTokens();
            estimatedTokens += template.estimatedTokens();
            shortestEstimatedTokens += template.shortestEstimatedTokens();
            template.targets().forEach((name, footprint) -> inputByTarget.merge(name, (long) footprint.inputTokens(), Long::sum));
        }
        int partials = (int) templates.stream().filter(t -> t.kind() == TemplateKind.PARTIAL).count();
        return new Totals(count, partials, staticTokens, estimatedTokens, shortestEstimatedTokens, inputByTarget);
    }

    /**
     * Prefix caching over the templates that count toward totals, for each selected target with a
     * prefix cache, in target order: the tokens per call cacheable now and with every template's
     * per-call parts after its static parts, and what caching them saves per month.
     */
    public Map<String, CacheTotals> cacheTotals() {
        Map<String, CacheTotals> totals = new LinkedHashMap<>();
        for (Target target : targetConfigs) {
            if (target.prefixCache().isEmpty()) {
                continue;
            }
            int count = 0;
            long cached = 0;
            long reordered = 0;
            double saving = 0;
            double reorderedSaving = 0;
            boolean priced = false;
            for (ScannedTemplate template : templates) {
                PrefixShare share = template.prefixes().get(target.name());
                if (share == null || !template.countsInTotals()) {
                    continue;
                }
                count++;
                cached += template.targets().get(target.name()).caching()
                        .map(Footprint.Caching::cacheablePrefixTokens).orElse(0);
                reordered += target.prefixCache().get().cacheable(share.reorderedStaticPrefixTokens());
                if (share.savingPerMonth().isPresent()) {
                    priced = true;
                    saving += share.savingPerMonth().getAsDouble();
                    reorderedSaving += share.reorderedSavingPerMonth().orElse(0);
                }
            }
            totals.put(target.name(), new CacheTotals(target, count, cached, reordered,
                    priced ? java.util.OptionalDouble.of(saving) : java.util.OptionalDouble.empty(),
                    priced ? java.util.OptionalDouble.of(reorderedSaving) : java.util.OptionalDouble.empty()));
        }
        return totals;
    }

    /**
     * One target's prefix caching, summed over its templates; money is a planning estimate.
     *
     * @param target                  the target, which has a prefix cache
     * @param templates               how many templates run on it
     * @param cachedTokens            cached input tokens per call, summed: what the cache serves now
     * @param reorderedCachedTokens   the same with every template's per-call parts after its static parts
     * @param savingPerMonth          what caching saves per month now, on a priced target with traffic
     * @param reorderedSavingPerMonth what it would save with the per-call parts last
     */
    public record CacheTotals(Target target, int templates, long cachedTokens, long reorderedCachedTokens,
                              java.util.OptionalDouble savingPerMonth, java.util.OptionalDouble reorderedSavingPerMonth) {
        /** The currency of the savings, when the target is priced. */
        public java.util.Optional<String> currency() {
            return target.price().map(Price::currency);
        }
    }

    /**
     * Repository totals.
     *
     * @param templates       templates counted (partials and tool files excluded)
     * @param partials        partials found (their tokens are inside their includers' counts)
     * @param staticTokens    sum of static tokens on the primary tokenizer
     * @param estimatedTokens sum of estimated tokens on the primary tokenizer
     * @param shortestEstimatedTokens sum of estimated tokens on each template's shortest path
     * @param inputTokensByTarget sum of input tokens per target, over the templates on that target
     */
    public record Totals(int templates, int partials, long staticTokens, long estimatedTokens, long shortestEstimatedTokens,
                         Map<String, Long> inputTokensByTarget) {
    }

    /** The counts a baseline records: each template's estimated tokens per target, partials left out (their tokens are inside their includers'). */
    public Baseline baseline() {
        Map<String, Map<String, Integer>> tokens = new TreeMap<>();
        for (ScannedTemplate template : templates) {
            if (!template.countsInTotals()) {
                continue;
            }
            Map<String, Integer> byTarget = new TreeMap<>();
            if (targets.isEmpty()) {
                byTarget.put(tokenizer, template.estimatedTokens());
            }
            byTarget.putAll(template.estimatedByTarget());
            tokens.put(template.key(), byTarget);
        }
        return new Baseline(tokens);
    }
}
