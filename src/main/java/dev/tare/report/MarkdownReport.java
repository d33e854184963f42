package dev.tare.report;

import dev.tare.app.BaselineStatus;
import dev.tare.app.Overview;
import dev.tare.app.RuleTally;
import dev.tare.app.ScanResult;
import dev.tare.app.ScannedTemplate;
import dev.tare.app.TargetTotals;
import dev.tare.footprint.Coverage;
import dev.tare.footprint.Footprint;
import dev.tare.footprint.Target;
import dev.tare.lint.BaselineChange;
import dev.tare.lint.RewriteClass;
import dev.tare.lint.Severity;
import dev.tare.workspace.SkippedFile;
import dev.tare.template.TemplateKind;
import java.util.ArrayList;
import java.util.List;
import java.util.OptionalDouble;

/**
 * Renders an {@link Overview} as a Markdown summary short enough for a pull-request comment: totals
 * per target, the costliest templates, findings and savings by rule, and the change since the baseline.
 */
public final class MarkdownReport {
    /** How many templates the costliest-templates table lists. */
    static final int COSTLIEST = 10;
    /** How many baseline changes are listed before the rest are only counted. */
    static final int MAX_CHANGES = 20;

    private MarkdownReport() {
    }

    /** The Markdown document. */
    public static String render(Overview overview) {
        ScanResult scan = overview.scan();
        StringBuilder out = new StringBuilder();
        out.append("## Tare report for ").append(code(scan.root())).append("\n\n");
        out.append(intro(overview)).append("\n\n");
        out.append("> ").append(Figures.ESTIMATE_NOTE).append("\n\n");
        targets(out, overview);
        prefixCaching(out, overview);
        costliest(out, overview);
        findings(out, overview);
        savings(out, overview);
        baseline(out, overview);
        skipped(out, scan);
        return out.toString();
    }

    private static String intro(Overview overview) {
        ScanResult.Totals totals = overview.scan().totals();
        StringBuilder line = new StringBuilder();
        line.append(CheckReport.plural(totals.templates(), "template")).append(" measured");
        if (totals.partials() > 0) {
            line.append(" (and ").append(CheckReport.plural(totals.partials(), "partial"))
                    .append(", counted inside the templates that include them)");
        }
        line.append(", ").append(Figures.count(totals.staticTokens())).append(" static and ")
                .append(Figures.count(totals.estimatedTokens())).append(" estimated tokens on ")
                .append(code(overview.scan().tokenizer())).append(". ");
        long tools = overview.scan().templates().stream().filter(t -> t.kind() == TemplateKind.TOOLS).count();
        long checked = overview.check().templates();
        if (totals.partials() + tools == 0) {
            line.append(CheckReport.plural(checked, "template")).append(" checked");
        } else {
            List<String> parts = new ArrayList<>(List.of(CheckReport.plural(checked - totals.partials() - tools, "template")));
            if (totals.partials() > 0) {
                parts.add(CheckReport.plural(totals.partials(), "partial"));
            }
            if (tools > 0) {
                parts.add(CheckReport.plural(tools, "tool file"));
            }
            line.append(CheckReport.plural(checked, "file")).append(" checked (").append(String.join(", ", parts)).append(')');
        }
        line.append(" with ").append(CheckReport.plural(overview.check().rules().size(), "rule")).append('.');
        if (!overview.scan().skipped().isEmpty()) {
            line.append(' ').append(CheckReport.plural(overview.scan().skipped().size(), "file")).append(" skipped.");
        }
        return line.toString();
    }

    private static void targets(StringBuilder out, Overview overview) {
        if (overview.targets().isEmpty()) {
            return;
        }
        out.append("### Totals per target\n\n");
        Table table = new Table("Target", "Tokenizer", ">Templates", ">Input tokens per call, summed",
                ">Cost per month (estimate)", "KV cache, largest request (estimate)");
        boolean priced = false;
        for (TargetTotals t : overview.targets()) {
            String cost = t.costPerMonth().isPresent()
                    ? Figures.money(t.costPerMonth().getAsDouble(), t.currency().orElse(""), 2) : "–";
            priced |= t.costPerMonth().isPresent();
            table.row(text(t.target().name()), code(t.target().tokenizer()), Figures.count(t.templates()),
                    Figures.count(t.inputTokens()), cost, kvCache(t));
        }
        out.append(table.render()).append('\n');
        if (priced) {
            out.append("Cost per month adds up every template at its own traffic: its front matter's `calls_per_day`, else"
                    + " the first matching `traffic` glob, else the target's `calls_per_day`.\n\n");
        }
        List<String> cautions = TargetSections.cautions(overview.scan());
        cautions.forEach(line -> out.append("> ").append(text(line)).append("\n"));
        if (!cautions.isEmpty()) {
            out.append('\n');
        }
    }

