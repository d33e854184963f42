package dev.tare.lint;

/**
 * What a check is asked for.
 *
 * @param failOn the severity at or above which the check fails
 */
public record CheckOptions(Severity failOn) {
    /** Fail on errors only. */
    public static CheckOptions defaults() {
        return new CheckOptions(Severity.ERROR);
    }
}
