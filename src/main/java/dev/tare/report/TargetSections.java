package dev.tare.report;

import dev.tare.app.ScanResult;
import dev.tare.app.ScannedTemplate;
import dev.tare.footprint.Cautions;
import dev.tare.footprint.Coverage;
import dev.tare.footprint.Footprint;
import dev.tare.footprint.PrefixCache;
import dev.tare.footprint.Target;
import dev.tare.overlap.PrefixShare;
import java.util.ArrayList;
import java.util.List;

/**
 * The per-target part of a scan's text report: for each priced target, cost per call and per month
 * of every template; for each target with a prefix cache, the prefix each template shares with others
 * and what caching it saves, now and with per-call parts last; for each target with a model, prefill,
 * decode, KV cache and concurrency.
 */
final class TargetSections {
    private TargetSections() {
    }

    /** Every section, then the estimate note and what each target lacks; empty when no target estimates anything. */
    static String render(ScanResult result, ScanResult.Order order) {
        StringBuilder out = new StringBuilder();
        List<String> gaps = new ArrayList<>();
        List<ScannedTemplate> templates = result.templatesIn(order).stream().filter(ScannedTemplate::countsInTotals)
                .toList();
        java.util.Map<String, ScanResult.CacheTotals> caches = result.cacheTotals();
        for (Target target : result.targetConfigs()) {
            Coverage coverage = Coverage.of(target);
            if (coverage.hasCost()) {
                out.append('\n').append(cost(target, templates));
            }
            if (caches.containsKey(target.name())) {
                out.append('\n').append(prefixCache(target, templates, caches.get(target.name())));
            }
            if (coverage.hasDeviceFigures()) {
                out.append('\n').append(device(target, templates));
            }
            if (coverage.hasCost() || coverage.hasDeviceFigures()) {
                gaps.addAll(Figures.missing(target, coverage));
            }
        }
        if (out.length() == 0) {
            return "";
        }
        if (!caches.isEmpty()) {
            out.append('\n').append(cacheSummary(caches));
        }
        out.append('\n').append(Figures.ESTIMATE_NOTE).append('\n');
        gaps.forEach(line -> out.append(line).append('\n'));
        return out.toString();
    }

    private static String cost(Target target, List<ScannedTemplate> templates) {
        boolean caches = target.prefixCache().isPresent();
        List<String> heads = caches
                ? List.of("PATH", "INPUT", "STATIC PREFIX", "CACHEABLE", "HIT RATE", "OUTPUT", "COST/CALL", "COST/MONTH",
                "UNCACHED/MONTH")
                : List.of("PATH", "INPUT", "OUTPUT", "COST/CALL", "COST/MONTH");
        TextTable table = new TextTable(heads, false, true, true, true, true, true, true, true, true);
        for (ScannedTemplate template : templates) {
            Footprint f = template.targets().get(target.name());
            if (f == null) {
                continue;
            }
            List<String> row = new ArrayList<>(List.of(template.key(), Figures.count(f.inputTokens())));
            f.caching().ifPresent(c -> row.addAll(List.of(Figures.count(c.staticPrefixTokens()),
                    Figures.count(c.cacheablePrefixTokens()), c.hitRateKnown() ? Figures.percent(c.hitRate()) : "-")));
            row.addAll(List.of(Figures.count(f.outputTokens()), Figures.perCall(f), Figures.perMonth(f)));
            if (caches) {
                row.add(f.costPerMonthUncached().isPresent()
                        ? Figures.money(f.costPerMonthUncached().getAsDouble(), f.currency().orElse(""), 2) : "-");
            }
            table.row(row);
        }
        StringBuilder head = new StringBuilder("Cost on ").append(target.name()).append(" (")
                .append(Figures.price(target.price().orElseThrow()));
        target.callsPerDay().ifPresent(calls -> head.append("; ").append(Figures.significant(calls)).append(" calls a day"));
        target.prefixCache().ifPresent(cache -> head.append("; ").append(Figures.prefixCache(cache)));
        return head.append(")").append(calibration(target)).append(":\n").append(table.render()).toString();
    }

    /**
     * What caching saves per template on a target with a prefix cache, as written and with every
     * template's per-call parts after its static parts.
     */
    private static String prefixCache(Target target, List<ScannedTemplate> templates, ScanResult.CacheTotals totals) {
        TextTable table = new TextTable(List.of("PATH", "STATIC PREFIX", "CACHEABLE", "SAVES/MONTH", "REORDERED PREFIX",
                "CACHEABLE", "SAVES/MONTH"), false, true, true, true, true, true, true);
        String currency = totals.currency().orElse("");
        PrefixCache cache = target.prefixCache().orElseThrow();
        for (ScannedTemplate template : templates) {
            PrefixShare share = template.prefixes().get(target.name());
            Footprint f = template.targets().get(target.name());
            if (share != null && f != null && f.caching().isPresent()) {
                Footprint.Caching now = f.caching().get();
                table.row(List.of(template.key(), Figures.count(now.staticPrefixTokens()),
                        Figures.count(now.cacheablePrefixTokens()), money(share.savingPerMonth(), currency),
                        Figures.count(share.reorderedStaticPrefixTokens()),
                        Figures.count(cache.cacheable(share.reorderedStaticPrefixTokens())),
                        money(share.reorderedSavingPerMonth(), currency)));
            }
        }
        table.rule();
        table.row(List.of("total (" + CheckReport.plural(totals.templates(), "template") + ")", "", Figures.count(totals.cachedTokens()),
                money(totals.savingPerMonth(), currency), "", Figures.count(totals.reorderedCachedTokens()),
                money(totals.reorderedSavingPerMonth(), currency)));
        String breakEven = target.cacheBreakEvenCallsPerDay().stream()
                .mapToObj(calls -> "; caching pays from " + Figures.breakEven(calls)).findFirst().orElse("");
        return "Prefix cache on " + target.name() + " (" + Figures.prefixCache(cache) + breakEven + "; STATIC PREFIX: tools, then"
                + " the text up to the first per-call part; SAVES: the month without the cache less the expected month"
                + " with it; REORDERED: as if every template's per-call parts came after its static parts)"
                + calibration(target) + ":\n" + table.render();
    }