    private static void prefixCaching(StringBuilder out, Overview overview) {
        var caches = overview.scan().cacheTotals();
        if (caches.isEmpty()) {
            return;
        }
        out.append("### Prefix caching\n\n");
        Table table = new Table("Target", ">Cacheable tokens per call", ">Saving per month (estimate)",
                ">If per-call parts came last", ">Saving per month then (estimate)");
        caches.forEach((name, cache) -> {
            String currency = cache.currency().orElse("");
            table.row(text(name), Figures.count(cache.cachedTokens()), money(cache.savingPerMonth(), currency),
                    Figures.count(cache.reorderedCachedTokens()), money(cache.reorderedSavingPerMonth(), currency));
        });
        List<String[]> rows = new ArrayList<>();
        caches.forEach((name, cache) -> {
            String currency = cache.currency().orElse("");
            for (ScannedTemplate t : overview.cacheLeaders(name, COSTLIEST)) {
                Footprint f = t.targets().get(name);
                Footprint.Caching c = f.caching().orElseThrow();
                rows.add(new String[] {code(t.key()), text(name), Figures.count(c.staticPrefixTokens()),
                        Figures.count(c.cacheablePrefixTokens()), c.hitRateKnown() ? Figures.percent(c.hitRate()) : "–",
                        money(f.costPerMonth(), currency), money(f.costPerMonthUncached(), currency),
                        money(t.prefixes().get(name).reorderedSavingPerMonth(), currency)});
            }
        });
        out.append(table.render()).append('\n');
        if (!rows.isEmpty()) {
            Table templates = new Table("Template", "Target", ">Static prefix", ">Cacheable", ">Hit rate",
                    ">Cost per month (estimate)", ">Without caching (estimate)",
                    ">Caching would save with per-call parts last (estimate)");
            rows.forEach(templates::row);
            out.append("Per priced target, up to ").append(COSTLIEST).append(" templates whose static parts, put first,")
                    .append(" caching would save most on:\n\n").append(templates.render()).append('\n');
        }
        out.append("A template's static prefix is its tool definitions, then its text up to the first per-call part;"
                + " the cache holds it from the target's `prefix_cache` minimum on, and a call finds it there as often as"
                + " the traffic of every template sharing it keeps the entry alive. The last columns move every"
                + " template's per-call parts after its static text. Savings are at each template's traffic.\n\n");
    }

    private static String money(OptionalDouble amount, String currency) {
        return amount.isPresent() ? Figures.money(amount.getAsDouble(), currency, 2) : "–";
    }

    private static String kvCache(TargetTotals t) {
        if (t.largestKvCacheBytes().isEmpty()) {
            return "–";
        }
        StringBuilder cell = new StringBuilder(Figures.bytes(t.largestKvCacheBytes().getAsLong()))
                .append(" for ").append(code(t.largestRequest().orElse("")));
        t.fewestConcurrent().ifPresent(n -> cell.append("; ").append(Figures.count(n)).append(" such requests fit"));
        t.weightBytes().ifPresent(w -> cell.append(" beside ").append(Figures.bytes(w)).append(" of weights"));
        return cell.toString();
    }

