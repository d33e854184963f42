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
        return java.util.Collections.unmodifiableMap(names);
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
