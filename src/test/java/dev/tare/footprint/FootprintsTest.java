package dev.tare.footprint;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.OptionalInt;
import org.junit.jupiter.api.Test;

/** Footprints of whole targets, against hand-computed values; what a target lacks is named, never zero. */
class FootprintsTest {
    private static final double EXACT = 1e-9;

    /** The prefix cache holds a static prefix only from its minimum on (design.md, "Prefix caching — hosted"). */
    @Test
    void cachedPrefixCountsOnlyFromTheMinimum() {
        // 20,000 calls a day with a 300 s entry: λ × ttl = 69.4, so h = 1 − e^−69.4, 1 to fifteen places.
        Target hosted = Targets.priced(2.50, 0.60, 10.00, 1024, 20_000);
        // A 1,000-token static prefix is under the 1,024 minimum: nothing cached, (2000 × 2.5 + 300 × 10) / 1e6 = 0.008.
        Footprint below = Footprints.estimate(hosted, new CallSize(2000, 0, 300, 1000));
        assertEquals(0, below.caching().orElseThrow().cacheablePrefixTokens());
        assertEquals(0, below.cachedInputTokens().getAsDouble(), EXACT);
        assertEquals(0.008, below.costPerCall().getAsDouble(), EXACT);
        // 1,200: (800 × 2.5 + 1200 × 0.6 + 300 × 10) / 1e6 = 0.00572; a month 0.00572 × 20,000 × 30 = 3,432.
        Footprint above = Footprints.estimate(hosted, new CallSize(2000, 0, 300, 1200));
        assertEquals(1200, above.cachedInputTokens().getAsDouble(), EXACT);
        assertEquals(0.00572, above.costPerCall().getAsDouble(), EXACT);
        assertEquals(3432, above.costPerMonth().getAsDouble(), 1e-6);
        assertEquals(4800, above.costPerMonthUncached().getAsDouble(), 1e-6);
        assertEquals("USD", above.currency().orElseThrow());
    }

    /** Little traffic: most calls write the prefix at the premium instead of reading it. */
    @Test
    void rareCallsPayTheWritePremium() {
        Target hosted = new Target("hosted", "o200k_base",
                Optional.of(new Price(3.00, OptionalDouble.of(0.30), OptionalDouble.of(3.75), 15.00, "USD")),
                Optional.of(new PrefixCache(1024, 128, OptionalDouble.of(300))), 0, 0, OptionalDouble.of(48),
                OptionalInt.empty());
        // P = 1,300: C = 1024 + floor(276 / 128) × 128 = 1,280. λ × ttl = 48 / 86,400 × 300 = 1/6.
        Footprint f = Footprints.estimate(hosted, new CallSize(3000, 0, 0, 1300));
        double h = 1 - Math.exp(-1.0 / 6);
        assertEquals(1280, f.caching().orElseThrow().cacheablePrefixTokens());
        assertEquals(h, f.caching().orElseThrow().hitRate(), EXACT);
        assertEquals((1720 * 3.00 + 1280 * (h * 0.30 + (1 - h) * 3.75)) / 1e6, f.costPerCall().getAsDouble(), EXACT);
        // Below the break-even traffic (70.6 calls a day) caching costs more than it saves.
        assertTrue(f.costPerMonth().getAsDouble() > f.costPerMonthUncached().getAsDouble());
    }

