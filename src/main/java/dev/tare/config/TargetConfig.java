package dev.tare.config;

import dev.tare.footprint.Device;
import dev.tare.footprint.ModelShape;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.OptionalInt;

/**
 * One deployment target as configured: the tokenizer its model reads with, and what is known of
 * its price and traffic, or of the model shape, precisions and device it runs on.
 *
 * @param name                  the name used with {@code --target} and in front matter
 * @param tokenizer             a built-in encoding name or a path to a {@code tokenizer.json}
 * @param price                 per-million-token prices, for hosted targets
 * @param prefixCacheMinTokens  the shortest prefix the provider caches
 * @param messageOverheadTokens framing tokens the chat format adds per message
 * @param replyOverheadTokens   framing tokens the chat format adds per call, priming the reply
 * @param callsPerDay           traffic, for monthly figures
 * @param outputTokens          output tokens expected per call
 * @param model                 the model's shape, for self-run targets
 * @param weightBits            bits per weight as served
 * @param kvBits                bits per KV-cache value as served
 * @param device                the hardware the model is served from
 */
public record TargetConfig(String name, String tokenizer, Optional<Price> price, OptionalInt prefixCacheMinTokens,
                           int messageOverheadTokens, int replyOverheadTokens, OptionalDouble callsPerDay,
                           OptionalInt outputTokens, Optional<ModelShape> model, OptionalDouble weightBits,
                           OptionalDouble kvBits, Optional<Device> device) {

    /** A target without a model or device: priced, or tokens only. */
    public TargetConfig(String name, String tokenizer, Optional<Price> price, OptionalInt prefixCacheMinTokens,
                        int messageOverheadTokens, int replyOverheadTokens, OptionalDouble callsPerDay,
                        OptionalInt outputTokens) {
        this(name, tokenizer, price, prefixCacheMinTokens, messageOverheadTokens, replyOverheadTokens, callsPerDay,
                outputTokens, Optional.empty(), OptionalDouble.empty(), OptionalDouble.empty(), Optional.empty());
    }

    /** A target that names only a tokenizer. */
    public static TargetConfig ofTokenizer(String name, String tokenizer) {
        return new TargetConfig(name, tokenizer, Optional.empty(), OptionalInt.empty(), 0, 0, OptionalDouble.empty(),
                OptionalInt.empty());
    }
}
