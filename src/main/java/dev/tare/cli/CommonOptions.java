package dev.tare.cli;

import java.nio.file.Path;
import java.util.Optional;
import picocli.CommandLine.Option;

/** Options every command that reads a repository shares. */
final class CommonOptions {
    @Option(names = "--config", paramLabel = "FILE",
            description = "The configuration file. Default: tare.yaml in the scanned folder or the nearest folder above it, up to the git work tree's top.")
    Path config;

    @Option(names = "--debug", description = "Print the stack trace of an error as well as its message.")
    boolean debug;

    @Option(names = "--timings", description = "Print on standard error where the time went: JVM start, tokenizer loading, the work.")
    boolean timings;

    Optional<Path> configFile() {
        return Optional.ofNullable(config);
    }
}
