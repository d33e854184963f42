package dev.tare.scan;

import java.io.ByteArrayOutputStream;
import java.io.DataOutputStream;
import java.io.IOException;
import java.nio.BufferUnderflowException;
import java.nio.ByteBuffer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HexFormat;
import java.util.List;
import java.util.Optional;
import java.util.zip.CRC32C;

/**
 * A few lines of text kept in a root's {@code .tare/cache} under a key, and given back only to a
 * run that asks with the same key: what a command line asked for, so that the same command run
 * again need not be parsed again. The file's name is a 64-bit hash of the key and the file holds the
 * key itself, which makes a collision harmless, then the lines (as {@link StoredReport} writes
 * strings) and a checksum. Files are written
 * whole (see {@link CacheFolder#replace}); one that cannot be read or written only means the lines
 * are not remembered.
 */
public final class RememberedLines {
    private static final int MAGIC = 0x74617265; // "tare"
    private static final int FORMAT = 1;
    /** Far more than any command line needs; a longer file is not one of these. */
    private static final long MAX_BYTES = 1 << 20;

    private RememberedLines() {
    }

    /** The lines remembered under {@code key} in {@code root}'s cache, among those of {@code kind}. */
    public static Optional<List<String>> read(Path root, String kind, String key) {
        Path file = file(root, kind, key);
        try {
            if (!Files.isRegularFile(file) || Files.size(file) > MAX_BYTES) {
                return Optional.empty();
            }
            return parse(ByteBuffer.wrap(Files.readAllBytes(file)), key);
        } catch (IOException | RuntimeException e) {
            return Optional.empty();
        }
    }

    /**
     * Remembers {@code lines} under {@code key} in {@code root}'s cache, unless they are remembered
     * already, and keeps only the newest few other files of {@code kind}.
     */
    public static void write(Path root, String kind, String key, List<String> lines) {
        if (read(root, kind, key).filter(lines::equals).isPresent()) {
            return;
        }
        Path file = file(root, kind, key);
        try {
            CacheFolder.prepare(root);
            CacheFolder.replace(file, contents(key, lines));
            CacheFolder.pruneOthers(file, kind + "-");
        } catch (IOException | RuntimeException e) {
            // Only a shortcut: the command runs the long way next time.
        }
    }

    private static Path file(Path root, String kind, String key) {
        return CacheFolder.of(root).resolve(kind + "-" + HexFormat.of().toHexDigits(TemplateCache.hash(key)) + ".bin");
    }

    private static byte[] contents(String key, List<String> lines) throws IOException {
        ByteArrayOutputStream bytes = new ByteArrayOutputStream();
        DataOutputStream out = new DataOutputStream(bytes);
        out.writeInt(MAGIC);
        out.writeInt(FORMAT);
        StoredReport.string(out, key);
        out.writeInt(lines.size());
        for (String line : lines) {
            StoredReport.string(out, line);
        }
        out.flush();
        CRC32C crc = new CRC32C();
        crc.update(bytes.toByteArray());
        out.writeLong(crc.getValue());
        out.flush();
        return bytes.toByteArray();
    }

    private static Optional<List<String>> parse(ByteBuffer in, String key) {
        try {
            if (in.remaining() < Long.BYTES) {
                return Optional.empty();
            }
            int end = in.limit() - Long.BYTES;
            CRC32C crc = new CRC32C();
            crc.update(in.array(), 0, end);
            if (crc.getValue() != in.getLong(end)) {
                return Optional.empty();
            }
            in.limit(end);
            if (in.getInt() != MAGIC || in.getInt() != FORMAT
                    || !Arrays.equals(StoredReport.bytes(in), key.getBytes(StandardCharsets.UTF_8))) {
                return Optional.empty();
            }
            int count = in.getInt();
            if (count < 0 || count > in.remaining() / Integer.BYTES) {
                return Optional.empty();
            }
            List<String> lines = new ArrayList<>(count);
            for (int i = 0; i < count; i++) {
                lines.add(new String(StoredReport.bytes(in), StandardCharsets.UTF_8));
            }
            return in.hasRemaining() ? Optional.empty() : Optional.of(List.copyOf(lines));
        } catch (BufferUnderflowException | IllegalArgumentException e) {
            return Optional.empty();
        }
    }
}
