package dev.tare.footprint;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * Which footprint figures a target can estimate and, for each one it cannot, the configuration keys
 * it lacks, so that a missing input is named instead of shown as a zero.
 *
 * @param computes         the footprint keys (as in JSON) the target fills, in contract order
 * @param missing          for each footprint key it cannot fill, the missing target keys
 * @param outputConfigured whether the target sets {@code output_tokens}; without it calls assume none
 */
public record Coverage(List<String> computes, Map<String, List<String>> missing, boolean outputConfigured) {
    /** The FOOTPRINT keys of the JSON contract, in order. */
    public static final List<String> KEYS = List.of("input_tokens", "framing_tokens", "static_prefix_tokens",
            "cacheable_prefix_tokens", "cache_hit_rate", "cached_input_tokens", "cost_per_call", "cost_per_month",
            "cost_per_month_uncached", "currency", "params_total", "params_active", "prefill_flops",
            "prefill_ms", "decode_ms_per_token", "tokens_per_second", "time_to_first_token_ms", "weight_bytes",
            "kv_bytes_per_token", "kv_cache_bytes", "max_concurrent", "context_limit", "concurrency",
            "decode_bytes_per_step", "tokens_per_second_total", "end_to_end_ms");
    /** Keys shown when known and never reported missing: a model may simply not state them. */
    private static final List<String> INFORMATIONAL = List.of("context_limit");

    public Coverage {
        computes = List.copyOf(computes);
        missing = java.util.Collections.unmodifiableMap(new LinkedHashMap<>(missing));
    }

    /** What {@code target} can and cannot estimate. */
    public static Coverage of(Target target) {
        Map<String, List<String>> needs = new LinkedHashMap<>();
        needs.put("input_tokens", List.of());
        needs.put("framing_tokens", List.of());
        List<String> prefixCache = absent(target.prefixCache().isEmpty(), "prefix_cache");
        needs.put("static_prefix_tokens", prefixCache);
        needs.put("cacheable_prefix_tokens", prefixCache);
        // A provider's cache is found as often as it is used; a server's keeps its blocks.
        List<String> hits = target.prefixCache().isPresent() && target.prefixCache().get().ttlSeconds().isPresent()
                ? absent(target.callsPerDay().isEmpty(), "calls_per_day") : prefixCache;
        needs.put("cache_hit_rate", hits);
        needs.put("cached_input_tokens", hits);
        List<String> price = absent(target.price().isEmpty(), "price");
        needs.put("cost_per_call", price);
        List<String> month = join(price, absent(target.callsPerDay().isEmpty(), "calls_per_day"));
        needs.put("cost_per_month", month);
        needs.put("cost_per_month_uncached", month);
        needs.put("currency", price);
        List<String> model = absent(target.model().isEmpty(), "model");
        List<String> weights = join(model, absent(target.weightBits().isEmpty(), "weight_bits"));
        List<String> cache = join(model, absent(target.kvBits().isEmpty(), "kv_bits"));
        needs.put("params_total", model);
        needs.put("params_active", model);
        needs.put("prefill_flops", model);
        List<String> prefill = join(weights, device(target, "peak_tflops", "efficiency", "bandwidth_gbps"));
        needs.put("prefill_ms", prefill);
        List<String> decode = join(join(weights, absent(target.kvBits().isEmpty(), "kv_bits")),
                device(target, "bandwidth_gbps"));
        needs.put("decode_ms_per_token", decode);
        needs.put("tokens_per_second", decode);
        needs.put("time_to_first_token_ms", prefill);
        needs.put("weight_bytes", weights);
        needs.put("kv_bytes_per_token", cache);
        needs.put("kv_cache_bytes", cache);
        needs.put("max_concurrent", join(join(weights, absent(target.kvBits().isEmpty(), "kv_bits")),
                device(target, "memory_gib", "usable_fraction")));
        needs.put("context_limit", join(model, absent(target.model().isPresent()
                && target.model().get().contextLimit().isEmpty(), "model.context_limit")));
        needs.put("concurrency", model);
        needs.put("decode_bytes_per_step", decode);
        needs.put("tokens_per_second_total", decode);
        needs.put("end_to_end_ms", join(prefill, decode));
        List<String> computes = new ArrayList<>();
        Map<String, List<String>> missing = new LinkedHashMap<>();
        for (String key : KEYS) {
            List<String> lacking = needs.get(key);
            if (lacking.isEmpty()) {
                computes.add(key);
            } else if (!INFORMATIONAL.contains(key)) {
                missing.put(key, lacking);
            }
        }
        return new Coverage(computes, missing, target.outputTokens().isPresent());
    }

    /** Whether the target estimates any cost figure. */
    public boolean hasCost() {
        return computes.contains("cost_per_call");
    }

    /** Whether the target estimates any memory or time figure. */
    public boolean hasDeviceFigures() {
        return computes.contains("prefill_flops");
    }

    private static List<String> device(Target target, String... keys) {
        if (target.device().isEmpty()) {
            return List.of("device");
        }
        Device device = target.device().get();
        List<String> lacking = new ArrayList<>();
        for (String key : keys) {
            boolean present = switch (key) {
                case "memory_gib" -> device.memoryGib().isPresent();
                case "usable_fraction" -> device.usableFraction().isPresent();
                case "peak_tflops" -> device.peakTflops().isPresent();
                case "bandwidth_gbps" -> device.bandwidthGbps().isPresent();
                case "efficiency" -> device.efficiency().isPresent();
                case "bandwidth_efficiency" -> device.bandwidthEfficiency().isPresent();
                default -> throw new IllegalArgumentException("not a device key: " + key);
            };
            if (!present) {
                lacking.add("device." + key);
            }
        }
        return lacking;
    }

    private static List<String> absent(boolean isAbsent, String key) {
        return isAbsent ? List.of(key) : List.of();
    }

    private static List<String> join(List<String> first, List<String> second) {
        List<String> all = new ArrayList<>(first);
        second.stream().filter(k -> !all.contains(k)).forEach(all::add);
        return List.copyOf(all);
    }
}
