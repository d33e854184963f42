package dev.tare.report;

import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.tare.calibrate.Calibration;
import dev.tare.calibrate.CalibrationResult;
import dev.tare.calibrate.ErrorSummary;
import java.util.Locale;

/** Renders a fitted calibration: a YAML snippet to paste and the errors before and after. */
public final class CalibrationReport {
    private CalibrationReport() {
    }

    /** The text a person reads: the fit as {@code tare.yaml} lines, then the error it removes. */
    public static String text(CalibrationResult result) {
        Calibration fit = result.fit();
        StringBuilder out = new StringBuilder();
        out.append("Calibration of target '").append(result.target()).append("' from ").append(result.samples())
                .append(" samples. Paste into the target's entry in tare.yaml:\n\n");
        out.append("    scale: ").append(String.format(Locale.ROOT, "%.4f", fit.scale())).append('\n');
        out.append("    message_overhead_tokens: ").append(fit.messageOverheadTokens()).append('\n');
        out.append("    reply_overhead_tokens: ").append(fit.replyOverheadTokens()).append('\n');
        out.append("    tool_overhead_tokens: ").append(fit.toolOverheadTokens()).append("\n\n");
        out.append("Error against reported input tokens    mean    worst\n");
        out.append(row("before (current settings)", result.errorBefore()));
        out.append(row("after (fitted values)", result.errorAfter()));
        for (String note : result.notes()) {
            out.append("Note: ").append(note).append('\n');
        }
        out.append("Counts scaled this way are calibrated estimates of what the provider bills, not its count.\n");
        return out.toString();
    }

    private static String row(String label, ErrorSummary error) {
        return String.format(Locale.ROOT, "  %-34s %6.2f%% %7.2f%%%n", label, error.meanAbsPercent(), error.maxAbsPercent());
    }

    /** The JSON document: target, samples, fit, error_before, error_after. */
    public static String json(CalibrationResult result) {
        ObjectNode root = Json.report();
        root.put("target", result.target());
        root.put("samples", result.samples());
        ObjectNode fit = root.putObject("fit");
        fit.put("scale", result.fit().scale());
        fit.put("message_overhead_tokens", result.fit().messageOverheadTokens());
        fit.put("reply_overhead_tokens", result.fit().replyOverheadTokens());
        fit.put("tool_overhead_tokens", result.fit().toolOverheadTokens());
        error(root.putObject("error_before"), result.errorBefore());
        error(root.putObject("error_after"), result.errorAfter());
        result.notes().forEach(root.putArray("notes")::add);
        return Json.write(root);
    }

    private static void error(ObjectNode node, ErrorSummary error) {
        node.put("mean_abs_percent", error.meanAbsPercent());
        node.put("max_abs_percent", error.maxAbsPercent());
    }
}
