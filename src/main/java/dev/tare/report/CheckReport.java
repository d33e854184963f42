package dev.tare.report;

import com.fasterxml.jackson.core.JsonGenerator;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.tare.Tare;
import dev.tare.app.CheckResult;
import dev.tare.lint.Edit;
import dev.tare.lint.Finding;
import dev.tare.lint.Related;
import dev.tare.lint.Rewrite;
import dev.tare.lint.RewriteClass;
import dev.tare.lint.RuleDescriptor;
import dev.tare.lint.Severity;
import dev.tare.workspace.SkippedFile;
import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.io.Writer;
import java.util.HashMap;
import java.util.Map;

/** Renders a {@link CheckResult} as text lines, as the JSON document of the design contract, or as SARIF 2.1.0. */
public final class CheckReport {
    /** What every output says about token figures. */
    static final String ESTIMATE_NOTE = "Token savings are planning estimates from the template's tokenizer,"
            + " not measurements or invoices.";
    private static final String SARIF_SCHEMA = "https://docs.oasis-open.org/sarif/sarif/v2.1.0/errata01/os/schemas/sarif-schema-2.1.0.json";
    private static final String ROOT_BASE = "SRCROOT";

    private CheckReport() {
    }

    /** One line per finding ({@code path:line:col: severity rule: message}), then a summary. */
    public static String text(CheckResult result) {
        StringWriter out = new StringWriter();
        text(result, out);
        return out.toString();
    }

    /** The text report written to {@code out} finding by finding, for a check too large to hold as one string. */
    public static void text(CheckResult result, Writer writer) {
        PrintWriter out = writer instanceof PrintWriter print ? print : new PrintWriter(writer);
        StringBuilder line = new StringBuilder();
        for (Finding finding : result.findings()) {
            line.setLength(0);
            line.append(finding.path()).append(':').append(finding.line()).append(':').append(finding.column())
                    .append(": ").append(finding.severity().label()).append(' ').append(finding.rule()).append(": ")
                    .append(finding.message());
            finding.rewrite().ifPresent(rewrite -> line.append(" [").append(finding.rewriteClass().label())
                    .append(" rewrite, saves ").append(tokens(rewrite.savingTokens())).append(']'));
            line.append('\n');
            for (Related related : finding.related()) {
                line.append("    ").append(related.message()).append(": ").append(related.path()).append(':')
                        .append(related.line()).append(':').append(related.column()).append('\n');
            }
            out.append(line);
        }
        if (!result.findings().isEmpty()) {
            out.append('\n');
        }
        out.append("Checked ").append(plural(result.templates(), "template")).append(" with ")
                .append(plural(result.rules().size(), "rule")).append(": ")
                .append(plural(result.count(Severity.ERROR), "error")).append(", ")
                .append(plural(result.count(Severity.WARNING), "warning")).append(", ")
                .append(plural(result.count(Severity.INFO), "info")).append(" in ")
                .append(plural(result.filesWithFindings(), "file")).append(".\n");
        if (result.rewrites() > 0) {
            out.append(plural(result.rewrites(), "finding")).append(result.rewrites() == 1
                            ? " offers a rewrite; it saves about " : " offer a rewrite; together they save about ")
                    .append(tokens(result.savingTokens())).append(" per call. ").append(ESTIMATE_NOTE).append('\n');
        }
        out.append(result.failed() ? "Failed: findings at or above " + result.failOn().label() + ".\n"
                : "Passed: no findings at or above " + result.failOn().label() + ".\n");
        if (!result.skipped().isEmpty()) {
            out.append("\nSkipped ").append(plural(result.skipped().size(), "file")).append(":\n");
            for (SkippedFile skipped : result.skipped()) {
                out.append("  ").append(skipped.path()).append(": ").append(skipped.reason()).append('\n');
            }
        }
        out.flush();
    }

    /** The {@code check} JSON document of the design contract. */
    public static String json(CheckResult result) {
        StringWriter out = new StringWriter();
        json(result, out);
        return out.toString();
    }