    /**
     * A worked price list. The mechanics are those the hosted providers publish in their prompt-caching
     * documentation: the cache matches an exact prefix (tools, then system, then messages), from a
     * minimum length (1,024 tokens) in steps (128), reads cost a tenth of input, an entry lives five
     * minutes and each hit refreshes it, and some providers charge a quarter more to write one (the
     * figures from memory). Rates 2.50 input, 0.25 cached, 3.125 write, 10 output per million; calls of
     * 5,000 input tokens and no output; hit rate h = 1 − e^(−λ × 300 s) with λ the calls per second.
     */
    @Test
    void aHostedPriceListWorkedAtTwoTrafficsAndAShortPrefix() {
        Target busy = new Target("hosted", "o200k_base",
                Optional.of(new Price(2.50, OptionalDouble.of(0.25), OptionalDouble.of(3.125), 10.00, "USD")),
                Optional.of(new PrefixCache(1024, 128, OptionalDouble.of(300))), 0, 0, OptionalDouble.of(40_000),
                OptionalInt.empty());
        // 3,000-token prefix: C = 1024 + floor((3000 − 1024) / 128) × 128 = 1024 + 15 × 128 = 2,944.
        // 40,000 a day: λ × ttl = 40,000 / 86,400 × 300 = 138.9, h = 1 to sixty places;
        // (2,056 × 2.50 + 2,944 × 0.25) / 1e6 = (5,140 + 736) / 1e6 = 0.005876 a call, × 1,200,000 calls a
        // month = 7,051.20, against 5,000 × 2.50 / 1e6 × 1,200,000 = 15,000 uncached.
        Footprint busyCall = Footprints.estimate(busy, new CallSize(5000, 0, 0, 3000));
        assertEquals(2944, busyCall.caching().orElseThrow().cacheablePrefixTokens());
        assertEquals(1, busyCall.caching().orElseThrow().hitRate(), EXACT);
        assertEquals(0.005876, busyCall.costPerCall().getAsDouble(), EXACT);
        assertEquals(7051.20, busyCall.costPerMonth().getAsDouble(), 1e-6);
        assertEquals(15_000, busyCall.costPerMonthUncached().getAsDouble(), 1e-6);
        // 100 a day: λ × ttl = 100 / 86,400 × 300 = 0.347222, h = 1 − e^−0.347222 = 0.293352;
        // (5,140 + 2,944 × (0.293352 × 0.25 + 0.706648 × 3.125)) / 1e6 = (5,140 + 6,717.07) / 1e6
        // = 0.0118571 a call: the writes eat most of the saving, but the traffic is above the break-even,
        // h* = (3.125 − 2.50) / (3.125 − 0.25) = 0.217391, λ* = −ln(1 − h*) / 300 × 86,400 = 70.595 a day.
        Footprint rareCall = Footprints.estimate(busy.withCallsPerDay(100), new CallSize(5000, 0, 0, 3000));
        double h = 1 - Math.exp(-100.0 / 86_400 * 300);
        assertEquals(0.293352, h, 1e-6);
        assertEquals(0.0118571, rareCall.costPerCall().getAsDouble(), 1e-7);
        assertEquals(35.571, rareCall.costPerMonth().getAsDouble(), 1e-3);
        assertEquals(37.50, rareCall.costPerMonthUncached().getAsDouble(), 1e-9);
        assertEquals(70.595, busy.cacheBreakEvenCallsPerDay().getAsDouble(), 1e-3);
        // A 900-token prefix is under the minimum: nothing cached, every call 0.0125 at any traffic.
        Footprint shortPrefix = Footprints.estimate(busy, new CallSize(5000, 0, 0, 900));
        assertEquals(0, shortPrefix.caching().orElseThrow().cacheablePrefixTokens());
        assertEquals(0.0125, shortPrefix.costPerCall().getAsDouble(), EXACT);
        assertEquals(15_000, shortPrefix.costPerMonth().getAsDouble(), 1e-6);
    }

