package dev.tare.report;

import dev.tare.Tare;
import dev.tare.app.BaselineStatus;
import dev.tare.app.CheckResult;
import dev.tare.app.Overview;
import dev.tare.app.RuleTally;
import dev.tare.app.ScanResult;
import dev.tare.app.ScannedTemplate;
import dev.tare.footprint.Footprint;
import dev.tare.lint.BaselineChange;
import dev.tare.lint.Finding;
import dev.tare.lint.RewriteClass;
import dev.tare.lint.Severity;
import dev.tare.workspace.SkippedFile;
import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.stream.Collectors;

/**
 * Renders an {@link Overview} as one self-contained HTML page: inline CSS and SVG, no script and no
 * request to anywhere (its content security policy forbids both). Key numbers carry {@code data-*}
 * attributes holding the JSON report's values, so that tools and tests can read them back.
 */
public final class HtmlReport {
    private static final String CSS = stylesheet();
    private static final String CSP = "default-src 'none'; style-src 'unsafe-inline'; img-src data:";

    private HtmlReport() {
    }

    /** The page; the per-template views follow {@code order}. */
    public static String render(Overview overview, ScanResult.Order order) {
        ScanResult scan = overview.scan();
        StringBuilder out = new StringBuilder(64 * 1024);
        out.append("<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\">\n")
                .append("<meta http-equiv=\"Content-Security-Policy\" content=\"").append(CSP).append("\">\n")
                .append("<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\">\n")
                .append("<title>Tare report: ").append(Html.text(scan.root())).append("</title>\n")
                .append("<style>\n").append(CSS).append("</style>\n</head>\n<body>\n");
        header(out, overview);
        out.append("<main>\n");
        summary(out, overview);
        tokens(out, overview);
        HtmlTargets.section(out, overview);
        templateTable(out, overview, order);
        savings(out, overview);
        baseline(out, overview);
        lines(out, overview, order);
        skipped(out, overview);
        out.append("</main>\n<footer><p>Made by tare ").append(Html.text(Tare.version())).append(". ")
                .append(Html.text(Figures.ESTIMATE_NOTE)).append("</p></footer>\n</body>\n</html>\n");
        return out.toString();
    }

    private static void header(StringBuilder out, Overview overview) {
        ScanResult scan = overview.scan();
        out.append("<header>\n<p class=\"eyebrow\">Tare report</p>\n<h1>").append(Html.text(scan.root())).append("</h1>\n");
        out.append("<p class=\"lede\">Token footprint of every prompt template, counted on <code>")
                .append(Html.text(scan.tokenizer())).append("</code>");
        if (!scan.targets().isEmpty()) {
            out.append(" and on ").append(scan.targets().size() == 1 ? "one target" : scan.targets().size() + " targets")
                    .append(": ").append(scan.targets().stream().map(Html::text).collect(Collectors.joining(", ")));
        }
        out.append(".</p>\n<p class=\"note\" role=\"note\"><strong>Estimates.</strong> ")
                .append(Html.text(Figures.ESTIMATE_NOTE)).append("</p>\n");
        out.append("<nav aria-label=\"Sections\"><ol><li><a href=\"#tokens\">Tokens per template</a></li>")
                .append("<li><a href=\"#targets\">Targets</a></li><li><a href=\"#templates\">All templates</a></li>")
                .append("<li><a href=\"#savings\">Savings</a></li><li><a href=\"#baseline\">Baseline</a></li>")
                .append("<li><a href=\"#lines\">Line by line</a></li></ol></nav>\n</header>\n");
    }

    private static void summary(StringBuilder out, Overview overview) {
        ScanResult.Totals totals = overview.scan().totals();
        CheckResult check = overview.check();
        out.append("<section id=\"summary\" aria-label=\"Summary\"><dl class=\"tiles\">\n");
        tile(out, "Templates", number(totals.templates(), "totals.templates", "count"),
                totals.partials() == 0 ? "" : "and " + CheckReport.plural(totals.partials(), "partial") + " inside them");
        tile(out, "Static tokens", number(totals.staticTokens(), "totals.static_tokens", "tokens"),
                "every variable empty");
        tile(out, "Estimated tokens", number(totals.estimatedTokens(), "totals.estimated_tokens", "tokens"),
                "with samples and declared sizes");
        tile(out, "Findings", number(check.findings().size(), "check.findings", "count"),
                CheckReport.plural(check.count(Severity.ERROR), "error") + ", "
                        + CheckReport.plural(check.count(Severity.WARNING), "warning") + ", "
                        + CheckReport.plural(check.count(Severity.INFO), "info"));
        tile(out, "Tokens saved by rewrites", number(overview.savingTokens(RewriteClass.SAFE)
                        + overview.savingTokens(RewriteClass.REVIEW), "fix.saving_tokens", "tokens"),
                "per call: " + Figures.count(overview.savingTokens(RewriteClass.SAFE)) + " safe, "
                        + Figures.count(overview.savingTokens(RewriteClass.REVIEW)) + " to review");
        out.append("</dl></section>\n");
    }