    /**
     * The {@code check} JSON document written to {@code out} finding by finding, laid out exactly as
     * {@link #json(CheckResult)} gives it: a large repository's findings make a document of hundreds
     * of megabytes, which is never held whole.
     */
    public static void json(CheckResult result, Writer out) {
        Json.stream(generator -> {
            generator.writeStringField("root", result.root());
            generator.writeArrayFieldStart("findings");
            for (Finding finding : result.findings()) {
                finding(generator, finding);
            }
            generator.writeEndArray();
            generator.writeFieldName("summary");
            Json.tree(generator, summary(result));
            generator.writeFieldName("skipped");
            ArrayNode skipped = Json.mapper().createArrayNode();
            for (SkippedFile file : result.skipped()) {
                skipped.addObject().put("path", file.path()).put("reason", file.reason());
            }
            Json.tree(generator, skipped);
        }, out);
    }

    /**
     * One finding, written straight to the generator: a large repository's report has hundreds of
     * thousands, and building a tree for each first took most of a warm check's time.
     */
    private static void finding(JsonGenerator out, Finding finding) throws IOException {
        out.writeStartObject();
        out.writeStringField("path", finding.path());
        out.writeNumberField("line", finding.line());
        out.writeNumberField("column", finding.column());
        out.writeNumberField("end_line", finding.endLine());
        out.writeNumberField("end_column", finding.endColumn());
        out.writeStringField("rule", finding.rule());
        out.writeStringField("severity", finding.severity().label());
        out.writeStringField("message", finding.message());
        out.writeStringField("rewrite_class", finding.rewrite().isPresent() ? finding.rewriteClass().label()
                : RewriteClass.NONE.label());
        if (finding.rewrite().isPresent()) {
            out.writeNumberField("saving_tokens", finding.rewrite().get().savingTokens());
        } else {
            out.writeNullField("saving_tokens");
        }
        out.writeArrayFieldStart("related");
        for (Related place : finding.related()) {
            out.writeStartObject();
            out.writeStringField("path", place.path());
            out.writeNumberField("line", place.line());
            out.writeNumberField("column", place.column());
            out.writeStringField("message", place.message());
            out.writeEndObject();
        }
        out.writeEndArray();
        out.writeArrayFieldStart("edits");
        if (finding.rewrite().isPresent()) {
            for (Edit edit : finding.rewrite().get().edits()) {
                out.writeStartObject();
                out.writeNumberField("start", edit.start());
                out.writeNumberField("end", edit.end());
                out.writeStringField("replacement", edit.replacement());
                out.writeEndObject();
            }
        }
        out.writeEndArray();
        out.writeEndObject();
    }

    private static ObjectNode summary(CheckResult result) {
        ObjectNode summary = Json.mapper().createObjectNode();
        summary.put("templates", result.templates());
        summary.put("rules", result.rules().size());
        summary.put("findings", result.findings().size());
        summary.put("errors", result.count(Severity.ERROR));
        summary.put("warnings", result.count(Severity.WARNING));
        summary.put("infos", result.count(Severity.INFO));
        summary.put("files_with_findings", result.filesWithFindings());
        summary.put("rewrites", result.rewrites());
        summary.put("saving_tokens", result.savingTokens());
        summary.put("fail_on", result.failOn().label());
        summary.put("failed", result.failed());
        summary.put("note", ESTIMATE_NOTE);
        return summary;
    }