    /** A server's cache keeps whole blocks of the prefix: prefill computes only the rest. */
    @Test
    void serverCacheSkipsThePrefillOfWholeBlocks() {
        ModelShape model = Targets.model(1e9, 24, 16, 16, 128);
        Target plain = Targets.device(model, 16, 16, Targets.device(16, 0.75, 25, 120, 0.4));
        Target cached = new Target("device", "o200k_base", Optional.empty(), Optional.of(PrefixCache.blocks(16)), 0, 0,
                OptionalDouble.empty(), OptionalInt.empty(), Optional.of(model), OptionalDouble.of(16),
                OptionalDouble.of(16), plain.device());
        // P = 1,000: floor(1000 / 16) × 16 = 992 tokens are in the cache, found on every call.
        Footprint f = Footprints.estimate(cached, new CallSize(2000, 0, 0, 1000));
        assertEquals(992, f.caching().orElseThrow().cacheablePrefixTokens());
        assertEquals(1, f.caching().orElseThrow().hitRate(), EXACT);
        assertEquals(Formulas.prefillFlops(model, 2000, 992), f.prefillFlops().getAsDouble(), EXACT);
        assertTrue(f.prefillFlops().getAsDouble() < Footprints.estimate(plain, new CallSize(2000, 0, 0, 1000))
                .prefillFlops().getAsDouble());
        // The blocks are stored once for every request that starts with them (PagedAttention, §4.4).
        // KV per token 2 × 24 × 16 × 128 × 2 bytes = 196,608; free 16 GiB × 0.75 − 2e9 weight bytes
        // = 10,884,901,888. Alone: floor(free / (2,000 × 196,608)) = 27 requests; sharing 992 tokens:
        // floor((free − 992 × 196,608) / (1,008 × 196,608)) = 53.
        assertEquals(27, Footprints.estimate(plain, new CallSize(2000, 0, 0, 1000)).maxConcurrent().getAsLong());
        assertEquals(53, f.maxConcurrent().getAsLong());
    }

    @Test
    void targetWithoutAPrefixCacheHasNoCachedTokens() {
        Target hosted = Targets.priced(2.50, 0.60, 10.00, null, 20_000);
        Footprint f = Footprints.estimate(hosted, new CallSize(2000, 0, 300, 1500));
        assertTrue(f.cachedInputTokens().isEmpty());
        assertTrue(f.caching().isEmpty());
        assertEquals(0.008, f.costPerCall().getAsDouble(), EXACT);
    }

    @Test
    void deviceTargetFillsEveryDeviceFigure() {
        // 7e9 params at 4 bits = 3.5e9 bytes; 32 layers, 8 KV heads of 128 at 16 bits:
        // 2 × 32 × 8 × 128 × 2 = 131,072 bytes per token; 1,000 + 24 tokens -> 134,217,728 bytes.
        Target target = Targets.device(Targets.model(7e9, 32, 32, 8, 128), 4, 16,
                Targets.device(16, 0.75, 25, 120, 0.4));
        Footprint f = Footprints.estimate(target, CallSize.of(1000, 24));
        assertEquals(3_500_000_000L, f.weightBytes().getAsLong());
        assertEquals(131_072, f.kvBytesPerToken().getAsLong());
        assertEquals(134_217_728, f.kvCacheBytes().getAsLong());
        // Prefill: 2 × 7e9 × 1000 + 2 × 32 × 1000² × 4096 = 1.4e13 + 2.62144e11 = 14,262,144,000,000 FLOPs;
        // at 25e12 × 0.4 = 1e13 FLOP/s that is 1,426.2144 ms (more than the 29.17 ms of weight reads).
        assertEquals(14_262_144_000_000.0, f.prefillFlops().getAsDouble(), EXACT);
        assertEquals(1426.2144, f.prefillMillis().getAsDouble(), 1e-9);
        // Decode: (3.5e9 + 134,217,728) / 120e9 × 1000 = 30.2851477... ms.
        assertEquals((3.5e9 + 134_217_728) / 120e9 * 1000, f.decodeMillisPerToken().getAsDouble(), 1e-9);
        // Concurrency: (12,884,901,888 − 3.5e9) / 134,217,728 = 69.92... -> 69.
        assertEquals(69, f.maxConcurrent().getAsLong());
        assertTrue(f.costPerCall().isEmpty());
    }

