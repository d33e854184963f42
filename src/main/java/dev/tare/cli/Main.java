package dev.tare.cli;

import java.io.FileDescriptor;
import java.io.FileOutputStream;
import java.io.OutputStreamWriter;
import java.io.PrintWriter;
import java.nio.charset.StandardCharsets;
import java.util.OptionalInt;

/** The {@code tare} program: parses the command line, runs one command, exits with its code. */
public final class Main {
    private Main() {
    }

    public static void main(String[] args) {
        PrintWriter out = new StandardOutput(new FileOutputStream(FileDescriptor.out));
        PrintWriter err = new PrintWriter(new OutputStreamWriter(new FileOutputStream(FileDescriptor.err), StandardCharsets.UTF_8), true);
        int code = run(args, out, err);
        out.flush();
        err.flush();
        System.exit(code);
    }

    /**
     * Runs one command and returns its exit code: a warm scan that ran before from the same folder
     * straight from what it asked for then ({@link ScanReplay}), any other through picocli.
     */
    static int run(String[] args, PrintWriter out, PrintWriter err) {
        OptionalInt replayed = ScanReplay.run(args, out);
        return replayed.isPresent() ? replayed.getAsInt() : TareCommand.commandLine(out, err, args).execute(args);
    }
}
