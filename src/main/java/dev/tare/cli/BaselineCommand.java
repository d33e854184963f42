package dev.tare.cli;

import dev.tare.app.BaselineUpdate;
import dev.tare.workspace.SafeFileWriter;
import dev.tare.workspace.Workspace;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/** {@code tare baseline}: records every template's estimated tokens per target for later comparison. */
@Command(name = "baseline", mixinStandardHelpOptions = true, addMethodSubcommands = false,
        description = {"Records each template's estimated tokens on each target in the baseline file"
                + " (baseline.file in tare.yaml, default tare-baseline.json), sorted and stable for review diffs.",
                "Commit it; 'tare check' then fails when a template grows beyond baseline.tolerance_percent."})
final class BaselineCommand implements Callable<Integer> {
    @Spec
    private CommandSpec spec;

    @Mixin
    private CommonOptions common;

    @Parameters(paramLabel = "PATH", arity = "0..*", description = "The repository (default: the current folder).")
    private List<Path> paths = new ArrayList<>();

    @Override
    public Integer call() {
        BaselineUpdate.Report report = BaselineUpdate.run(Workspace.open(paths, common.configFile()));
        String what = switch (report.outcome()) {
            case WRITTEN -> "Wrote";
            case UNCHANGED -> "Unchanged:";
            case CHANGED_MEANWHILE -> "Left alone (it changed while Tare ran):";
        };
        spec.commandLine().getOut().println(what + " " + report.file() + " (" + report.templates()
                + (report.templates() == 1 ? " template" : " templates") + (report.skipped() == 0 ? ""
                : ", " + report.skipped() + (report.skipped() == 1 ? " file" : " files") + " skipped: see 'tare scan'") + ").");
        return report.outcome() == SafeFileWriter.Outcome.CHANGED_MEANWHILE ? ExitCodes.USAGE : ExitCodes.OK;
    }
}
