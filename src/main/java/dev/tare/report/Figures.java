package dev.tare.report;

import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.tare.footprint.Coverage;
import dev.tare.footprint.Device;
import dev.tare.footprint.Footprint;
import dev.tare.footprint.ModelShape;
import dev.tare.footprint.Precision;
import dev.tare.footprint.PrefixCache;
import dev.tare.footprint.Price;
import dev.tare.footprint.Target;
import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.OptionalDouble;

/** How footprint figures are written, in text and in JSON, by every report that shows them. */
final class Figures {
    /** Said by every output that shows cost, time or memory. */
    static final String ESTIMATE_NOTE = "Cost, time and memory figures are planning estimates from Tare's formulas,"
            + " not measurements or invoices.";

    private Figures() {
    }

    /** The FOOTPRINT object of the JSON contract, as a tree for reports built whole. */
    static ObjectNode json(Footprint f) {
        return Json.object(fields(f));
    }

    /**
     * The FOOTPRINT object's fields in the contract's order: the token counts, then the keys the
     * target has inputs for, then the flags that are set.
     */
    static Map<String, Object> fields(Footprint f) {
        Map<String, Object> values = new java.util.HashMap<>();
        f.caching().ifPresent(c -> {
            values.put("static_prefix_tokens", c.staticPrefixTokens());
            values.put("cacheable_prefix_tokens", c.cacheablePrefixTokens());
            if (c.hitRateKnown()) {
                values.put("cache_hit_rate", round(c.hitRate(), 4));
                values.put("cached_input_tokens", round(c.cachedInputTokens(), 1));
            }
        });
        f.costPerMonthUncached().ifPresent(v -> values.put("cost_per_month_uncached", v));
        f.costPerCall().ifPresent(v -> values.put("cost_per_call", v));
        f.costPerMonth().ifPresent(v -> values.put("cost_per_month", v));
        f.currency().ifPresent(v -> values.put("currency", v));
        f.prefillFlops().ifPresent(v -> values.put("prefill_flops", BigDecimal.valueOf(Math.rint(v)).toBigInteger()));
        f.prefillMillis().ifPresent(v -> values.put("prefill_ms", v));
        f.decodeMillisPerToken().ifPresent(v -> values.put("decode_ms_per_token", v));
        f.weightBytes().ifPresent(v -> values.put("weight_bytes", v));
        f.kvBytesPerToken().ifPresent(v -> values.put("kv_bytes_per_token", v));
        f.kvCacheBytes().ifPresent(v -> values.put("kv_cache_bytes", v));
        f.maxConcurrent().ifPresent(v -> values.put("max_concurrent", v));
        f.load().ifPresent(load -> {
            values.put("params_total", load.paramsTotal());
            values.put("params_active", load.paramsActive());
            values.put("concurrency", load.concurrency());
            load.decodeBytesPerStep().ifPresent(v -> values.put("decode_bytes_per_step", v));
            load.tokensPerSecond().ifPresent(v -> values.put("tokens_per_second", v));
            load.tokensPerSecondTotal().ifPresent(v -> values.put("tokens_per_second_total", v));
            load.timeToFirstTokenMillis().ifPresent(v -> values.put("time_to_first_token_ms", v));
            load.endToEndMillis().ifPresent(v -> values.put("end_to_end_ms", v));
            load.contextLimit().ifPresent(v -> values.put("context_limit", v));
        });
        Map<String, Object> fields = new LinkedHashMap<>();
        fields.put("input_tokens", f.inputTokens());
        fields.put("framing_tokens", f.framingTokens());
        for (String key : Coverage.KEYS) {
            Object value = values.get(key);
            if (value != null) {
                fields.put(key, value);
            }
        }
        if (f.exceedsContext()) {
            fields.put("exceeds_context", true);
        }
        if (f.calibrated()) {
            fields.put("calibrated", true);
        }
        return fields;
    }

    /** {@code value} rounded to {@code decimals} places, for JSON figures that are shares or expectations. */
    private static double round(double value, int decimals) {
        return BigDecimal.valueOf(value).setScale(decimals, java.math.RoundingMode.HALF_EVEN).doubleValue();
    }

    static String money(double amount, String currency, int decimals) {
        return currency + " " + String.format(Locale.ROOT, "%,." + decimals + "f", amount);
    }

    static String perCall(Footprint f) {
        return f.costPerCall().isPresent() ? money(f.costPerCall().getAsDouble(), f.currency().orElse(""), 6) : "-";
    }

