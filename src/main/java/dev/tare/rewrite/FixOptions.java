package dev.tare.rewrite;

import java.util.Set;
import java.util.TreeSet;

/**
 * What a fix is asked for.
 *
 * @param includeReview whether review-class rewrites are applied as well as safe ones
 * @param only          the ids of the rules whose rewrites are applied; empty for every rule
 * @param dryRun        whether to plan and verify only, writing nothing
 */
public record FixOptions(boolean includeReview, Set<String> only, boolean dryRun) {
    public FixOptions {
        only = java.util.Collections.unmodifiableSet(new TreeSet<>(only));
    }

    /** Safe rewrites of every rule, written to the files. */
    public static FixOptions defaults() {
        return new FixOptions(false, Set.of(), false);
    }
}
