package dev.tare.lint;

import java.util.Collections;
import java.util.Map;
import java.util.TreeMap;

/**
 * Recorded token counts: for each template path, the estimated tokens on each target (on the
 * primary tokenizer, under its name, when no target is configured). Sorted, so that the file it is
 * written to changes only where a count changed.
 *
 * @param tokens path to target name to estimated tokens
 */
public record Baseline(Map<String, Map<String, Integer>> tokens) {
    public Baseline {
        TreeMap<String, Map<String, Integer>> sorted = new TreeMap<>();
        tokens.forEach((path, byTarget) -> sorted.put(path, Collections.unmodifiableMap(new TreeMap<>(byTarget))));
        tokens = Collections.unmodifiableMap(sorted);
    }
}
