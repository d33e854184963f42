package dev.tare.scan;

import dev.tare.Tare;
import dev.tare.source.FileSelection;
import dev.tare.source.WalkedFolder;
import java.io.ByteArrayOutputStream;
import java.io.DataOutputStream;
import java.io.IOException;
import java.nio.BufferUnderflowException;
import java.nio.ByteBuffer;
import java.nio.channels.FileChannel;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.AccessDeniedException;
import java.nio.file.FileSystemException;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.nio.file.attribute.BasicFileAttributes;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collection;
import java.util.HexFormat;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.TimeUnit;
import java.util.function.IntPredicate;
import java.util.stream.IntStream;
import java.util.zip.CRC32C;

/**
 * A whole rendered report of a scan or a check kept in {@code .tare/cache}, with what it was made
 * from: every folder the walk listed, every template, partial, tool and ignore-rule file, and the
 * command's exit status. When none of them changed, a run prints the stored report without walking,
 * reading, counting, linting or rendering anything. One file per command, build, configuration,
 * options and output form.
 *
 * <p>A folder is unchanged when its modification time is, and that time lies more than two seconds
 * before the run that stored it; a more recent folder (the root, whose {@code .tare} the first
 * run creates) is listed again and its names compared with the walk's. A file is unchanged when its
 * size and modification time are, and the time is that old; a file too recent to vouch for makes
 * the command run (where {@link TemplateCache} hashes its text). A run that skipped a file is not
 * stored, since what made it fail may lie anywhere.
 *
 * <p>The file holds the stamps, the report, the exit status and the report's length, then a
 * checksum of all of it. It is written to a temporary file, the report as it is rendered (a check's
 * report can be hundreds of megabytes), and moved into place whole, as {@link TemplateCache} is; a
 * file that cannot be read or written only means the command runs.
 */
public final class StoredReport {
    private static final int MAGIC = 0x74617265; // "tare"
    private static final int FORMAT = 2;
    /** The exit status, the report's length and the checksum, after the report. */
    private static final int TRAILER = 4 + 8 + 8;
    private static final long RACY_NANOS = TemplateCache.RACY_NANOS;
    /** The stamp of a path that did not exist, and of a folder, which counts by its presence only. */
    private static final long ABSENT = -1;
    private static final long FOLDER = -2;
    private static final long UNREADABLE = Long.MIN_VALUE;

    private final Path root;
    private final Path file;
    private final byte[] key;

    private StoredReport(Path root, Path file, byte[] key) {
        this.root = root;
        this.file = file;
        this.key = key;
    }

    /**
     * A stored report: the file it is in, held open (a run that replaces the file meanwhile
     * replaces a name, not what this reads), where its UTF-8 text lies, and the exit status of the
     * run that made it. Close it once printed.
     */
    public static final class Report implements AutoCloseable {
        private final FileChannel channel;
        private final long start;
        private final long length;
        private final int status;

        private Report(FileChannel channel, long start, long length, int status) {
            this.channel = channel;
            this.start = start;
            this.length = length;
            this.status = status;
        }

        /** The exit status of the run that made the report. */
        public int status() {
            return status;
        }

        /** The text, mapped read-only: for a report small enough to stay mapped while it is printed. */
        public ByteBuffer map() throws IOException {
            return channel.map(FileChannel.MapMode.READ_ONLY, start, length);
        }

        /**
         * Hands the text to {@code target} from the file, through the kernel where it can (a report
         * of hundreds of megabytes, mapped, would count whole towards the process's resident memory).
         */
        public void transferTo(java.nio.channels.WritableByteChannel target) throws IOException {
            for (long at = start; at < start + length; ) {
                long moved = channel.transferTo(at, start + length - at, target);
                if (moved <= 0) {
                    throw new IOException("the stored report " + length + " bytes long ended early");
                }
                at += moved;
            }
        }

        /**
         * Copies the text to {@code out} a chunk at a time: a report of hundreds of megabytes, mapped,
         * would count whole towards the process's resident memory.
         */
        public void copyTo(java.io.OutputStream out) throws IOException {
            ByteBuffer chunk = ByteBuffer.allocate(1 << 16);
            for (long at = start; at < start + length; ) {
                chunk.clear().limit((int) Math.min(chunk.capacity(), start + length - at));
                int n = channel.read(chunk, at);
                if (n <= 0) {
                    throw new IOException("the stored report " + length + " bytes long ended early");
                }
                out.write(chunk.array(), 0, n);
                at += n;
            }
        }

