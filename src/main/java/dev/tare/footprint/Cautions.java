package dev.tare.footprint;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.OptionalDouble;

/**
 * The warnings that go with footprint figures: low-bit quantization, a call longer than the model's
 * context, more concurrent requests than fit, and what a model's source says that Tare does not model.
 * Every output that shows the figures shows these lines beside them.
 */
public final class Cautions {
    /** Weights below this many bits carry the quality caution. */
    public static final double LOW_WEIGHT_BITS = 4;
    /** A KV cache below this many bits carries the quality caution. */
    public static final double LOW_KV_BITS = 8;
    /** Said when weights or the KV cache are quantized low (common practice, no source). */
    public static final String QUANTIZATION = "Quality after quantizing must be measured on your own tasks; below"
            + " 4-bit weights (or an 8-bit KV cache) it usually drops noticeably (common practice).";
    /** Said by every sweep. */
    public static final String SWEEP = "Memory and speed are estimated here; quality is not: a setting that fits"
            + " may still answer worse.";
    /** Said beside figures under load for a mixture of experts. */
    public static final String EXPERTS = "Experts read at batch B are the expected number under uniform routing,"
            + " E x (1 - (1 - k/E)^B) per layer (from memory); real routing is uneven.";

    private Cautions() {
    }

    /** Whether {@code weightBits} or {@code kvBits} is low enough to need the quality caution. */
    public static boolean lowPrecision(OptionalDouble weightBits, OptionalDouble kvBits) {
        return (weightBits.isPresent() && weightBits.getAsDouble() < LOW_WEIGHT_BITS)
                || (kvBits.isPresent() && kvBits.getAsDouble() < LOW_KV_BITS);
    }

    /** The cautions of a target's settings alone: its model's notes and its precisions. */
    public static List<String> of(Target target) {
        List<String> lines = new ArrayList<>();
        target.model().ifPresent(m -> m.notes().forEach(note -> lines.add(target.name() + ": " + note)));
        if (lowPrecision(target.weightBits(), target.kvBits())) {
            lines.add(QUANTIZATION);
        }
        if (target.batch() > 1 && target.model().isPresent() && target.model().get().experts().present()) {
            lines.add(EXPERTS);
        }
        return lines;
    }

    /** The cautions of one footprint on {@code target}: the target's, then the call's context and concurrency. */
    public static List<String> of(Target target, Footprint footprint) {
        List<String> lines = of(target);
        contextLine(target, footprint, "").ifPresent(lines::add);
        if (footprint.maxConcurrent().isPresent() && footprint.maxConcurrent().getAsLong() == 0) {
            lines.add(target.name() + ": the weights and one request's KV cache do not fit in the device's usable"
                    + " memory; use fewer weight bits, a larger device or several devices");
        } else if (footprint.maxConcurrent().isPresent() && target.batch() > footprint.maxConcurrent().getAsLong()) {
            lines.add(String.format(Locale.ROOT, "%s: %,d concurrent requests do not fit; at most %,d of this size"
                    + " fit beside the weights", target.name(), target.batch(), footprint.maxConcurrent().getAsLong()));
        }
        return lines;
    }

    /**
     * The warning for a call whose input plus output exceed the model's context, naming {@code what}
     * (a template's path, or nothing), when they do.
     */
    public static Optional<String> contextLine(Target target, Footprint footprint, String what) {
        if (!footprint.exceedsContext()) {
            return Optional.empty();
        }
        int limit = footprint.load().orElseThrow().contextLimit().getAsInt();
        long tokens = (long) footprint.inputTokens() + footprint.outputTokens();
        return Optional.of(String.format(Locale.ROOT, "%s%s: %,d input + %,d output = %,d tokens exceed"
                        + " the model's context of %,d tokens by %,d; the provider or server will cut or refuse the call",
                what.isEmpty() ? "" : what + " on ", target.name(), footprint.inputTokens(), footprint.outputTokens(),
                tokens, limit, tokens - limit));
    }
}
