package dev.tare.overlap;

import java.util.OptionalDouble;

/**
 * How one template's leading static tokens are shared with other templates on one target with a
 * prefix cache, as its text stands and as it would be with its per-call parts after its static
 * parts. Token counts are counted; the money is a planning estimate.
 *
 * @param sharedTokens            the longest run of leading static tokens the template shares with
 *                                another template on the target, whatever its length
 * @param cachedTokens            {@code sharedTokens} when it reaches the target's
 *                                {@code prefix_cache_min_tokens}, else 0: the design's cached input tokens
 * @param reorderedSharedTokens   the same as {@code sharedTokens}, with every template's variables moved
 *                                after its static text
 * @param reorderedCachedTokens   the same as {@code cachedTokens}, with every template's variables moved
 *                                after its static text
 * @param savingPerMonth          what caching {@code cachedTokens} saves per month at the target's traffic,
 *                                when the target is priced and has {@code calls_per_day}
 * @param reorderedSavingPerMonth what caching {@code reorderedCachedTokens} would save per month
 */
public record PrefixShare(int sharedTokens, int cachedTokens, int reorderedSharedTokens, int reorderedCachedTokens,
                          OptionalDouble savingPerMonth, OptionalDouble reorderedSavingPerMonth) {
}
