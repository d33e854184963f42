package dev.tare.report;

import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.tare.app.CostEstimate;
import dev.tare.footprint.CallSize;
import dev.tare.footprint.Cautions;
import dev.tare.footprint.Footprint;
import dev.tare.footprint.Precision;
import dev.tare.footprint.Sweep;
import dev.tare.footprint.Target;
import java.util.ArrayList;
import java.util.List;
import java.util.OptionalDouble;
import java.util.function.Function;

/** Renders the footprint of one prompt size on one target, and sweep tables across settings. */
public final class CostReport {
    private CostReport() {
    }

    /** The footprint as a list of figures, or the sweep table when settings were swept. */
    public static String text(CostEstimate.Result result) {
        Target target = result.target();
        StringBuilder out = new StringBuilder();
        out.append(result.rows().isEmpty() ? "Footprint on target " : "Sweep on target ").append(target.name())
                .append(": ").append(describe(result)).append('\n');
        out.append(Figures.ESTIMATE_NOTE).append("\n\n");
        out.append(setup(target));
        out.append('\n').append(result.rows().isEmpty() ? figures(result.footprint()) : sweep(result));
        List<String> cautions = cautions(result);
        if (!cautions.isEmpty()) {
            out.append('\n');
            cautions.forEach(line -> out.append(line).append('\n'));
        }
        List<String> missing = Figures.missing(target, result.coverage());
        if (!missing.isEmpty()) {
            out.append('\n');
            missing.forEach(line -> out.append(line).append('\n'));
        }
        return out.toString();
    }

    /** The {@code cost} JSON document of the design contract, with the sweep's rows when there are any. */
    public static String json(CostEstimate.Result result) {
        ObjectNode root = Json.report();
        root.put("target", result.target().name());
        result.file().ifPresent(file -> root.put("path", file));
        root.put("input_tokens", result.call().inputTokens());
        root.put("output_tokens", result.call().outputTokens());
        root.set("footprint", Figures.json(result.footprint()));
        root.put("estimate_note", Figures.ESTIMATE_NOTE);
        Figures.cautions(root, cautions(result));
        if (!result.rows().isEmpty()) {
            ArrayNode rows = root.putArray("sweep");
            for (Sweep.Row row : result.rows()) {
                ObjectNode node = rows.addObject();
                ObjectNode settings = node.putObject("settings");
                for (int i = 0; i < result.sweep().size(); i++) {
                    String key = result.sweep().get(i).key();
                    double value = row.settings().get(i);
                    if (key.endsWith("_tokens")) {
                        settings.put(key, (long) value);
                    } else {
                        settings.put(key, value);
                    }
                }
                node.set("footprint", Figures.json(row.footprint()));
            }
        }
        return Json.write(root);
    }

    /**
     * The cautions of the footprint; for a sweep, the reminder that quality is not estimated and the
     * quantization caution when any row has low bits.
     */
    private static List<String> cautions(CostEstimate.Result result) {
        if (result.rows().isEmpty()) {
            return Cautions.of(result.target(), result.footprint());
        }
        // A sweep's rows differ in what fits, so only the target's own cautions and each row's context apply.
        List<String> lines = new ArrayList<>(Cautions.of(result.target()));
        lines.remove(Cautions.QUANTIZATION);
        boolean mixture = result.target().model().map(m -> m.experts().present()).orElse(false);
        if (mixture && result.sweep().stream().anyMatch(a -> a.key().equals("concurrency"))
                && !lines.contains(Cautions.EXPERTS)) {
            lines.add(Cautions.EXPERTS);
        }
        lines.add(Cautions.SWEEP);
        boolean low = false;
        for (Sweep.Row row : result.rows()) {
            OptionalDouble weights = result.target().weightBits();
            OptionalDouble kv = result.target().kvBits();
            for (int i = 0; i < result.sweep().size(); i++) {
                String key = result.sweep().get(i).key();
                if (key.equals("weight_bits")) {
                    weights = OptionalDouble.of(row.settings().get(i));
                } else if (key.equals("kv_bits")) {
                    kv = OptionalDouble.of(row.settings().get(i));
                }
            }
            low |= Cautions.lowPrecision(weights, kv);
            Cautions.contextLine(result.target(), row.footprint(), "").filter(l -> !lines.contains(l))
                    .ifPresent(lines::add);
        }
        if (low) {
            lines.add(Cautions.QUANTIZATION);
        }
        return lines;
    }

