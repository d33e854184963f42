package dev.tare.footprint;

import java.util.OptionalDouble;

/**
 * The hardware a self-run target serves from. Any number may be missing; the footprint then
 * leaves out the figures that need it and says which key is missing.
 *
 * @param origin              where the numbers came from, shown to users: a catalog name or inline
 * @param memoryGib           accelerator (or unified) memory, in GiB (2^30 bytes)
 * @param usableFraction      the share of that memory left for weights and KV cache
 * @param peakTflops          peak dense throughput at the serving precision, in 10^12 FLOP/s
 * @param bandwidthGbps       memory bandwidth, in 10^9 bytes/s
 * @param efficiency          the share of peak throughput reached during prefill
 * @param bandwidthEfficiency the share of the bandwidth reached while reading weights and KV cache;
 *                            the full bandwidth when missing
 */
public record Device(String origin, OptionalDouble memoryGib, OptionalDouble usableFraction,
                     OptionalDouble peakTflops, OptionalDouble bandwidthGbps, OptionalDouble efficiency,
                     OptionalDouble bandwidthEfficiency) {

    /** A device whose reads reach the full bandwidth. */
    public Device(String origin, OptionalDouble memoryGib, OptionalDouble usableFraction, OptionalDouble peakTflops,
                  OptionalDouble bandwidthGbps, OptionalDouble efficiency) {
        this(origin, memoryGib, usableFraction, peakTflops, bandwidthGbps, efficiency, OptionalDouble.empty());
    }

    /** The share of the bandwidth reads reach: {@code bandwidthEfficiency}, else 1. */
    public double readShare() {
        return bandwidthEfficiency.orElse(1);
    }
}
