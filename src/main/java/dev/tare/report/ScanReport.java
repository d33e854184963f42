package dev.tare.report;

import com.fasterxml.jackson.core.JsonGenerator;
import dev.tare.app.ScanResult;
import dev.tare.app.ScannedTemplate;
import dev.tare.footprint.Footprint;
import dev.tare.overlap.PrefixShare;
import dev.tare.template.Rendering;
import dev.tare.template.TemplateKind;
import dev.tare.workspace.SkippedFile;
import java.io.IOException;
import java.io.StringWriter;
import java.io.Writer;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/** Renders a {@link ScanResult} as a text table or as the JSON document of the design contract. */
public final class ScanReport {
    private static final int MAX_VARIABLES_SHOWN = 3;

    private ScanReport() {
    }

    /** The table a person reads in a terminal. */
    public static String text(ScanResult result, ScanResult.Order order) {
        List<String> headers = new ArrayList<>(List.of("PATH", "KIND", "STATIC", "ESTIMATED"));
        result.targets().forEach(name -> headers.add(name));
        headers.add("VARIABLES");
        boolean[] numeric = new boolean[headers.size()];
        for (int c = 2; c < headers.size() - 1; c++) {
            numeric[c] = true;
        }
        TextTable table = new TextTable(headers, numeric);
        for (ScannedTemplate template : result.templatesIn(order)) {
            List<String> row = new ArrayList<>(List.of(template.key(), template.kind().label(),
                    TextTable.number(template.staticTokens()), TextTable.number(template.estimatedTokens())));
            for (String target : result.targets()) {
                Footprint footprint = template.targets().get(target);
                row.add(footprint == null ? "-" : TextTable.number(footprint.inputTokens()));
            }
            row.add(variables(template.variables()));
            table.row(row);
        }
        ScanResult.Totals totals = result.totals();
        table.rule();
        List<String> total = new ArrayList<>(List.of("total (" + CheckReport.plural(totals.templates(), "template") + ")", "",
                TextTable.number(totals.staticTokens()), TextTable.number(totals.estimatedTokens())));
        result.targets().forEach(name -> total.add(TextTable.number(totals.inputTokensByTarget().get(name))));
        total.add("");
        table.row(total);

        StringBuilder out = new StringBuilder();
        out.append("Tare scan of ").append(result.root()).append(": tokens on ").append(result.tokenizer());
        if (!result.targets().isEmpty()) {
            out.append("; target columns are input tokens per call on each target's tokenizer");
        }
        out.append("\n\n").append(table.render()).append('\n');
        out.append(notes(result, totals));
        out.append(TargetSections.render(result, order));
        return out.toString();
    }

    private static String notes(ScanResult result, ScanResult.Totals totals) {
        StringBuilder out = new StringBuilder();
        out.append("Static: every variable empty. Estimated: variables filled with declared samples or sizes.");
        if (result.templates().stream().anyMatch(t -> !t.loops().isEmpty() || t.shortestEstimatedTokens() != t.estimatedTokens())) {
            out.append(" Both follow the longest branch of each conditional and count a loop's body once per expected item.");
        }
        out.append('\n');
        if (totals.partials() > 0) {
            out.append(totals.partials()).append(totals.partials() == 1 ? " partial is" : " partials are")
                    .append(" listed but left out of the total; their tokens count inside each template that includes them.\n");
        }
        long tools = result.templates().stream().filter(t -> t.kind() == TemplateKind.TOOLS).count();
        if (tools > 0) {
            out.append(tools).append(tools == 1 ? " tool file is" : " tool files are")
                    .append(" listed but left out of the total; their tokens count in each template whose front matter names them.\n");
        }
        long unsized = result.templates().stream().filter(t -> !t.unsizedVariables().isEmpty()).count();
        if (unsized > 0) {
            out.append(unsized).append(unsized == 1 ? " template has" : " templates have")
                    .append(" variables or function calls with neither a sample nor a token size; their estimates leave those out.\n");
        }
        long assumed = result.templates().stream()
                .filter(t -> t.countsInTotals() && t.loops().stream().anyMatch(loop -> !loop.declared())).count();
        if (assumed > 0) {
            out.append(assumed).append(assumed == 1 ? " template has" : " templates have")
                    .append(" loops without declared items, counted once; declare variables: {NAME: {items: N}}.\n");
        }
        for (ScannedTemplate template : result.templates()) {
            for (String note : template.notes()) {
                out.append(template.key()).append(": ").append(note).append('\n');
            }
        }
        if (!result.skipped().isEmpty()) {
            out.append("\nSkipped ").append(result.skipped().size()).append(result.skipped().size() == 1 ? " file:\n" : " files:\n");
            for (SkippedFile skipped : result.skipped()) {
                out.append("  ").append(skipped.path()).append(": ").append(skipped.reason()).append('\n');
            }
        }
        return out.toString();
    }

