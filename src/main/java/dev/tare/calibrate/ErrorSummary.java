package dev.tare.calibrate;

import java.util.List;

/**
 * How far predictions are from reported usage, in absolute percent of the reported value.
 *
 * @param meanAbsPercent the mean absolute percentage error
 * @param maxAbsPercent  the worst absolute percentage error
 */
public record ErrorSummary(double meanAbsPercent, double maxAbsPercent) {

    /** The errors of {@code calibration}'s predictions over {@code samples}. */
    static ErrorSummary of(Calibration calibration, List<UsageSample> samples) {
        double sum = 0;
        double max = 0;
        for (UsageSample sample : samples) {
            double error = Math.abs(calibration.predict(sample) - sample.reportedInputTokens()) * 100.0
                    / sample.reportedInputTokens();
            sum += error;
            max = Math.max(max, error);
        }
        return new ErrorSummary(samples.isEmpty() ? 0 : sum / samples.size(), max);
    }
}
