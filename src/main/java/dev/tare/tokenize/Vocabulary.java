package dev.tare.tokenize;

import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.nio.ByteBuffer;
import java.nio.charset.StandardCharsets;
import java.util.Arrays;

/**
 * The tokens of a byte-level BPE encoding and their ranks: a token's rank is both its id and its
 * merge priority. Held as one byte array of every token in rank order, with an open-addressing hash
 * table from a byte range to its rank, so a lookup allocates nothing.
 *
 * <p>The source is the {@code .tiktoken} files jtokkit ships (one token a line, base64 then the rank),
 * decoded by hand straight from the bytes: building the maps of boxed keys that a general decoder
 * makes costs most of a second for the largest encoding, which a pre-commit hook cannot afford. The
 * build turns each file into a compact form ({@link CompactVocabularies}: every token's length, then
 * every token's bytes, in rank order) that loads several times faster still, because nothing is
 * decoded; a class path without it (an IDE that skipped the build step) falls back to the file.
 */
final class Vocabulary {
    private static final int NO_RANK = -1;

    private final byte[] bytes;
    /** Token {@code r} is {@code bytes[starts[r], starts[r + 1])}; an unused rank is empty. */
    private final int[] starts;
    /** Rank + 1 of the token in each slot, 0 for an empty slot; the size is a power of two. */
    private final int[] slots;
    private final int mask;

    private Vocabulary(byte[] bytes, int[] starts) {
        this.bytes = bytes;
        this.starts = starts;
        int ranks = starts.length - 1;
        int size = Integer.highestOneBit(Math.max(ranks, 1) * 3 - 1) << 1;
        this.slots = new int[size];
        this.mask = size - 1;
        for (int rank = 0; rank < ranks; rank++) {
            int from = starts[rank];
            int to = starts[rank + 1];
            if (from == to) {
                continue;
            }
            int slot = hash(bytes, from, to) & mask;
            while (slots[slot] != 0) {
                slot = (slot + 1) & mask;
            }
            slots[slot] = rank + 1;
        }
    }

    /** Where jtokkit keeps an encoding's {@code .tiktoken} file. */
    private static final String TIKTOKEN = "/com/knuddels/jtokkit/%s.tiktoken";
    /** Where the build puts an encoding's compact form. */
    static final String COMPACT = "/dev/tare/tokenize/%s.ranks";
    private static final byte[] MAGIC = "TARERNK1".getBytes(StandardCharsets.US_ASCII);
    private static final int HEADER = MAGIC.length + 8;

    /**
     * The vocabulary of built-in encoding {@code encoding}, from its compact form when the build made
     * one, else from jtokkit's file.
     *
     * @throws IllegalStateException when neither is on the class path or one is malformed, which is a packaging bug
     */
    static Vocabulary load(String encoding) {
        byte[] compact = resource(String.format(COMPACT, encoding));
        if (compact != null) {
            return readCompact(encoding, compact);
        }
        return fromTiktoken(encoding);
    }

    /** The vocabulary of built-in encoding {@code encoding}, parsed from jtokkit's {@code .tiktoken} file. */
    static Vocabulary fromTiktoken(String encoding) {
        String name = String.format(TIKTOKEN, encoding);
        byte[] file = resource(name);
        if (file == null) {
            throw new IllegalStateException("encoding resource " + name + " is not on the class path");
        }
        return parse(name, file);
    }

    private static byte[] resource(String name) {
        try (InputStream in = Vocabulary.class.getResourceAsStream(name)) {
            return in == null ? null : in.readAllBytes();
        } catch (IOException e) {
            throw new UncheckedIOException("cannot read encoding resource " + name, e);
        }
    }

    /**
     * The compact form: {@code TARERNK1}, the number of ranks and of token bytes (big-endian ints),
     * each rank's token length (one byte; no token is longer than 255 bytes), then the tokens' bytes.
     */
    byte[] compact() {
        int ranks = ranks();
        ByteBuffer out = ByteBuffer.allocate(HEADER + ranks + bytes.length);
        out.put(MAGIC).putInt(ranks).putInt(bytes.length);
        for (int rank = 0; rank < ranks; rank++) {
            int length = starts[rank + 1] - starts[rank];
            if (length > 255) {
                throw new IllegalStateException("token " + rank + " is " + length + " bytes long; the compact form holds up to 255");
            }
            out.put((byte) length);
        }
        return out.put(bytes).array();
    }

    /** Reads the compact form written by {@link #compact()}. */
    static Vocabulary readCompact(String name, byte[] data) {
        if (data.length < HEADER || !Arrays.equals(data, 0, MAGIC.length, MAGIC, 0, MAGIC.length)) {
            throw new IllegalStateException(name + ": not a compact vocabulary");
        }
        ByteBuffer in = ByteBuffer.wrap(data, MAGIC.length, 8);
        int ranks = in.getInt();
        int length = in.getInt();
        if (ranks < 0 || length < 0 || (long) HEADER + ranks + length != data.length) {
            throw new IllegalStateException(name + ": compact vocabulary of the wrong size");
        }
        int[] starts = new int[ranks + 1];
        int at = 0;
        for (int rank = 0; rank < ranks; rank++) {
            starts[rank] = at;
            at += data[HEADER + rank] & 0xFF;
        }
        starts[ranks] = at;
        if (at != length) {
            throw new IllegalStateException(name + ": compact vocabulary's lengths do not add up");
        }
        return new Vocabulary(Arrays.copyOfRange(data, HEADER + ranks, data.length), starts);
    }

