package dev.tare.cli;

import dev.tare.TareException;
import dev.tare.app.InitPlan;
import dev.tare.config.ConfigLoader;
import dev.tare.config.StarterConfig;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.FileAlreadyExistsException;
import java.nio.file.Files;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/** {@code tare init}: writes a commented starter {@code tare.yaml}, never over an existing one. */
@Command(name = "init", mixinStandardHelpOptions = true, addMethodSubcommands = false,
        description = {"Looks at a repository (default: the current folder) for files that look like prompts, and writes a"
                + " commented starter tare.yaml whose include globs select them, with the placeholder syntax they use.",
                "Prints what it found; 'tare scan' right after measures exactly those files. An existing tare.yaml is"
                        + " never replaced."})
final class InitCommand implements Callable<Integer> {
    /** How many of the files found are listed. */
    private static final int LISTED = 20;

    @Spec
    private CommandSpec spec;

    @Parameters(paramLabel = "FOLDER", arity = "0..1", description = "Where to look and write tare.yaml. Default: the current folder.")
    private Path folder = Path.of(".");

    @Override
    public Integer call() {
        if (!Files.isDirectory(folder)) {
            throw new TareException(folder + ": no such folder");
        }
        Path file = folder.resolve(ConfigLoader.FILE_NAME);
        if (Files.exists(file)) {
            throw new TareException(file + " already exists; edit it, or remove it first to start again");
        }
        InitPlan plan = InitPlan.of(folder.toAbsolutePath().normalize());
        String text = StarterConfig.text(plan.include(), plan.exclude(), plan.placeholder().label(), plan.partials(),
                plan.codeInclude());
        try {
            Files.writeString(file, text, StandardCharsets.UTF_8, StandardOpenOption.CREATE_NEW, StandardOpenOption.WRITE);
        } catch (FileAlreadyExistsException e) {
            throw new TareException(file + " already exists; edit it, or remove it first to start again", e);
        } catch (IOException e) {
            throw new TareException(file + ": cannot be written (" + e.getMessage() + ")", e);
        }
        PrintWriter out = spec.commandLine().getOut();
        out.println("Wrote " + file + ".");
        if (!plan.codeFiles().isEmpty()) {
            int files = plan.codeFiles().size();
            out.println("Found prompts written in " + files + (files == 1 ? " source file" : " source files")
                    + ", read through " + String.join(", ", plan.codeInclude()) + ":");
            plan.codeFiles().stream().limit(LISTED).forEach(path -> out.println("  " + path));
            if (files > LISTED) {
                out.println("  and " + (files - LISTED) + " more");
            }
        }
        if (plan.templates().isEmpty()) {
            out.println("Found no template file that looks like a prompt (a template extension, a prompts or templates folder,"
                    + " placeholders, role lines, chat messages); the include globs are the usual places. Edit them to"
                    + " where your prompts are, then run 'tare scan'.");
            return ExitCodes.OK;
        }
        int n = plan.templates().size();
        out.println("Found " + n + (n == 1 ? " file" : " files") + " that look like prompts, selected by "
                + String.join(", ", plan.include()) + "; placeholder syntax " + plan.placeholder().label()
                + (plan.syntaxSeen() > 0 ? " (seen in " + plan.syntaxSeen() + " of " + n + ")" : " (none seen; the default)")
                + "; partials in " + plan.partials() + ":");
        plan.templates().stream().limit(LISTED).forEach(path -> out.println("  " + path));
        if (n > LISTED) {
            out.println("  and " + (n - LISTED) + " more");
        }
        out.println("Next: set your targets' prices in tare.yaml, then run 'tare scan'.");
        return ExitCodes.OK;
    }
}
