package dev.tare.app;

import java.util.List;
import java.util.Optional;

/**
 * What a scan is asked for.
 *
 * @param targets   target names to measure on; all configured targets when empty
 * @param tokenizer the primary tokenizer, overriding the first target's (and the default)
 * @param cache     whether to reuse and keep measurements in the repository's {@code .tare/cache}
 */
public record ScanOptions(List<String> targets, Optional<String> tokenizer, boolean cache) {
    public ScanOptions {
        targets = List.copyOf(targets);
    }

    /** All targets, the default primary tokenizer, no cache. */
    public static ScanOptions defaults() {
        return new ScanOptions(List.of(), Optional.empty(), false);
    }

    /** Options for the given targets and tokenizer, no cache. */
    public ScanOptions(List<String> targets, Optional<String> tokenizer) {
        this(targets, tokenizer, false);
    }
}