    /** One key figure: a label, the figure (already markup) and an optional line of detail. */
    static void tile(StringBuilder out, String label, String value, String detail) {
        out.append("<div class=\"tile\"><dt>").append(Html.text(label)).append("</dt><dd class=\"figure\">").append(value)
                .append("</dd>");
        if (!detail.isEmpty()) {
            out.append("<dd class=\"detail\">").append(Html.text(detail)).append("</dd>");
        }
        out.append("</div>\n");
    }

    private static String number(long value, String total, String unit) {
        return "<span data-total=\"" + total + "\" data-value=\"" + value + "\" data-unit=\"" + unit + "\">"
                + Figures.count(value) + "</span>";
    }

    private static void tokens(StringBuilder out, Overview overview) {
        ScanResult scan = overview.scan();
        out.append("<section id=\"tokens\">\n<h2>Tokens per template</h2>\n");
        List<ScannedTemplate> templates = scan.templates().stream().filter(ScannedTemplate::countsInTotals)
                .sorted(Comparator.comparingLong(HtmlReport::chartTotal).reversed()
                        .thenComparing(ScannedTemplate::path)).toList();
        if (templates.isEmpty()) {
            out.append("<p>No templates were measured.</p>\n</section>\n");
            return;
        }
        out.append("<p>What each call sends on the first target (its input tokens, as in the table below), split into")
                .append(" the template's own text (static), what its variables add with their samples and declared")
                .append(" sizes, and the chat framing and tool definitions of that target.")
                .append(" Static and variables are counted on <code>").append(Html.text(scan.tokenizer()))
                .append("</code>. Partials are inside the templates that include them.</p>\n");
        SvgBarChart chart = new SvgBarChart("tokens", "Tokens per template: static, variables, framing",
                List.of(new SvgBarChart.Series("static: the template's own text", SvgBarChart.Fill.SOLID),
                        new SvgBarChart.Series("variables: samples and declared sizes", SvgBarChart.Fill.HATCH),
                        new SvgBarChart.Series("framing and tools: chat format and tool definitions", SvgBarChart.Fill.DOTS)),
                tick -> Figures.count(Math.round(tick)));
        for (ScannedTemplate t : templates) {
            long framing = framing(t);
            long variables = t.estimatedTokens() - t.staticTokens();
            long staticPart = chartTotal(t) - framing - variables;
            String data = " data-template=\"" + Html.attr(t.key()) + "\" data-static=\"" + staticPart
                    + "\" data-variables=\"" + variables + "\" data-framing=\"" + framing + "\"";
            chart.row(new SvgBarChart.Row(t.key(), List.of((double) staticPart, (double) variables,
                    (double) framing), Figures.count(chartTotal(t)), data));
        }
        out.append(chart.legend()).append("<div class=\"chart-frame\">").append(chart.render()).append("</div>\n</section>\n");
    }

    /**
     * What the first target adds to the template's text: its chat framing and the tool definitions
     * sent with it (its input tokens less its estimate there); none without targets.
     */
    private static long framing(ScannedTemplate template) {
        return template.targets().entrySet().stream().findFirst()
                .map(e -> (long) e.getValue().inputTokens()
                        - template.estimatedByTarget().getOrDefault(e.getKey(), template.estimatedTokens()))
                .orElse(0L);
    }

    /**
     * A bar's length: the input tokens of one call on the first target, the figure of the template
     * table's first target column; the estimated tokens without targets.
     */
    private static long chartTotal(ScannedTemplate template) {
        return template.targets().values().stream().findFirst().map(f -> (long) f.inputTokens())
                .orElse((long) template.estimatedTokens());
    }

