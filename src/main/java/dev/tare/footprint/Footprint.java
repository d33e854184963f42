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
 * @param caching              the static prefix and what the prefix cache makes of it, on targets with one
 * @param costPerCall          expected price of one call, in {@code currency}, with the prefix cache's hits
 *                             and writes
 * @param costPerMonth         expected price of a month (30 days) of the template's calls, in {@code currency}
 * @param costPerMonthUncached the same month with nothing cached
 * @param currency             the currency of the costs
 * @param prefillFlops         floating-point operations to process the prompt
 * @param prefillMillis        time before the first output token, in milliseconds
 * @param decodeMillisPerToken time of one decode step (one output token for each of the {@code concurrency}
 *                             requests) once the prompts are in the cache, in milliseconds
 * @param weightBytes          memory the weights take at the target's weight precision
 * @param kvBytesPerToken      KV-cache memory per token at the target's KV precision
 * @param kvCacheBytes         KV-cache memory of one request of I + O tokens
 * @param maxConcurrent        requests of this size whose KV caches fit beside the weights
 * @param calibrated           whether the token counts were scaled by the target's calibration, which
 *                             makes every figure here a calibrated estimate
 * @param load                 the model's params and the figures under load, on targets with a model
 */
public record Footprint(int inputTokens, int framingTokens, int outputTokens, Optional<Caching> caching,
                        OptionalDouble costPerCall, OptionalDouble costPerMonth, OptionalDouble costPerMonthUncached,
                        Optional<String> currency,
                        OptionalDouble prefillFlops, OptionalDouble prefillMillis,
                        OptionalDouble decodeMillisPerToken, OptionalLong weightBytes, OptionalLong kvBytesPerToken,
                        OptionalLong kvCacheBytes, OptionalLong maxConcurrent, boolean calibrated,
                        Optional<Load> load) {

    /** Token counts only, as for a target that names nothing but a tokenizer. */
    public Footprint(int inputTokens, int framingTokens) {
        this(inputTokens, framingTokens, 0, Optional.empty(), OptionalDouble.empty(), OptionalDouble.empty(),
                OptionalDouble.empty(), Optional.empty(), OptionalDouble.empty(), OptionalDouble.empty(), OptionalDouble.empty(),
                OptionalLong.empty(), OptionalLong.empty(), OptionalLong.empty(), OptionalLong.empty(), false,
                Optional.empty());
    }

    /**
     * A call's static prefix and the prefix cache (design.md, "Prefix caching").
     *
     * @param staticPrefixTokens    P: the leading tokens every call of the template sends alike
     * @param cacheablePrefixTokens C: the part of P the cache holds (its minimum and steps, or whole blocks)
     * @param hitRate               h: the share of calls that find C in the cache (1 on a server's cache)
     * @param sharedCallsPerDay     the calls a day of every template sharing those C tokens, which h comes from
     */
    public record Caching(int staticPrefixTokens, int cacheablePrefixTokens, double hitRate,
                          OptionalDouble sharedCallsPerDay) {
        /** The cached input tokens expected per call: h × C. */
        public double cachedInputTokens() {
            return hitRate * cacheablePrefixTokens;
        }

        /**
         * Whether h is known: from the traffic of a provider's cache (without traffic h is taken as 0,
         * every cacheable token written), or a server's cache, which keeps its blocks (h = 1).
         */
        public boolean hitRateKnown() {
            return sharedCallsPerDay.isPresent() || hitRate == 1;
        }
    }

    /** The cached input tokens expected per call, on targets with a prefix cache whose hit rate is known. */
    public OptionalDouble cachedInputTokens() {
        return caching.filter(Caching::hitRateKnown).isPresent()
                ? OptionalDouble.of(caching.get().cachedInputTokens()) : OptionalDouble.empty();
    }

    /**
     * What a model does with this call: its parameters, its context limit, and the figures of serving
     * {@code concurrency} such requests at once. Batch-1 figures are those with concurrency 1.
     *
     * @param paramsTotal            parameters stored (memory)
     * @param paramsActive           parameters one token uses (compute, batch-1 reads)
     * @param contextLimit           the most tokens the model takes, when known
     * @param concurrency            requests decoded together (B)
     * @param decodeBytesPerStep     bytes one decode step reads: the weights the B tokens use and B KV caches
     * @param tokensPerSecond        output tokens per second of one request
     * @param tokensPerSecondTotal   output tokens per second of all B requests
     * @param timeToFirstTokenMillis time to the first output token when B prefills arrive together
     * @param endToEndMillis         time to the last output token of a request
     */
    public record Load(double paramsTotal, double paramsActive, OptionalInt contextLimit, int concurrency,
                       OptionalLong decodeBytesPerStep, OptionalDouble tokensPerSecond,
                       OptionalDouble tokensPerSecondTotal, OptionalDouble timeToFirstTokenMillis,
                       OptionalDouble endToEndMillis) {
    }

    /** Whether input plus output exceed the model's context. */
    public boolean exceedsContext() {
        return load.isPresent() && load.get().contextLimit().isPresent()
                && (long) inputTokens + outputTokens > load.get().contextLimit().getAsInt();
    }

    /** Whether a cost was estimated. */
    public boolean hasCost() {
        return costPerCall.isPresent();
    }
}
