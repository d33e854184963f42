package dev.tare.footprint;

/**
 * The token counts of one call, which the footprint is estimated from.
 *
 * @param inputTokens       tokens sent (I), framing included
 * @param framingTokens     the part of {@code inputTokens} that is chat framing
 * @param outputTokens      tokens generated (O)
 * @param sharedPrefixTokens leading input tokens shared with other prompts on the same target; they
 *                          count as cached only on a target with a prefix cache and only when at
 *                          least its {@code prefix_cache_min_tokens}
 */
public record CallSize(int inputTokens, int framingTokens, int outputTokens, int sharedPrefixTokens) {
    public CallSize {
        if (inputTokens < 0 || framingTokens < 0 || outputTokens < 0 || sharedPrefixTokens < 0) {
            throw new IllegalArgumentException("token counts cannot be negative");
        }
    }

    /** A call of {@code inputTokens} with no framing and no shared prefix. */
    public static CallSize of(int inputTokens, int outputTokens) {
        return new CallSize(inputTokens, 0, outputTokens, 0);
    }
}
