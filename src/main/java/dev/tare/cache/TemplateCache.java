package dev.tare.cache;

import dev.tare.Tare;
import java.io.BufferedInputStream;
import java.io.DataInputStream;
import java.io.DataOutputStream;
import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.LinkOption;
import java.nio.file.Path;
import java.nio.file.attribute.BasicFileAttributes;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.ArrayList;
import java.util.HexFormat;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.TimeUnit;
import java.util.zip.CRC32C;
import java.util.zip.CheckedOutputStream;

/**
 * What earlier runs found per template, so that a template whose file and includes have not changed
 * is not read, parsed, counted or linted again. One file under {@code .tare/cache} per kind of
 * result ({@code scan}, {@code check}), build of Tare and key (configuration and options; the file's
 * name is a hash of them), holding per template the file's size, modification time and a hash of its
 * text, the same for every partial and tool file it depends on, and the result, written by a
 * {@link Codec}.
 *
 * <p>An entry is used when the file's size and modification time are unchanged and the time is
 * older than the run that wrote the entry (so a file edited twice within one clock tick is still
 * hashed), or when the text hashes the same. Files that were skipped are read again each time,
 * since what made them fail (a partial not yet written) may be elsewhere.
 *
 * <p>The file is written whole to a temporary file and moved into place, so concurrent runs each
 * leave a complete cache and the last one wins; a cache that cannot be read (another version,
 * truncated, corrupt) is ignored, and one that cannot be written is not written. Neither ever fails
 * a run.
 *
 * <p>Besides the results per template, the cache keeps one result of the run as a whole (what the
 * check's cross-template rules found), with the {@link #fingerprint} of the templates it came from.
 *
 * @param <R> what one template gave
 */
public final class TemplateCache<R> {
    /** How long before a run a file's modification time must lie for its size and time to vouch for it. */
    private static final long RACY_NANOS = 2_000_000_000L;
    private static final int FORMAT = 3;

    /**
     * Writes and reads one template's result. A format change needs no version of its own: the
     * build's identity is part of every cache file's name.
     */
    public interface Codec<R> {
        void write(DataOutputStream out, R result) throws IOException;

        /** The result written for the template at {@code path}. */
        R read(DataInputStream in, String path) throws IOException;
    }

    private final Optional<Path> file;
    private final String magic;
    private final Codec<R> codec;
    private final Map<String, Entry<R>> previous;
    private final Optional<Whole<R>> previousWhole;
    private volatile Whole<R> currentWhole;
    private final Map<String, Entry<R>> current = new ConcurrentHashMap<>();
    private final Map<String, Optional<FileState>> states = new ConcurrentHashMap<>();
    private final Path root;
    private final long startedNanos;
    private final boolean wholeRoot;
    private volatile boolean changed;

    private TemplateCache(Path root, Optional<Path> file, String magic, Codec<R> codec, long startedNanos,
                          boolean wholeRoot) {
        this.root = root;
        this.file = file;
        this.magic = magic;
        this.codec = codec;
        this.startedNanos = startedNanos;
        this.wholeRoot = wholeRoot;
        Contents<R> contents = file.map(this::read).orElse(Contents.empty());
        this.previous = contents.entries();
        this.previousWhole = contents.whole();
    }

    /** A cache that remembers nothing: {@code --no-cache}, staged content, and library use that does not ask for one. */
    public static <R> TemplateCache<R> disabled(Path root) {
        return new TemplateCache<>(root, Optional.empty(), "", null, System.currentTimeMillis() * 1_000_000L, true);
    }

    /**
     * Opens the cache of the repository at {@code root} for results of {@code kind} described by
     * {@code key} (everything besides the files that decides the results: configuration, options,
     * tokenizer files; see {@link CacheKey}).
     *
     * @param wholeRoot whether the run covers the whole root, rather than paths named on the command line
     */
    public static <R> TemplateCache<R> open(Path root, boolean wholeRoot, String kind, String key, Codec<R> codec) {
        Path file = CacheFolder.of(root).resolve(kind + "-" + digest(Tare.buildIdentity() + "\n" + key) + ".bin");
        long started = System.currentTimeMillis() * 1_000_000L;
        return new TemplateCache<>(root, Optional.of(file), "tare-" + kind + "-cache", codec, started, wholeRoot);
    }

    /** Whether this cache neither reads nor writes anything. */
    public boolean isDisabled() {
        return file.isEmpty();
    }

    /** Whether nothing was remembered: every template will be read afresh. */
    public boolean isEmpty() {
        return previous.isEmpty();
    }

    /** The result remembered for {@code path}, when the file and everything it depends on are unchanged. */
    public Optional<R> find(String path) {
        Entry<R> entry = previous.get(path);
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
        Entry<R> kept = new Entry<>(self.get(), dependencies, entry.result());
        if (!kept.stamps().equals(entry.stamps())) {
            changed = true;
        }
        current.put(path, kept);
        return Optional.of(entry.result());
    }