    static String perMonth(Footprint f) {
        return f.costPerMonth().isPresent() ? money(f.costPerMonth().getAsDouble(), f.currency().orElse(""), 2) : "-";
    }

    /** Bytes in binary units with three significant digits: {@code 800 KiB}, {@code 1.56 GiB}. */
    static String bytes(double bytes) {
        String[] units = {"B", "KiB", "MiB", "GiB", "TiB", "PiB"};
        double value = bytes;
        int unit = 0;
        while (Math.abs(value) >= 1024 && unit < units.length - 1) {
            value /= 1024;
            unit++;
        }
        return unit == 0 ? String.format(Locale.ROOT, "%,d B", Math.round(value)) : significant(value) + " " + units[unit];
    }

    static String millis(double ms) {
        return significant(ms) + " ms";
    }

    /** FLOPs in decimal units: {@code 12.3 TFLOP}. */
    static String flops(double flops) {
        String[] units = {"FLOP", "kFLOP", "MFLOP", "GFLOP", "TFLOP", "PFLOP", "EFLOP"};
        double value = flops;
        int unit = 0;
        while (Math.abs(value) >= 1000 && unit < units.length - 1) {
            value /= 1000;
            unit++;
        }
        return significant(value) + " " + units[unit];
    }

    static String count(long value) {
        return TextTable.number(value);
    }

    /** A number with three significant digits, or as a whole number when larger. */
    static String significant(double value) {
        double magnitude = Math.abs(value);
        if (magnitude >= 100 || magnitude == 0) {
            return String.format(Locale.ROOT, "%,.0f", value);
        }
        if (magnitude >= 10) {
            return String.format(Locale.ROOT, "%.1f", value);
        }
        if (magnitude >= 1) {
            return String.format(Locale.ROOT, "%.2f", value);
        }
        return String.format(Locale.ROOT, "%.3g", value);
    }

    /** A configured number as written: {@code 16}, {@code 0.6}, {@code 2.5}. */
    static String plain(double value) {
        return BigDecimal.valueOf(value).stripTrailingZeros().toPlainString();
    }

    /** A parameter count as people write it: {@code 1.54e9}. */
    static String params(double params) {
        return String.format(Locale.ROOT, "%.3g", params).replace("e+0", "e").replace("e+", "e");
    }

    static String bits(OptionalDouble bits) {
        return bits.isPresent() ? Precision.label(bits.getAsDouble()) + " bits" + Precision.meaning(bits.getAsDouble())
                .map(m -> " (" + m + ")").orElse("") : "not set";
    }

    /** Bytes in binary units and, from a kilobyte up, in decimal ones too: {@code 1.94 GiB = 2.08 GB}. */
    static String bytesBoth(double bytes) {
        if (Math.abs(bytes) < 1e3) {
            return bytes(bytes);
        }
        String[] units = {"kB", "MB", "GB", "TB", "PB"};
        double value = bytes / 1e3;
        int unit = 0;
        while (Math.abs(value) >= 1000 && unit < units.length - 1) {
            value /= 1000;
            unit++;
        }
        return bytes(bytes) + " = " + significant(value) + " " + units[unit];
    }

    /** One line describing a model shape and where it came from. */
    static String model(ModelShape m) {
        StringBuilder out = new StringBuilder(m.origin()).append(": ").append(params(m.paramsTotal())).append(" params");
        if (m.paramsActive() != m.paramsTotal()) {
            out.append(" (").append(params(m.paramsActive())).append(" active per token)");
        }
        if (m.paramsComputed()) {
            out.append(" computed from the shape");
        }
        out.append(", ").append(m.layers()).append(" layers, ").append(m.heads()).append(" heads, ");
        if (m.kv().latent()) {
            out.append("latent KV of ").append(m.kv().widthPerLayer()).append(" per token and layer");
        } else {
            out.append(m.kvHeads()).append(m.kvHeads() == 1 ? " KV head" : " KV heads");
        }
        out.append(", head size ").append(m.headDim());
        if (m.experts().present()) {
            out.append("; ").append(m.experts().count()).append(" experts, ").append(m.experts().perToken())
                    .append(" per token");
        }
        if (m.kv().window() > 0) {
            out.append("; sliding window of ").append(count(m.kv().window())).append(" tokens on ")
                    .append(m.kv().windowedLayers()).append(" of ").append(m.layers()).append(" layers");
        }
        m.contextLimit().ifPresent(c -> out.append("; context ").append(count(c)).append(" tokens"));
        return out.toString();
    }

