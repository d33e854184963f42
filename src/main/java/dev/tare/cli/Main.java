package dev.tare.cli;

import java.io.BufferedWriter;
import java.io.FileDescriptor;
import java.io.FileOutputStream;
import java.io.OutputStreamWriter;
import java.io.PrintWriter;
import java.nio.charset.StandardCharsets;

/** The {@code tare} program: parses the command line, runs one command, exits with its code. */
public final class Main {
    private Main() {
    }

    public static void main(String[] args) {
        PrintWriter out = new PrintWriter(new BufferedWriter(new OutputStreamWriter(new FileOutputStream(FileDescriptor.out),
                StandardCharsets.UTF_8)));
        PrintWriter err = new PrintWriter(new OutputStreamWriter(new FileOutputStream(FileDescriptor.err), StandardCharsets.UTF_8), true);
        int code = run(args, out, err);
        out.flush();
        err.flush();
        System.exit(code);
    }

    /** Runs one command through picocli and returns its exit code. */
    static int run(String[] args, PrintWriter out, PrintWriter err) {
        return TareCommand.commandLine(out, err, args).execute(args);
    }
}