    private static String describe(CostEstimate.Result result) {
        CallSize call = result.call();
        String size = Figures.count(call.inputTokens()) + " input tokens"
                + (call.framingTokens() > 0 ? " (" + Figures.count(call.framingTokens()) + " of them framing)" : "")
                + ", " + Figures.count(call.outputTokens()) + " output tokens";
        return result.file().map(file -> file + ", " + size).orElse(size);
    }

    private static String setup(Target target) {
        TextTable table = new TextTable(List.of("SETTING", "VALUE"), false, false);
        table.row(List.of("tokenizer", target.tokenizer()));
        target.price().ifPresent(p -> table.row(List.of("price", Figures.price(p))));
        target.callsPerDay().ifPresent(c -> table.row(List.of("calls per day", Figures.significant(c))));
        target.prefixCache().ifPresent(cache -> table.row(List.of("prefix cache", Figures.prefixCache(cache))));
        target.cacheBreakEvenCallsPerDay().ifPresent(calls -> table.row(List.of("caching pays from",
                Figures.breakEven(calls))));
        target.model().ifPresent(m -> table.row(List.of("model", Figures.model(m))));
        if (target.model().isPresent()) {
            table.row(List.of("weights", Figures.bits(target.weightBits())));
            table.row(List.of("KV cache", Figures.bits(target.kvBits())));
        }
        target.device().ifPresent(d -> table.row(List.of("device", Figures.device(d))));
        if (target.model().isPresent()) {
            table.row(List.of("load", target.batch() == 1 ? "batch 1: one request at a time (set --concurrency N"
                    + " or the target's concurrency)" : Figures.count(target.batch()) + " concurrent requests"));
        }
        return table.render();
    }

    private static String figures(Footprint f) {
        TextTable table = new TextTable(List.of("FIGURE", "ESTIMATE"), false, false);
        table.row(List.of("input tokens", Figures.count(f.inputTokens())));
        f.caching().ifPresent(c -> {
            table.row(List.of("static prefix tokens", Figures.count(c.staticPrefixTokens())));
            table.row(List.of("cacheable prefix tokens", Figures.count(c.cacheablePrefixTokens())));
            if (c.hitRateKnown()) {
                table.row(List.of("cache hit rate", Figures.percent(c.hitRate())));
                table.row(List.of("cached input tokens (expected)", Figures.count(Math.round(c.cachedInputTokens()))));
            }
        });
        table.row(List.of("output tokens", Figures.count(f.outputTokens())));
        if (f.hasCost()) {
            table.row(List.of("cost per call", Figures.perCall(f)));
        }
        if (f.costPerMonth().isPresent()) {
            table.row(List.of("cost per month", Figures.perMonth(f)));
        }
        if (f.caching().isPresent() && f.costPerMonthUncached().isPresent()) {
            table.row(List.of("cost per month uncached",
                    Figures.money(f.costPerMonthUncached().getAsDouble(), f.currency().orElse(""), 2)));
        }
        f.load().ifPresent(load -> {
            table.row(List.of("params total", Figures.params(load.paramsTotal()) + " (stored: memory)"));
            table.row(List.of("params active", Figures.params(load.paramsActive()) + " per token (compute, batch-1 reads)"));
            load.contextLimit().ifPresent(c -> table.row(List.of("context limit", Figures.count(c) + " tokens"
                    + (f.exceedsContext() ? " (EXCEEDED by this call)" : ""))));
        });
        f.prefillFlops().ifPresent(v -> table.row(List.of("prefill compute", Figures.flops(v))));
        f.prefillMillis().ifPresent(v -> table.row(List.of("prefill time", Figures.millis(v)
                + " before the first output token, batch 1")));
        f.weightBytes().ifPresent(v -> table.row(List.of("weight memory", Figures.bytesBoth(v))));
        f.kvBytesPerToken().ifPresent(v -> table.row(List.of("KV cache per token", Figures.bytesBoth(v) + " over all layers")));
        f.kvCacheBytes().ifPresent(v -> table.row(List.of("KV cache per request",
                Figures.bytesBoth(v) + " for " + Figures.count((long) f.inputTokens() + f.outputTokens()) + " tokens")));
        f.maxConcurrent().ifPresent(v -> table.row(List.of("max concurrent", Figures.count(v) + " requests of this size")));
        f.load().ifPresent(load -> {
            String batch = load.concurrency() == 1 ? "batch 1" : "at " + Figures.count(load.concurrency()) + " concurrent requests";
            load.decodeBytesPerStep().ifPresent(v -> table.row(List.of("decode step reads", Figures.bytesBoth(v)
                    + ", " + batch)));
            f.decodeMillisPerToken().ifPresent(v -> table.row(List.of("decode time", Figures.millis(v)
                    + " per output token, " + batch)));
            load.tokensPerSecond().ifPresent(v -> table.row(List.of("tokens per second", Figures.significant(v)
                    + " per request" + load.tokensPerSecondTotal().stream().mapToObj(t -> ", " + Figures.significant(t)
                    + " in total").findFirst().orElse("") + ", " + batch)));
            load.timeToFirstTokenMillis().ifPresent(v -> table.row(List.of("time to first token", Figures.millis(v)
                    + (load.concurrency() == 1 ? ", batch 1" : " when " + Figures.count(load.concurrency())
                    + " prefills arrive together"))));
            load.endToEndMillis().ifPresent(v -> table.row(List.of("end-to-end latency", Figures.millis(v)
                    + " to the last output token, " + batch)));
        });
        return table.render();
    }