    /** Adds the caution lines to a JSON object, as {@code cautions}, when there are any. */
    static void cautions(ObjectNode node, List<String> lines) {
        if (!lines.isEmpty()) {
            node.putPOJO("cautions", List.copyOf(lines));
        }
    }

    /** One line describing a device and where its numbers came from. */
    static String device(Device d) {
        List<String> parts = new ArrayList<>();
        d.memoryGib().ifPresent(v -> parts.add(plain(v) + " GiB"));
        d.usableFraction().ifPresent(v -> parts.add(plain(v * 100) + "% usable"));
        d.peakTflops().ifPresent(v -> parts.add(plain(v) + " TFLOPS peak"));
        d.efficiency().ifPresent(v -> parts.add(plain(v * 100) + "% of peak in prefill"));
        d.bandwidthGbps().ifPresent(v -> parts.add(plain(v) + " GB/s"));
        d.bandwidthEfficiency().ifPresent(v -> parts.add(plain(v * 100) + "% of bandwidth in reads"));
        return d.origin() + ": " + (parts.isEmpty() ? "no numbers" : String.join(", ", parts));
    }

    /** One line describing a price. */
    static String price(Price p) {
        return p.currency() + " " + plain(p.inputPerMillion()) + " input"
                + p.cachedInputPerMillion().stream().mapToObj(v -> ", " + plain(v) + " cached input").findFirst().orElse("")
                + p.cacheWritePerMillion().stream().mapToObj(v -> ", " + plain(v) + " cache write").findFirst().orElse("")
                + ", " + plain(p.outputPerMillion()) + " output, per million tokens";
    }

    /** One line describing a prefix cache. */
    static String prefixCache(PrefixCache cache) {
        if (cache.ttlSeconds().isEmpty()) {
            return "prefix cache of " + count(cache.stepTokens()) + "-token blocks";
        }
        return "prefix cache from " + count(cache.minTokens()) + " tokens"
                + (cache.stepTokens() > 1 ? " in steps of " + count(cache.stepTokens()) : "")
                + ", entries live " + plain(cache.ttlSeconds().getAsDouble()) + " s after their last use";
    }

    /** The traffic from which caching a prefix pays, in calls a day of every template sharing it. */
    static String breakEven(double callsPerDay) {
        return Double.isInfinite(callsPerDay) ? "never (cached reads cost no less than input)"
                : significant(callsPerDay) + " calls a day sharing the prefix (below that, cache writes cost more than reads save)";
    }

    /** A share as a percentage with one decimal: {@code 63.2%}. */
    static String percent(double share) {
        return String.format(Locale.ROOT, "%.1f%%", share * 100);
    }

    /**
     * Lines naming the figures a target cannot estimate and the keys it lacks, one line per set of
     * missing keys. Cost gaps are named for a priced target and device gaps for a target with any
     * model or device setting; a target with neither gets one line saying what to set.
     */
    static List<String> missing(Target target, Coverage coverage) {
        boolean deviceSet = target.model().isPresent() || target.device().isPresent() || target.weightBits().isPresent()
                || target.kvBits().isPresent();
        List<String> lines = new ArrayList<>();
        if (!deviceSet && target.price().isEmpty()) {
            lines.add(target.name() + ": estimates tokens only; set price (and calls_per_day, prefix_cache)"
                    + " for cost, or model, weight_bits, kv_bits and device for memory and time");
            return lines;
        }
        boolean costWanted = target.price().isPresent();
        Map<List<String>, List<String>> figuresByKeys = new LinkedHashMap<>();
        for (Map.Entry<String, List<String>> entry : coverage.missing().entrySet()) {
            String figure = entry.getKey();
            boolean cost = figure.startsWith("cost") || figure.startsWith("cache") || figure.equals("static_prefix_tokens");
            if (figure.equals("currency") || (cost ? !costWanted : !deviceSet)) {
                continue;
            }
            figuresByKeys.computeIfAbsent(entry.getValue(), k -> new ArrayList<>()).add(figure);
        }
        figuresByKeys.forEach((keys, figures) -> lines.add(target.name() + ": " + String.join(", ", figures)
                + " not estimated; set " + String.join(", ", keys)));
        if (!coverage.outputConfigured()) {
            lines.add(target.name() + ": no output_tokens set; calls are taken to produce no output tokens"
                    + " (set output_tokens on the target or in front matter)");
        }
        return lines;
    }
}