    /**
     * Remembers a template's result, with the text it was read from and its dependencies' paths
     * (root-relative); not when a dependency cannot be read, since then nothing vouches for it.
     */
    public void remember(String path, String text, List<String> dependencies, R result) {
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
        current.put(path, new Entry<>(new Stamp(path, self.get()), stamps, result));
        changed = true;
    }

    /**
     * A hash of the files behind the results remembered or found for {@code paths} in this run: their
     * paths and the hashes of their texts and dependencies. Two runs whose fingerprints agree read
     * the same texts. Empty when one of the paths has no result here (it was skipped, or the cache
     * is off).
     */
    public Optional<Long> fingerprint(java.util.Collection<String> paths) {
        if (file.isEmpty()) {
            return Optional.empty();
        }
        long h = 0xcbf29ce484222325L;
        for (String path : new java.util.TreeSet<>(paths)) {
            Entry<R> entry = current.get(path);
            if (entry == null) {
                return Optional.empty();
            }
            for (Stamp stamp : entry.stamps()) {
                h = (h ^ hash(stamp.path())) * 0x100000001b3L;
                h = (h ^ stamp.state().hash()) * 0x100000001b3L;
            }
        }
        return Optional.of(h);
    }

    /** The result of the whole run remembered with {@code fingerprint}, when there is one. */
    public Optional<R> findWhole(long fingerprint) {
        Optional<R> found = previousWhole.filter(w -> w.fingerprint() == fingerprint).map(Whole::result);
        found.ifPresent(result -> currentWhole = new Whole<>(fingerprint, result));
        return found;
    }

    /** Remembers the result of the whole run, made from the templates {@code fingerprint} stands for. */
    public void rememberWhole(long fingerprint, R result) {
        if (file.isPresent()) {
            currentWhole = new Whole<>(fingerprint, result);
            changed = true;
        }
    }

