package dev.tare.scan;

import java.util.List;
import java.util.Optional;

/**
 * What a scan is asked for.
 *
 * @param targets   target names to measure on; all configured targets when empty
 * @param tokenizer the primary tokenizer, overriding the first target's (and the default)
 */
public record ScanOptions(List<String> targets, Optional<String> tokenizer) {
    public ScanOptions {
        targets = List.copyOf(targets);
    }

    /** All targets, the default primary tokenizer. */
    public static ScanOptions defaults() {
        return new ScanOptions(List.of(), Optional.empty());
    }
}