    private static String variables(List<String> names) {
        if (names.size() <= MAX_VARIABLES_SHOWN) {
            return String.join(", ", names);
        }
        return String.join(", ", names.subList(0, MAX_VARIABLES_SHOWN)) + " (+" + (names.size() - MAX_VARIABLES_SHOWN) + ")";
    }

    /**
     * The JSON document of the design contract. Written template by template rather than built as
     * one tree first: on 20,000 templates that halves the time and memory of writing it.
     */
    public static String json(ScanResult result, ScanResult.Order order) {
        StringWriter out = new StringWriter(1 << 16);
        json(result, order, out);
        return out.toString();
    }

    /** {@link #json(ScanResult, ScanResult.Order)} written to {@code writer} as it is made, which is flushed and left open. */
    public static void json(ScanResult result, ScanResult.Order order, Writer writer) {
        Json.stream(out -> {
            out.writeStringField("root", result.root());
            out.writeStringField("tokenizer", result.tokenizer());
            out.writeArrayFieldStart("targets_selected");
            for (String target : result.targets()) {
                out.writeString(target);
            }
            out.writeEndArray();
            out.writeStringField("estimate_note", Figures.ESTIMATE_NOTE);
            out.writeArrayFieldStart("templates");
            for (ScannedTemplate template : result.templatesIn(order)) {
                template(out, template);
            }
            out.writeEndArray();
            out.writeFieldName("totals");
            totals(out, result);
            List<String> cautions = TargetSections.cautions(result);
            if (!cautions.isEmpty()) {
                out.writeArrayFieldStart("cautions");
                for (String line : cautions) {
                    out.writeString(line);
                }
                out.writeEndArray();
            }
            out.writeArrayFieldStart("skipped");
            for (SkippedFile file : result.skipped()) {
                out.writeStartObject();
                out.writeStringField("path", file.path());
                out.writeStringField("reason", file.reason());
                out.writeEndObject();
            }
            out.writeEndArray();
        }, writer);
    }

    private static void template(JsonGenerator out, ScannedTemplate template) throws IOException {
        out.writeStartObject();
        out.writeStringField("path", template.path());
        out.writeStringField("kind", template.kind().label());
        if (!template.name().isEmpty()) {
            out.writeStringField("name", template.name());
            out.writeNumberField("line", template.line());
        }
        out.writeNumberField("chars", template.characters());
        out.writeNumberField("static_tokens", template.staticTokens());
        out.writeNumberField("estimated_tokens", template.estimatedTokens());
        out.writeNumberField("estimated_tokens_shortest", template.shortestEstimatedTokens());
        strings(out, "variables", template.variables());
        strings(out, "unsized_variables", template.unsizedVariables());
        strings(out, "includes", template.includes());
        loops(out, template);
        if (!template.notes().isEmpty()) {
            strings(out, "notes", template.notes());
        }
        out.writeObjectFieldStart("targets");
        for (Map.Entry<String, Footprint> entry : template.targets().entrySet()) {
            Map<String, Object> footprint = Figures.fields(entry.getValue());
            PrefixShare share = template.prefixes().get(entry.getKey());
            if (share != null) {
                prefix(footprint, share);
            }
            out.writeFieldName(entry.getKey());
            Json.object(out, footprint);
        }
        out.writeEndObject();
        out.writeEndObject();
    }

