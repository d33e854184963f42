package dev.tare.report;

import dev.tare.app.Overview;
import dev.tare.app.ScanResult;
import dev.tare.app.ScannedTemplate;
import dev.tare.app.TargetTotals;
import dev.tare.footprint.Coverage;
import dev.tare.footprint.Footprint;
import dev.tare.footprint.Target;
import java.util.Comparator;
import java.util.List;
import java.util.function.DoubleFunction;

/**
 * The HTML report's section on targets: per target its configuration, its totals (input tokens,
 * cost per month, the largest request's KV cache, the weights) and a chart of cost or KV-cache
 * memory per template. Every money and memory figure is labelled an estimate.
 */
final class HtmlTargets {
    private HtmlTargets() {
    }

    static void section(StringBuilder out, Overview overview) {
        out.append("<section id=\"targets\">\n<h2>Targets</h2>\n");
        if (overview.targets().isEmpty()) {
            out.append("<p>No targets are configured; set <code>targets</code> in <code>tare.yaml</code> for cost,")
                    .append(" time and memory estimates.</p>\n</section>\n");
            return;
        }
        out.append("<p>Cost, time and memory below are planning estimates from Tare's formulas, not measurements or")
                .append(" invoices.</p>\n");
        for (TargetTotals totals : overview.targets()) {
            target(out, overview, totals);
        }
        out.append("</section>\n");
    }

    private static void target(StringBuilder out, Overview overview, TargetTotals totals) {
        Target target = totals.target();
        String name = Html.attr(target.name());
        out.append("<article class=\"target\" data-target=\"").append(name).append("\">\n<h3>").append(Html.text(target.name()))
                .append("</h3>\n<p class=\"facts\">Tokenizer <code>").append(Html.text(target.tokenizer())).append("</code>");
        target.price().ifPresent(p -> out.append(" · ").append(Html.text(Figures.price(p))));
        target.callsPerDay().ifPresent(c -> out.append(" · ").append(Html.text(Figures.significant(c))).append(" calls a day"));
        target.prefixCache().ifPresent(cache -> out.append(" · ").append(Html.text(Figures.prefixCache(cache))));
        target.model().ifPresent(m -> out.append("<br>Model ").append(Html.text(Figures.model(m))));
        target.device().ifPresent(d -> out.append("<br>Device ").append(Html.text(Figures.device(d))));
        out.append("</p>\n<dl class=\"tiles small\">\n");
        HtmlReport.tile(out, "Templates on it", targetNumber(name, "templates", totals.templates(), "count"), "");
        HtmlReport.tile(out, "Input tokens per call", targetNumber(name, "input_tokens", totals.inputTokens(), "tokens"),
                "summed over its templates");
        totals.costPerMonth().ifPresent(cost -> HtmlReport.tile(out, "Cost per month (estimate)",
                "<span data-target=\"" + name + "\" data-total=\"cost_per_month\" data-value=\"" + Html.value(cost)
                        + "\" data-unit=\"money\">" + Html.text(Figures.money(cost, totals.currency().orElse(""), 2))
                        + "</span>", "each template at its own traffic"));
        totals.largestKvCacheBytes().ifPresent(bytes -> HtmlReport.tile(out, "KV cache, largest request (estimate)",
                "<span data-target=\"" + name + "\" data-total=\"max_kv_cache_bytes\" data-value=\"" + bytes
                        + "\" data-unit=\"bytes\">" + Html.text(Figures.bytes(bytes)) + "</span>",
                totals.largestRequest().orElse("") + totals.fewestConcurrent().stream()
                        .mapToObj(n -> "; " + Figures.count(n) + " such requests fit").findFirst().orElse("")));
        totals.weightBytes().ifPresent(bytes -> HtmlReport.tile(out, "Weights (estimate)",
                "<span data-target=\"" + name + "\" data-total=\"weight_bytes\" data-value=\"" + bytes
                        + "\" data-unit=\"bytes\">" + Html.text(Figures.bytes(bytes)) + "</span>", ""));
        ScanResult.CacheTotals cache = overview.scan().cacheTotals().get(target.name());
        if (cache != null) {
            HtmlReport.tile(out, "Cacheable tokens per call", targetNumber(name, "cached_input_tokens",
                    cache.cachedTokens(), "tokens"), "the cacheable part of each template's static prefix, summed");
            money(out, "Prefix-cache saving per month (estimate)", name, "cache_saving_per_month", cache.savingPerMonth(), cache);
            HtmlReport.tile(out, "Cacheable if per-call parts came last", targetNumber(name,
                    "reordered_cached_input_tokens", cache.reorderedCachedTokens(), "tokens"),
                    "every template's variables after its static text");
            money(out, "Saving per month then (estimate)", name, "reordered_cache_saving_per_month",
                    cache.reorderedSavingPerMonth(), cache);
        }
        out.append("</dl>\n");
        cacheLeaders(out, overview, target);
        List<ScannedTemplate> on = overview.scan().templates().stream()
                .filter(t -> t.countsInTotals() && t.targets().containsKey(target.name())).toList();
        for (String line : TargetSections.cautions(target, on)) {
            out.append("<p class=\"caution\">").append(Html.text(line)).append("</p>\n");
        }
        Coverage coverage = Coverage.of(target);
        if (coverage.computes().contains("cost_per_month") && !on.isEmpty()) {
            String currency = totals.currency().orElse("");
            targetChart(out, target, on, "cost_per_month", "Cost per month per template (estimate)", "money",
                    f -> f.costPerMonth().orElse(0), v -> Figures.money(v, currency, 2),
                    tick -> currency + " " + Figures.significant(tick));
        }
        if (coverage.computes().contains("kv_cache_bytes") && !on.isEmpty()) {
            targetChart(out, target, on, "kv_cache_bytes", "KV-cache memory of one request per template (estimate)",
                    "bytes", f -> f.kvCacheBytes().orElse(0), Figures::bytes, Figures::bytes);
        }
        out.append("</article>\n");
    }

