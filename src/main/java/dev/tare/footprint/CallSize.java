package dev.tare.footprint;

/**
 * The token counts of one call, which the footprint is estimated from.
 *
 * @param inputTokens       tokens sent (I), framing included
 * @param framingTokens     the part of {@code inputTokens} that is chat framing
 * @param outputTokens      tokens generated (O)
 * @param staticPrefixTokens P: the leading input tokens every call sends alike (tool definitions, then
 *                           the messages with their framing, up to the first per-call part), which a
 *                           target's prefix cache can hold
 */
public record CallSize(int inputTokens, int framingTokens, int outputTokens, int staticPrefixTokens) {
    public CallSize {
        if (inputTokens < 0 || framingTokens < 0 || outputTokens < 0 || staticPrefixTokens < 0) {
            throw new IllegalArgumentException("token counts cannot be negative");
        }
    }

    /** A call of {@code inputTokens} with no framing and no static prefix. */
    public static CallSize of(int inputTokens, int outputTokens) {
        return new CallSize(inputTokens, 0, outputTokens, 0);
    }

    /** The same call with a static prefix of {@code tokens} (at most the whole input). */
    public CallSize withStaticPrefix(int tokens) {
        return new CallSize(inputTokens, framingTokens, outputTokens, Math.min(tokens, inputTokens));
    }
}
