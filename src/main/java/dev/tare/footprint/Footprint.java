package dev.tare.footprint;

import java.util.Optional;
import java.util.OptionalDouble;
import java.util.OptionalInt;
import java.util.OptionalLong;

/**
 * The numbers for one template (or one prompt size) on one target. The token counts are counted;
 * every other figure is a planning estimate from {@link Formulas}, never a measurement or an
 * invoice. A figure is empty when the target lacks an input it needs ({@link Coverage} says which).
 *
 * @param inputTokens          tokens sent per call (I): estimated tokens plus framing
 * @param framingTokens        per-message and per-reply tokens the target's chat format adds
 * @param outputTokens         output tokens assumed per call (O); 0 when none are configured
 * @param cachedInputTokens    leading input tokens served from the prefix cache, on targets with one
 * @param costPerCall          price of one call, in {@code currency}
 * @param costPerMonth         price of a month (30 days) of the target's calls, in {@code currency}
 * @param currency             the currency of the costs
 * @param prefillFlops         floating-point operations to process the prompt
 * @param prefillMillis        time before the first output token, in milliseconds
 * @param decodeMillisPerToken time per output token once the prompt is in the cache, in milliseconds
 * @param weightBytes          memory the weights take at the target's weight precision
 * @param kvBytesPerToken      KV-cache memory per token at the target's KV precision
 * @param kvCacheBytes         KV-cache memory of one request of I + O tokens
 * @param maxConcurrent        requests of this size whose KV caches fit beside the weights
 * @param calibrated           whether the token counts were scaled by the target's calibration, which
 *                             makes every figure here a calibrated estimate
 */
public record Footprint(int inputTokens, int framingTokens, int outputTokens, OptionalInt cachedInputTokens,
                        OptionalDouble costPerCall, OptionalDouble costPerMonth, Optional<String> currency,
                        OptionalDouble prefillFlops, OptionalDouble prefillMillis,
                        OptionalDouble decodeMillisPerToken, OptionalLong weightBytes, OptionalLong kvBytesPerToken,
                        OptionalLong kvCacheBytes, OptionalLong maxConcurrent, boolean calibrated) {

    /** Token counts only, as for a target that names nothing but a tokenizer. */
    public Footprint(int inputTokens, int framingTokens) {
        this(inputTokens, framingTokens, 0, OptionalInt.empty(), OptionalDouble.empty(), OptionalDouble.empty(),
                Optional.empty(), OptionalDouble.empty(), OptionalDouble.empty(), OptionalDouble.empty(),
                OptionalLong.empty(), OptionalLong.empty(), OptionalLong.empty(), OptionalLong.empty(), false);
    }

    /** Whether a cost was estimated. */
    public boolean hasCost() {
        return costPerCall.isPresent();
    }
}
