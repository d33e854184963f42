package dev.tare.footprint;

import java.util.OptionalDouble;

/**
 * What a hosted target charges, per million tokens.
 *
 * @param inputPerMillion       uncached input tokens
 * @param cachedInputPerMillion input tokens read from the provider's prefix cache, when it has one
 * @param cacheWritePerMillion  input tokens written to the prefix cache, when the provider charges a
 *                              premium for that; otherwise they cost the input price
 * @param outputPerMillion      output tokens
 * @param currency              the currency code shown beside amounts
 */
public record Price(double inputPerMillion, OptionalDouble cachedInputPerMillion, OptionalDouble cacheWritePerMillion,
                    double outputPerMillion, String currency) {

    /** A price without a cache-write premium. */
    public Price(double inputPerMillion, OptionalDouble cachedInputPerMillion, double outputPerMillion, String currency) {
        this(inputPerMillion, cachedInputPerMillion, OptionalDouble.empty(), outputPerMillion, currency);
    }

    /** The price of a cached input token: the cached price, else the input price. */
    public double cachedInput() {
        return cachedInputPerMillion.orElse(inputPerMillion);
    }

    /** The price of writing an input token to the cache: the write price, else the input price. */
    public double cacheWrite() {
        return cacheWritePerMillion.orElse(inputPerMillion);
    }
}
