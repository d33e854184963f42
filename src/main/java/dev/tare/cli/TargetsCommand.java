package dev.tare.cli;

import dev.tare.footprint.Catalog;
import dev.tare.report.TargetsReport;
import dev.tare.workspace.Workspace;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/** {@code tare targets}: the configured targets and what each can estimate, or the shipped catalog. */
@Command(name = "targets", mixinStandardHelpOptions = true, addMethodSubcommands = false,
        description = {"Lists the targets of tare.yaml: each one's tokenizer, price, model, precisions and device,"
                + " the footprint figures it can estimate, and the keys it lacks for the others.",
                "With --catalog, lists the model shapes and devices shipped with Tare that a target may name"
                + " and override, each with its published source."})
final class TargetsCommand implements Callable<Integer> {
    enum Format { text, json }

    @Spec
    private CommandSpec spec;

    @Mixin
    private CommonOptions common;

    @Parameters(paramLabel = "PATH", arity = "0..1",
            description = "The repository whose tare.yaml to read. Default: the current folder.")
    private Path path;

    @Option(names = "--catalog", description = "List the shipped model shapes and devices instead.")
    private boolean catalog;

    @Option(names = "--format", paramLabel = "FORMAT", description = "Output format: ${COMPLETION-CANDIDATES}. Default: ${DEFAULT-VALUE}.")
    private Format format = Format.text;

    @Override
    public Integer call() {
        String report;
        if (catalog) {
            Catalog shipped = Catalog.shipped();
            report = format == Format.json ? TargetsReport.catalogJson(shipped) : TargetsReport.catalogText(shipped);
        } else {
            List<Path> paths = new ArrayList<>();
            if (path != null) {
                paths.add(path);
            } else {
                common.configFile().ifPresent(c -> paths.add(c.toAbsolutePath().getParent()));
            }
            Workspace workspace = Workspace.open(paths, common.configFile());
            String file = workspace.config().file().map(Path::toString).orElse("(no tare.yaml)");
            report = format == Format.json ? TargetsReport.json(file, workspace.config().targets())
                    : TargetsReport.text(file, workspace.config().targets());
        }
        spec.commandLine().getOut().print(report);
        spec.commandLine().getOut().flush();
        return ExitCodes.OK;
    }
}
