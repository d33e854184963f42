package dev.tare.footprint;

import java.util.Optional;
import java.util.OptionalDouble;
import java.util.OptionalLong;

/**
 * Estimates a {@link Footprint} from a target and the token counts of one call, filling every
 * figure the target has the inputs for; {@link Coverage} names the inputs of the rest.
 */
public final class Footprints {
    private Footprints() {
    }

    /** The footprint of {@code call} on {@code target}, called as often as the target's {@code calls_per_day}. */
    public static Footprint estimate(Target target, CallSize call) {
        return estimate(target, call, Traffic.of(target));
    }

    /** The footprint of {@code call} on {@code target}, called as {@code traffic} says. */
    public static Footprint estimate(Target target, CallSize call, Traffic traffic) {
        int input = call.inputTokens();
        int output = call.outputTokens();
        Optional<Footprint.Caching> caching = target.prefixCache().map(cache -> caching(cache, call, traffic));
        int cacheable = caching.map(Footprint.Caching::cacheablePrefixTokens).orElse(0);
        double hitRate = caching.map(Footprint.Caching::hitRate).orElse(0.0);

        OptionalDouble costPerCall = OptionalDouble.empty();
        OptionalDouble costPerMonth = OptionalDouble.empty();
        OptionalDouble costPerMonthUncached = OptionalDouble.empty();
        Optional<String> currency = Optional.empty();
        if (target.price().isPresent()) {
            Price price = target.price().get();
            double perCall = Formulas.costPerCall(input, cacheable, hitRate, output, price.inputPerMillion(),
                    price.cachedInput(), price.cacheWrite(), price.outputPerMillion());
            costPerCall = OptionalDouble.of(perCall);
            currency = Optional.of(price.currency());
            if (traffic.callsPerDay().isPresent()) {
                double calls = traffic.callsPerDay().getAsDouble();
                costPerMonth = OptionalDouble.of(Formulas.costPerMonth(perCall, calls));
                double uncached = Formulas.costPerCall(input, 0, output, price.inputPerMillion(), price.cachedInput(),
                        price.outputPerMillion());
                costPerMonthUncached = OptionalDouble.of(Formulas.costPerMonth(uncached, calls));
            }
        }

        OptionalDouble prefillFlops = OptionalDouble.empty();
        OptionalDouble weightBytes = OptionalDouble.empty();
        OptionalDouble kvPerToken = OptionalDouble.empty();
        OptionalDouble kvCache = OptionalDouble.empty();
        OptionalDouble prefillMillis = OptionalDouble.empty();
        OptionalDouble decodeMillis = OptionalDouble.empty();
        OptionalLong maxConcurrent = OptionalLong.empty();
        Optional<Footprint.Load> load = Optional.empty();
        if (target.model().isPresent()) {
            ModelShape model = target.model().get();
            int batch = target.batch();
            long tokens = (long) input + output;
            // Tokens found in the prefix cache are not computed again: on a server's cache the static
            // prefix's whole blocks, on a provider's the expected h × C.
            prefillFlops = OptionalDouble.of(Formulas.prefillFlops(model, input, Math.round(hitRate * cacheable)));
            if (target.weightBits().isPresent()) {
                weightBytes = OptionalDouble.of(Formulas.weightBytes(model.paramsTotal(),
                        target.weightBits().getAsDouble()));
            }
            if (target.kvBits().isPresent()) {
                double bits = target.kvBits().getAsDouble();
                kvPerToken = OptionalDouble.of(Formulas.kvBytesPerToken(model, bits));
                kvCache = OptionalDouble.of(Formulas.kvCacheBytes(model, tokens, bits));
            }
            OptionalLong stepBytes = OptionalLong.empty();
            OptionalDouble perRequest = OptionalDouble.empty();
            OptionalDouble total = OptionalDouble.empty();
            OptionalDouble firstToken = OptionalDouble.empty();
            OptionalDouble endToEnd = OptionalDouble.empty();
            Optional<Device> device = target.device();
            if (device.isPresent() && weightBytes.isPresent()) {
                Device d = device.get();
                double bits = target.weightBits().getAsDouble();
                if (d.peakTflops().isPresent() && d.efficiency().isPresent() && d.bandwidthGbps().isPresent()) {
                    double peak = d.peakTflops().getAsDouble();
                    double efficiency = d.efficiency().getAsDouble();
                    double bandwidth = d.bandwidthGbps().getAsDouble();
                    prefillMillis = OptionalDouble.of(Formulas.prefillMillis(prefillFlops.getAsDouble(),
                            Formulas.paramsRead(model, input) * bits / 8, peak, efficiency, bandwidth, d.readShare()));
                    firstToken = OptionalDouble.of(Formulas.prefillMillis(batch * prefillFlops.getAsDouble(),
                            Formulas.paramsRead(model, (double) batch * input) * bits / 8, peak, efficiency,
                            bandwidth, d.readShare()));
                }
                if (kvCache.isPresent() && d.bandwidthGbps().isPresent()) {
                    double bytes = Formulas.decodeBytesPerStep(model, bits, kvCache.getAsDouble(), batch);
                    double step = Formulas.stepMillis(bytes, d.bandwidthGbps().getAsDouble(), d.readShare(),
                            Formulas.decodeFlopsPerStep(model, tokens, batch), d.peakTflops().orElse(0),
                            d.efficiency().orElse(0));
                    decodeMillis = OptionalDouble.of(step);
                    stepBytes = OptionalLong.of(Math.round(bytes));
                    perRequest = OptionalDouble.of(Formulas.tokensPerSecond(step));
                    total = OptionalDouble.of(batch * Formulas.tokensPerSecond(step));
                    if (firstToken.isPresent()) {
                        endToEnd = OptionalDouble.of(Formulas.endToEndMillis(firstToken.getAsDouble(), output, step));
                    }
                }
                if (kvCache.isPresent() && d.memoryGib().isPresent() && d.usableFraction().isPresent()) {
                    // A server's cache keeps the prefix's blocks once for every request that shares them.
                    double shared = target.prefixCache().filter(c -> c.ttlSeconds().isEmpty()).isPresent()
                            ? Formulas.sharedKvCacheBytes(model, cacheable, target.kvBits().getAsDouble()) : 0;
                    maxConcurrent = OptionalLong.of(Formulas.maxConcurrent(d.memoryGib().getAsDouble(),
                            d.usableFraction().getAsDouble(), weightBytes.getAsDouble(), shared,
                            kvCache.getAsDouble() - shared));
                }
            }
            load = Optional.of(new Footprint.Load(model.paramsTotal(), model.paramsActive(), model.contextLimit(),
                    batch, stepBytes, perRequest, total, firstToken, endToEnd));
        }
        return new Footprint(input, call.framingTokens(), output, caching, costPerCall, costPerMonth,
                costPerMonthUncached, currency,
                prefillFlops, prefillMillis, decodeMillis, bytes(weightBytes), bytes(kvPerToken), bytes(kvCache),
                maxConcurrent, target.isCalibrated(), load);
    }

    /**
     * The static prefix P (at most the input), the part C the cache holds, and the hit rate from the
     * traffic of every template sharing C: none without traffic on a provider's cache, all on a server's.
     */
    private static Footprint.Caching caching(PrefixCache cache, CallSize call, Traffic traffic) {
        int prefix = Math.min(call.staticPrefixTokens(), call.inputTokens());
        int cacheable = cache.cacheable(prefix);
        double hitRate = cache.hitRate(traffic.sharedCallsPerDay().orElse(0));
        return new Footprint.Caching(prefix, cacheable, hitRate, traffic.sharedCallsPerDay());
    }

    /** Whole bytes: a fractional precision such as 4.5 bits can leave half a byte. */
    private static OptionalLong bytes(OptionalDouble value) {
        return value.isPresent() ? OptionalLong.of(Math.round(value.getAsDouble())) : OptionalLong.empty();
    }
}
