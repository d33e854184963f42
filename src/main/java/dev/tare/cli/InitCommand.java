package dev.tare.cli;

import dev.tare.TareException;
import dev.tare.config.ConfigLoader;
import dev.tare.config.StarterConfig;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.FileAlreadyExistsException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/** {@code tare init}: writes a commented starter {@code tare.yaml}, never over an existing one. */
@Command(name = "init", mixinStandardHelpOptions = true, addMethodSubcommands = false,
        description = "Writes a commented starter tare.yaml into a folder (default: the current one). An existing tare.yaml is never replaced.")
final class InitCommand implements Callable<Integer> {
    @Spec
    private CommandSpec spec;

    @Parameters(paramLabel = "FOLDER", arity = "0..1", description = "Where to write tare.yaml. Default: the current folder.")
    private Path folder = Path.of(".");

    @Override
    public Integer call() {
        if (!Files.isDirectory(folder)) {
            throw new TareException(folder + ": no such folder");
        }
        Path file = folder.resolve(ConfigLoader.FILE_NAME);
        try {
            Files.writeString(file, StarterConfig.text(), StandardCharsets.UTF_8, StandardOpenOption.CREATE_NEW,
                    StandardOpenOption.WRITE);
        } catch (FileAlreadyExistsException e) {
            throw new TareException(file + " already exists; edit it, or remove it first to start again", e);
        } catch (IOException e) {
            throw new TareException(file + ": cannot be written (" + e.getMessage() + ")", e);
        }
        spec.commandLine().getOut().println("Wrote " + file + ". Next: adjust the include globs and targets, then run 'tare scan'.");
        return ExitCodes.OK;
    }
}