    private static void templateTable(StringBuilder out, Overview overview, ScanResult.Order order) {
        ScanResult scan = overview.scan();
        Map<String, List<Finding>> findings = findingsByPath(overview.check());
        out.append("<section id=\"templates\">\n<h2>All templates</h2>\n<div class=\"table-frame\"><table class=\"figures\">\n")
                .append("<thead><tr><th scope=\"col\">Template</th><th scope=\"col\">Kind</th>")
                .append("<th scope=\"col\" class=\"num\">Static</th><th scope=\"col\" class=\"num\">Estimated</th>");
        for (String target : scan.targets()) {
            out.append("<th scope=\"col\" class=\"num\">").append(Html.text(target)).append("<br><small>input tokens</small></th>");
        }
        out.append("<th scope=\"col\" class=\"num\">Findings</th></tr></thead>\n<tbody>\n");
        for (ScannedTemplate t : scan.templatesIn(order)) {
            String path = Html.attr(t.path());
            out.append("<tr data-template=\"").append(path).append("\"").append(t.countsInTotals() ? "" : " class=\"partial\"")
                    .append("><th scope=\"row\"><a href=\"#").append(Html.id("t", t.path())).append("\">")
                    .append(Html.text(t.key())).append("</a></th><td>").append(t.kind().label()).append("</td>");
            cell(out, t.key(), "", "static_tokens", Html.value(t.staticTokens()), Figures.count(t.staticTokens()), "tokens");
            cell(out, t.key(), "", "estimated_tokens", Html.value(t.estimatedTokens()), Figures.count(t.estimatedTokens()),
                    "tokens");
            for (String target : scan.targets()) {
                Footprint f = t.targets().get(target);
                if (f == null) {
                    out.append("<td class=\"num none\" title=\"does not run on ").append(Html.attr(target)).append("\">–</td>");
                } else {
                    cell(out, t.key(), target, "input_tokens", Html.value(f.inputTokens()), Figures.count(f.inputTokens()),
                            "tokens");
                }
            }
            out.append("<td class=\"num\">").append(findings.getOrDefault(t.path(), List.of()).size()).append("</td></tr>\n");
        }
        ScanResult.Totals totals = scan.totals();
        out.append("</tbody>\n<tfoot><tr><th scope=\"row\">Total (").append(CheckReport.plural(totals.templates(), "template"))
                .append(", partials left out)</th><td></td><td class=\"num\">").append(Figures.count(totals.staticTokens()))
                .append("</td><td class=\"num\">").append(Figures.count(totals.estimatedTokens())).append("</td>");
        for (String target : scan.targets()) {
            out.append("<td class=\"num\">").append(Figures.count(totals.inputTokensByTarget().get(target))).append("</td>");
        }
        out.append("<td class=\"num\">").append(overview.check().findings().size()).append("</td></tr></tfoot>\n</table></div>\n");
        out.append("<p class=\"aside\">Target columns are input tokens per call on each target's tokenizer, framing")
                .append(" included; a dash means the template does not run there. Partials are shown in grey: their")
                .append(" tokens are counted inside every template that includes them. Costs per template are charted")
                .append(" under <a href=\"#targets\">Targets</a>.</p>\n</section>\n");
    }

    private static void cell(StringBuilder out, String path, String target, String field, String value, String shown,
                             String unit) {
        out.append("<td class=\"num\" data-template=\"").append(Html.attr(path)).append('"');
        if (!target.isEmpty()) {
            out.append(" data-target=\"").append(Html.attr(target)).append('"');
        }
        out.append(" data-field=\"").append(field).append("\" data-value=\"").append(value).append("\" data-unit=\"")
                .append(unit).append("\">").append(Html.text(shown)).append("</td>");
    }