        @Override
        public void close() {
            try {
                channel.close();
            } catch (IOException e) {
                // Only read from: nothing is lost.
            }
        }
    }

    /**
     * The stored report of {@code command} ({@code scan}, {@code check}) for a run described by
     * {@code key} (the command's cache key, output form, root and starts). The file's name is a
     * 64-bit hash of the key, and the file holds the key itself: a hash needs no cryptographic code
     * loaded at the start of every run, and the key makes a collision harmless.
     */
    public static StoredReport of(Path root, String command, String key) {
        String full = Tare.buildIdentity() + "\n" + command + "\n" + key;
        return new StoredReport(root, CacheFolder.of(root).resolve("report-" + command + "-"
                + HexFormat.of().toHexDigits(TemplateCache.hash(full)) + ".bin"), full.getBytes(StandardCharsets.UTF_8));
    }

    /**
     * The stored report, when it exists, reads whole and nothing it was made from has changed. Only
     * the stamps are read into the heap; the report stays in the file (see {@link Report}). Files
     * are only ever replaced whole (see {@link CacheFolder#replace}).
     */
    public Optional<Report> read() {
        FileChannel channel;
        try {
            channel = FileChannel.open(file, StandardOpenOption.READ);
        } catch (IOException | RuntimeException e) {
            return Optional.empty();
        }
        Optional<Report> report = Optional.empty();
        try {
            report = whole(channel).filter(this::vouched);
            return report;
        } finally {
            if (report.isEmpty()) {
                close(channel);
            }
        }
    }

    /** The report in {@code channel} when the file is whole: its checksum holds over all before it. */
    private static Optional<Report> whole(FileChannel channel) {
        try {
            long size = channel.size();
            if (size < TRAILER) {
                return Optional.empty();
            }
            ByteBuffer trailer = ByteBuffer.allocate(TRAILER);
            readFully(channel, trailer, size - TRAILER);
            int status = trailer.getInt(0);
            long length = trailer.getLong(4);
            long stored = trailer.getLong(12);
            if (length < 0 || length > size - TRAILER) {
                return Optional.empty();
            }
            CRC32C crc = new CRC32C();
            ByteBuffer chunk = ByteBuffer.allocate(1 << 20);
            for (long at = 0; at < size - 8; ) {
                chunk.clear().limit((int) Math.min(chunk.capacity(), size - 8 - at));
                readFully(channel, chunk, at);
                chunk.flip();
                crc.update(chunk);
                at += chunk.limit();
            }
            return crc.getValue() == stored ? Optional.of(new Report(channel, size - TRAILER - length, length, status))
                    : Optional.empty();
        } catch (IOException | RuntimeException e) {
            return Optional.empty();
        }
    }

    /** Whether {@code report} was stored for this key and nothing it was made from has changed. */
    private boolean vouched(Report report) {
        try {
            if (report.start > Integer.MAX_VALUE) {
                return false;
            }
            ByteBuffer in = ByteBuffer.allocate((int) report.start);
            readFully(report.channel, in, 0);
            in.flip();
            if (in.getInt() != MAGIC || in.getInt() != FORMAT || !Arrays.equals(bytes(in), key)) {
                return false;
            }
            long vouchedUntil = in.getLong() - RACY_NANOS;
            int folderCount = in.getInt();
            int[] folderAt = new int[folderCount];
            long[] folderTimes = new long[folderCount];
            long[] folderNames = new long[folderCount];
            for (int i = 0; i < folderCount; i++) {
                folderAt[i] = skipString(in);
                folderTimes[i] = in.getLong();
                folderNames[i] = in.getLong();
            }
            int fileCount = in.getInt();
            int[] fileAt = new int[fileCount];
            long[] sizes = new long[fileCount];
            long[] times = new long[fileCount];
            for (int i = 0; i < fileCount; i++) {
                fileAt[i] = skipString(in);
                sizes[i] = in.getLong();
                times[i] = in.getLong();
            }
            if (in.hasRemaining()) {
                return false;
            }
            IntPredicate unchanged = i -> {
                if (i < folderCount) {
                    Path folder = Path.of(string(in, folderAt[i]));
                    long[] now = stamp(folder);
                    return now[0] == FOLDER && now[1] == folderTimes[i]
                            && (folderTimes[i] < vouchedUntil || namesHash(folder) == folderNames[i]);
                }
                int f = i - folderCount;
                long[] now = stamp(Path.of(string(in, fileAt[f])));
                return now[0] == sizes[f] && (now[0] < 0 || now[1] == times[f] && times[f] < vouchedUntil);
            };
            // One pass over folders and files, on every core: the stat calls are most of a warm run,
            // and each path's string is made by the thread that needs it.
            return IntStream.range(0, folderCount + fileCount).parallel().allMatch(unchanged);
        } catch (IOException | RuntimeException e) {
            // Truncated or from an older format that slipped past the checksum: the command runs.
            return false;
        }
    }