    private static void costliest(StringBuilder out, Overview overview) {
        List<ScannedTemplate> costliest = overview.costliest(COSTLIEST);
        if (costliest.isEmpty()) {
            return;
        }
        List<Target> priced = new ArrayList<>();
        List<Target> devices = new ArrayList<>();
        for (Target target : overview.scan().targetConfigs()) {
            Coverage coverage = Coverage.of(target);
            if (coverage.computes().contains("cost_per_month")) {
                priced.add(target);
            }
            if (coverage.computes().contains("kv_cache_bytes")) {
                devices.add(target);
            }
        }
        out.append("### The ").append(costliest.size()).append(" costliest templates\n\n");
        List<String> headers = new ArrayList<>(List.of(">#", "Template", "Kind", ">Static tokens", ">Estimated tokens"));
        priced.forEach(t -> headers.add(">" + text(t.name()) + ": cost per month (estimate)"));
        devices.forEach(t -> headers.add(">" + text(t.name()) + ": KV cache (estimate)"));
        Table table = new Table(headers.toArray(String[]::new));
        int rank = 1;
        for (ScannedTemplate template : costliest) {
            List<String> row = new ArrayList<>(List.of(String.valueOf(rank++), code(template.key()),
                    template.kind().label(), Figures.count(template.staticTokens()),
                    Figures.count(template.estimatedTokens())));
            for (Target target : priced) {
                Footprint f = template.targets().get(target.name());
                row.add(f == null ? "–" : Figures.perMonth(f));
            }
            for (Target target : devices) {
                Footprint f = template.targets().get(target.name());
                row.add(f == null || f.kvCacheBytes().isEmpty() ? "–" : Figures.bytes(f.kvCacheBytes().getAsLong()));
            }
            table.row(row.toArray(String[]::new));
        }
        out.append(table.render()).append('\n');
        out.append(priced.isEmpty() ? "Ranked by estimated tokens.\n\n"
                : "Ranked by cost per month summed over the priced targets, then by estimated tokens."
                + " A dash: the template does not run on that target.\n\n");
    }

    private static void findings(StringBuilder out, Overview overview) {
        var check = overview.check();
        out.append("### Findings by rule\n\n");
        if (check.findings().isEmpty()) {
            out.append("No findings in ").append(CheckReport.plural(check.templates(), "template")).append(".\n\n");
            return;
        }
        out.append("**").append(CheckReport.plural(check.count(Severity.ERROR), "error")).append(", ")
                .append(CheckReport.plural(check.count(Severity.WARNING), "warning")).append(", ")
                .append(CheckReport.plural(check.count(Severity.INFO), "info")).append("** in ")
                .append(CheckReport.plural(check.filesWithFindings(), "file")).append(".\n\n");
        Table table = new Table("Rule", "Severity", ">Findings", ">Files", "Rewrite", ">Tokens saved per call");
        for (RuleTally tally : overview.rules()) {
            table.row(code(tally.rule()), tally.severity().label(), Figures.count(tally.findings()),
                    Figures.count(tally.files()), tally.rewrites() == 0 ? "–" : tally.rewriteClass().label(),
                    tally.rewrites() == 0 ? "–" : Figures.count(tally.savingTokens()));
        }
        out.append(table.render()).append('\n');
        out.append("`tare check` lists every finding; `tare explain RULE` says why a rule matters.\n\n");
    }

    private static void savings(StringBuilder out, Overview overview) {
        long safe = overview.savingTokens(RewriteClass.SAFE);
        long review = overview.savingTokens(RewriteClass.REVIEW);
        out.append("### Savings available\n\n");
        if (overview.check().rewrites() == 0) {
            out.append("No rule offers a rewrite.\n\n");
            return;
        }
        Table table = new Table("Rewrites", ">Findings", ">Tokens saved per call");
        table.row("safe: meaning-preserving, may be applied unattended", Figures.count(rewrites(overview, RewriteClass.SAFE)),
                Figures.count(safe));
        table.row("review: a person decides", Figures.count(rewrites(overview, RewriteClass.REVIEW)), Figures.count(review));
        table.row("**all**", "**" + Figures.count(overview.check().rewrites()) + "**", "**" + Figures.count(safe + review) + "**");
        out.append(table.render()).append('\n');
        out.append(CheckReport.ESTIMATE_NOTE).append(" Savings are what `tare fix` saves applying the rewrites"
                + " (safe ones first, then those to review), on each template's tokenizer.\n\n");
    }

    private static long rewrites(Overview overview, RewriteClass rewriteClass) {
        return overview.rules().stream().filter(t -> t.rewriteClass() == rewriteClass).mapToLong(RuleTally::rewrites).sum();
    }

