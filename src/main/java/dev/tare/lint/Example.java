package dev.tare.lint;

import java.util.Map;
import java.util.TreeMap;

/**
 * One worked example of a rule, shown by {@code tare explain} and run as a test: the rule must flag
 * {@code before}, must not flag {@code after}, and when it offers rewrites, applying them all to
 * {@code before} must give exactly {@code after}.
 *
 * @param before   a template the rule flags
 * @param after    what to write instead
 * @param settings target settings the example assumes, by their {@code tare.yaml} key: the keys
 *                 understood are {@value #PREFIX_CACHE_MIN_TOKENS}, {@value #BASELINE_TOKENS} and
 *                 {@value #SHARED_BLOCK_TOKENS}
 */
public record Example(String before, String after, Map<String, Integer> settings) {
    /** The setting that stands in for the target's shortest cacheable prefix. */
    public static final String PREFIX_CACHE_MIN_TOKENS = "prefix_cache.min_tokens";
    /** The setting that stands in for the template's count in a committed baseline, on the default tokenizer. */
    public static final String BASELINE_TOKENS = "baseline_tokens";
    /** The setting that stands in for {@code rules.limits.shared_block_tokens}. */
    public static final String SHARED_BLOCK_TOKENS = "shared_block_tokens";

    public Example {
        settings = java.util.Collections.unmodifiableMap(new TreeMap<>(settings));
        for (String key : settings.keySet()) {
            if (!key.equals(PREFIX_CACHE_MIN_TOKENS) && !key.equals(BASELINE_TOKENS) && !key.equals(SHARED_BLOCK_TOKENS)) {
                throw new IllegalArgumentException("unknown example setting " + key);
            }
        }
    }

    /** An example that assumes no settings. */
    public static Example of(String before, String after) {
        return new Example(before, after, Map.of());
    }
}
