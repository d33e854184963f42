package dev.tare.cli;

import dev.tare.app.Fix;
import dev.tare.app.FixResult;
import dev.tare.report.FixReport;
import dev.tare.rewrite.FixOptions;
import dev.tare.tokenize.TokenizerRegistry;
import dev.tare.workspace.FileSystemOps;
import dev.tare.workspace.Workspace;
import java.io.Console;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/** {@code tare fix}: applies the rules' rewrites, verified, and prints the diff and the saving. */
@Command(name = "fix", mixinStandardHelpOptions = true, addMethodSubcommands = false,
        description = {"Applies the rewrites the rules offer to the templates of a repository and prints a unified"
                + " diff per file and the tokens saved per file, per rule and in total on each target's tokenizer.",
                "Only safe rewrites are applied unless --include-review is given. Every rewritten file is checked"
                        + " against its original (variables, includes, code, JSON, paragraph breaks, line endings,"
                        + " final newline, byte-order mark) and written in one atomic step, or not at all.",
                "Exits 0 when everything was fixed or there was nothing to fix, 1 when a file was not fixed (its"
                        + " rewrite failed verification, it changed on disk meanwhile, or writing it failed) or a copy"
                        + " of a shared block could not be replaced, 2 on a usage or configuration error."})
final class FixCommand implements Callable<Integer> {
    enum Format { text, json }

    /** The file system writes go through; tests swap it to make a step fail. */
    FileSystemOps fileSystem = FileSystemOps.DEFAULT;

    @Spec
    private CommandSpec spec;

    @Mixin
    private CommonOptions common;

    @Parameters(paramLabel = "PATH", arity = "0..*",
            description = "Folders or files to fix, inside one repository. Default: the current folder.")
    private List<Path> paths = new ArrayList<>();

    @Option(names = "--dry-run", description = "Show the diff and the saving, but write nothing.")
    private boolean dryRun;

    @Option(names = "--include-review",
            description = "Apply review-class rewrites too. They change what the prompt says: evaluate the changed"
                    + " prompts before they ship. This also moves blocks of text that several templates hold into a"
                    + " partial and includes it in their place, when every changed template renders exactly as before.")
    private boolean includeReview;

    @Option(names = "--only", paramLabel = "RULE", arity = "1..*", split = ",",
            description = "Apply only the rewrites of these rules, separated by spaces or commas ('tare rules' lists them). Put paths before this option.")
    private List<String> only = new ArrayList<>();

    @Option(names = "--format", paramLabel = "FORMAT", description = "Output format: ${COMPLETION-CANDIDATES}. Default: ${DEFAULT-VALUE}.")
    private Format format = Format.text;

    @Option(names = "--staged", description = "Fix the staged templates whose working tree equals the index, then stage"
            + " them; a partially staged file is reported and left alone.")
    private boolean staged;

    @Override
    public Integer call() {
        Workspace workspace = Workspace.open(paths, common.configFile());
        Fix fix = new Fix(workspace, new TokenizerRegistry(), fileSystem);
        FixOptions options = new FixOptions(includeReview, Set.copyOf(only), dryRun);
        FixResult result = staged ? fix.runStaged(options) : fix.run(options);
        PrintWriter out = spec.commandLine().getOut();
        out.print(format == Format.json ? FixReport.json(result) : FixReport.text(result, colourful()));
        out.flush();
        return result.failed() ? ExitCodes.NOT_FIXED : ExitCodes.OK;
    }

    /**
     * Whether standard output is a terminal that wants colour. From Java 22 a console object exists even
     * when output is redirected, so its {@code isTerminal()} is asked where it exists; NO_COLOR switches
     * colour off (common practice, no source).
     */
    private static boolean colourful() {
        Console console = System.console();
        if (console == null || System.getenv("NO_COLOR") != null) {
            return false;
        }
        try {
            return (Boolean) Console.class.getMethod("isTerminal").invoke(console);
        } catch (ReflectiveOperationException e) {
            return true;
        }
    }
}
