package dev.tare.footprint;

import dev.tare.TareException;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.Set;

/**
 * A table of footprints across every combination of a few settings, such as weight and KV-cache
 * precision: the quick way to see what quantizing does to memory, concurrency and prefill time.
 */
public final class Sweep {
    /** Keys that may be swept, in the order they are listed to users. */
    public static final List<String> KEYS = List.of("weight_bits", "kv_bits", "memory_gib", "usable_fraction",
            "peak_tflops", "bandwidth_gbps", "efficiency", "bandwidth_efficiency", "concurrency", "input_tokens",
            "output_tokens");
    /** The most combinations one sweep may ask for. */
    public static final int MAX_ROWS = 1000;

    private static final Set<String> TOKEN_KEYS = Set.of("input_tokens", "output_tokens");
    private static final Set<String> WHOLE_KEYS = Set.of("input_tokens", "output_tokens", "concurrency");
    private static final Set<String> DEVICE_KEYS = Set.of("memory_gib", "usable_fraction", "peak_tflops",
            "bandwidth_gbps", "efficiency", "bandwidth_efficiency");

    private Sweep() {
    }

    /**
     * One swept setting and its values.
     *
     * @param key    one of {@link #KEYS}
     * @param values the values, in the order given
     */
    public record Axis(String key, List<Double> values) {
        public Axis {
            values = List.copyOf(values);
        }

        /**
         * Parses {@code key=v1,v2,...}; bit keys also take precision names such as {@code fp16}.
         *
         * @throws TareException naming the key and what it accepts
         */
        public static Axis parse(String text) {
            int eq = text.indexOf('=');
            if (eq <= 0 || eq == text.length() - 1) {
                throw new TareException("--sweep " + text + ": write KEY=V1,V2,... with KEY one of "
                        + String.join(", ", KEYS));
            }
            String key = text.substring(0, eq).strip();
            if (!KEYS.contains(key)) {
                throw new TareException("--sweep " + text + ": unknown key '" + key + "'; use one of "
                        + String.join(", ", KEYS));
            }
            List<Double> values = new ArrayList<>();
            for (String part : text.substring(eq + 1).split(",")) {
                values.add(value(key, part.strip(), text));
            }
            return new Axis(key, values);
        }

        private static double value(String key, String part, String text) {
            if (key.endsWith("_bits")) {
                try {
                    return Precision.parse(part);
                } catch (TareException e) {
                    throw new TareException("--sweep " + text + ": " + key + ": " + e.getMessage(), e);
                }
            }
            double value;
            try {
                value = Double.parseDouble(part);
            } catch (NumberFormatException e) {
                throw new TareException("--sweep " + text + ": " + key + ": '" + part + "' is not a number");
            }
            boolean fraction = key.equals("usable_fraction") || key.endsWith("efficiency");
            boolean whole = WHOLE_KEYS.contains(key);
            double least = key.equals("concurrency") ? 1 : 0;
            if (!Double.isFinite(value) || (whole ? value < least || value != Math.rint(value)
                    || value > Integer.MAX_VALUE : value <= 0) || (fraction && value > 1)) {
                throw new TareException("--sweep " + text + ": " + key + ": " + part + " must be "
                        + (key.equals("concurrency") ? "a whole number of requests, 1 or more"
                        : whole ? "a whole number of tokens" : fraction ? "above 0 and at most 1" : "above 0"));
            }
            return value;
        }
    }

    /**
     * One combination and its footprint.
     *
     * @param settings  the value of each axis, in axis order
     * @param footprint the footprint under those settings
     */
    public record Row(List<Double> settings, Footprint footprint) {
        public Row {
            settings = List.copyOf(settings);
        }
    }

    /**
     * The footprint of {@code call} on {@code target} for every combination of the axes' values,
     * the first axis varying slowest.
     *
     * @throws TareException when a key repeats, a device key is swept on a target without a model,
     *                       or the combinations exceed {@value #MAX_ROWS}
     */
    public static List<Row> run(Target target, CallSize call, List<Axis> axes) {
        Set<String> seen = new HashSet<>();
        long combinations = 1;
        for (Axis axis : axes) {
            if (!seen.add(axis.key())) {
                throw new TareException("--sweep " + axis.key() + " is given twice; list all its values in one --sweep");
            }
            if (!TOKEN_KEYS.contains(axis.key()) && target.model().isEmpty()) {
                throw new TareException("target '" + target.name() + "' has no model, so " + axis.key()
                        + " does not change its footprint; add model (and weight_bits, kv_bits, device) to the target");
            }
            combinations *= axis.values().size();
            if (combinations > MAX_ROWS) {
                throw new TareException("--sweep asks for more than " + MAX_ROWS + " combinations; sweep fewer values");
            }
        }
        List<Row> rows = new ArrayList<>();
        fill(target, call, axes, 0, new ArrayList<>(), rows);
        return rows;
    }

    private static void fill(Target target, CallSize call, List<Axis> axes, int depth, List<Double> settings,
                             List<Row> rows) {
        if (depth == axes.size()) {
            rows.add(new Row(settings, Footprints.estimate(target, call)));
            return;
        }
        Axis axis = axes.get(depth);
        for (double value : axis.values()) {
            settings.add(value);
            fill(with(target, axis.key(), value), with(call, axis.key(), value), axes, depth + 1, settings, rows);
            settings.remove(settings.size() - 1);
        }
    }

    private static CallSize with(CallSize call, String key, double value) {
        return switch (key) {
            case "input_tokens" -> new CallSize((int) value, 0, call.outputTokens(),
                    Math.min(call.staticPrefixTokens(), (int) value));
            case "output_tokens" -> new CallSize(call.inputTokens(), call.framingTokens(), (int) value,
                    call.staticPrefixTokens());
            default -> call;
        };
    }

    private static Target with(Target t, String key, double value) {
        OptionalDouble weightBits = key.equals("weight_bits") ? OptionalDouble.of(value) : t.weightBits();
        OptionalDouble kvBits = key.equals("kv_bits") ? OptionalDouble.of(value) : t.kvBits();
        Optional<Device> device = t.device();
        if (DEVICE_KEYS.contains(key)) {
            device = Optional.of(withDevice(device.orElse(new Device("swept", OptionalDouble.empty(),
                    OptionalDouble.empty(), OptionalDouble.empty(), OptionalDouble.empty(), OptionalDouble.empty())),
                    key, OptionalDouble.of(value)));
        }
        Target swept = new Target(t.name(), t.tokenizer(), t.price(), t.prefixCache(),
                t.messageOverheadTokens(), t.replyOverheadTokens(), t.callsPerDay(), t.outputTokens(), t.model(),
                weightBits, kvBits, device, t.scale(), t.toolOverheadTokens(), t.concurrency());
        return key.equals("concurrency") ? swept.withConcurrency((int) value) : swept;
    }

    private static Device withDevice(Device d, String key, OptionalDouble value) {
        return new Device(d.origin(),
                key.equals("memory_gib") ? value : d.memoryGib(),
                key.equals("usable_fraction") ? value : d.usableFraction(),
                key.equals("peak_tflops") ? value : d.peakTflops(),
                key.equals("bandwidth_gbps") ? value : d.bandwidthGbps(),
                key.equals("efficiency") ? value : d.efficiency(),
                key.equals("bandwidth_efficiency") ? value : d.bandwidthEfficiency());
    }
}