    /**
     * A SARIF 2.1.0 log: one run whose driver lists every rule that ran (with its summary, why, help
     * and default level), one result per finding with its location, related locations and, for a
     * rewrite, a fix. Columns are Unicode code points; paths are relative to {@value #ROOT_BASE}.
     */
    public static String sarif(CheckResult result) {
        ObjectNode log = Json.mapper().createObjectNode();
        log.put("$schema", SARIF_SCHEMA);
        log.put("version", "2.1.0");
        ObjectNode run = log.putArray("runs").addObject();
        ObjectNode driver = run.putObject("tool").putObject("driver");
        driver.put("name", "tare");
        driver.put("version", Tare.version());
        driver.put("semanticVersion", Tare.version().replace("-SNAPSHOT", ""));
        ArrayNode rules = driver.putArray("rules");
        Map<String, Integer> index = new HashMap<>();
        for (RuleDescriptor rule : result.rules()) {
            index.put(rule.id(), index.size());
            ObjectNode node = rules.addObject();
            node.put("id", rule.id());
            node.put("name", pascal(rule.id()));
            node.putObject("shortDescription").put("text", rule.summary());
            node.putObject("fullDescription").put("text", rule.why());
            node.putObject("help").put("text", RuleReport.explainText(rule));
            node.putObject("defaultConfiguration").put("level", level(rule.severity()));
            ObjectNode properties = node.putObject("properties");
            properties.put("rewrite_class", rule.rewriteClass().label());
            properties.put("origin", rule.origin());
        }
        run.putObject("originalUriBaseIds").putObject(ROOT_BASE).putObject("description")
                .put("text", "The checked root: " + result.root());
        run.put("columnKind", "unicodeCodePoints");
        ArrayNode results = run.putArray("results");
        for (Finding finding : result.findings()) {
            ObjectNode node = results.addObject();
            node.put("ruleId", finding.rule());
            Integer ruleIndex = index.get(finding.rule());
            if (ruleIndex != null) {
                node.put("ruleIndex", ruleIndex);
            }
            node.put("level", level(finding.severity()));
            node.putObject("message").put("text", finding.message());
            ObjectNode location = node.putArray("locations").addObject();
            physical(location.putObject("physicalLocation"), finding.path(), finding.line(), finding.column(),
                    finding.endLine(), finding.endColumn());
            if (!finding.related().isEmpty()) {
                ArrayNode related = node.putArray("relatedLocations");
                int id = 1;
                for (Related place : finding.related()) {
                    ObjectNode item = related.addObject();
                    item.put("id", id++);
                    physical(item.putObject("physicalLocation"), place.path(), place.line(), place.column(), place.line(),
                            place.column());
                    item.putObject("message").put("text", place.message());
                }
            }
            finding.rewrite().ifPresent(rewrite -> fix(node, finding, rewrite));
            node.putObject("properties").put("saving_tokens", finding.savingTokens())
                    .put("rewrite_class", finding.rewriteClass().label());
        }
        run.putObject("properties").put("note", ESTIMATE_NOTE);
        return Json.write(log);
    }

    private static void fix(ObjectNode result, Finding finding, Rewrite rewrite) {
        ObjectNode fix = result.putArray("fixes").addObject();
        fix.putObject("description").put("text", finding.rewriteClass().label() + " rewrite, saves "
                + tokens(rewrite.savingTokens()) + " (planning estimate)");
        ObjectNode change = fix.putArray("artifactChanges").addObject();
        change.putObject("artifactLocation").put("uri", uri(finding.path())).put("uriBaseId", ROOT_BASE);
        ArrayNode replacements = change.putArray("replacements");
        for (Edit edit : rewrite.edits()) {
            ObjectNode replacement = replacements.addObject();
            replacement.putObject("deletedRegion").put("charOffset", edit.start()).put("charLength", edit.end() - edit.start());
            replacement.putObject("insertedContent").put("text", edit.replacement());
        }
    }

    private static void physical(ObjectNode node, String path, int line, int column, int endLine, int endColumn) {
        node.putObject("artifactLocation").put("uri", uri(path)).put("uriBaseId", ROOT_BASE);
        ObjectNode region = node.putObject("region");
        region.put("startLine", line);
        region.put("startColumn", column);
        region.put("endLine", endLine);
        region.put("endColumn", endColumn);
    }

    /** A relative URI reference for a root-relative path: each segment percent-encoded as RFC 3986 requires. */
    static String uri(String path) {
        StringBuilder out = new StringBuilder();
        for (byte b : path.getBytes(java.nio.charset.StandardCharsets.UTF_8)) {
            int c = b & 0xFF;
            if ((c >= 'a' && c <= 'z') || (c >= 'A' && c <= 'Z') || (c >= '0' && c <= '9') || "-._~/".indexOf(c) >= 0) {
                out.append((char) c);
            } else {
                out.append('%').append(String.format(java.util.Locale.ROOT, "%02X", c));
            }
        }
        return out.toString();
    }

    private static String level(Severity severity) {
        return switch (severity) {
            case ERROR -> "error";
            case WARNING -> "warning";
            case INFO -> "note";
        };
    }

    private static String pascal(String id) {
        StringBuilder out = new StringBuilder();
        for (String part : id.split("-")) {
            out.append(Character.toUpperCase(part.charAt(0))).append(part.substring(1));
        }
        return out.toString();
    }

    static String plural(long count, String word) {
        return TextTable.number(count) + " " + word + (count == 1 ? "" : "s");
    }

    private static String tokens(long count) {
        return plural(count, "token");
    }
}