    /**
     * The templates whose static parts, put first, the target's prefix cache would save most on, with
     * their prefix and monthly figures.
     */
    private static void cacheLeaders(StringBuilder out, Overview overview, Target target) {
        List<ScannedTemplate> leaders = overview.cacheLeaders(target.name(), 10);
        if (leaders.isEmpty()) {
            return;
        }
        out.append("<h4>Where putting static parts first would save most (estimates)</h4>\n")
                .append("<div class=\"table-frame\"><table class=\"figures\"><thead><tr><th scope=\"col\">Template</th>")
                .append("<th scope=\"col\" class=\"num\">Static prefix</th><th scope=\"col\" class=\"num\">Cacheable</th>")
                .append("<th scope=\"col\" class=\"num\">Hit rate</th><th scope=\"col\" class=\"num\">Cost per month</th>")
                .append("<th scope=\"col\" class=\"num\">Without caching</th>")
                .append("<th scope=\"col\" class=\"num\">Caching would save with per-call parts last</th></tr></thead>\n<tbody>\n");
        for (ScannedTemplate t : leaders) {
            Footprint f = t.targets().get(target.name());
            Footprint.Caching c = f.caching().orElseThrow();
            String currency = f.currency().orElse("");
            out.append("<tr><th scope=\"row\">").append(Html.text(t.key())).append("</th>");
            for (String cell : List.of(Figures.count(c.staticPrefixTokens()), Figures.count(c.cacheablePrefixTokens()),
                    c.hitRateKnown() ? Figures.percent(c.hitRate()) : "–", amount(f.costPerMonth(), currency),
                    amount(f.costPerMonthUncached(), currency),
                    amount(t.prefixes().get(target.name()).reorderedSavingPerMonth(), currency))) {
                out.append("<td class=\"num\">").append(Html.text(cell)).append("</td>");
            }
            out.append("</tr>\n");
        }
        out.append("</tbody></table></div>\n");
    }

    private static String amount(java.util.OptionalDouble value, String currency) {
        return value.isPresent() ? Figures.money(value.getAsDouble(), currency, 2) : "–";
    }

    /** A tile with a monthly saving, on a priced target with traffic. */
    private static void money(StringBuilder out, String label, String name, String total, java.util.OptionalDouble amount,
                              ScanResult.CacheTotals cache) {
        amount.ifPresent(value -> HtmlReport.tile(out, label, "<span data-target=\"" + name + "\" data-total=\"" + total
                + "\" data-value=\"" + Html.value(value) + "\" data-unit=\"money\">"
                + Html.text(Figures.money(value, cache.currency().orElse(""), 2)) + "</span>",
                "each template at its own traffic"));
    }

    private static String targetNumber(String name, String total, long value, String unit) {
        return "<span data-target=\"" + name + "\" data-total=\"" + total + "\" data-value=\"" + value + "\" data-unit=\""
                + unit + "\">" + Figures.count(value) + "</span>";
    }

    /** What a target chart plots for one footprint. */
    private interface Measure {
        double of(Footprint footprint);
    }

    private static void targetChart(StringBuilder out, Target target, List<ScannedTemplate> templates,
                                     String field, String title, String unit, Measure measure,
                                     DoubleFunction<String> label, DoubleFunction<String> tick) {
        SvgBarChart chart = new SvgBarChart(Html.id(field, target.name()), title + " on " + target.name(),
                List.of(new SvgBarChart.Series(title, SvgBarChart.Fill.SOLID)), tick);
        List<ScannedTemplate> sorted = templates.stream()
                .sorted(Comparator.comparingDouble((ScannedTemplate t) -> measure.of(t.targets().get(target.name())))
                        .reversed().thenComparing(ScannedTemplate::path)).toList();
        for (ScannedTemplate t : sorted) {
            Footprint f = t.targets().get(target.name());
            double value = measure.of(f);
            String data = " data-template=\"" + Html.attr(t.key()) + "\" data-target=\"" + Html.attr(target.name())
                    + "\" data-field=\"" + field + "\" data-value=\"" + (unit.equals("bytes") ? Html.value((long) value)
                    : Html.value(value)) + "\" data-unit=\"" + unit + "\"";
            chart.row(new SvgBarChart.Row(t.key(), List.of(value), label.apply(value), data));
        }
        out.append("<h4>").append(Html.text(title)).append("</h4>\n<div class=\"chart-frame\">").append(chart.render())
                .append("</div>\n");
    }
}
