package dev.tare.scan;

import dev.tare.Tare;
import dev.tare.footprint.CallSize;
import dev.tare.overlap.CachePrefixes;
import dev.tare.template.TemplateKind;
import java.io.BufferedInputStream;
import java.io.ByteArrayOutputStream;
import java.io.DataInputStream;
import java.io.DataOutputStream;
import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.LinkOption;
import java.nio.file.Path;
import java.nio.file.attribute.BasicFileAttributes;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HexFormat;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.TimeUnit;
import java.util.zip.CRC32C;

/**
 * What earlier scans measured, so that a template whose file and includes have not changed is not
 * read, parsed or counted again. One file under {@code .tare/cache} per build of Tare, configuration
 * and scan options (its name is a hash of all of them), holding per template the file's size,
 * modification time and a hash of its text, the same for every partial and tool file it depends on,
 * and the counts it gave.
 *
 * <p>An entry is used when the file's size and modification time are unchanged and the time is
 * older than the scan that wrote the entry (so a file edited twice within one clock tick is still
 * hashed), or when the text hashes the same. Files that were skipped are measured again each time,
 * since what made them fail (a partial not yet written) may be elsewhere.
 *
 * <p>The file is written whole to a temporary file and moved into place, so concurrent runs each
 * leave a complete cache and the last one wins; a cache that cannot be read (another version,
 * truncated, corrupt) is ignored, and one that cannot be written is not written. Neither ever fails
 * a scan.
 */
final class ScanCache {
    private static final String MAGIC = "tare-scan-cache";
    private static final int FORMAT = 2;
    /** How long before a scan a file's modification time must lie for its size and time to vouch for it. */
    static final long RACY_NANOS = 2_000_000_000L;

    private final Optional<Path> file;
    private final Map<String, Entry> previous;
    private final Map<String, Entry> current = new ConcurrentHashMap<>();
    private final Map<String, Optional<FileState>> states = new ConcurrentHashMap<>();
    private final Path root;
    private final long startedNanos;
    private final boolean wholeRoot;
    private volatile boolean changed;

    private ScanCache(Path root, Optional<Path> file, Map<String, Entry> previous, long startedNanos, boolean wholeRoot) {
        this.root = root;
        this.file = file;
        this.previous = previous;
        this.startedNanos = startedNanos;
        this.wholeRoot = wholeRoot;
    }

    /** A cache that remembers nothing: {@code --no-cache}, and library use that does not ask for one. */
    static ScanCache disabled(Path root) {
        return new ScanCache(root, Optional.empty(), Map.of(), System.currentTimeMillis() * 1_000_000L, true);
    }

    /**
     * Opens the cache of {@code workspace} for scans described by {@code key} (everything besides the
     * files that decides the results: configuration, options, tokenizer files).
     */
    static ScanCache open(Workspace workspace, String key) {
        Path root = workspace.root();
        Path file = CacheFolder.of(root).resolve("scan-" + digest(Tare.buildIdentity() + "\n" + key) + ".bin");
        long started = System.currentTimeMillis() * 1_000_000L;
        return new ScanCache(root, Optional.of(file), read(file), started, workspace.starts().isEmpty());
    }

    /** Whether nothing was remembered: every template will be measured afresh. */
    boolean isEmpty() {
        return previous.isEmpty();
    }

    /** The measurement remembered for {@code path}, when the file and everything it depends on are unchanged. */
    Optional<Measurement> find(String path) {
        Entry entry = previous.get(path);
        if (entry == null) {
            return Optional.empty();
        }
        Optional<Stamp> self = checked(entry.self());
        if (self.isEmpty()) {
            return Optional.empty();
        }
        List<Stamp> dependencies = new ArrayList<>();
        for (Stamp dependency : entry.dependencies()) {
            Optional<Stamp> checked = checked(dependency);
            if (checked.isEmpty()) {
                return Optional.empty();
            }
            dependencies.add(checked.get());
        }
        Entry kept = new Entry(self.get(), dependencies, entry.result());
        if (!kept.stamps().equals(entry.stamps())) {
            changed = true;
        }
        current.put(path, kept);
        return Optional.of(entry.result());
    }

