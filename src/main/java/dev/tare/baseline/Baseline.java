package dev.tare.baseline;

import dev.tare.scan.ScanResult;
import dev.tare.scan.ScannedTemplate;
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

    /** The counts of a scan, partials left out (their tokens are inside their includers'). */
    public static Baseline of(ScanResult scan) {
        Map<String, Map<String, Integer>> tokens = new TreeMap<>();
        for (ScannedTemplate template : scan.templates()) {
            if (!template.countsInTotals()) {
                continue;
            }
            Map<String, Integer> byTarget = new TreeMap<>();
            if (scan.targets().isEmpty()) {
                byTarget.put(scan.tokenizer(), template.estimatedTokens());
            }
            byTarget.putAll(template.estimatedByTarget());
            tokens.put(template.path(), byTarget);
        }
        return new Baseline(tokens);
    }
}