    /** Parses the lines {@code BASE64 RANK}; ranks may leave gaps (a special token's id, say). */
    static Vocabulary parse(String name, byte[] file) {
        byte[] tokens = new byte[file.length];
        int[] tokenStart = new int[1024];
        int[] tokenRank = new int[1024];
        int count = 0;
        int length = 0;
        int maxRank = -1;
        int pos = 0;
        while (pos < file.length) {
            int end = pos;
            while (end < file.length && file[end] != '\n') {
                end++;
            }
            int lineEnd = end > pos && file[end - 1] == '\r' ? end - 1 : end;
            if (lineEnd == pos) {
                pos = end + 1;
                continue;
            }
            int space = pos;
            while (space < lineEnd && file[space] != ' ') {
                space++;
            }
            if (space == pos || space >= lineEnd - 1) {
                throw new IllegalStateException(name + ": malformed line at byte " + pos);
            }
            int rank = 0;
            for (int i = space + 1; i < lineEnd; i++) {
                int digit = file[i] - '0';
                if (digit < 0 || digit > 9) {
                    throw new IllegalStateException(name + ": malformed rank at byte " + i);
                }
                rank = rank * 10 + digit;
            }
            if (count == tokenStart.length) {
                tokenStart = Arrays.copyOf(tokenStart, count * 2);
                tokenRank = Arrays.copyOf(tokenRank, count * 2);
            }
            tokenStart[count] = length;
            tokenRank[count] = rank;
            count++;
            length = decodeBase64(file, pos, space, tokens, length, name);
            maxRank = Math.max(maxRank, rank);
            pos = end + 1;
        }
        // Lay the tokens out in rank order, so that token r is a slice found from its rank alone.
        int[] lengthOf = new int[maxRank + 1];
        int[] sourceOf = new int[maxRank + 1];
        for (int i = 0; i < count; i++) {
            int to = i + 1 < count ? tokenStart[i + 1] : length;
            lengthOf[tokenRank[i]] = to - tokenStart[i];
            sourceOf[tokenRank[i]] = tokenStart[i];
        }
        byte[] ordered = new byte[length];
        int[] starts = new int[maxRank + 2];
        int at = 0;
        for (int rank = 0; rank <= maxRank; rank++) {
            starts[rank] = at;
            System.arraycopy(tokens, sourceOf[rank], ordered, at, lengthOf[rank]);
            at += lengthOf[rank];
        }
        starts[maxRank + 1] = at;
        return new Vocabulary(ordered, starts);
    }

    /** The rank of the token whose bytes are {@code piece[from, to)}, or -1 when there is none. */
    int rank(byte[] piece, int from, int to) {
        int slot = hash(piece, from, to) & mask;
        int length = to - from;
        while (true) {
            int entry = slots[slot];
            if (entry == 0) {
                return NO_RANK;
            }
            int rank = entry - 1;
            int start = starts[rank];
            if (starts[rank + 1] - start == length && Arrays.equals(bytes, start, start + length, piece, from, to)) {
                return rank;
            }
            slot = (slot + 1) & mask;
        }
    }

    /** The number of rank values, gaps included: every id is below it. */
    int ranks() {
        return starts.length - 1;
    }

    /** The bytes of token {@code rank}. */
    byte[] token(int rank) {
        return Arrays.copyOfRange(bytes, starts[rank], starts[rank + 1]);
    }

    private static final byte[] BASE64 = new byte[128];

    static {
        Arrays.fill(BASE64, (byte) -1);
        String alphabet = "ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789+/";
        for (int i = 0; i < alphabet.length(); i++) {
            BASE64[alphabet.charAt(i)] = (byte) i;
        }
    }

    /** Decodes standard base64 {@code in[from, to)} into {@code out} at {@code at}; returns the end. */
    private static int decodeBase64(byte[] in, int from, int to, byte[] out, int at, String name) {
        int bits = 0;
        int held = 0;
        for (int i = from; i < to; i++) {
            int c = in[i];
            if (c == '=') {
                break;
            }
            int value = c >= 0 ? BASE64[c] : -1;
            if (value < 0) {
                throw new IllegalStateException(name + ": not base64 at byte " + i);
            }
            bits = (bits << 6) | value;
            held += 6;
            if (held >= 8) {
                held -= 8;
                out[at++] = (byte) (bits >>> held);
            }
        }
        return at;
    }

    private static int hash(byte[] data, int from, int to) {
        int h = 0x9E3779B9 * (to - from);
        for (int i = from; i < to; i++) {
            h = (h ^ data[i]) * 0x01000193;
        }
        return h ^ (h >>> 15);
    }
}