    private static void savings(StringBuilder out, Overview overview) {
        out.append("<section id=\"savings\">\n<h2>Savings available</h2>\n");
        List<RuleTally> offering = overview.rules().stream().filter(t -> t.rewrites() > 0).toList();
        if (offering.isEmpty()) {
            out.append("<p>No rule offers a rewrite.</p>\n");
        } else {
            out.append("<p>Tokens per call that the rules' rewrites would take out, summed by rule. <strong>Safe</strong>")
                    .append(" rewrites keep the meaning and may be applied unattended; <strong>review</strong> rewrites")
                    .append(" need a person. ").append(Html.text(CheckReport.ESTIMATE_NOTE)).append("</p>\n");
            SvgBarChart chart = new SvgBarChart("savings", "Tokens saved per call, by rule",
                    List.of(new SvgBarChart.Series("safe rewrites", SvgBarChart.Fill.SOLID),
                            new SvgBarChart.Series("rewrites to review", SvgBarChart.Fill.HATCH)),
                    tick -> Figures.count(Math.round(tick)));
            for (RuleTally t : offering.stream().sorted(Comparator.comparingLong(RuleTally::savingTokens).reversed()
                    .thenComparing(RuleTally::rule)).toList()) {
                boolean safe = t.rewriteClass() == RewriteClass.SAFE;
                String data = " data-rule=\"" + Html.attr(t.rule()) + "\" data-field=\"saving_tokens\" data-value=\""
                        + t.savingTokens() + "\" data-unit=\"tokens\"";
                chart.row(new SvgBarChart.Row(t.rule(), List.of(safe ? (double) t.savingTokens() : 0,
                        safe ? 0 : (double) t.savingTokens()), CheckReport.plural(t.savingTokens(), "token")
                        + " (" + t.rewriteClass().label() + ")", data));
            }
            out.append(chart.legend()).append("<div class=\"chart-frame\">").append(chart.render()).append("</div>\n");
        }
        out.append("<div class=\"table-frame\"><table class=\"figures\">\n<thead><tr><th scope=\"col\">Rule</th>")
                .append("<th scope=\"col\">Severity</th><th scope=\"col\" class=\"num\">Findings</th>")
                .append("<th scope=\"col\" class=\"num\">Files</th><th scope=\"col\">Rewrite</th>")
                .append("<th scope=\"col\" class=\"num\">Tokens saved per call</th></tr></thead>\n<tbody>\n");
        for (RuleTally t : overview.rules()) {
            String rule = Html.attr(t.rule());
            out.append("<tr data-rule=\"").append(rule).append("\"><th scope=\"row\"><code>").append(Html.text(t.rule()))
                    .append("</code></th><td><span class=\"severity-label severity-").append(t.severity().label()).append("\">")
                    .append(t.severity().label()).append("</span></td><td class=\"num\" data-rule=\"").append(rule)
                    .append("\" data-field=\"findings\" data-value=\"").append(t.findings()).append("\" data-unit=\"count\">")
                    .append(Figures.count(t.findings())).append("</td><td class=\"num\">").append(Figures.count(t.files()))
                    .append("</td><td>").append(t.rewrites() == 0 ? "–" : t.rewriteClass().label()).append("</td>")
                    .append("<td class=\"num\">").append(t.rewrites() == 0 ? "–" : Figures.count(t.savingTokens()))
                    .append("</td></tr>\n");
        }
        long safe = overview.savingTokens(RewriteClass.SAFE);
        long review = overview.savingTokens(RewriteClass.REVIEW);
        out.append("</tbody>\n<tfoot><tr><th scope=\"row\">All rules</th><td></td><td class=\"num\">")
                .append(Figures.count(overview.check().findings().size())).append("</td><td class=\"num\">")
                .append(Figures.count(overview.check().filesWithFindings())).append("</td><td>")
                .append(Figures.count(safe)).append(" safe, ").append(Figures.count(review)).append(" review</td>")
                .append("<td class=\"num\">").append(Figures.count(safe + review)).append("</td></tr></tfoot>\n")
                .append("</table></div>\n</section>\n");
    }

