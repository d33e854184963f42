package dev.tare.app;

import dev.tare.lint.Severity;

/**
 * What a check is asked for.
 *
 * @param failOn the severity at or above which the check fails
 * @param cache  whether to reuse, and keep, what earlier checks found in unchanged files (under
 *               {@code .tare/cache}; see {@link Check#run(CheckOptions)})
 */
public record CheckOptions(Severity failOn, boolean cache) {
    /** Fail on errors only; no cache. */
    public static CheckOptions defaults() {
        return new CheckOptions(Severity.ERROR, false);
    }
}
