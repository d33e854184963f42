package dev.tare.calibrate;

import dev.tare.TareException;
import java.util.ArrayList;
import java.util.List;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.ArrayRealVector;
import org.apache.commons.math3.linear.QRDecomposition;
import org.apache.commons.math3.linear.RealMatrix;
import org.apache.commons.math3.linear.RealVector;
import org.apache.commons.math3.linear.SingularValueDecomposition;

/**
 * Fits a {@link Calibration} to reported usage by ordinary least squares over the columns
 * text tokens, messages, one (the per-call reply overhead) and tools. The solve is Commons Math's
 * QR decomposition; an SVD of the column-normalised design tells which constants the samples cannot
 * tell apart, and the fit is then refused naming them. Overheads become whole tokens (the form
 * {@code tare.yaml} takes): of the roundings down and up of each, the one whose refitted scale leaves
 * the least squared error is kept, so the reported error is the error of the values a user pastes.
 */
public final class Calibrator {
    private static final String[] NAMES = {"scale", "message_overhead_tokens", "reply_overhead_tokens", "tool_overhead_tokens"};
    /** Singular values this small, relative to the largest, mean a direction the samples do not determine. */
    private static final double RANK_TOLERANCE = 1e-9;

    /**
     * Fits {@code log} for {@code target}, starting from {@code before}.
     *
     * @throws TareException when there are too few samples or the samples cannot determine the constants
     */
    public CalibrationResult fit(String target, UsageLog log, Calibration before) {
        List<UsageSample> samples = log.samples();
        boolean anyTools = samples.stream().anyMatch(s -> s.tools() > 0);
        int columns = anyTools ? 4 : 3;
        if (samples.size() < columns + 1) {
            throw new TareException(log.file() + ": " + samples.size() + " usable sample" + (samples.size() == 1 ? "" : "s")
                    + "; fitting " + columns + " constants needs at least " + (columns + 1));
        }
        RealMatrix design = new Array2DRowRealMatrix(samples.size(), columns);
        RealVector reported = new ArrayRealVector(samples.size());
        for (int i = 0; i < samples.size(); i++) {
            UsageSample sample = samples.get(i);
            design.setEntry(i, 0, sample.textTokens());
            design.setEntry(i, 1, sample.messages());
            design.setEntry(i, 2, 1.0);
            if (anyTools) {
                design.setEntry(i, 3, sample.tools());
            }
            reported.setEntry(i, sample.reportedInputTokens());
        }
        refuseIfUndetermined(log.file(), design, samples);
        double[] solved = new QRDecomposition(design).getSolver().solve(reported).toArray();

        List<String> notes = new ArrayList<>();
        double[] overheads = {solved[1], solved[2], anyTools ? solved[3] : before.toolOverheadTokens()};
        for (int k = 0; k < 3; k++) {
            if (overheads[k] < -0.5 && (k < 2 || anyTools)) {
                notes.add(NAMES[k + 1] + " fitted below zero (" + String.format(java.util.Locale.ROOT, "%.2f", overheads[k])
                        + "), set to 0");
            }
        }
        if (!anyTools) {
            notes.add(NAMES[3] + " kept at " + before.toolOverheadTokens() + ": no sample sends tools");
        }
        Calibration fit = bestWholeTokens(samples, overheads, anyTools);
        return new CalibrationResult(target, samples.size(), before, fit, ErrorSummary.of(before, samples),
                ErrorSummary.of(fit, samples), notes);
    }

    private static void refuseIfUndetermined(String file, RealMatrix design, List<UsageSample> samples) {
        RealMatrix normalised = design.copy();
        for (int c = 0; c < design.getColumnDimension(); c++) {
            double norm = design.getColumnVector(c).getNorm();
            if (norm == 0) {
                throw new TareException(file + ": every sample has zero " + (c == 0 ? "text tokens" : "tools")
                        + ", so " + NAMES[c] + " cannot be fitted");
            }
            normalised.setColumnVector(c, design.getColumnVector(c).mapDivide(norm));
        }
        SingularValueDecomposition svd = new SingularValueDecomposition(normalised);
        double[] values = svd.getSingularValues();
        RealMatrix directions = svd.getV();
        List<String> entangled = new ArrayList<>();
        for (int k = 0; k < values.length; k++) {
            if (values[k] > RANK_TOLERANCE * values[0]) {
                continue;
            }
            for (int c = 0; c < design.getColumnDimension(); c++) {
                if (Math.abs(directions.getEntry(c, k)) > 0.1 && !entangled.contains(NAMES[c])) {
                    entangled.add(NAMES[c]);
                }
            }
        }
        if (entangled.isEmpty()) {
            return;
        }
        boolean sameMessageCount = samples.stream().mapToInt(UsageSample::messages).distinct().count() == 1;
        throw new TareException(file + ": these samples cannot tell " + String.join(" and ", entangled) + " apart"
                + (sameMessageCount ? " (every sample has " + samples.get(0).messages() + " messages)" : "")
                + "; add samples that differ in " + (sameMessageCount ? "message count" : "those respects"));
    }

    /**
     * Of the whole-token overheads next to the fitted ones (each rounded down or up, never below
     * zero), the set that, with its own best scale, leaves the least squared error.
     */
    private static Calibration bestWholeTokens(List<UsageSample> samples, double[] fitted, boolean fitTools) {
        Calibration best = null;
        double bestError = Double.POSITIVE_INFINITY;
        for (int choice = 0; choice < 8; choice++) {
            int[] whole = new int[3];
            for (int k = 0; k < 3; k++) {
                boolean fixed = k == 2 && !fitTools;
                double value = fixed ? fitted[k] : ((choice >> k) & 1) == 0 ? Math.floor(fitted[k]) : Math.ceil(fitted[k]);
                whole[k] = (int) Math.max(0, value);
            }
            Calibration candidate = new Calibration(scaleWith(samples, whole[0], whole[1], whole[2]), whole[0], whole[1], whole[2]);
            double error = 0;
            for (UsageSample sample : samples) {
                double residual = candidate.predict(sample) - sample.reportedInputTokens();
                error += residual * residual;
            }
            if (error < bestError) {
                bestError = error;
                best = candidate;
            }
        }
        return best;
    }

    /** The least-squares scale once the overheads are fixed: Σ x(y − overheads) / Σ x². */
    private static double scaleWith(List<UsageSample> samples, int message, int reply, int tool) {
        double numerator = 0;
        double denominator = 0;
        for (UsageSample sample : samples) {
            double rest = sample.reportedInputTokens() - message * (double) sample.messages() - reply
                    - tool * (double) sample.tools();
            numerator += sample.textTokens() * rest;
            denominator += (double) sample.textTokens() * sample.textTokens();
        }
        return numerator / denominator;
    }
}
