package dev.tare.config;

import java.util.Collection;
import java.util.Comparator;
import java.util.Optional;
import org.apache.commons.text.similarity.LevenshteinDistance;

/**
 * The name a mistyped key, rule, command, option or tokenizer most likely meant: one it begins, else
 * the nearest by edit distance, when at most two edits or a third of its length away.
 */
public final class Suggestion {
    private static final LevenshteinDistance DISTANCE = LevenshteinDistance.getDefaultInstance();

    private Suggestion() {
    }

    /**
     * The known name nearest to {@code typed}, if near enough; ties go to the first in name order. A
     * name that {@code typed} begins (three characters or more, as {@code o200k} for
     * {@code o200k_base}) is nearest of all.
     */
    public static Optional<String> nearest(String typed, Collection<String> known) {
        Optional<String> completed = typed.length() < 3 ? Optional.empty()
                : known.stream().filter(k -> k.startsWith(typed)).sorted().findFirst();
        if (completed.isPresent()) {
            return completed;
        }
        return known.stream()
                .min(Comparator.comparingInt((String k) -> DISTANCE.apply(typed, k)).thenComparing(k -> k))
                .filter(k -> DISTANCE.apply(typed, k) <= Math.max(2, typed.length() / 3));
    }

    /** {@code "; did you mean 'x'?"} for the nearest known name, or nothing when none is near. */
    public static String didYouMean(String typed, Collection<String> known) {
        return nearest(typed, known).map(k -> "; did you mean '" + k + "'?").orElse("");
    }
}
