package dev.tare.cli;

import dev.tare.scan.StoredReport;
import java.io.IOException;
import java.io.OutputStream;
import java.io.OutputStreamWriter;
import java.io.PrintWriter;
import java.nio.ByteBuffer;
import java.nio.channels.Channels;
import java.nio.channels.WritableByteChannel;
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

    /**
     * Prints a stored report to {@code out}: copied a chunk at a time onto standard output, decoded
     * onto any other writer.
     */
    static void print(PrintWriter out, StoredReport.Report report) {
        try {
            if (out instanceof StandardOutput standard) {
                standard.flush();
                report.copyTo(standard.stream);
                standard.stream.flush();
            } else {
                java.io.ByteArrayOutputStream bytes = new java.io.ByteArrayOutputStream();
                report.copyTo(bytes);
                out.print(bytes.toString(StandardCharsets.UTF_8));
                out.flush();
            }
        } catch (IOException e) {
            // As PrintWriter does: a closed pipe (tare check | head) is not an error of the check.
            out.flush();
            if (out instanceof StandardOutput standard) {
                standard.setError();
            }
        }
    }

    /** Prints UTF-8 text to {@code out}: as bytes on standard output, as text on any other writer. */
    static void print(PrintWriter out, ByteBuffer utf8) {
        if (out instanceof StandardOutput standard) {
            standard.flush();
            try {
                WritableByteChannel channel = Channels.newChannel(standard.stream);
                ByteBuffer rest = utf8.duplicate();
                while (rest.hasRemaining()) {
                    channel.write(rest);
                }
                standard.stream.flush();
            } catch (IOException e) {
                // As PrintWriter does: a closed pipe (tare scan | head) is not an error of the scan.
                standard.setError();
            }
        } else {
            out.print(StandardCharsets.UTF_8.decode(utf8.duplicate()));
            out.flush();
        }
    }
}