    private static void readFully(FileChannel channel, ByteBuffer into, long position) throws IOException {
        while (into.hasRemaining()) {
            if (channel.read(into, position + into.position()) < 0) {
                throw new IOException("ended early");
            }
        }
    }

    private static void close(FileChannel channel) {
        try {
            channel.close();
        } catch (IOException e) {
            // Only read from.
        }
    }

    /**
     * The stamps of what a report was made from: every folder of {@code selection} and its rule
     * files, and {@code files} (absolute paths of the templates and everything they depend on),
     * for a scan that started at {@code startedNanos}. Empty when a file is too recent to vouch for
     * itself, since a report stored with it would never be used.
     */
    public Optional<byte[]> stamps(FileSelection selection, Collection<Path> files, long startedNanos) {
        try {
            ByteArrayOutputStream bytes = new ByteArrayOutputStream(64 * files.size() + (1 << 16));
            DataOutputStream out = new DataOutputStream(bytes);
            out.writeInt(MAGIC);
            out.writeInt(FORMAT);
            bytes(out, key);
            out.writeLong(startedNanos);
            out.writeInt(selection.folders().size());
            for (WalkedFolder folder : selection.folders()) {
                long[] now = stamp(folder.path());
                if (now[0] != FOLDER) {
                    return Optional.empty();
                }
                string(out, folder.path().toString());
                out.writeLong(now[1]);
                out.writeLong(folder.namesHash());
            }
            List<Path> all = new ArrayList<>(files);
            all.addAll(selection.ruleFiles());
            out.writeInt(all.size());
            for (Path path : all) {
                long[] now = stamp(path);
                if (now[0] == UNREADABLE || now[0] >= 0 && now[1] >= startedNanos - RACY_NANOS) {
                    return Optional.empty();
                }
                string(out, path.toString());
                out.writeLong(now[0]);
                out.writeLong(now[1]);
            }
            out.flush();
            return Optional.of(bytes.toByteArray());
        } catch (IOException | RuntimeException e) {
            return Optional.empty();
        }
    }

    /** Stores {@code report} and the run's exit status with the {@link #stamps} of what it was made from. */
    void save(byte[] stamps, byte[] report, int status) {
        try {
            write(stamps, out -> out.write(report), status).close();
        } catch (IOException | RuntimeException e) {
            // An optimisation only: the report is printed either way.
        }
    }

    /**
     * Stores the report {@code render} writes, with the run's exit status and the {@link #stamps}
     * of what it was made from, and gives it back from the stored file; empty when it could not be
     * stored (the caller then renders it where it goes), having printed nothing.
     */
    public Optional<Report> store(byte[] stamps, CacheFolder.Body render, int status) {
        try {
            return Optional.of(write(stamps, render, status));
        } catch (IOException | RuntimeException e) {
            return Optional.empty();
        }
    }

