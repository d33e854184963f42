package dev.tare.report;

import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.tare.app.FixResult;
import dev.tare.rewrite.FileFix;
import dev.tare.rewrite.NotApplied;
import dev.tare.rewrite.RuleSaving;
import dev.tare.rewrite.TokenChange;
import dev.tare.rewrite.UnifiedDiff;
import dev.tare.workspace.SkippedFile;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;

/** Renders a {@link FixResult}: unified diffs and a token summary as text, or one JSON document. */
public final class FixReport {
    /** What every fix output says about its figures. */
    static final String ESTIMATE_NOTE = "Token counts are planning estimates from each target's tokenizer, not"
            + " measurements or invoices; they count the prompt text each file holds (includes not expanded), so a"
            + " partial's saving is counted once, in the partial.";
    static final String REVIEW_CAUTION = "Review-class rewrites change what the prompt says: evaluate the prompts"
            + " they change before they ship.";
    /** Said when shared blocks were moved into partials. */
    static final String EXTRACTION_NOTE = "Every template a shared block was moved out of renders exactly as before,"
            + " so the tokens sent per call do not change; the counts above are of the text each file holds.";

    private FixReport() {
    }

    /** The diff of every verified rewrite, then what was not fixed and why, then the token summary. */
    public static String text(FixResult result, boolean colour) {
        StringBuilder out = new StringBuilder();
        for (FileFix file : result.files()) {
            if (file.verified()) {
                out.append(diff(file, colour));
            }
        }
        if (!result.files().isEmpty()) {
            out.append('\n');
        }
        if (!result.notFixed().isEmpty() || !result.refused().isEmpty()) {
            out.append("Not fixed:\n");
            for (FileFix file : result.notFixed()) {
                out.append("  ").append(file.path()).append(": ")
                        .append(file.outcome() == FileFix.Outcome.DROPPED ? "rewrite dropped, nothing written: " : "")
                        .append(String.join("; ", file.problems())).append('\n');
            }
            for (NotApplied place : result.refused()) {
                out.append("  ").append(place.path()).append(':').append(place.line()).append(": ").append(place.rule())
                        .append(" not applied: ").append(place.reason()).append('\n');
            }
            out.append('\n');
        }
        if (!result.applied().isEmpty()) {
            out.append("Tokens per file:\n").append(fileTable(result)).append('\n');
            out.append("Rewrites per rule (tokens saved on each tokenizer):\n").append(ruleTable(result)).append('\n');
        }
        review(result, out);
        out.append(status(result)).append('\n');
        if (!result.applied().isEmpty()) {
            out.append(ESTIMATE_NOTE).append('\n');
        }
        if (!result.created().isEmpty() || result.rules().stream().anyMatch(r -> r.rule().equals("shared-block"))) {
            out.append(EXTRACTION_NOTE).append('\n');
        }
        if (!result.skipped().isEmpty()) {
            out.append("\nSkipped ").append(CheckReport.plural(result.skipped().size(), "file")).append(":\n");
            for (SkippedFile skipped : result.skipped()) {
                out.append("  ").append(skipped.path()).append(": ").append(skipped.reason()).append('\n');
            }
        }
        return out.toString();
    }

    /** The file's diff; a new file's shows it added whole, as {@code git diff} does. */
    private static String diff(FileFix file, boolean colour) {
        String diff = UnifiedDiff.of(file.path(), file.before(), file.after(), colour);
        if (!file.created()) {
            return diff;
        }
        return diff.replaceFirst("a/" + java.util.regex.Pattern.quote(file.path()), "/dev/null")
                .replaceFirst("@@ -1,0 ", "@@ -0,0 ");
    }

    private static String fileTable(FixResult result) {
        TextTable table = new TextTable(List.of("file", "tokenizer", "before", "after", "saved"),
                false, false, true, true, true);
        for (FileFix file : result.applied()) {
            boolean first = true;
            for (TokenChange change : file.tokens()) {
                table.row(tokenRow(first ? file.path() + (file.created() ? " (new)" : "") : "", change));
                first = false;
            }
        }
        table.rule();
        boolean first = true;
        for (TokenChange total : result.totals()) {
            table.row(tokenRow(first ? "total" : "", total));
            first = false;
        }
        return table.render();
    }

    private static List<String> tokenRow(String label, TokenChange change) {
        return List.of(label, change.tokenizer(), TextTable.number(change.before()), TextTable.number(change.after()),
                TextTable.number(change.saved()));
    }

    private static String ruleTable(FixResult result) {
        List<String> tokenizers = result.tokenizers();
        List<String> headers = new ArrayList<>(List.of("rule", "class", "rewrites", "files"));
        headers.addAll(tokenizers);
        boolean[] numeric = new boolean[headers.size()];
        for (int c = 2; c < numeric.length; c++) {
            numeric[c] = true;
        }
        TextTable table = new TextTable(headers, numeric);
        for (RuleSaving saving : result.rules()) {
            List<String> row = new ArrayList<>(List.of(saving.rule(), saving.rewriteClass().label(),
                    TextTable.number(saving.rewrites()), TextTable.number(saving.files())));
            for (String tokenizer : tokenizers) {
                Integer saved = saving.saved().get(tokenizer);
                row.add(saved == null ? "-" : TextTable.number(saved));
            }
            table.row(row);
        }
        return table.render();
    }

