package dev.tare.config;

import java.util.Optional;
import java.util.OptionalDouble;
import java.util.OptionalInt;

/**
 * One deployment target as configured: the tokenizer its model reads with, and what is known of
 * its price and traffic.
 *
 * @param name                  the name used with {@code --target} and in front matter
 * @param tokenizer             a built-in encoding name or a path to a {@code tokenizer.json}
 * @param price                 per-million-token prices, for hosted targets
 * @param prefixCacheMinTokens  the shortest prefix the provider caches
 * @param messageOverheadTokens framing tokens the chat format adds per message
 * @param replyOverheadTokens   framing tokens the chat format adds per call, priming the reply
 * @param callsPerDay           traffic, for monthly figures
 * @param outputTokens          output tokens expected per call
 */
public record TargetConfig(String name, String tokenizer, Optional<Price> price, OptionalInt prefixCacheMinTokens,
                           int messageOverheadTokens, int replyOverheadTokens, OptionalDouble callsPerDay,
                           OptionalInt outputTokens) {

    /** A target that names only a tokenizer. */
    public static TargetConfig ofTokenizer(String name, String tokenizer) {
        return new TargetConfig(name, tokenizer, Optional.empty(), OptionalInt.empty(), 0, 0, OptionalDouble.empty(),
                OptionalInt.empty());
    }
}
