package dev.tare.footprint;

import java.util.OptionalDouble;

/**
 * A target's prefix cache: the leading tokens a call shares with calls before it are read from the
 * cache instead of being computed again (design.md, "Prefix caching").
 *
 * <p>A provider's cache (hosted) takes a prefix from {@code minTokens} on, in steps of
 * {@code stepTokens}, and keeps an entry {@code ttlSeconds} after its last use. A server's cache
 * (self-hosted) keeps whole blocks of the KV cache: minimum and step are the block size, and it has
 * no time to live of its own (blocks stay while memory allows).
 *
 * @param minTokens  the shortest prefix cached
 * @param stepTokens the granularity above the minimum
 * @param ttlSeconds how long an entry lives after its last use, for a provider's cache
 */
public record PrefixCache(int minTokens, int stepTokens, OptionalDouble ttlSeconds) {
    public PrefixCache {
        if (minTokens < 1 || stepTokens < 1) {
            throw new IllegalArgumentException("a prefix cache's minimum and step are at least 1 token");
        }
        if (ttlSeconds.isPresent() && !(ttlSeconds.getAsDouble() > 0)) {
            throw new IllegalArgumentException("a prefix cache's time to live is above 0 seconds");
        }
    }

    /** A server's cache of whole KV blocks of {@code blockTokens} tokens. */
    public static PrefixCache blocks(int blockTokens) {
        return new PrefixCache(blockTokens, blockTokens, OptionalDouble.empty());
    }

    /** C: the part of a static prefix of {@code prefixTokens} that this cache holds. */
    public int cacheable(int prefixTokens) {
        return Formulas.cacheableTokens(prefixTokens, minTokens, stepTokens);
    }

    /**
     * h: the share of calls that find the prefix in the cache when every template sharing it is
     * called {@code callsPerDay} times a day in all; 1 for a server's cache, which keeps it.
     */
    public double hitRate(double callsPerDay) {
        return ttlSeconds.isPresent() ? Formulas.hitRate(callsPerDay, ttlSeconds.getAsDouble()) : 1;
    }
}
