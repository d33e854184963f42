package dev.tare.footprint;

import java.util.Optional;
import java.util.OptionalDouble;
import java.util.OptionalInt;

/**
 * One deployment target as configured: the tokenizer its model reads with, and what is known of
 * its price and traffic, or of the model shape, precisions and device it runs on.
 *
 * @param name                  the name used with {@code --target} and in front matter
 * @param tokenizer             a built-in encoding name or a path to a {@code tokenizer.json}
 * @param price                 per-million-token prices, for hosted targets
 * @param prefixCache           the provider's or the server's prefix cache, when it has one
 * @param messageOverheadTokens framing tokens the chat format adds per message
 * @param replyOverheadTokens   framing tokens the chat format adds per call, priming the reply
 * @param callsPerDay           traffic, for monthly figures
 * @param outputTokens          output tokens expected per call
 * @param model                 the model's shape, for self-run targets
 * @param weightBits            bits per weight as served
 * @param kvBits                bits per KV-cache value as served
 * @param device                the hardware the model is served from
 * @param scale                 multiplier on counted text tokens, for a target whose tokenizer is not
 *                              public and is counted with a stand-in (1 when not calibrated)
 * @param toolOverheadTokens    tokens the provider adds per tool definition sent with a call
 * @param concurrency           requests served at once (the decode batch); batch 1 when not set
 */
public record Target(String name, String tokenizer, Optional<Price> price, Optional<PrefixCache> prefixCache,
                           int messageOverheadTokens, int replyOverheadTokens, OptionalDouble callsPerDay,
                           OptionalInt outputTokens, Optional<ModelShape> model, OptionalDouble weightBits,
                           OptionalDouble kvBits, Optional<Device> device, double scale, int toolOverheadTokens,
                           OptionalInt concurrency) {

    public Target {
        if (!(scale > 0) || Double.isInfinite(scale)) {
            throw new IllegalArgumentException("scale must be positive: " + scale);
        }
        if (concurrency.isPresent() && concurrency.getAsInt() < 1) {
            throw new IllegalArgumentException("concurrency must be 1 or more: " + concurrency.getAsInt());
        }
    }

    /** A target that serves one request at a time unless told otherwise. */
    public Target(String name, String tokenizer, Optional<Price> price, Optional<PrefixCache> prefixCache,
                        int messageOverheadTokens, int replyOverheadTokens, OptionalDouble callsPerDay,
                        OptionalInt outputTokens, Optional<ModelShape> model, OptionalDouble weightBits,
                        OptionalDouble kvBits, Optional<Device> device, double scale, int toolOverheadTokens) {
        this(name, tokenizer, price, prefixCache, messageOverheadTokens, replyOverheadTokens, callsPerDay,
                outputTokens, model, weightBits, kvBits, device, scale, toolOverheadTokens, OptionalInt.empty());
    }

    /** The same target serving {@code requests} requests at once. */
    public Target withConcurrency(int requests) {
        return new Target(name, tokenizer, price, prefixCache, messageOverheadTokens,
                replyOverheadTokens, callsPerDay, outputTokens, model, weightBits, kvBits, device, scale,
                toolOverheadTokens, OptionalInt.of(requests));
    }

    /** The same target with each template called {@code calls} times a day. */
    public Target withCallsPerDay(double calls) {
        return new Target(name, tokenizer, price, prefixCache, messageOverheadTokens, replyOverheadTokens,
                OptionalDouble.of(calls), outputTokens, model, weightBits, kvBits, device, scale, toolOverheadTokens,
                concurrency);
    }

    /**
     * The traffic below which caching a prefix costs more than it saves, in calls a day of every
     * template sharing it: only on a priced target whose provider charges a premium to write the cache.
     */
    public OptionalDouble cacheBreakEvenCallsPerDay() {
        if (price.isEmpty() || prefixCache.isEmpty() || prefixCache.get().ttlSeconds().isEmpty()
                || price.get().cacheWrite() <= price.get().inputPerMillion()) {
            return OptionalDouble.empty();
        }
        Price p = price.get();
        return OptionalDouble.of(Formulas.breakEvenCallsPerDay(prefixCache.get().ttlSeconds().getAsDouble(),
                p.inputPerMillion(), p.cachedInput(), p.cacheWrite()));
    }

    /** The decode batch: {@code concurrency}, else 1. */
    public int batch() {
        return concurrency.orElse(1);
    }

    /** A target without calibration: scale 1 and no per-tool overhead. */
    public Target(String name, String tokenizer, Optional<Price> price, Optional<PrefixCache> prefixCache,
                        int messageOverheadTokens, int replyOverheadTokens, OptionalDouble callsPerDay,
                        OptionalInt outputTokens, Optional<ModelShape> model, OptionalDouble weightBits,
                        OptionalDouble kvBits, Optional<Device> device) {
        this(name, tokenizer, price, prefixCache, messageOverheadTokens, replyOverheadTokens, callsPerDay,
                outputTokens, model, weightBits, kvBits, device, 1.0, 0);
    }

    /** Whether counts on this target are scaled, so that figures derived from them are calibrated estimates. */
    public boolean isCalibrated() {
        return scale != 1.0;
    }

    /** {@code tokens} counted locally, as this target's provider would count them: scaled and rounded. */
    public int scaled(int tokens) {
        return isCalibrated() ? (int) Math.round(tokens * scale) : tokens;
    }

    /** A target without a model or device: priced, or tokens only. */
    public Target(String name, String tokenizer, Optional<Price> price, Optional<PrefixCache> prefixCache,
                        int messageOverheadTokens, int replyOverheadTokens, OptionalDouble callsPerDay,
                        OptionalInt outputTokens) {
        this(name, tokenizer, price, prefixCache, messageOverheadTokens, replyOverheadTokens, callsPerDay,
                outputTokens, Optional.empty(), OptionalDouble.empty(), OptionalDouble.empty(), Optional.empty());
    }

    /** A target that names only a tokenizer. */
    public static Target ofTokenizer(String name, String tokenizer) {
        return new Target(name, tokenizer, Optional.empty(), Optional.empty(), 0, 0, OptionalDouble.empty(),
                OptionalInt.empty());
    }
}
