package dev.tare.cli;

import dev.tare.app.TargetCalibration;
import dev.tare.calibrate.CalibrationResult;
import dev.tare.report.CalibrationReport;
import dev.tare.workspace.Workspace;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/** {@code tare calibrate}: fits a target's scale and overheads to the usage a provider reported. */
@Command(name = "calibrate", mixinStandardHelpOptions = true, addMethodSubcommands = false,
        description = {"Fits a target's scale and framing overheads, by least squares, to input-token counts a provider"
                + " reported. Each line of the log is {\"messages\": [{role, content}], \"tools\": [...], \"reported_input_tokens\": N}.",
                "Prints the fitted values as lines to paste into tare.yaml, and the error before and after the fit."})
final class CalibrateCommand implements Callable<Integer> {
    enum Format { text, json }

    @Spec
    private CommandSpec spec;

    @Mixin
    private CommonOptions common;

    @Option(names = "--target", paramLabel = "NAME", required = true, description = "The configured target to fit.")
    private String target;

    @Parameters(paramLabel = "FILE.jsonl", description = "Usage copied from real responses, one JSON object per line.")
    private Path log;

    @Option(names = "--format", paramLabel = "FORMAT", description = "Output format: ${COMPLETION-CANDIDATES}. Default: ${DEFAULT-VALUE}.")
    private Format format = Format.text;

    @Override
    public Integer call() {
        TargetCalibration.Fit fit = TargetCalibration.fit(Workspace.open(List.of(), common.configFile()), target, log);
        PrintWriter err = spec.commandLine().getErr();
        fit.problems().forEach(problem -> err.println("tare: " + problem + " (skipped)"));
        err.flush();
        CalibrationResult result = fit.result();
        spec.commandLine().getOut().print(format == Format.json ? CalibrationReport.json(result) : CalibrationReport.text(result));
        spec.commandLine().getOut().flush();
        return ExitCodes.OK;
    }
}
