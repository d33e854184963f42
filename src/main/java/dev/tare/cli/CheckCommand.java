package dev.tare.cli;

import dev.tare.app.Check;
import dev.tare.app.CheckOptions;
import dev.tare.app.CheckResult;
import dev.tare.lint.Severity;
import dev.tare.report.CheckReport;
import dev.tare.tokenize.TokenizerRegistry;
import dev.tare.workspace.Workspace;
import java.io.PrintWriter;
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

/** {@code tare check}: runs the rules over every template and fails on findings at or above a severity. */
@Command(name = "check", mixinStandardHelpOptions = true, addMethodSubcommands = false,
        description = {"Runs every enabled rule over the templates of a repository and prints the findings"
                + " (path:line:column, severity, rule, message, and the token saving where a rewrite exists).",
                "Exits 1 when a finding is at or above --fail-on, 0 otherwise, 2 on a usage or configuration error.",
                "Silence a rule on one line with {# tare-ignore RULE #}, on the next line with"
                        + " {# tare-ignore-next-line RULE #}, or in the whole file with tare-ignore-file RULE"
                        + " (for example as a YAML comment in front matter)."})
final class CheckCommand implements Callable<Integer> {
    enum Format { text, json, sarif }

    enum Level { error, warning, info }

    @Spec
    private CommandSpec spec;

    @Mixin
    private CommonOptions common;

    @Parameters(paramLabel = "PATH", arity = "0..*",
            description = "Folders or files to check, inside one repository. Default: the current folder.")
    private List<Path> paths = new ArrayList<>();

    @Option(names = "--format", paramLabel = "FORMAT", description = "Output format: ${COMPLETION-CANDIDATES}. Default: ${DEFAULT-VALUE}.")
    private Format format = Format.text;

    @Option(names = "--fail-on", paramLabel = "SEVERITY",
            description = "Exit 1 when any finding is at or above this severity: ${COMPLETION-CANDIDATES}. Default: ${DEFAULT-VALUE}.")
    private Level failOn = Level.error;

    @Option(names = "--staged", description = "Check the staged content of staged templates (the git index), not the working tree.")
    private boolean staged;

    @Option(names = "--no-cache", description = {"Lint every template afresh, and neither read nor write the"
            + " cache of findings in the repository's .tare/cache folder.",
            "By default a template whose file, partials and tool files are unchanged since the last check with the"
            + " same configuration, rule packs, baseline and build of Tare is not read or linted again, and when no"
            + " template changed the cross-template rules' findings are reused too. --staged never uses the cache."})
    private boolean noCache;

    @Override
    public Integer call() {
        Workspace workspace = Workspace.open(paths, common.configFile());
        CheckOptions options = new CheckOptions(Severity.parse(failOn.name(), "--fail-on"), !noCache);
        Check check = new Check(workspace, new TokenizerRegistry());
        CheckResult result = staged ? check.runStaged(options) : check.run(options);
        // Written as it is made: a large repository's report is hundreds of megabytes.
        PrintWriter out = spec.commandLine().getOut();
        switch (format) {
            case text -> CheckReport.text(result, out);
            case json -> CheckReport.json(result, out);
            case sarif -> out.write(CheckReport.sarif(result));
        }
        out.flush();
        return result.failed() ? ExitCodes.FINDINGS : ExitCodes.OK;
    }
}