    /** The loops on the template's longest path: what each walks and how many items were assumed. */
    private static void loops(JsonGenerator out, ScannedTemplate template) throws IOException {
        out.writeArrayFieldStart("loops");
        for (Rendering.Loop loop : template.loops()) {
            out.writeStartObject();
            out.writeStringField("variable", loop.variable());
            out.writeStringField("iterable", loop.iterable());
            out.writeNumberField("items", loop.items());
            out.writeBooleanField("declared", loop.declared());
            if (!loop.owner().equals(template.path())) {
                out.writeStringField("in", loop.owner());
            }
            out.writeNumberField("line", loop.line());
            out.writeEndObject();
        }
        out.writeEndArray();
    }

    private static void strings(JsonGenerator out, String name, List<String> values) throws IOException {
        out.writeArrayFieldStart(name);
        for (String value : values) {
            out.writeString(value);
        }
        out.writeEndArray();
    }

    private static void totals(JsonGenerator out, ScanResult result) throws IOException {
        ScanResult.Totals totals = result.totals();
        out.writeStartObject();
        out.writeNumberField("templates", totals.templates());
        out.writeNumberField("partials", totals.partials());
        out.writeNumberField("static_tokens", totals.staticTokens());
        out.writeNumberField("estimated_tokens", totals.estimatedTokens());
        out.writeNumberField("estimated_tokens_shortest", totals.shortestEstimatedTokens());
        Map<String, Map<String, Object>> byTarget = new LinkedHashMap<>();
        totals.inputTokensByTarget().forEach((name, tokens) -> byTarget.computeIfAbsent(name, n -> new LinkedHashMap<>())
                .put("input_tokens", tokens));
        result.cacheTotals().forEach((name, cache) -> {
            Map<String, Object> target = byTarget.computeIfAbsent(name, n -> new LinkedHashMap<>());
            target.put("cached_input_tokens", cache.cachedTokens());
            target.put("reordered_cached_input_tokens", cache.reorderedCachedTokens());
            cache.savingPerMonth().ifPresent(v -> target.put("cache_saving_per_month", v));
            cache.reorderedSavingPerMonth().ifPresent(v -> target.put("reordered_cache_saving_per_month", v));
            cache.currency().filter(c -> cache.savingPerMonth().isPresent()).ifPresent(c -> target.put("currency", c));
            // Never when reads cost no less than input: caching a prefix then pays at no traffic at all.
            cache.target().cacheBreakEvenCallsPerDay().stream().filter(Double::isFinite).findFirst()
                    .ifPresent(v -> target.put("cache_break_even_calls_per_day", v));
        });
        out.writeObjectFieldStart("targets");
        for (Map.Entry<String, Map<String, Object>> target : byTarget.entrySet()) {
            out.writeFieldName(target.getKey());
            Json.object(out, target.getValue());
        }
        out.writeEndObject();
        out.writeEndObject();
    }

    /**
     * Beside a template's footprint on a target with a prefix cache: what caching saves per month, and
     * the static prefix and saving with every template's per-call parts after its static parts
     * (estimates).
     */
    private static void prefix(Map<String, Object> fields, PrefixShare share) {
        share.savingPerMonth().ifPresent(v -> fields.put("cache_saving_per_month", v));
        fields.put("reordered_static_prefix_tokens", share.reorderedStaticPrefixTokens());
        share.reorderedSavingPerMonth().ifPresent(v -> fields.put("reordered_cache_saving_per_month", v));
    }
}
