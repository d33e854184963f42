package dev.tare.calibrate;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.TareException;
import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/** The fit recovers constants that generated synthetic usage: exactly without noise, closely with it. */
class CalibratorTest {
    private static final Calibration TRUTH = new Calibration(1.25, 4, 3, 9);

    /** Samples whose reported counts follow {@code truth}, each perturbed by up to ±{@code noise} (a fraction). */
    private static UsageLog synthetic(int count, double noise, long seed, boolean tools) {
        SplittableRandom random = new SplittableRandom(seed);
        List<UsageSample> samples = new ArrayList<>();
        for (int i = 0; i < count; i++) {
            int text = 4 * random.nextInt(20, 2000);
            int messages = random.nextInt(1, 8);
            int toolCount = tools ? random.nextInt(0, 6) : 0;
            double exact = TRUTH.predict(new UsageSample(i, text, messages, toolCount, 1));
            double perturbed = exact * (1 + noise * (2 * random.nextDouble() - 1));
            samples.add(new UsageSample(i + 1, text, messages, toolCount, (int) Math.round(perturbed)));
        }
        return new UsageLog("usage.jsonl", samples, List.of());
    }

    @Test
    void withoutNoiseTheConstantsComeBackExactly() {
        CalibrationResult result = new Calibrator().fit("t", synthetic(40, 0, 7, true), Calibration.NONE);
        assertEquals(4, result.fit().messageOverheadTokens());
        assertEquals(3, result.fit().replyOverheadTokens());
        assertEquals(9, result.fit().toolOverheadTokens());
        assertEquals(1.25, result.fit().scale(), 1e-12);
        assertEquals(0.0, result.errorAfter().maxAbsPercent(), 1e-9);
        assertTrue(result.errorBefore().meanAbsPercent() > 10, "the uncalibrated count is well off");
    }

    @Test
    void withBoundedNoiseTheConstantsComeBackWithinTolerance() {
        // ±1% noise on each reported count; tolerance: scale within 0.01, per-message and per-tool
        // overheads within 2 tokens, the per-call intercept (which the noise on large calls swamps) within 3.
        CalibrationResult result = new Calibrator().fit("t", synthetic(400, 0.01, 11, true), Calibration.NONE);
        assertEquals(1.25, result.fit().scale(), 0.01);
        assertEquals(4, result.fit().messageOverheadTokens(), 2);
        assertEquals(3, result.fit().replyOverheadTokens(), 3);
        assertEquals(9, result.fit().toolOverheadTokens(), 2);
        assertTrue(result.errorAfter().meanAbsPercent() < 1.0, "mean error after the fit: " + result.errorAfter());
        assertTrue(result.errorAfter().meanAbsPercent() < result.errorBefore().meanAbsPercent() / 10, result.toString());
    }

    @Test
    void withoutToolsTheToolOverheadIsKeptAndSaidSo() {
        CalibrationResult result = new Calibrator().fit("t", synthetic(30, 0, 3, false), new Calibration(1, 0, 0, 6));
        assertEquals(6, result.fit().toolOverheadTokens());
        assertEquals(List.of("tool_overhead_tokens kept at 6: no sample sends tools"), result.notes());
    }

    @Test
    void refusesTooFewSamples() {
        TareException e = assertThrows(TareException.class,
                () -> new Calibrator().fit("t", synthetic(3, 0, 1, true), Calibration.NONE));
        assertEquals("usage.jsonl: 3 usable samples; fitting 4 constants needs at least 5", e.getMessage());
    }

    @Test
    void refusesWhenEverySampleHasTheSameMessageCountNamingTheConstants() {
        List<UsageSample> samples = new ArrayList<>();
        for (int i = 0; i < 10; i++) {
            samples.add(new UsageSample(i + 1, 100 + 37 * i, 2, 0, 200 + 40 * i));
        }
        TareException e = assertThrows(TareException.class,
                () -> new Calibrator().fit("t", new UsageLog("u.jsonl", samples, List.of()), Calibration.NONE));
        assertEquals("u.jsonl: these samples cannot tell message_overhead_tokens and reply_overhead_tokens apart"
                + " (every sample has 2 messages); add samples that differ in message count", e.getMessage());
    }
}
