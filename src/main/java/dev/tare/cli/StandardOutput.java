package dev.tare.cli;

import java.io.IOException;
import java.io.OutputStream;
import java.io.OutputStreamWriter;
import java.io.PrintWriter;
import java.nio.charset.StandardCharsets;

/**
 * Standard output as the writer commands print to, which also takes text already encoded in UTF-8
 * as it is: a stored scan report of many megabytes goes out without being decoded and encoded again.
 */
final class StandardOutput extends PrintWriter {
    private final OutputStream stream;

    StandardOutput(OutputStream stream) {
        super(new OutputStreamWriter(stream, StandardCharsets.UTF_8), true);
        this.stream = stream;
    }

    /** Prints UTF-8 text to {@code out}: as bytes on standard output, as text on any other writer. */
    static void print(PrintWriter out, byte[] utf8) {
        if (out instanceof StandardOutput standard) {
            standard.flush();
            try {
                standard.stream.write(utf8);
                standard.stream.flush();
            } catch (IOException e) {
                // As PrintWriter does: a closed pipe (tare scan | head) is not an error of the scan.
                standard.setError();
            }
        } else {
            out.print(new String(utf8, StandardCharsets.UTF_8));
            out.flush();
        }
    }
}