    private static void baseline(StringBuilder out, Overview overview) {
        out.append("### Since the baseline\n\n");
        if (overview.baseline().isEmpty()) {
            out.append("No baseline: ").append(code(overview.baselineFile()))
                    .append(" does not exist. `tare baseline` records one; commit it to see changes here.\n\n");
            return;
        }
        BaselineStatus status = overview.baseline().get();
        String tolerance = Figures.plain(status.tolerancePercent()) + "%";
        out.append("Compared with ").append(code(status.file())).append(" (tolerance ").append(tolerance).append("): ");
        int over = status.overTolerance().size();
        int grew = status.grew().size();
        List<String> parts = new ArrayList<>();
        parts.add(over > 0 ? "**" + plural(over, "count") + " grew beyond the tolerance**" : "nothing grew beyond the tolerance");
        if (grew > over) {
            parts.add(plural(grew - over, "count") + " grew within it");
        }
        parts.add(plural(status.shrank().size(), "count") + " shrank");
        if (!status.added().isEmpty()) {
            parts.add(CheckReport.plural(status.added().size(), "template") + " new");
        }
        if (!status.removed().isEmpty()) {
            parts.add(CheckReport.plural(status.removed().size(), "template") + " gone");
        }
        out.append(String.join(", ", parts)).append(".\n\n");
        if (!status.changes().isEmpty()) {
            Table table = new Table("Template", "Target", ">Recorded", ">Now", ">Change", "");
            List<BaselineChange> ordered = new ArrayList<>(status.overTolerance());
            status.changes().stream().filter(c -> !c.overTolerance()).forEach(ordered::add);
            for (BaselineChange change : ordered.subList(0, Math.min(MAX_CHANGES, ordered.size()))) {
                table.row(code(change.path()), text(change.target()), Figures.count(change.recorded()),
                        Figures.count(change.current()), change(change),
                        change.overTolerance() ? "**over tolerance**" : change.grew() ? "grew" : "shrank");
            }
            out.append(table.render());
            if (ordered.size() > MAX_CHANGES) {
                out.append("\n…and ").append(plural(ordered.size() - MAX_CHANGES, "more change")).append(".\n");
            }
            out.append('\n');
        }
        if (!status.added().isEmpty()) {
            out.append("New since the baseline: ").append(String.join(", ", status.added().stream().map(MarkdownReport::code)
                    .toList())).append(".\n\n");
        }
        if (!status.removed().isEmpty()) {
            out.append("Recorded but gone: ").append(String.join(", ", status.removed().stream().map(MarkdownReport::code)
                    .toList())).append(".\n\n");
        }
    }

    private static String change(BaselineChange change) {
        int delta = change.current() - change.recorded();
        String sign = delta > 0 ? "+" : "−";
        String percent = Double.isInfinite(change.percent()) ? "new"
                : sign + Figures.significant(Math.abs(change.percent())) + "%";
        return sign + Figures.count(Math.abs(delta)) + " (" + percent + ")";
    }

    private static void skipped(StringBuilder out, ScanResult scan) {
        if (scan.skipped().isEmpty()) {
            return;
        }
        out.append("### Skipped\n\n");
        for (SkippedFile file : scan.skipped()) {
            out.append("- ").append(code(file.path())).append(": ").append(text(file.reason())).append('\n');
        }
        out.append('\n');
    }

    private static String plural(long count, String word) {
        return CheckReport.plural(count, word);
    }

    /** Text as a code span that survives inside a table cell. */
    static String code(String value) {
        String cell = value.replace("|", "\\|").replace("\n", " ");
        String fence = cell.contains("`") ? "``" : "`";
        String pad = cell.startsWith("`") || cell.endsWith("`") ? " " : "";
        return fence + pad + cell + pad + fence;
    }

    /** Plain text with Markdown's special characters escaped, on one line. */
    static String text(String value) {
        StringBuilder out = new StringBuilder();
        for (char c : value.replace('\n', ' ').toCharArray()) {
            if ("\\`*_[]<>|#".indexOf(c) >= 0) {
                out.append('\\');
            }
            out.append(c);
        }
        return out.toString();
    }

    /** A GitHub-flavoured Markdown table; a header starting with {@code >} is a right-aligned column. */
    private static final class Table {
        private final List<String> headers = new ArrayList<>();
        private final List<Boolean> right = new ArrayList<>();
        private final List<String[]> rows = new ArrayList<>();

        Table(String... headers) {
            for (String header : headers) {
                boolean alignRight = header.startsWith(">");
                this.headers.add(alignRight ? header.substring(1) : header);
                this.right.add(alignRight);
            }
        }

        void row(String... cells) {
            rows.add(cells);
        }

        String render() {
            StringBuilder out = new StringBuilder("| ").append(String.join(" | ", headers)).append(" |\n|");
            right.forEach(r -> out.append(r ? " --: |" : " :-- |"));
            out.append('\n');
            for (String[] row : rows) {
                out.append("| ").append(String.join(" | ", row)).append(" |\n");
            }
            return out.toString();
        }
    }
}
