package dev.tare.footprint;

import java.util.OptionalDouble;

/**
 * What a hosted target charges, per million tokens.
 *
 * @param inputPerMillion       uncached input tokens
 * @param cachedInputPerMillion input tokens served from the provider's prefix cache, when it has one
 * @param outputPerMillion      output tokens
 * @param currency              the currency code shown beside amounts
 */
public record Price(double inputPerMillion, OptionalDouble cachedInputPerMillion, double outputPerMillion,
                    String currency) {
}
