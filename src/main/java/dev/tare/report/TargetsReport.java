package dev.tare.report;

import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.tare.footprint.Catalog;
import dev.tare.footprint.Cautions;
import dev.tare.footprint.Coverage;
import dev.tare.footprint.Device;
import dev.tare.footprint.Formulas;
import dev.tare.footprint.ModelShape;
import dev.tare.footprint.Precision;
import dev.tare.footprint.Target;
import java.util.List;
import java.util.Map;
import java.util.OptionalDouble;

/** Renders the configured targets and what each can estimate, and the shipped catalog. */
public final class TargetsReport {
    private TargetsReport() {
    }

    /** One row per target, then each target's model, device and missing inputs. */
    public static String text(String configFile, List<Target> targets) {
        if (targets.isEmpty()) {
            return configFile + " configures no targets; add a 'targets' list (see 'tare targets --catalog' for"
                    + " model shapes and devices a target can name)\n";
        }
        TextTable table = new TextTable(List.of("NAME", "TOKENIZER", "ESTIMATES"), false, false, false);
        StringBuilder details = new StringBuilder();
        for (Target target : targets) {
            Coverage coverage = Coverage.of(target);
            table.row(List.of(target.name(), target.tokenizer(), estimates(coverage)));
            details.append('\n').append(target.name()).append(":\n");
            target.price().ifPresent(p -> details.append("  price    ").append(Figures.price(p)).append('\n'));
            target.callsPerDay().ifPresent(c -> details.append("  traffic  ").append(Figures.significant(c))
                    .append(" calls a day\n"));
            target.outputTokens().ifPresent(o -> details.append("  output   ").append(Figures.count(o))
                    .append(" tokens per call\n"));
            target.model().ifPresent(m -> details.append("  model    ").append(Figures.model(m)).append('\n')
                    .append("  weights  ").append(Figures.bits(target.weightBits())).append("; KV cache ")
                    .append(Figures.bits(target.kvBits())).append('\n'));
            target.device().ifPresent(d -> details.append("  device   ").append(Figures.device(d)).append('\n'));
            target.concurrency().ifPresent(c -> details.append("  load     ").append(Figures.count(c))
                    .append(" concurrent requests\n"));
            for (String line : Cautions.of(target)) {
                details.append("  caution  ").append(line).append('\n');
            }
            for (String line : Figures.missing(target, coverage)) {
                details.append("  missing  ").append(line.substring(target.name().length() + 2)).append('\n');
            }
        }
        return "Targets in " + configFile + "\n\n" + table.render() + details + "\n" + Figures.ESTIMATE_NOTE + "\n";
    }

    /** The targets as JSON: each with its settings, the footprint keys it fills and the keys it lacks. */
    public static String json(String configFile, List<Target> targets) {
        ObjectNode root = Json.report();
        root.put("config", configFile);
        ArrayNode list = root.putArray("targets");
        for (Target target : targets) {
            Coverage coverage = Coverage.of(target);
            ObjectNode node = list.addObject();
            node.put("name", target.name());
            node.put("tokenizer", target.tokenizer());
            target.price().ifPresent(p -> {
                ObjectNode price = node.putObject("price");
                price.put("input", p.inputPerMillion());
                p.cachedInputPerMillion().ifPresent(v -> price.put("cached_input", v));
                p.cacheWritePerMillion().ifPresent(v -> price.put("cache_write", v));
                price.put("output", p.outputPerMillion());
                price.put("currency", p.currency());
            });
            target.prefixCache().ifPresent(cache -> {
                ObjectNode prefix = node.putObject("prefix_cache");
                if (cache.ttlSeconds().isPresent()) {
                    prefix.put("min_tokens", cache.minTokens());
                    prefix.put("step_tokens", cache.stepTokens());
                    prefix.put("ttl_seconds", cache.ttlSeconds().getAsDouble());
                } else {
                    prefix.put("block_tokens", cache.stepTokens());
                }
            });
            target.callsPerDay().ifPresent(v -> node.put("calls_per_day", v));
            target.outputTokens().ifPresent(v -> node.put("output_tokens", v));
            target.model().ifPresent(m -> node.set("model", model(m)));
            target.weightBits().ifPresent(v -> node.put("weight_bits", v));
            target.kvBits().ifPresent(v -> node.put("kv_bits", v));
            target.device().ifPresent(d -> node.set("device", device(d)));
            target.concurrency().ifPresent(v -> node.put("concurrency", v));
            Figures.cautions(node, Cautions.of(target));
            node.putPOJO("computes", coverage.computes());
            ObjectNode missing = node.putObject("missing");
            for (Map.Entry<String, List<String>> entry : coverage.missing().entrySet()) {
                missing.putPOJO(entry.getKey(), entry.getValue());
            }
        }
        root.put("estimate_note", Figures.ESTIMATE_NOTE);
        return Json.write(root);
    }

