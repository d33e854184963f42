package dev.tare.footprint;

import java.util.Optional;
import java.util.OptionalDouble;
import java.util.OptionalInt;

/** Test targets written out in full, so that each test shows every number it depends on. */
final class Targets {
    private Targets() {
    }

    static Target priced(double input, double cachedInput, double output, Integer prefixCacheMin,
                               double callsPerDay) {
        return new Target("hosted", "o200k_base",
                Optional.of(new Price(input, OptionalDouble.of(cachedInput), output, "USD")),
                prefixCacheMin == null ? Optional.empty()
                        : Optional.of(new PrefixCache(prefixCacheMin, 1, OptionalDouble.of(300))), 0, 0,
                OptionalDouble.of(callsPerDay), OptionalInt.empty());
    }

    static Target device(ModelShape model, double weightBits, double kvBits, Device device) {
        return new Target("device", "o200k_base", Optional.empty(), Optional.empty(), 0, 0,
                OptionalDouble.empty(), OptionalInt.empty(), Optional.of(model), OptionalDouble.of(weightBits),
                OptionalDouble.of(kvBits), Optional.of(device));
    }

    static ModelShape model(double params, int layers, int heads, int kvHeads, int headDim) {
        return new ModelShape(params, layers, heads, kvHeads, headDim, "test", false);
    }

    static Device device(double memoryGib, double usableFraction, double peakTflops, double bandwidthGbps,
                         double efficiency) {
        return new Device("test", OptionalDouble.of(memoryGib), OptionalDouble.of(usableFraction),
                OptionalDouble.of(peakTflops), OptionalDouble.of(bandwidthGbps), OptionalDouble.of(efficiency));
    }
}
