package dev.tare.cli;

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