    /** One line per target: the tokens per call cacheable now and with per-call parts last, and the savings. */
    private static String cacheSummary(java.util.Map<String, ScanResult.CacheTotals> caches) {
        StringBuilder out = new StringBuilder();
        caches.forEach((name, totals) -> {
            String currency = totals.currency().orElse("");
            out.append("Prefix cache on ").append(name).append(": ").append(Figures.count(totals.cachedTokens()))
                    .append(" tokens per call cacheable now");
            totals.savingPerMonth().ifPresent(v -> out.append(", saving ").append(Figures.money(v, currency, 2))
                    .append(" a month"));
            out.append("; ").append(Figures.count(totals.reorderedCachedTokens()))
                    .append(" if each template's per-call parts came after its static parts");
            totals.reorderedSavingPerMonth().ifPresent(v -> out.append(", saving ").append(Figures.money(v, currency, 2))
                    .append(" a month"));
            out.append(" (estimates).\n");
        });
        return out.toString();
    }

    private static String money(java.util.OptionalDouble amount, String currency) {
        return amount.isPresent() ? Figures.money(amount.getAsDouble(), currency, 2) : "-";
    }

    private static String device(Target target, List<ScannedTemplate> templates) {
        TextTable table = new TextTable(List.of("PATH", "INPUT", "OUTPUT", "PREFILL", "PREFILL MS", "DECODE MS/TOKEN",
                "KV CACHE", "MAX CONCURRENT"), false, true, true, true, true, true, true, true);
        for (ScannedTemplate template : templates) {
            Footprint f = template.targets().get(target.name());
            if (f != null) {
                table.row(List.of(template.key(), Figures.count(f.inputTokens()), Figures.count(f.outputTokens()),
                        f.prefillFlops().isPresent() ? Figures.flops(f.prefillFlops().getAsDouble()) : "-",
                        f.prefillMillis().isPresent() ? Figures.significant(f.prefillMillis().getAsDouble()) : "-",
                        f.decodeMillisPerToken().isPresent() ? Figures.significant(f.decodeMillisPerToken().getAsDouble()) : "-",
                        f.kvCacheBytes().isPresent() ? Figures.bytes(f.kvCacheBytes().getAsLong()) : "-",
                        f.maxConcurrent().isPresent() ? Figures.count(f.maxConcurrent().getAsLong()) : "-"));
            }
        }
        StringBuilder head = new StringBuilder("Device figures on ").append(target.name()).append(calibration(target))
                .append(":\n");
        head.append("  model   ").append(Figures.model(target.model().orElseThrow())).append('\n');
        head.append("  weights ").append(Figures.bits(target.weightBits()));
        templates.stream().map(t -> t.targets().get(target.name())).filter(f -> f != null && f.weightBytes().isPresent())
                .findFirst().ifPresent(f -> head.append(" = ").append(Figures.bytes(f.weightBytes().getAsLong())));
        head.append("; KV cache ").append(Figures.bits(target.kvBits()));
        templates.stream().map(t -> t.targets().get(target.name())).filter(f -> f != null && f.kvBytesPerToken().isPresent())
                .findFirst().ifPresent(f -> head.append(" = ").append(Figures.bytes(f.kvBytesPerToken().getAsLong()))
                        .append(" per token"));
        head.append('\n');
        target.device().ifPresent(d -> head.append("  device  ").append(Figures.device(d)).append('\n'));
        head.append("  load    ").append(target.batch() == 1 ? "batch 1 (decode for one request at a time)"
                : Figures.count(target.batch()) + " concurrent requests (decode step of the batch)").append('\n');
        head.append(table.render());
        for (String line : cautions(target, templates)) {
            head.append(line).append('\n');
        }
        return head.toString();
    }

    /** The target's cautions, then one line per template whose call exceeds the model's context. */
    static List<String> cautions(Target target, List<ScannedTemplate> templates) {
        List<String> lines = new ArrayList<>(Cautions.of(target));
        for (ScannedTemplate template : templates) {
            Footprint f = template.targets().get(target.name());
            if (f != null) {
                Cautions.contextLine(target, f, template.key()).ifPresent(lines::add);
            }
        }
        return lines;
    }

    /** Every target's cautions over the templates counted in totals, each line once. */
    static List<String> cautions(ScanResult result) {
        List<ScannedTemplate> counted = result.templates().stream().filter(ScannedTemplate::countsInTotals).toList();
        List<String> lines = new ArrayList<>();
        for (Target target : result.targetConfigs()) {
            cautions(target, counted).stream().filter(l -> !lines.contains(l)).forEach(lines::add);
        }
        return lines;
    }

    /** The mark of a calibrated target's figures. */
    static String calibration(Target target) {
        return target.isCalibrated() ? "; calibrated estimate: counts scaled by " + Figures.significant(target.scale()) : "";
    }
}
