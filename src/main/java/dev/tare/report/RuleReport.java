package dev.tare.report;

import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.tare.lint.EditKind;
import dev.tare.lint.Example;
import dev.tare.lint.ExampleRunner;
import dev.tare.lint.RewriteClass;
import dev.tare.lint.RuleCatalog;
import dev.tare.lint.RuleDescriptor;
import java.util.List;
import java.util.Map;

/** Renders the rule list, one rule's explanation, and the outcome of running every rule's examples. */
public final class RuleReport {
    private RuleReport() {
    }

    /** A table of every rule: id, class, severity in force, origin and summary. */
    public static String list(RuleCatalog catalog) {
        TextTable table = new TextTable(List.of("RULE", "CLASS", "EDITS", "SEVERITY", "FROM", "SUMMARY"));
        for (RuleDescriptor rule : catalog.descriptors()) {
            String severity = catalog.isDisabled(rule.id()) ? "off" : catalog.severity(rule).label();
            table.row(List.of(rule.id(), rule.rewriteClass().label(), rule.editKind().map(EditKind::label).orElse("-"),
                    severity, rule.origin(), rule.summary()));
        }
        return table.render() + "\n" + CheckReport.plural(catalog.descriptors().size(), "rule")
                + ". 'tare explain RULE' shows what a rule flags, why, an example and what to write instead.\n"
                + RewriteClass.SAFE.meaning() + "\n" + RewriteClass.REVIEW.meaning() + "\n";
    }

    /** The rule list as JSON: {@code {"tool", "version", "rules": [{id, class, edit_kind, severity, default_severity, enabled, origin, summary}]}}. */
    public static String listJson(RuleCatalog catalog) {
        ObjectNode root = Json.report();
        ArrayNode rules = root.putArray("rules");
        for (RuleDescriptor rule : catalog.descriptors()) {
            ObjectNode node = rules.addObject();
            node.put("id", rule.id());
            node.put("class", rule.rewriteClass().label());
            rule.editKind().ifPresent(kind -> node.put("edit_kind", kind.label()));
            node.put("severity", catalog.severity(rule).label());
            node.put("default_severity", rule.severity().label());
            node.put("enabled", !catalog.isDisabled(rule.id()));
            node.put("origin", rule.origin());
            node.put("summary", rule.summary());
            node.put("why", rule.why());
            node.put("instead", rule.instead());
        }
        return Json.write(root);
    }

    /** The four parts of a rule's explanation, in order: what it flags, why it costs, an example, what to write instead. */
    public static String explainText(RuleDescriptor rule) {
        StringBuilder out = new StringBuilder();
        out.append(rule.id()).append(" (").append(rule.severity().label()).append(", ")
                .append(rule.rewriteClass() == RewriteClass.NONE ? "no rewrite" : rule.rewriteClass().label() + " rewrite")
                .append(", ").append(rule.origin()).append(")\n\n");
        out.append("What it flags\n  ").append(rule.summary()).append("\n\n");
        out.append("Why it costs\n  ").append(rule.why()).append("\n\n");
        List<Example> examples = rule.examples();
        for (int i = 0; i < examples.size(); i++) {
            Example example = examples.get(i);
            out.append(examples.size() == 1 ? "Example" : "Example " + (i + 1)).append('\n');
            for (Map.Entry<String, Integer> setting : example.settings().entrySet()) {
                out.append(setting.getKey().equals(Example.SHARED_BLOCK_TOKENS) ? "  Given rules.limits."
                        : "  Given a target with ").append(setting.getKey()).append(": ").append(setting.getValue()).append('\n');
            }
            out.append("  Flagged:\n").append(indent(example.before()));
            out.append("  Instead:\n").append(indent(example.after()));
            out.append('\n');
        }
        out.append("What to write instead\n  ").append(rule.instead()).append('\n');
        out.append("\nIts rewrite\n  ").append(rule.editKind().map(kind -> kind.meaning() + " ").orElse(""))
                .append(rule.rewriteClass().meaning()).append('\n');
        return out.toString();
    }

    /** One line per failed example and a count; every line names the rule and where it is declared. */
    public static String testResults(List<ExampleRunner.Outcome> outcomes) {
        StringBuilder out = new StringBuilder();
        long failed = 0;
        for (ExampleRunner.Outcome outcome : outcomes) {
            if (!outcome.passed()) {
                failed++;
                out.append("FAIL ").append(outcome.rule()).append(" example ").append(outcome.number()).append(" (")
                        .append(outcome.origin()).append("): ").append(outcome.problem().orElse("")).append('\n');
            }
        }
        long rules = outcomes.stream().map(ExampleRunner.Outcome::rule).distinct().count();
        out.append(outcomes.size() - failed).append(" passed, ").append(failed).append(" failed (")
                .append(CheckReport.plural(outcomes.size(), "example")).append(" of ")
                .append(CheckReport.plural(rules, "rule")).append(")\n");
        return out.toString();
    }

    private static String indent(String text) {
        StringBuilder out = new StringBuilder();
        String body = text.endsWith("\n") ? text.substring(0, text.length() - 1) : text;
        for (String line : body.split("\n", -1)) {
            out.append("    | ").append(visible(line)).append('\n');
        }
        return out.toString();
    }

    /** Makes whitespace and invisible characters visible, so an example shows what the rule sees. */
    private static String visible(String line) {
        StringBuilder out = new StringBuilder();
        for (int i = 0; i < line.length(); i++) {
            char c = line.charAt(i);
            if (c == '\t') {
                out.append("\\t");
            } else if (c == '\r') {
                out.append("\\r");
            } else if (Character.getType(c) == Character.FORMAT || c == '\u00A0' || c == '\u00AD') {
                out.append(String.format(java.util.Locale.ROOT, "<U+%04X>", (int) c));
            } else {
                out.append(c);
            }
        }
        String shown = out.toString();
        int trailing = shown.length() - shown.stripTrailing().length();
        return trailing > 0 ? shown.stripTrailing() + "·".repeat(trailing) : shown;
    }
}