    /** Writes the cache when it changed; says nothing and keeps the old one when that fails. */
    public void save() {
        if (file.isEmpty()) {
            return;
        }
        Map<String, Entry<R>> kept = new LinkedHashMap<>();
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
            CacheFolder.prepare(root);
            Optional<Whole<R>> whole = currentWhole != null ? Optional.of(currentWhole) : previousWhole;
            CacheFolder.replace(file.get(), out -> encode(out, kept, whole));
            String name = file.get().getFileName().toString();
            CacheFolder.pruneOthers(file.get(), name.substring(0, name.lastIndexOf('-') + 1));
        } catch (IOException | RuntimeException e) {
            // A cache is an optimisation: a read-only checkout or a full disk must not fail the scan.
        }
    }

    /** Each thread's chars for {@link #hash}, which reads a text a block at a time. */
    private static final ThreadLocal<char[]> HASHED_CHARS = ThreadLocal.withInitial(() -> new char[8192]);
    private static final long FNV_PRIME = 0x100000001b3L;

    /**
     * A 64-bit hash of the text's chars, enough to tell an edited file from an unchanged one: four
     * 64-bit FNV-1a hashes, of the chars at 0, 4, 8, ..., at 1, 5, 9, ..., and so on, combined. The
     * four multiply side by side where one waited for each product, and blocks of chars copied out
     * of the string are read without {@code charAt}'s checks, which the first JIT tier does not
     * remove; a cold scan hashes every template.
     */
    static long hash(String text) {
        char[] block = HASHED_CHARS.get();
        int length = text.length();
        long a = 0xcbf29ce484222325L ^ length;
        long b = 0x84222325cbf29ce4L;
        long c = 0x9e3779b97f4a7c15L;
        long d = 0xbf58476d1ce4e5b9L;
        for (int from = 0; from < length; from += block.length) {
            int size = Math.min(block.length, length - from);
            text.getChars(from, from + size, block, 0);
            int i = 0;
            for (; i + 4 <= size; i += 4) {
                a = (a ^ block[i]) * FNV_PRIME;
                b = (b ^ block[i + 1]) * FNV_PRIME;
                c = (c ^ block[i + 2]) * FNV_PRIME;
                d = (d ^ block[i + 3]) * FNV_PRIME;
            }
            // A block is a multiple of four chars long, so only the text's last block has a rest.
            for (; i < size; i++) {
                a = (a ^ block[i]) * FNV_PRIME;
            }
        }
        return a ^ Long.rotateLeft(b, 16) ^ Long.rotateLeft(c, 32) ^ Long.rotateLeft(d, 48);
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

    /** A result of the whole run and the fingerprint of the templates it came from. */
    private record Whole<R>(long fingerprint, R result) {
    }

    /** What a cache file holds. */
    private record Contents<R>(Map<String, Entry<R>> entries, Optional<Whole<R>> whole) {
        static <R> Contents<R> empty() {
            return new Contents<>(Map.of(), Optional.empty());
        }
    }

    private record Entry<R>(Stamp self, List<Stamp> dependencies, R result) {
        List<Stamp> stamps() {
            List<Stamp> all = new ArrayList<>(dependencies);
            all.add(self);
            return all;
        }
    }

    private Contents<R> read(Path file) {
        if (!Files.isRegularFile(file)) {
            return Contents.empty();
        }
        try (InputStream in = new BufferedInputStream(Files.newInputStream(file), 1 << 16)) {
            byte[] bytes = in.readAllBytes();
            if (bytes.length < 8) {
                return Contents.empty();
            }
            CRC32C crc = new CRC32C();
            crc.update(bytes, 0, bytes.length - 8);
            long stored = java.nio.ByteBuffer.wrap(bytes, bytes.length - 8, 8).getLong();
            if (stored != crc.getValue()) {
                return Contents.empty();
            }
            return decode(new DataInputStream(new ArrayInput(bytes, bytes.length - 8)));
        } catch (IOException | RuntimeException e) {
            return Contents.empty();
        }
    }

    private Contents<R> decode(DataInputStream in) throws IOException {
        if (!magic.equals(in.readUTF()) || in.readInt() != FORMAT) {
            return Contents.empty();
        }
        int count = in.readInt();
        Map<String, Entry<R>> entries = new LinkedHashMap<>();
        for (int i = 0; i < count; i++) {
            Stamp self = readStamp(in);
            int dependencyCount = in.readInt();
            List<Stamp> dependencies = new ArrayList<>(dependencyCount);
            for (int d = 0; d < dependencyCount; d++) {
                dependencies.add(readStamp(in));
            }
            entries.put(self.path(), new Entry<>(self, dependencies, codec.read(in, self.path())));
        }
        Optional<Whole<R>> whole = Optional.empty();
        if (in.readBoolean()) {
            long fingerprint = in.readLong();
            whole = Optional.of(new Whole<>(fingerprint, codec.read(in, "")));
        }
        return new Contents<>(entries, whole);
    }

    /** Writes the entries and the whole run's result, then a checksum of everything before it. */
    private void encode(OutputStream stream, Map<String, Entry<R>> entries, Optional<Whole<R>> whole) throws IOException {
        CRC32C crc = new CRC32C();
        DataOutputStream out = new DataOutputStream(new ChunkedOutput(new CheckedOutputStream(stream, crc)));
        out.writeUTF(magic);
        out.writeInt(FORMAT);
        out.writeInt(entries.size());
        for (Entry<R> entry : entries.values()) {
            writeStamp(out, entry.self());
            out.writeInt(entry.dependencies().size());
            for (Stamp dependency : entry.dependencies()) {
                writeStamp(out, dependency);
            }
            codec.write(out, entry.result());
        }
        out.writeBoolean(whole.isPresent());
        if (whole.isPresent()) {
            out.writeLong(whole.get().fingerprint());
            codec.write(out, whole.get().result());
        }
        out.flush();
        new DataOutputStream(stream).writeLong(crc.getValue());
    }

    /**
     * A byte array read one byte at a time without a lock: {@code DataInputStream} reads each int
     * as four single bytes, and {@code ByteArrayInputStream}'s reads are synchronized, which on a
     * cache of tens of megabytes costs a second.
     */
    private static final class ArrayInput extends InputStream {
        private final byte[] bytes;
        private final int end;
        private int at;

        ArrayInput(byte[] bytes, int end) {
            this.bytes = bytes;
            this.end = end;
        }

        @Override
        public int read() {
            return at < end ? bytes[at++] & 0xff : -1;
        }

        @Override
        public int read(byte[] into, int offset, int length) {
            if (length == 0) {
                return 0;
            }
            if (at >= end) {
                return -1;
            }
            int n = Math.min(length, end - at);
            System.arraycopy(bytes, at, into, offset, n);
            at += n;
            return n;
        }
    }

    /**
     * Bytes gathered into chunks without a lock before they go on: {@code DataOutputStream} writes
     * each int as four single bytes, and {@code BufferedOutputStream}'s writes are synchronized.
     */
    private static final class ChunkedOutput extends OutputStream {
        private final OutputStream out;
        private final byte[] chunk = new byte[1 << 16];
        private int used;

        ChunkedOutput(OutputStream out) {
            this.out = out;
        }

        @Override
        public void write(int b) throws IOException {
            if (used == chunk.length) {
                flushChunk();
            }
            chunk[used++] = (byte) b;
        }

        @Override
        public void write(byte[] bytes, int offset, int length) throws IOException {
            if (length > chunk.length - used) {
                flushChunk();
                if (length > chunk.length) {
                    out.write(bytes, offset, length);
                    return;
                }
            }
            System.arraycopy(bytes, offset, chunk, used, length);
            used += length;
        }

        @Override
        public void flush() throws IOException {
            flushChunk();
            out.flush();
        }

        private void flushChunk() throws IOException {
            out.write(chunk, 0, used);
            used = 0;
        }
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
}