    /** The shipped model shapes and devices, with their sources. */
    public static String catalogText(Catalog catalog) {
        StringBuilder out = new StringBuilder("Model shapes a target may name (model: NAME, or {catalog: NAME, ...}"
                + " with any number overridden):\n\n");
        TextTable models = new TextTable(List.of("NAME", "PARAMS", "ACTIVE", "LAYERS", "HEADS", "KV HEADS", "HEAD DIM",
                "KV/TOKEN AT FP16", "DESCRIPTION"), false, true, true, true, true, true, true, true, false);
        for (Catalog.ModelEntry entry : catalog.models()) {
            ModelShape m = entry.shape();
            models.row(List.of(entry.name(), Figures.params(m.paramsTotal()) + (m.paramsComputed() ? "*" : ""),
                    Figures.params(m.paramsActive()), String.valueOf(m.layers()), String.valueOf(m.heads()),
                    m.kv().latent() ? "latent" : String.valueOf(m.kvHeads()), String.valueOf(m.headDim()),
                    Figures.bytes(Formulas.kvBytesPerToken(m, 16)), entry.description()));
        }
        out.append(models.render()).append("* params computed from the shape (embeddings, attention and feed-forward"
                + " weights; biases and norms left out).\n\nSources:\n");
        catalog.models().forEach(e -> out.append("  ").append(e.name()).append(": ").append(e.source())
                .append(e.fromMemory() ? " (from memory)" : "").append('\n'));
        out.append("\nDevices a target may name (device: NAME, or {catalog: NAME, ...} with any number overridden):\n\n");
        TextTable devices = new TextTable(List.of("NAME", "MEMORY", "USABLE", "PEAK TFLOPS", "BANDWIDTH", "EFFICIENCY",
                "DESCRIPTION"), false, true, true, true, true, true, false);
        for (Catalog.DeviceEntry entry : catalog.devices()) {
            Device d = entry.device();
            devices.row(List.of(entry.name(), number(d.memoryGib(), " GiB", 1), number(d.usableFraction(), "%", 100),
                    number(d.peakTflops(), "", 1), number(d.bandwidthGbps(), " GB/s", 1),
                    number(d.efficiency(), "%", 100), entry.description()));
        }
        out.append(devices.render()).append("\nSources:\n");
        catalog.devices().forEach(e -> out.append("  ").append(e.name()).append(": ").append(e.source())
                .append(e.fromMemory() ? " (from memory)" : "").append('\n'));
        out.append("\nPrecisions weight_bits and kv_bits may name (or give a number of bits such as 4.5):\n");
        Precision.names().forEach((name, bits) -> out.append("  ").append(name).append(" = ")
                .append(Precision.label(bits)).append(" bits: ")
                .append(Precision.meaning(name)).append('\n'));
        return out.append('\n').append(Figures.ESTIMATE_NOTE).append('\n').toString();
    }

    /** The catalog as JSON. */
    public static String catalogJson(Catalog catalog) {
        ObjectNode root = Json.report();
        ArrayNode models = root.putArray("models");
        for (Catalog.ModelEntry entry : catalog.models()) {
            ObjectNode node = model(entry.shape());
            node.put("name", entry.name());
            node.put("description", entry.description());
            node.put("source", entry.source());
            node.put("from_memory", entry.fromMemory());
            models.add(node);
        }
        ArrayNode devices = root.putArray("devices");
        for (Catalog.DeviceEntry entry : catalog.devices()) {
            ObjectNode node = device(entry.device());
            node.put("name", entry.name());
            node.put("description", entry.description());
            node.put("source", entry.source());
            node.put("from_memory", entry.fromMemory());
            devices.add(node);
        }
        root.put("estimate_note", Figures.ESTIMATE_NOTE);
        return Json.write(root);
    }

    private static String estimates(Coverage coverage) {
        StringBuilder out = new StringBuilder("tokens");
        if (coverage.hasCost()) {
            out.append(", cost per call").append(coverage.computes().contains("cost_per_month") ? " and per month" : "");
        }
        if (coverage.hasDeviceFigures()) {
            out.append(", prefill compute");
            for (String[] figure : new String[][] {{"weight_bytes", "weight memory"}, {"kv_cache_bytes", "KV cache"},
                    {"prefill_ms", "prefill time"}, {"decode_ms_per_token", "decode time"},
                    {"max_concurrent", "max concurrent"}}) {
                if (coverage.computes().contains(figure[0])) {
                    out.append(", ").append(figure[1]);
                }
            }
        }
        return out.toString();
    }

    private static ObjectNode model(ModelShape m) {
        ObjectNode node = Json.mapper().createObjectNode();
        node.put("origin", m.origin());
        node.put("params", m.paramsTotal());
        node.put("params_total", m.paramsTotal());
        node.put("params_active", m.paramsActive());
        node.put("params_computed", m.paramsComputed());
        node.put("layers", m.layers());
        node.put("heads", m.heads());
        node.put("kv_heads", m.kvHeads());
        node.put("head_dim", m.headDim());
        node.put("kv_width_per_layer", m.kv().widthPerLayer());
        if (m.kv().latent()) {
            node.put("kv_latent", true);
        }
        if (m.kv().window() > 0) {
            node.put("window", m.kv().window());
            node.put("windowed_layers", m.kv().windowedLayers());
        }
        if (m.experts().present()) {
            node.put("experts", m.experts().count());
            node.put("experts_per_token", m.experts().perToken());
        }
        m.contextLimit().ifPresent(v -> node.put("context_limit", v));
        return node;
    }

    private static ObjectNode device(Device d) {
        ObjectNode node = Json.mapper().createObjectNode();
        node.put("origin", d.origin());
        d.memoryGib().ifPresent(v -> node.put("memory_gib", v));
        d.usableFraction().ifPresent(v -> node.put("usable_fraction", v));
        d.peakTflops().ifPresent(v -> node.put("peak_tflops", v));
        d.bandwidthGbps().ifPresent(v -> node.put("bandwidth_gbps", v));
        d.efficiency().ifPresent(v -> node.put("efficiency", v));
        d.bandwidthEfficiency().ifPresent(v -> node.put("bandwidth_efficiency", v));
        return node;
    }

    private static String number(OptionalDouble value, String unit, double scale) {
        return value.isPresent() ? Figures.plain(value.getAsDouble() * scale) + unit : "-";
    }
}
