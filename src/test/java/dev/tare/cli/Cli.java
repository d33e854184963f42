package dev.tare.cli;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Path;

/** Runs the command line in-process, as the {@code tare} program would, and keeps what it printed. */
public final class Cli {
    /** The exit code and the two output streams of one run. */
    public record Run(int exitCode, String out, String err) {
    }

    private Cli() {
    }

    public static Run run(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int code = Main.run(args, new PrintWriter(out, true), new PrintWriter(err, true));
        return new Run(code, out.toString(), err.toString());
    }

    /** The checkout's top folder, where {@code corpora/} and the launcher live. */
    public static Path projectDir() {
        return Path.of(System.getProperty("tare.project.dir", ".")).toAbsolutePath().normalize();
    }
}
