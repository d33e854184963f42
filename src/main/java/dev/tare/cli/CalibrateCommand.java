package dev.tare.cli;

import dev.tare.TareException;
import dev.tare.calibrate.Calibration;
import dev.tare.calibrate.CalibrationResult;
import dev.tare.calibrate.Calibrator;
import dev.tare.calibrate.UsageLog;
import dev.tare.calibrate.UsageLogReader;
import dev.tare.config.TargetConfig;
import dev.tare.report.CalibrationReport;
import dev.tare.scan.Workspace;
import dev.tare.tokenize.TokenizerRegistry;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;

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
        Workspace workspace = Workspace.open(List.of(), common.configFile());
        TargetConfig config = workspace.config().target(target);
        UsageLog usage = new UsageLogReader(new TokenizerRegistry().get(config.tokenizer(), workspace.root())).read(log);
        PrintWriter err = spec.commandLine().getErr();
        usage.problems().forEach(problem -> err.println("tare: " + log + ", " + problem + " (skipped)"));
        err.flush();
        if (usage.samples().isEmpty()) {
            throw new TareException(log + ": no usable line; each line needs messages and reported_input_tokens");
        }
        Calibration before = new Calibration(config.scale(), config.messageOverheadTokens(), config.replyOverheadTokens(),
                config.toolOverheadTokens());
        CalibrationResult result = new Calibrator().fit(target, usage, before);
        spec.commandLine().getOut().print(format == Format.json ? CalibrationReport.json(result) : CalibrationReport.text(result));
        spec.commandLine().getOut().flush();
        return ExitCodes.OK;
    }
}