    private static void baseline(StringBuilder out, Overview overview) {
        out.append("<section id=\"baseline\">\n<h2>Since the baseline</h2>\n");
        if (overview.baseline().isEmpty()) {
            out.append("<p>No baseline: <code>").append(Html.text(overview.baselineFile()))
                    .append("</code> does not exist. <code>tare baseline</code> records one.</p>\n</section>\n");
            return;
        }
        BaselineStatus status = overview.baseline().get();
        out.append("<p>Compared with <code>").append(Html.text(status.file())).append("</code>, tolerance ")
                .append(Html.text(Figures.plain(status.tolerancePercent()))).append("%: ")
                .append(CheckReport.plural(status.overTolerance().size(), "count")).append(" grew beyond the tolerance, ")
                .append(CheckReport.plural(status.grew().size(), "count")).append(" grew in all, ")
                .append(CheckReport.plural(status.shrank().size(), "count")).append(" shrank, ")
                .append(CheckReport.plural(status.added().size(), "template")).append(" new, ")
                .append(CheckReport.plural(status.removed().size(), "template")).append(" gone.</p>\n");
        if (!status.changes().isEmpty()) {
            out.append("<div class=\"table-frame\"><table class=\"figures\">\n<thead><tr><th scope=\"col\">Template</th>")
                    .append("<th scope=\"col\">Target</th><th scope=\"col\" class=\"num\">Recorded</th>")
                    .append("<th scope=\"col\" class=\"num\">Now</th><th scope=\"col\" class=\"num\">Change</th>")
                    .append("<th scope=\"col\"></th></tr></thead>\n<tbody>\n");
            List<BaselineChange> ordered = new ArrayList<>(status.overTolerance());
            status.changes().stream().filter(c -> !c.overTolerance()).forEach(ordered::add);
            for (BaselineChange c : ordered) {
                int delta = c.current() - c.recorded();
                out.append("<tr").append(c.overTolerance() ? " class=\"over\"" : "").append("><th scope=\"row\">")
                        .append(Html.text(c.path())).append("</th><td>").append(Html.text(c.target())).append("</td>")
                        .append("<td class=\"num\">").append(Figures.count(c.recorded())).append("</td><td class=\"num\">")
                        .append(Figures.count(c.current())).append("</td><td class=\"num\">")
                        .append(delta > 0 ? "+" : "−").append(Figures.count(Math.abs(delta))).append("</td><td>")
                        .append(c.overTolerance() ? "<strong>over tolerance</strong>" : c.grew() ? "grew" : "shrank")
                        .append("</td></tr>\n");
            }
            out.append("</tbody></table></div>\n");
        }
        out.append("</section>\n");
    }

    private static void lines(StringBuilder out, Overview overview, ScanResult.Order order) {
        Map<String, List<Finding>> findings = findingsByPath(overview.check());
        out.append("<section id=\"lines\">\n<h2>Line by line</h2>\n<p>Each line is shaded by the static tokens it costs")
                .append(" on <code>").append(Html.text(overview.scan().tokenizer())).append("</code>, with the count and a")
                .append(" bar beside it; an include's line carries what it pastes in. Findings are shown under their line.")
                .append(" Open a template to see it.</p>\n").append(LineView.legend());
        Set<String> shown = new java.util.HashSet<>();
        for (ScannedTemplate t : overview.scan().templatesIn(order)) {
            shown.add(t.path());
            out.append(LineView.render(t, overview.linesOf(t.path()), findings.getOrDefault(t.path(), List.of())));
        }
        List<Finding> unmeasured = overview.check().findings().stream().filter(f -> !shown.contains(f.path())).toList();
        if (!unmeasured.isEmpty()) {
            out.append("<h3>Findings in files that could not be measured</h3>\n<div class=\"file-findings\">");
            unmeasured.forEach(f -> out.append("<div class=\"finding-file\">").append(Html.text(f.path())).append("</div>")
                    .append(LineView.finding(f)));
            out.append("</div>\n");
        }
        out.append("</section>\n");
    }

    private static void skipped(StringBuilder out, Overview overview) {
        List<SkippedFile> skipped = overview.scan().skipped();
        if (skipped.isEmpty()) {
            return;
        }
        out.append("<section id=\"skipped\">\n<h2>Skipped files</h2>\n<ul class=\"skipped\">\n");
        for (SkippedFile file : skipped) {
            out.append("<li><code>").append(Html.text(file.path())).append("</code>: ").append(Html.text(file.reason()))
                    .append("</li>\n");
        }
        out.append("</ul>\n</section>\n");
    }

    private static Map<String, List<Finding>> findingsByPath(CheckResult check) {
        return check.findings().stream().collect(Collectors.groupingBy(Finding::path, java.util.LinkedHashMap::new,
                Collectors.toList()));
    }

    private static String stylesheet() {
        try (InputStream in = HtmlReport.class.getResourceAsStream("report.css")) {
            if (in == null) {
                throw new IllegalStateException("report.css is missing from the build");
            }
            return new String(in.readAllBytes(), StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }
}