    /** The paths of the partials and tool files behind the measurement {@link #find} last gave for {@code path}. */
    List<String> dependencies(String path) {
        Entry entry = current.get(path);
        return entry == null ? List.of() : entry.dependencies().stream().map(Stamp::path).toList();
    }

    /** Remembers a template's measurement, with the text it was read from and its dependencies' paths. */
    void remember(String path, String text, List<String> dependencies, Measurement result) {
        if (file.isEmpty()) {
            return;
        }
        Optional<FileState> self = stat(path).map(s -> s.withHash(hash(text)));
        if (self.isEmpty()) {
            return;
        }
        List<Stamp> stamps = new ArrayList<>();
        for (String dependency : dependencies) {
            Optional<Stamp> stamp = stampOf(dependency);
            if (stamp.isEmpty()) {
                return;
            }
            stamps.add(stamp.get());
        }
        current.put(path, new Entry(new Stamp(path, self.get()), stamps, result));
        changed = true;
    }

    /** Writes the cache when it changed; says nothing and keeps the old one when that fails. */
    void save() {
        if (file.isEmpty()) {
            return;
        }
        Map<String, Entry> kept = new LinkedHashMap<>();
        if (!wholeRoot) {
            // A scan of part of the repository keeps what it did not look at for the next full scan.
            kept.putAll(previous);
        } else if (!current.keySet().containsAll(previous.keySet())) {
            changed = true;
        }
        kept.putAll(current);
        if (!changed) {
            return;
        }
        try {
            CacheFolder.replace(file.get(), encode(kept));
            CacheFolder.pruneOthers(file.get(), "scan-");
        } catch (IOException | RuntimeException e) {
            // A cache is an optimisation: a read-only checkout or a full disk must not fail the scan.
        }
    }

    /** A 64-bit FNV-1a hash of the text's chars: enough to tell an edited file from an unchanged one. */
    static long hash(String text) {
        long h = 0xcbf29ce484222325L ^ text.length();
        for (int i = 0; i < text.length(); i++) {
            h = (h ^ text.charAt(i)) * 0x100000001b3L;
        }
        return h;
    }

    /** The first 16 hex digits of the SHA-256 of {@code text}. */
    static String digest(String text) {
        try {
            byte[] sha = MessageDigest.getInstance("SHA-256").digest(text.getBytes(StandardCharsets.UTF_8));
            return HexFormat.of().formatHex(sha, 0, 8);
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("every Java runtime has SHA-256", e);
        }
    }

    /**
     * The stamp to keep when the file is as {@code stamp} saw it: the same one when its size and time
     * vouch for it, else the file's new state when its text still hashes the same; empty when it changed.
     */
    private Optional<Stamp> checked(Stamp stamp) {
        Optional<FileState> now = stat(stamp.path());
        if (now.isEmpty()) {
            return Optional.empty();
        }
        FileState was = stamp.state();
        if (now.get().size() == was.size() && now.get().modifiedNanos() == was.modifiedNanos()
                && was.modifiedNanos() < was.vouchedUntilNanos() - RACY_NANOS) {
            return Optional.of(stamp);
        }
        return stampOf(stamp.path()).filter(s -> s.state().hash() == was.hash());
    }

    /** The state of a file with its text hashed: read once per scan. */
    private Optional<Stamp> stampOf(String path) {
        Optional<FileState> state = stat(path);
        if (state.isEmpty()) {
            return Optional.empty();
        }
        if (state.get().hash() != 0) {
            return Optional.of(new Stamp(path, state.get()));
        }
        try {
            String text = new String(Files.readAllBytes(root.resolve(path)), StandardCharsets.UTF_8);
            if (!text.isEmpty() && text.charAt(0) == '\uFEFF') {
                text = text.substring(1);
            }
            FileState hashed = state.get().withHash(hash(text));
            states.put(path, Optional.of(hashed));
            return Optional.of(new Stamp(path, hashed));
        } catch (IOException e) {
            return Optional.empty();
        }
    }