    private static String sweep(CostEstimate.Result result) {
        List<String> headers = new ArrayList<>();
        result.sweep().forEach(axis -> headers.add(axis.key().toUpperCase(java.util.Locale.ROOT)));
        List<Column> columns = columns(result);
        columns.forEach(c -> headers.add(c.header()));
        boolean[] numeric = new boolean[headers.size()];
        java.util.Arrays.fill(numeric, true);
        TextTable table = new TextTable(headers, numeric);
        for (Sweep.Row row : result.rows()) {
            List<String> cells = new ArrayList<>();
            row.settings().forEach(v -> cells.add(Precision.label(v)));
            columns.forEach(c -> cells.add(c.cell().apply(row.footprint())));
            table.row(cells);
        }
        return table.render();
    }

    private record Column(String header, Function<Footprint, String> cell) {
    }

    private static String cell(OptionalDouble value) {
        return value.isPresent() ? Figures.significant(value.getAsDouble()) : "";
    }

    /** The columns any row has a value for, so that a priced target shows cost and a device target memory and time. */
    private static List<Column> columns(CostEstimate.Result result) {
        List<Column> all = List.of(
                new Column("INPUT", f -> Figures.count(f.inputTokens())),
                new Column("OUTPUT", f -> Figures.count(f.outputTokens())),
                new Column("COST/CALL", f -> f.hasCost() ? Figures.perCall(f) : ""),
                new Column("WEIGHTS", f -> f.weightBytes().isPresent() ? Figures.bytes(f.weightBytes().getAsLong()) : ""),
                new Column("KV/TOKEN", f -> f.kvBytesPerToken().isPresent() ? Figures.bytes(f.kvBytesPerToken().getAsLong()) : ""),
                new Column("KV CACHE", f -> f.kvCacheBytes().isPresent() ? Figures.bytes(f.kvCacheBytes().getAsLong()) : ""),
                new Column("MAX CONCURRENT", f -> f.maxConcurrent().isPresent() ? Figures.count(f.maxConcurrent().getAsLong()) : ""),
                new Column("PREFILL MS", f -> f.prefillMillis().isPresent() ? Figures.significant(f.prefillMillis().getAsDouble()) : ""),
                new Column("DECODE MS/TOKEN", f -> f.decodeMillisPerToken().isPresent()
                        ? Figures.significant(f.decodeMillisPerToken().getAsDouble()) : ""),
                new Column("TOKENS/S TOTAL", f -> f.load().map(l -> cell(l.tokensPerSecondTotal())).orElse("")),
                new Column("TTFT MS", f -> f.load().filter(l -> l.concurrency() > 1)
                        .map(l -> cell(l.timeToFirstTokenMillis())).orElse("")));
        boolean swepTokens = result.sweep().stream().anyMatch(a -> a.key().endsWith("_tokens"));
        List<Column> shown = new ArrayList<>();
        for (Column column : all) {
            boolean tokens = column.header().equals("INPUT") || column.header().equals("OUTPUT");
            if (tokens ? swepTokens : result.rows().stream().anyMatch(r -> !column.cell().apply(r.footprint()).isEmpty())) {
                shown.add(column);
            }
        }
        return shown;
    }
}