    private static void review(FixResult result, StringBuilder out) {
        Map<String, Integer> applied = result.reviewApplied();
        if (!applied.isEmpty()) {
            out.append("Review-class rewrites applied: ").append(list(applied)).append(". ").append(REVIEW_CAUTION).append('\n');
        }
        if (!result.reviewLeft().isEmpty()) {
            out.append("Review-class rewrites not applied: ").append(list(result.reviewLeft()))
                    .append(". Add --include-review to apply them. ").append(REVIEW_CAUTION).append('\n');
        }
    }

    private static String list(Map<String, Integer> counts) {
        List<String> parts = new ArrayList<>();
        counts.forEach((rule, count) -> parts.add(rule + " (" + count + ")"));
        return String.join(", ", parts);
    }

    private static String status(FixResult result) {
        int changed = result.applied().size();
        String of = " of " + CheckReport.plural(result.templates(), "template");
        String line;
        if (result.files().isEmpty() && result.refused().isEmpty()) {
            line = "Nothing to fix in " + CheckReport.plural(result.templates(), "template") + ".";
        } else if (result.files().isEmpty()) {
            line = "Nothing fixed in " + CheckReport.plural(result.templates(), "template") + ".";
        } else if (result.options().dryRun()) {
            line = "Dry run: " + TextTable.number(changed) + of + " would change"
                    + "; nothing was written.";
        } else {
            line = "Fixed " + TextTable.number(changed) + of + ".";
        }
        if (!result.notFixed().isEmpty()) {
            line += " " + CheckReport.plural(result.notFixed().size(), "file") + " not fixed (see above).";
        }
        if (!result.refused().isEmpty()) {
            line += " " + CheckReport.plural(result.refused().size(), "place") + " a rewrite across files had to leave"
                    + " (see above).";
        }
        return line;
    }

    /** One JSON document: every file with its outcome, savings and diff, the per-rule and total savings, and notes. */
    public static String json(FixResult result) {
        ObjectNode root = Json.report();
        root.put("root", result.root());
        root.put("dry_run", result.options().dryRun());
        root.put("include_review", result.options().includeReview());
        ArrayNode only = root.putArray("only");
        result.options().only().forEach(only::add);
        ArrayNode files = root.putArray("files");
        for (FileFix file : result.files()) {
            ObjectNode node = files.addObject();
            node.put("path", file.path());
            node.put("outcome", file.outcome().label());
            node.put("created", file.created());
            node.put("rounds", file.rounds());
            ArrayNode problems = node.putArray("problems");
            file.problems().forEach(problems::add);
            tokens(node.putObject("tokens"), file.tokens());
            rules(node.putArray("rules"), file.rules());
            if (file.verified()) {
                node.put("diff", diff(file, false));
            } else {
                node.putNull("diff");
            }
        }
        ObjectNode summary = root.putObject("summary");
        summary.put("templates", result.templates());
        summary.put("files_changed", result.applied().size());
        summary.put("files_not_fixed", result.notFixed().size());
        summary.put("files_created", result.created().size());
        summary.put("places_not_applied", result.refused().size());
        tokens(summary.putObject("tokens"), result.totals());
        rules(summary.putArray("rules"), result.rules());
        ObjectNode applied = summary.putObject("review_applied");
        result.reviewApplied().forEach(applied::put);
        ObjectNode left = summary.putObject("review_not_applied");
        result.reviewLeft().forEach(left::put);
        summary.put("review_caution", REVIEW_CAUTION);
        summary.put("failed", result.failed());
        summary.put("note", ESTIMATE_NOTE);
        ArrayNode refused = root.putArray("not_applied");
        for (NotApplied place : result.refused()) {
            refused.addObject().put("path", place.path()).put("line", place.line()).put("rule", place.rule())
                    .put("reason", place.reason());
        }
        ArrayNode skipped = root.putArray("skipped");
        for (SkippedFile file : result.skipped()) {
            skipped.addObject().put("path", file.path()).put("reason", file.reason());
        }
        return Json.write(root);
    }

    private static void tokens(ObjectNode node, List<TokenChange> changes) {
        for (TokenChange change : changes) {
            node.putObject(change.tokenizer()).put("before", change.before()).put("after", change.after())
                    .put("saved", change.saved());
        }
    }

    private static void rules(ArrayNode node, List<RuleSaving> savings) {
        for (RuleSaving saving : savings) {
            ObjectNode rule = node.addObject();
            rule.put("rule", saving.rule());
            rule.put("class", saving.rewriteClass().label());
            rule.put("rewrites", saving.rewrites());
            rule.put("files", saving.files());
            ObjectNode saved = rule.putObject("saved_tokens");
            saving.saved().forEach(saved::put);
        }
    }
}
