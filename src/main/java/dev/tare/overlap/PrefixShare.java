package dev.tare.overlap;

import java.util.OptionalDouble;

/**
 * A template's static prefix on a target with a prefix cache, beside its footprint (which holds the
 * prefix as written, its cacheable part, hit rate and costs): what the cache saves, and what it would
 * save with every template's per-call parts after its static parts. Token counts are counted; the
 * money is a planning estimate.
 *
 * @param reorderedStaticPrefixTokens the static prefix with the per-call parts last
 * @param savingPerMonth              the monthly cost without the cache less the expected one with it,
 *                                    when the target is priced and the traffic known
 * @param reorderedSavingPerMonth     the same with every template's per-call parts last
 */
public record PrefixShare(int reorderedStaticPrefixTokens, OptionalDouble savingPerMonth,
                          OptionalDouble reorderedSavingPerMonth) {
}
