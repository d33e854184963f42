package dev.tare.scan;

import dev.tare.Tare;
import dev.tare.source.FileSelection;
import dev.tare.source.WalkedFolder;
import java.io.ByteArrayOutputStream;
import java.io.DataOutputStream;
import java.io.IOException;
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
import java.util.stream.IntStream;
import java.util.zip.CRC32C;

/**
 * A whole rendered scan report kept in {@code .tare/cache}, with what it was made from: every
 * folder the walk listed, every template, partial, tool and ignore-rule file. When none of them
 * changed, a run prints the stored report without walking, reading, counting or rendering
 * anything. One file per build, configuration, scan options and output form.
 *
 * <p>A folder is unchanged when its modification time is, and that time lies more than two seconds
 * before the run that stored it; a more recent folder (the root, whose {@code .tare} the first
 * scan creates) is listed again and its names compared with the walk's. A file is unchanged when its
 * size and modification time are, and the time is that old; a file too recent to vouch for makes
 * the run scan (where {@link TemplateCache} hashes its text). A scan that skipped a file is not stored,
 * since what made it fail may lie anywhere.
 *
 * <p>Written whole to a temporary file and moved into place with a checksum at its end, as
 * {@link TemplateCache} is; a file that cannot be read or written only means a scan.
 */
final class StoredReport {
    private static final int MAGIC = 0x74617265; // "tare"
    private static final int FORMAT = 1;
    private static final long RACY_NANOS = TemplateCache.RACY_NANOS;
    /** The stamp of a path that did not exist, and of a folder, which counts by its presence only. */
    private static final long ABSENT = -1;
    private static final long FOLDER = -2;
    private static final long UNREADABLE = Long.MIN_VALUE;

    private final Path file;
    private final byte[] key;

    private StoredReport(Path file, byte[] key) {
        this.file = file;
        this.key = key;
    }

    /**
     * The stored report for a scan described by {@code key} (scan key, output form, root and starts).
     * The file's name is a 64-bit hash of the key, and the file holds the key itself: a hash
     * needs no cryptographic code loaded at the start of every run, and the key makes a collision
     * harmless.
     */
    static StoredReport of(Path root, String key) {
        String full = Tare.buildIdentity() + "\n" + key;
        return new StoredReport(CacheFolder.of(root).resolve("report-" + HexFormat.of().toHexDigits(TemplateCache.hash(full)) + ".bin"),
                full.getBytes(StandardCharsets.UTF_8));
    }

    /**
     * The stored report as UTF-8, when it exists, reads whole and nothing it was made from has
     * changed. The file is mapped, not read: its report, megabytes long, goes from the page cache to
     * standard output without passing through the heap. Files are only ever replaced whole (see
     * {@link CacheFolder#replace}), so a mapping never sees one change under it.
     */
    Optional<ByteBuffer> read() {
        ByteBuffer bytes;
        try (FileChannel channel = FileChannel.open(file, StandardOpenOption.READ)) {
            long size = channel.size();
            if (size < 8 || size > Integer.MAX_VALUE) {
                return Optional.empty();
            }
            bytes = channel.map(FileChannel.MapMode.READ_ONLY, 0, size);
        } catch (IOException | RuntimeException e) {
            return Optional.empty();
        }
        try {
            int end = bytes.limit() - 8;
            CRC32C crc = new CRC32C();
            crc.update(bytes.duplicate().limit(end));
            ByteBuffer in = bytes.duplicate().limit(end);
            if (bytes.getLong(end) != crc.getValue()
                    || in.getInt() != MAGIC || in.getInt() != FORMAT || !Arrays.equals(bytes(in), key)) {
                return Optional.empty();
            }
            long vouchedUntil = in.getLong() - RACY_NANOS;
            int folderCount = in.getInt();
            String[] folders = new String[folderCount];
            long[] folderTimes = new long[folderCount];
            long[] folderNames = new long[folderCount];
            for (int i = 0; i < folderCount; i++) {
                folders[i] = string(in);
                folderTimes[i] = in.getLong();
                folderNames[i] = in.getLong();
            }
            int fileCount = in.getInt();
            String[] files = new String[fileCount];
            long[] sizes = new long[fileCount];
            long[] times = new long[fileCount];
            for (int i = 0; i < fileCount; i++) {
                files[i] = string(in);
                sizes[i] = in.getLong();
                times[i] = in.getLong();
            }
            int reportLength = in.getInt();
            ByteBuffer report = in.slice(in.position(), reportLength);
            // One pass over folders and files, on every core: the stat calls are most of a warm run.
            boolean hold = IntStream.range(0, folderCount + fileCount).parallel().allMatch(i -> {
                if (i < folderCount) {
                    Path folder = Path.of(folders[i]);
                    long[] now = stamp(folder);
                    return now[0] == FOLDER && now[1] == folderTimes[i]
                            && (folderTimes[i] < vouchedUntil || namesHash(folder) == folderNames[i]);
                }
                int f = i - folderCount;
                long[] now = stamp(Path.of(files[f]));
                return now[0] == sizes[f] && (now[0] < 0 || now[1] == times[f] && times[f] < vouchedUntil);
            });
            return hold ? Optional.of(report) : Optional.empty();
        } catch (RuntimeException e) {
            // Truncated or from an older format that slipped past the checksum: a scan.
            return Optional.empty();
        }
    }

    /**
     * The stamps of what a report was made from: every folder of {@code selection} and its rule
     * files, and {@code files} (absolute paths of the templates and everything they depend on),
     * for a scan that started at {@code startedNanos}. Empty when a file is too recent to vouch for
     * itself, since a report stored with it would never be used.
     */
    Optional<byte[]> stamps(FileSelection selection, Collection<Path> files, long startedNanos) {
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

    /** Stores {@code report} with the {@link #stamps} of what it was made from. */
    void save(byte[] stamps, byte[] report) {
        try {
            byte[] bytes = new byte[stamps.length + 4 + report.length + 8];
            ByteBuffer out = ByteBuffer.wrap(bytes);
            out.put(stamps).putInt(report.length).put(report);
            CRC32C crc = new CRC32C();
            crc.update(bytes, 0, out.position());
            out.putLong(crc.getValue());
            CacheFolder.replace(file, bytes);
            CacheFolder.pruneOthers(file, "report-");
        } catch (IOException | RuntimeException e) {
            // An optimisation only: the report is printed either way.
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

    private static void string(DataOutputStream out, String text) throws IOException {
        bytes(out, text.getBytes(StandardCharsets.UTF_8));
    }

    private static void bytes(DataOutputStream out, byte[] bytes) throws IOException {
        out.writeInt(bytes.length);
        out.write(bytes);
    }

    private static byte[] bytes(ByteBuffer in) {
        byte[] bytes = new byte[in.getInt()];
        in.get(bytes);
        return bytes;
    }

    private static String string(ByteBuffer in) {
        return new String(bytes(in), StandardCharsets.UTF_8);
    }
}
