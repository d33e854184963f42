package dev.tare.footprint;

import dev.tare.TareException;
import java.util.LinkedHashMap;
import java.util.Locale;
import java.util.Map;

/**
 * Numeric precision of weights or of the KV cache, in bits per value. Accepts the usual names
 * ({@code fp16}, {@code int4}, ...) and plain numbers, including effective bits such as 4.5 for
 * group-wise quantization whose per-group scales add a fraction of a bit to every weight.
 */
public final class Precision {
    /** The smallest number of bits accepted. */
    public static final double MIN_BITS = 1;
    /** The largest number of bits accepted. */
    public static final double MAX_BITS = 32;

    private static final Map<String, Double> NAMES = build();
    /** The usual scale of group-wise quantization: one 16-bit scale per group (from memory). */
    private static final int SCALE_BITS = 16;

    private Precision() {
    }

    /** Precision names and their bits, in the order they are listed to users. */
    public static Map<String, Double> names() {
        return NAMES;
    }

    private static Map<String, Double> build() {
        Map<String, Double> names = new LinkedHashMap<>();
        names.put("fp32", 32.0);
        names.put("fp16", 16.0);
        names.put("bf16", 16.0);
        names.put("fp8", 8.0);
        names.put("int8", 8.0);
        names.put("int4", 4.0);
        // Group-wise formats: a 16-bit scale shared by a group of weights adds 16 / group bits to each.
        names.put("int4-g32", 4.0 + (double) SCALE_BITS / 32);
        names.put("int4-g128", 4.0 + (double) SCALE_BITS / 128);
        names.put("int3-g32", 3.0 + (double) SCALE_BITS / 32);
        names.put("int2-g32", 2.0 + (double) SCALE_BITS / 32);
        return java.util.Collections.unmodifiableMap(names);
    }

    /**
     * What a precision name means, for help and listings: the group formats say what their scales add
     * (about half a bit at group size 32: 16 / 32, from memory of the common formats).
     */
    public static String meaning(String name) {
        return switch (name) {
            case "fp32" -> "32-bit floats";
            case "fp16" -> "16-bit floats";
            case "bf16" -> "16-bit floats with fp32's range";
            case "fp8" -> "8-bit floats";
            case "int8" -> "8-bit integers, scales not counted";
            case "int4" -> "4-bit integers, scales not counted";
            default -> {
                int dash = name.indexOf("-g");
                if (name.startsWith("int") && dash > 0) {
                    int group = Integer.parseInt(name.substring(dash + 2));
                    yield name.substring(3, dash) + "-bit integers with a " + SCALE_BITS + "-bit scale per group of "
                            + group + " weights: " + label(NAMES.get(name)) + " bits each (from memory)";
                }
                throw new IllegalArgumentException("not a precision name: " + name);
            }
        };
    }

    /**
     * A note for a number of bits that is not whole: such a figure is an effective width, values plus
     * their group scales; empty for whole bits.
     */
    public static java.util.Optional<String> meaning(double bits) {
        if (bits == Math.rint(bits)) {
            return java.util.Optional.empty();
        }
        return java.util.Optional.of("effective bits: " + (long) Math.floor(bits) + "-bit values plus group scales;"
                + " a 16-bit scale per 32 weights adds about 0.5 bit (from memory)");
    }

    /**
     * The bits of a precision written as a name or a number.
     *
     * @throws TareException naming the accepted names when {@code text} is neither
     */
    public static double parse(String text) {
        String key = text.strip().toLowerCase(Locale.ROOT);
        Double named = NAMES.get(key);
        if (named != null) {
            return named;
        }
        double bits;
        try {
            bits = Double.parseDouble(key);
        } catch (NumberFormatException e) {
            throw new TareException("unknown precision '" + text + "': use " + String.join(", ", NAMES.keySet())
                    + " or a number of bits such as 4.5");
        }
        return check(bits);
    }

    /**
     * {@code bits} when it lies between {@value #MIN_BITS} and {@value #MAX_BITS}.
     *
     * @throws TareException otherwise
     */
    public static double check(double bits) {
        if (!Double.isFinite(bits) || bits < MIN_BITS || bits > MAX_BITS) {
            throw new TareException("precision of " + label(bits) + " bits is out of range: use "
                    + String.join(", ", NAMES.keySet()) + " or a number of bits from 1 to 32");
        }
        return bits;
    }

    /** Bits written for people: {@code 16}, {@code 4.5}. */
    public static String label(double bits) {
        if (bits == Math.rint(bits) && Math.abs(bits) < 1e15) {
            return String.valueOf((long) bits);
        }
        return String.valueOf(bits);
    }
}
