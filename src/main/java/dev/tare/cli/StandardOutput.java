package dev.tare.cli;

import dev.tare.scan.StoredReport;
import java.io.FileOutputStream;
import java.io.IOException;
import java.io.OutputStreamWriter;
import java.io.PrintWriter;
import java.nio.ByteBuffer;
import java.nio.channels.FileChannel;
import java.nio.charset.StandardCharsets;

/**
 * Standard output as the writer commands print to, which also takes text already encoded in UTF-8
 * as it is: a stored report of many megabytes goes out through the file descriptor's channel, without
 * being decoded and encoded again, or even copied through the heap.
 */
final class StandardOutput extends PrintWriter {
    private final FileOutputStream stream;

    StandardOutput(FileOutputStream stream) {
        super(new OutputStreamWriter(stream, StandardCharsets.UTF_8), true);
        this.stream = stream;
    }

    /**
     * Prints a stored report to {@code out}: handed from its file to standard output by the kernel
     * where it can ({@link FileChannel#transferTo}), decoded onto any other writer.
     */
    static void print(PrintWriter out, StoredReport.Report report) {
        try {
            if (out instanceof StandardOutput standard) {
                standard.flush();
                report.transferTo(standard.stream.getChannel());
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
                // Written from the buffer itself: a stored report, mapped, goes out without a copy in the heap.
                FileChannel channel = standard.stream.getChannel();
                ByteBuffer rest = utf8.duplicate();
                while (rest.hasRemaining()) {
                    channel.write(rest);
                }
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