    /** Every key present in a footprint is one Coverage says the target computes, and no other. */
    @Test
    void coverageNamesExactlyTheFiguresAFootprintHas() {
        List<Target> targets = new ArrayList<>();
        targets.add(Target.ofTokenizer("tokens", "o200k_base"));
        targets.add(Targets.priced(1, 0.5, 2, 1024, 100));
        targets.add(Targets.device(Targets.model(1e9, 16, 8, 4, 64), 8, 8, Targets.device(4, 0.5, 10, 50, 0.5)));
        targets.add(new Target("partial", "o200k_base", Optional.empty(), Optional.empty(), 0, 0,
                OptionalDouble.empty(), OptionalInt.of(10), Optional.of(Targets.model(1e9, 16, 8, 4, 64)),
                OptionalDouble.empty(), OptionalDouble.of(16),
                Optional.of(new Device("memory only", OptionalDouble.of(8), OptionalDouble.empty(),
                        OptionalDouble.empty(), OptionalDouble.empty(), OptionalDouble.empty()))));
        targets.add(new Target("server", "o200k_base", Optional.empty(), Optional.of(PrefixCache.blocks(16)), 0, 0,
                OptionalDouble.empty(), OptionalInt.empty()));
        for (Target target : targets) {
            Footprint f = Footprints.estimate(target, CallSize.of(100, 10));
            List<String> present = new ArrayList<>(List.of("input_tokens", "framing_tokens"));
            addIf(present, "static_prefix_tokens", f.caching().isPresent());
            addIf(present, "cacheable_prefix_tokens", f.caching().isPresent());
            addIf(present, "cache_hit_rate", f.caching().filter(Footprint.Caching::hitRateKnown).isPresent());
            addIf(present, "cached_input_tokens", f.cachedInputTokens().isPresent());
            addIf(present, "cost_per_call", f.costPerCall().isPresent());
            addIf(present, "cost_per_month", f.costPerMonth().isPresent());
            addIf(present, "cost_per_month_uncached", f.costPerMonthUncached().isPresent());
            addIf(present, "currency", f.currency().isPresent());
            Optional<Footprint.Load> load = f.load();
            addIf(present, "params_total", load.isPresent());
            addIf(present, "params_active", load.isPresent());
            addIf(present, "prefill_flops", f.prefillFlops().isPresent());
            addIf(present, "prefill_ms", f.prefillMillis().isPresent());
            addIf(present, "decode_ms_per_token", f.decodeMillisPerToken().isPresent());
            addIf(present, "tokens_per_second", load.isPresent() && load.get().tokensPerSecond().isPresent());
            addIf(present, "time_to_first_token_ms", load.isPresent()
                    && load.get().timeToFirstTokenMillis().isPresent());
            addIf(present, "weight_bytes", f.weightBytes().isPresent());
            addIf(present, "kv_bytes_per_token", f.kvBytesPerToken().isPresent());
            addIf(present, "kv_cache_bytes", f.kvCacheBytes().isPresent());
            addIf(present, "max_concurrent", f.maxConcurrent().isPresent());
            addIf(present, "context_limit", load.isPresent() && load.get().contextLimit().isPresent());
            addIf(present, "concurrency", load.isPresent());
            addIf(present, "decode_bytes_per_step", load.isPresent() && load.get().decodeBytesPerStep().isPresent());
            addIf(present, "tokens_per_second_total", load.isPresent()
                    && load.get().tokensPerSecondTotal().isPresent());
            addIf(present, "end_to_end_ms", load.isPresent() && load.get().endToEndMillis().isPresent());
            assertEquals(Coverage.of(target).computes(), present, target.name());
        }
        Coverage partial = Coverage.of(targets.get(3));
        assertEquals(List.of("weight_bits"), partial.missing().get("weight_bytes"));
        assertEquals(List.of("weight_bits", "device.usable_fraction"),
                partial.missing().get("max_concurrent"));
        assertEquals(List.of("weight_bits", "device.peak_tflops", "device.efficiency", "device.bandwidth_gbps"),
                partial.missing().get("prefill_ms"));
        assertFalse(Coverage.of(targets.get(0)).outputConfigured());
    }

    private static void addIf(List<String> keys, String key, boolean present) {
        if (present) {
            keys.add(key);
        }
    }
}
