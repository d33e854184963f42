package dev.tare.footprint;

import dev.tare.config.Price;
import dev.tare.config.TargetConfig;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.OptionalInt;
import java.util.OptionalLong;

/**
 * Estimates a {@link Footprint} from a target and the token counts of one call, filling every
 * figure the target has the inputs for; {@link Coverage} names the inputs of the rest.
 */
public final class Footprints {
    private Footprints() {
    }

    /** The footprint of {@code call} on {@code target}. */
    public static Footprint estimate(TargetConfig target, CallSize call) {
        int input = call.inputTokens();
        int output = call.outputTokens();
        OptionalInt cached = OptionalInt.empty();
        if (target.prefixCacheMinTokens().isPresent()) {
            int shared = Math.min(call.sharedPrefixTokens(), input);
            cached = OptionalInt.of(shared > 0 && shared >= target.prefixCacheMinTokens().getAsInt() ? shared : 0);
        }

        OptionalDouble costPerCall = OptionalDouble.empty();
        OptionalDouble costPerMonth = OptionalDouble.empty();
        Optional<String> currency = Optional.empty();
        if (target.price().isPresent()) {
            Price price = target.price().get();
            double perCall = Formulas.costPerCall(input, cached.orElse(0), output, price.inputPerMillion(),
                    price.cachedInputPerMillion().orElse(price.inputPerMillion()), price.outputPerMillion());
            costPerCall = OptionalDouble.of(perCall);
            currency = Optional.of(price.currency());
            if (target.callsPerDay().isPresent()) {
                costPerMonth = OptionalDouble.of(Formulas.costPerMonth(perCall, target.callsPerDay().getAsDouble()));
            }
        }

        OptionalDouble prefillFlops = OptionalDouble.empty();
        OptionalDouble weightBytes = OptionalDouble.empty();
        OptionalDouble kvPerToken = OptionalDouble.empty();
        OptionalDouble kvCache = OptionalDouble.empty();
        OptionalDouble prefillMillis = OptionalDouble.empty();
        OptionalDouble decodeMillis = OptionalDouble.empty();
        OptionalLong maxConcurrent = OptionalLong.empty();
        if (target.model().isPresent()) {
            ModelShape model = target.model().get();
            prefillFlops = OptionalDouble.of(Formulas.prefillFlops(model.params(), model.layers(),
                    model.attentionWidth(), input));
            if (target.weightBits().isPresent()) {
                weightBytes = OptionalDouble.of(Formulas.weightBytes(model.params(), target.weightBits().getAsDouble()));
            }
            if (target.kvBits().isPresent()) {
                double perToken = Formulas.kvBytesPerToken(model.layers(), model.kvHeads(), model.headDim(),
                        target.kvBits().getAsDouble());
                kvPerToken = OptionalDouble.of(perToken);
                kvCache = OptionalDouble.of(Formulas.kvCacheBytes(perToken, (long) input + output));
            }
            Optional<Device> device = target.device();
            if (device.isPresent() && weightBytes.isPresent()) {
                Device d = device.get();
                if (d.peakTflops().isPresent() && d.efficiency().isPresent() && d.bandwidthGbps().isPresent()) {
                    prefillMillis = OptionalDouble.of(Formulas.prefillMillis(prefillFlops.getAsDouble(),
                            weightBytes.getAsDouble(), d.peakTflops().getAsDouble(), d.efficiency().getAsDouble(),
                            d.bandwidthGbps().getAsDouble()));
                }
                if (kvCache.isPresent() && d.bandwidthGbps().isPresent()) {
                    decodeMillis = OptionalDouble.of(Formulas.decodeMillisPerToken(weightBytes.getAsDouble(),
                            kvCache.getAsDouble(), d.bandwidthGbps().getAsDouble()));
                }
                if (kvCache.isPresent() && d.memoryGib().isPresent() && d.usableFraction().isPresent()) {
                    maxConcurrent = OptionalLong.of(Formulas.maxConcurrent(d.memoryGib().getAsDouble(),
                            d.usableFraction().getAsDouble(), weightBytes.getAsDouble(), kvCache.getAsDouble()));
                }
            }
        }
        return new Footprint(input, call.framingTokens(), output, cached, costPerCall, costPerMonth, currency,
                prefillFlops, prefillMillis, decodeMillis, bytes(weightBytes), bytes(kvPerToken), bytes(kvCache),
                maxConcurrent, target.isCalibrated());
    }

    /** Whole bytes: a fractional precision such as 4.5 bits can leave half a byte. */
    private static OptionalLong bytes(OptionalDouble value) {
        return value.isPresent() ? OptionalLong.of(Math.round(value.getAsDouble())) : OptionalLong.empty();
    }
}
