package dev.tare.cli;

import dev.tare.app.Overview;
import dev.tare.app.OverviewRun;
import dev.tare.app.ScanOptions;
import dev.tare.app.ScanResult;
import dev.tare.app.TemplateScan;
import dev.tare.report.HtmlReport;
import dev.tare.report.MarkdownReport;
import dev.tare.report.ScanReport;
import dev.tare.tokenize.TokenizerRegistry;
import dev.tare.workspace.Workspace;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/** {@code tare scan}: the token footprint of every template in a repository. */
@Command(name = "scan", mixinStandardHelpOptions = true, addMethodSubcommands = false,
        description = {"Counts the tokens of every template in a repository: static tokens (every variable empty),"
                + " estimated tokens (variables filled with their declared samples or sizes) and input tokens on each target.",
                "Files that cannot be read or parsed are listed with the reason and never stop the scan."})
final class ScanCommand implements Callable<Integer> {
    enum Format { text, json, md, html }

    enum Sort { tokens, cost, path }

    @Spec
    private CommandSpec spec;

    @Mixin
    private CommonOptions common;

    @Parameters(paramLabel = "PATH", arity = "0..*",
            description = "Folders or files to scan, inside one repository. Default: the current folder.")
    private List<Path> paths = new ArrayList<>();

    @Option(names = "--target", paramLabel = "NAME", split = ",",
            description = "Measure on these configured targets only (repeat or separate with commas). Default: all.")
    private List<String> targets = new ArrayList<>();

    @Option(names = "--tokenizer", paramLabel = "NAME|PATH",
            description = "The tokenizer of the STATIC and ESTIMATED columns. Default: the first target's, else "
                    + TokenizerRegistry.DEFAULT + ".")
    private String tokenizer;

    @Option(names = "--format", paramLabel = "FORMAT", description = {"Output format: ${COMPLETION-CANDIDATES}."
            + " Default: ${DEFAULT-VALUE}.", "md and html also run the rules and compare with the baseline file:"
            + " md is a summary for a pull-request comment, html one self-contained page with charts and every"
            + " template line by line (tare scan --format html > report.html)."})
    private Format format = Format.text;

    @Option(names = "--sort", paramLabel = "KEY", description = "Row order: ${COMPLETION-CANDIDATES}. Default: ${DEFAULT-VALUE}.")
    private Sort sort = Sort.path;

    @Option(names = "--no-cache", description = {"Measure every template afresh, and neither read nor write the"
            + " cache of measurements kept in the repository's .tare/cache folder.",
            "By default a template whose file, partials and tool files are unchanged since the last scan with the"
            + " same configuration and build of Tare is not read or counted again."})
    private boolean noCache;

    @Override
    public Integer call() {
        Workspace workspace = Workspace.open(paths, common.configFile());
        ScanOptions options = new ScanOptions(targets, Optional.ofNullable(tokenizer), !noCache);
        ScanResult.Order order = ScanResult.Order.valueOf(sort.name().toUpperCase(Locale.ROOT));
        if (format == Format.md || format == Format.html) {
            Overview overview = new OverviewRun(workspace, new TokenizerRegistry()).run(options, format == Format.html);
            spec.commandLine().getOut().print(format == Format.md ? MarkdownReport.render(overview)
                    : HtmlReport.render(overview, order));
            spec.commandLine().getOut().flush();
        } else {
            ScanResult result = new TemplateScan(workspace, new TokenizerRegistry()).run(options,
                    TerminalProgress.forOutput(format != Format.text));
            if (format == Format.json) {
                ScanReport.json(result, order, spec.commandLine().getOut());
            } else {
                spec.commandLine().getOut().print(ScanReport.text(result, order));
            }
            spec.commandLine().getOut().flush();
        }
        return ExitCodes.OK;
    }
}