    private Optional<FileState> stat(String path) {
        return states.computeIfAbsent(path, p -> {
            try {
                BasicFileAttributes attributes = Files.readAttributes(root.resolve(p), BasicFileAttributes.class,
                        LinkOption.NOFOLLOW_LINKS);
                if (attributes.isSymbolicLink()) {
                    attributes = Files.readAttributes(root.resolve(p), BasicFileAttributes.class);
                }
                long nanos = attributes.lastModifiedTime().to(TimeUnit.NANOSECONDS);
                return Optional.of(new FileState(attributes.size(), nanos, 0, startedNanos));
            } catch (IOException e) {
                return Optional.empty();
            }
        });
    }

    /**
     * A file as last seen: size, modification time, text hash (0 until hashed), and the time of the
     * scan that saw it, before which an unchanged size and time can be trusted.
     */
    private record FileState(long size, long modifiedNanos, long hash, long vouchedUntilNanos) {
        FileState withHash(long textHash) {
            return new FileState(size, modifiedNanos, textHash == 0 ? 1 : textHash, vouchedUntilNanos);
        }
    }

    private record Stamp(String path, FileState state) {
    }

    private record Entry(Stamp self, List<Stamp> dependencies, Measurement result) {
        List<Stamp> stamps() {
            List<Stamp> all = new ArrayList<>(dependencies);
            all.add(self);
            return all;
        }
    }

    private static Map<String, Entry> read(Path file) {
        if (!Files.isRegularFile(file)) {
            return Map.of();
        }
        try (InputStream in = new BufferedInputStream(Files.newInputStream(file), 1 << 16)) {
            byte[] bytes = in.readAllBytes();
            if (bytes.length < 8) {
                return Map.of();
            }
            CRC32C crc = new CRC32C();
            crc.update(bytes, 0, bytes.length - 8);
            long stored = java.nio.ByteBuffer.wrap(bytes, bytes.length - 8, 8).getLong();
            if (stored != crc.getValue()) {
                return Map.of();
            }
            return decode(new DataInputStream(new java.io.ByteArrayInputStream(bytes, 0, bytes.length - 8)));
        } catch (IOException | RuntimeException e) {
            return Map.of();
        }
    }

    private static Map<String, Entry> decode(DataInputStream in) throws IOException {
        if (!MAGIC.equals(in.readUTF()) || in.readInt() != FORMAT) {
            return Map.of();
        }
        int count = in.readInt();
        Map<String, Entry> entries = new LinkedHashMap<>();
        for (int i = 0; i < count; i++) {
            Stamp self = readStamp(in);
            int dependencyCount = in.readInt();
            List<Stamp> dependencies = new ArrayList<>(dependencyCount);
            for (int d = 0; d < dependencyCount; d++) {
                dependencies.add(readStamp(in));
            }
            TemplateKind kind = TemplateKind.valueOf(in.readUTF());
            int characters = in.readInt();
            int staticTokens = in.readInt();
            int estimatedTokens = in.readInt();
            List<String> variables = readStrings(in);
            List<String> unsized = readStrings(in);
            List<String> includes = readStrings(in);
            Map<String, CallSize> sizes = new LinkedHashMap<>();
            Map<String, Integer> byTarget = new LinkedHashMap<>();
            int targetCount = in.readInt();
            for (int t = 0; t < targetCount; t++) {
                String name = in.readUTF();
                sizes.put(name, new CallSize(in.readInt(), in.readInt(), in.readInt(), in.readInt()));
                byTarget.put(name, in.readInt());
            }
            Map<String, CachePrefixes.Leading> leading = new LinkedHashMap<>();
            int leadingCount = in.readInt();
            for (int t = 0; t < leadingCount; t++) {
                String name = in.readUTF();
                int[] now = readInts(in);
                leading.put(name, new CachePrefixes.Leading(now, in.readBoolean() ? now : readInts(in)));
            }
            entries.put(self.path(), new Entry(self, dependencies, new Measurement(self.path(), kind, characters,
                    staticTokens, estimatedTokens, variables, unsized, includes, sizes, byTarget, leading)));
        }
        return entries;
    }

