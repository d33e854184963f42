package dev.tare.calibrate;

import java.util.List;

/**
 * A fitted calibration with the errors it removes.
 *
 * @param target  the target it was fitted for
 * @param samples how many samples the fit used
 * @param before  the calibration in force before (from the target's configuration)
 * @param fit     the fitted calibration, overheads rounded to whole tokens
 * @param errorBefore the prediction errors with {@code before}
 * @param errorAfter  the prediction errors with {@code fit}
 * @param notes   what the fit could not determine and kept, in words
 */
public record CalibrationResult(String target, int samples, Calibration before, Calibration fit,
                                ErrorSummary errorBefore, ErrorSummary errorAfter, List<String> notes) {
    public CalibrationResult {
        notes = List.copyOf(notes);
    }
}
