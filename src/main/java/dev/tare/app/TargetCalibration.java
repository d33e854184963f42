package dev.tare.app;

import dev.tare.TareException;
import dev.tare.calibrate.Calibration;
import dev.tare.calibrate.CalibrationResult;
import dev.tare.calibrate.Calibrator;
import dev.tare.calibrate.UsageLog;
import dev.tare.calibrate.UsageLogReader;
import dev.tare.footprint.Target;
import dev.tare.tokenize.TokenizerRegistry;
import dev.tare.workspace.Workspace;
import java.io.BufferedReader;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.List;

/** Fits one configured target's scale and framing overheads to a usage log the provider reported. */
public final class TargetCalibration {
    private TargetCalibration() {
    }

    /**
     * What fitting gave, and one message per line of the log that could not be used.
     *
     * @param result   the fitted values and the error before and after
     * @param problems {@code FILE, line N: reason} for every unusable line
     */
    public record Fit(CalibrationResult result, List<String> problems) {
        public Fit {
            problems = List.copyOf(problems);
        }
    }

    /**
     * Fits the target called {@code targetName} in {@code workspace} to the log at {@code log}.
     *
     * @throws TareException when the log cannot be read or has no usable line
     */
    public static Fit fit(Workspace workspace, String targetName, Path log) {
        Target target = workspace.config().target(targetName);
        UsageLogReader reader = new UsageLogReader(new TokenizerRegistry().get(target.tokenizer(), workspace.root()));
        UsageLog usage;
        try (BufferedReader in = Files.newBufferedReader(log, StandardCharsets.UTF_8)) {
            usage = reader.read(in, log.toString());
        } catch (NoSuchFileException e) {
            throw new TareException(log + ": no such file; give the path of a usage log");
        } catch (IOException e) {
            throw new TareException(log + ": cannot be read (" + e.getMessage() + ")", e);
        }
        if (usage.samples().isEmpty()) {
            throw new TareException(log + ": no usable line; each line needs messages and reported_input_tokens");
        }
        Calibration before = new Calibration(target.scale(), target.messageOverheadTokens(),
                target.replyOverheadTokens(), target.toolOverheadTokens());
        List<String> problems = usage.problems().stream().map(problem -> log + ", " + problem).toList();
        return new Fit(new Calibrator().fit(targetName, usage, before), problems);
    }
}
