package dev.tare.report;

import dev.tare.app.ScannedTemplate;
import dev.tare.app.TemplateLines;
import dev.tare.lint.Finding;
import dev.tare.lint.Related;
import dev.tare.lint.Severity;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * One template of the HTML report, line by line: each line shaded by the static tokens it costs
 * (with the count and a bar beside it, so the shading is never the only cue), its findings shown
 * beneath it, and lines that are not sent (front matter, a chat file's keys) set apart.
 */
final class LineView {
    /** Upper bounds of the shading levels 1 to 4; more tokens than the last is level 5. */
    static final int[] LEVELS = {0, 4, 12, 30};
    /** Tokens at which a line's bar is full width: the same scale for every template. */
    static final int FULL_BAR = 40;

    private LineView() {
    }

    static String render(ScannedTemplate template, Optional<TemplateLines> lines, List<Finding> findings) {
        StringBuilder out = new StringBuilder();
        out.append("<details class=\"template\" id=\"").append(Html.id("t", template.path())).append("\" data-path=\"")
                .append(Html.attr(template.path())).append("\">\n<summary><span class=\"path\">")
                .append(Html.text(template.path())).append("</span> <span class=\"kind\">").append(template.kind().label())
                .append("</span> <span class=\"facts\">").append(Figures.count(template.staticTokens()))
                .append(" static tokens").append(findingCounts(findings)).append("</span></summary>\n");
        if (lines.isEmpty()) {
            out.append("<p class=\"aside\">The file changed while the report was made; its lines are not shown.</p>\n");
            appendFindings(out, findings);
            return out.append("</details>\n").toString();
        }
        TemplateLines counted = lines.get();
        Map<Integer, List<Finding>> byLine = new LinkedHashMap<>();
        List<Finding> elsewhere = new ArrayList<>();
        for (Finding finding : findings) {
            if (finding.line() >= 1 && finding.line() <= counted.lines().size()) {
                byLine.computeIfAbsent(finding.line(), l -> new ArrayList<>()).add(finding);
            } else {
                elsewhere.add(finding);
            }
        }
        out.append("<p class=\"aside\">Each line's text counted on its own: ")
                .append(Figures.count(counted.totalTokens())).append(" tokens over all lines, against ")
                .append(Figures.count(template.staticTokens()))
                .append(" for the whole template (the tokenizer merges differently across line ends).</p>\n");
        appendFindings(out, elsewhere);
        out.append("<table class=\"source\">\n<thead><tr><th scope=\"col\">line</th><th scope=\"col\">tokens</th>")
                .append("<th scope=\"col\"><span class=\"visually-hidden\">share</span></th><th scope=\"col\">text</th>")
                .append("</tr></thead>\n<tbody>\n");
        for (TemplateLines.Line line : counted.lines()) {
            List<Finding> here = byLine.getOrDefault(line.number(), List.of());
            out.append("<tr class=\"line ").append(line.prompt() ? "level-" + level(line.tokens()) : "unsent")
                    .append(here.isEmpty() ? "" : " flagged").append("\" data-line=\"").append(line.number())
                    .append("\" data-tokens=\"").append(line.tokens()).append("\">");
            out.append("<td class=\"ln\">").append(line.number()).append("</td>");
            if (line.prompt()) {
                out.append("<td class=\"tok\">").append(Figures.count(line.tokens())).append("</td>");
                out.append("<td class=\"share\"><span style=\"width:")
                        .append(String.format(java.util.Locale.ROOT, "%.1f", 100.0 * Math.min(line.tokens(), FULL_BAR) / FULL_BAR))
                        .append("%\"></span></td>");
            } else {
                out.append("<td class=\"tok\" title=\"not sent\">–</td><td class=\"share\"></td>");
            }
            out.append("<td class=\"code\">").append(Html.sourceText(line.text()));
            for (String include : line.includes()) {
                out.append(" <span class=\"pasted\">pastes ").append(Html.text(include)).append("</span>");
            }
            out.append("</td></tr>\n");
            for (Finding finding : here) {
                out.append("<tr class=\"finding-row\"><td></td><td colspan=\"3\">").append(finding(finding))
                        .append("</td></tr>\n");
            }
        }
        out.append("</tbody>\n</table>\n");
        return out.append("</details>\n").toString();
    }

    /** The legend of the shading levels. */
    static String legend() {
        StringBuilder out = new StringBuilder("<ul class=\"legend shades\">");
        String[] labels = {"0 tokens", "1–4", "5–12", "13–30", "31 or more"};
        for (int level = 1; level <= labels.length; level++) {
            out.append("<li><span class=\"shade level-").append(level).append("\"></span>").append(labels[level - 1])
                    .append("</li>");
        }
        return out.append("<li><span class=\"shade unsent\"></span>not sent (front matter, chat file keys)</li></ul>\n")
                .toString();
    }

    static int level(int tokens) {
        for (int i = 0; i < LEVELS.length; i++) {
            if (tokens <= LEVELS[i]) {
                return i + 1;
            }
        }
        return LEVELS.length + 1;
    }

    static String finding(Finding finding) {
        StringBuilder out = new StringBuilder("<div class=\"finding severity-").append(finding.severity().label())
                .append("\" data-rule=\"").append(Html.attr(finding.rule())).append("\" data-path=\"")
                .append(Html.attr(finding.path())).append("\" data-line=\"").append(finding.line()).append("\">");
        out.append("<span class=\"severity\">").append(finding.severity().label()).append("</span> ");
        out.append("<code class=\"rule\">").append(Html.text(finding.rule())).append("</code> ");
        out.append("<span class=\"where\">").append(finding.line()).append(':').append(finding.column()).append("</span> ");
        out.append("<span class=\"message\">").append(Html.text(finding.message())).append("</span>");
        finding.rewrite().ifPresent(rewrite -> out.append(" <span class=\"rewrite\">").append(finding.rewriteClass().label())
                .append(" rewrite, saves ").append(CheckReport.plural(rewrite.savingTokens(), "token")).append("</span>"));
        for (Related related : finding.related()) {
            out.append("<div class=\"related\">").append(Html.text(related.message())).append(": ")
                    .append(Html.text(related.path())).append(':').append(related.line()).append(':')
                    .append(related.column()).append("</div>");
        }
        return out.append("</div>").toString();
    }

    private static void appendFindings(StringBuilder out, List<Finding> findings) {
        if (findings.isEmpty()) {
            return;
        }
        out.append("<div class=\"file-findings\">");
        findings.forEach(f -> out.append(finding(f)));
        out.append("</div>\n");
    }

    private static String findingCounts(List<Finding> findings) {
        if (findings.isEmpty()) {
            return ", no findings";
        }
        List<String> parts = new ArrayList<>();
        for (Severity severity : new Severity[] {Severity.ERROR, Severity.WARNING, Severity.INFO}) {
            long count = findings.stream().filter(f -> f.severity() == severity).count();
            if (count > 0) {
                parts.add(CheckReport.plural(count, severity.label()));
            }
        }
        return ", " + String.join(", ", parts);
    }
}
