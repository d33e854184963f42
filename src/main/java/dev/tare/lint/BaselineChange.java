package dev.tare.lint;

/**
 * How one template's count on one target moved since the baseline.
 *
 * @param path     the template
 * @param target   the target (or tokenizer) name
 * @param recorded the baseline's count
 * @param current  the count now
 * @param overTolerance whether it grew by more than the configured tolerance
 */
public record BaselineChange(String path, String target, int recorded, int current, boolean overTolerance) {

    /** The growth in percent of the recorded count (infinite from zero). */
    public double percent() {
        if (recorded == 0) {
            return current == 0 ? 0 : Double.POSITIVE_INFINITY;
        }
        return (current - recorded) * 100.0 / recorded;
    }

    /** Whether the count went up. */
    public boolean grew() {
        return current > recorded;
    }
}