    /**
     * Writes the file and gives back its report, from the file held open as written, whatever
     * another run puts in its place: the stamps, then the report, then the {@link #TRAILER}.
     */
    private Report write(byte[] stamps, CacheFolder.Body render, int status) throws IOException {
        CacheFolder.prepare(root);
        FileChannel written = CacheFolder.replace(file, stream -> {
            CRC32C crc = new CRC32C();
            CountingOutput counted = new CountingOutput(new java.util.zip.CheckedOutputStream(stream, crc));
            counted.write(stamps);
            long before = counted.count();
            render.writeTo(counted);
            long length = counted.count() - before;
            DataOutputStream trailer = new DataOutputStream(counted);
            trailer.writeInt(status);
            trailer.writeLong(length);
            trailer.flush();
            new DataOutputStream(stream).writeLong(crc.getValue());
        });
        try {
            String name = file.getFileName().toString();
            CacheFolder.pruneOthers(file, name.substring(0, name.lastIndexOf('-') + 1));
        } catch (IOException | RuntimeException e) {
            // Old reports left behind are only disk space.
        }
        try {
            return new Report(written, stamps.length, written.size() - TRAILER - stamps.length, status);
        } catch (IOException | RuntimeException e) {
            close(written);
            throw e;
        }
    }

    /** Counts the bytes that pass through, so the report's length is known once it is written. */
    private static final class CountingOutput extends java.io.FilterOutputStream {
        private long count;

        CountingOutput(java.io.OutputStream out) {
            super(out);
        }

        @Override
        public void write(int b) throws IOException {
            out.write(b);
            count++;
        }

        @Override
        public void write(byte[] bytes, int offset, int length) throws IOException {
            out.write(bytes, offset, length);
            count += length;
        }

        long count() {
            return count;
        }
    }

    /** {size or ABSENT or FOLDER, modification time in nanoseconds}, following links. */
    private static long[] stamp(Path path) {
        try {
            BasicFileAttributes attributes = Files.readAttributes(path, BasicFileAttributes.class);
            if (attributes.isDirectory()) {
                return new long[] {FOLDER, attributes.lastModifiedTime().to(TimeUnit.NANOSECONDS)};
            }
            return new long[] {attributes.size(), attributes.lastModifiedTime().to(TimeUnit.NANOSECONDS)};
        } catch (NoSuchFileException e) {
            return new long[] {ABSENT, 0};
        } catch (AccessDeniedException e) {
            // Unreadable now: a stamp that matches nothing stored, so the run scans and says why.
            return new long[] {UNREADABLE, 0};
        } catch (FileSystemException e) {
            // A path through a file (.git/info/exclude where .git is a worktree's file) or a link loop:
            // nothing there, as far as the scan's rules go.
            return new long[] {ABSENT, 0};
        } catch (IOException e) {
            // Unreadable now: a stamp that matches nothing stored, so the run scans and says why.
            return new long[] {UNREADABLE, 0};
        }
    }

    private static long namesHash(Path folder) {
        try {
            return WalkedFolder.namesHash(folder);
        } catch (IOException e) {
            return 0;
        }
    }

    /** Writes {@code text} in UTF-8, its length first. */
    static void string(DataOutputStream out, String text) throws IOException {
        bytes(out, text.getBytes(StandardCharsets.UTF_8));
    }

    private static void bytes(DataOutputStream out, byte[] bytes) throws IOException {
        out.writeInt(bytes.length);
        out.write(bytes);
    }

    /** Reads what {@link #string(DataOutputStream, String)} wrote, as bytes; a length past the end throws. */
    static byte[] bytes(ByteBuffer in) {
        int length = in.getInt();
        if (length < 0 || length > in.remaining()) {
            throw new BufferUnderflowException();
        }
        byte[] bytes = new byte[length];
        in.get(bytes);
        return bytes;
    }

    /** Passes over a string written by {@link #string(DataOutputStream, String)} and returns where it starts (its length first). */
    private static int skipString(ByteBuffer in) {
        int at = in.position();
        int length = in.getInt();
        if (length < 0 || length > in.remaining()) {
            throw new BufferUnderflowException();
        }
        in.position(in.position() + length);
        return at;
    }

    /**
     * The string whose length stands at {@code at} in {@code in} (a heap buffer, which absolute reads
     * leave as it is, so threads may share it).
     */
    private static String string(ByteBuffer in, int at) {
        return new String(in.array(), in.arrayOffset() + at + Integer.BYTES, in.getInt(at), StandardCharsets.UTF_8);
    }
}