    private static byte[] encode(Map<String, Entry> entries) throws IOException {
        ByteArrayOutputStream bytes = new ByteArrayOutputStream(1 << 16);
        DataOutputStream out = new DataOutputStream(bytes);
        out.writeUTF(MAGIC);
        out.writeInt(FORMAT);
        out.writeInt(entries.size());
        for (Entry entry : entries.values()) {
            writeStamp(out, entry.self());
            out.writeInt(entry.dependencies().size());
            for (Stamp dependency : entry.dependencies()) {
                writeStamp(out, dependency);
            }
            Measurement r = entry.result();
            out.writeUTF(r.kind().name());
            out.writeInt(r.characters());
            out.writeInt(r.staticTokens());
            out.writeInt(r.estimatedTokens());
            writeStrings(out, r.variables());
            writeStrings(out, r.unsizedVariables());
            writeStrings(out, r.includes());
            out.writeInt(r.callSizes().size());
            for (Map.Entry<String, CallSize> size : r.callSizes().entrySet()) {
                CallSize s = size.getValue();
                out.writeUTF(size.getKey());
                out.writeInt(s.inputTokens());
                out.writeInt(s.framingTokens());
                out.writeInt(s.outputTokens());
                out.writeInt(s.sharedPrefixTokens());
                out.writeInt(r.estimatedByTarget().getOrDefault(size.getKey(), 0));
            }
            out.writeInt(r.leadingIds().size());
            for (Map.Entry<String, CachePrefixes.Leading> leading : r.leadingIds().entrySet()) {
                CachePrefixes.Leading ids = leading.getValue();
                out.writeUTF(leading.getKey());
                writeInts(out, ids.now());
                boolean same = Arrays.equals(ids.now(), ids.reordered());
                out.writeBoolean(same);
                if (!same) {
                    writeInts(out, ids.reordered());
                }
            }
        }
        out.flush();
        CRC32C crc = new CRC32C();
        crc.update(bytes.toByteArray());
        out.writeLong(crc.getValue());
        out.flush();
        return bytes.toByteArray();
    }

    private static void writeStamp(DataOutputStream out, Stamp stamp) throws IOException {
        out.writeUTF(stamp.path());
        out.writeLong(stamp.state().size());
        out.writeLong(stamp.state().modifiedNanos());
        out.writeLong(stamp.state().hash());
        out.writeLong(stamp.state().vouchedUntilNanos());
    }

    private static Stamp readStamp(DataInputStream in) throws IOException {
        return new Stamp(in.readUTF(), new FileState(in.readLong(), in.readLong(), in.readLong(), in.readLong()));
    }

    private static void writeInts(DataOutputStream out, int[] ints) throws IOException {
        out.writeInt(ints.length);
        for (int i : ints) {
            out.writeInt(i);
        }
    }

    private static int[] readInts(DataInputStream in) throws IOException {
        int[] ints = new int[in.readInt()];
        for (int i = 0; i < ints.length; i++) {
            ints[i] = in.readInt();
        }
        return ints;
    }

    private static void writeStrings(DataOutputStream out, List<String> strings) throws IOException {
        out.writeInt(strings.size());
        for (String s : strings) {
            out.writeUTF(s);
        }
    }

    private static List<String> readStrings(DataInputStream in) throws IOException {
        int n = in.readInt();
        List<String> strings = new ArrayList<>(n);
        for (int i = 0; i < n; i++) {
            strings.add(in.readUTF());
        }
        return strings;
    }
}
