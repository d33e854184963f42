package dev.tare.tokenize;

import java.util.Arrays;

/**
 * The token ids of pieces already encoded, for one thread counting with one encoding. Prompt text
 * repeats the same words endlessly, so after the first few files nearly every piece is found here
 * and the merge never runs. Pieces are looked up by their place in the text being counted, without
 * copying them out, in an open-addressing table. Only short pieces are kept, and at most
 * {@link #MAX_ENTRIES} of them, so the memory it takes stays small and fixed; once full, it keeps
 * what it has. Not thread-safe: each counting thread has its own.
 *
 * <p>The table is laid out for the memory, not the arithmetic: with tens of thousands of pieces it
 * outgrows the processor's caches, and a lookup through a key array of its own and an id array of
 * its own cost four cache misses in a row (the slot's key reference, the key, the value reference,
 * the ids). Here a slot is one {@code long} holding where the key's chars are, its length, its
 * number of ids and a few bits of its hash, and the keys' chars lie one after another in one array:
 * a hit while counting reads the slot and the chars, and a piece of another length or hash is
 * passed over without reading its chars at all.
 */
final class PieceCache {
    /** Longer pieces are rare and unlikely to come again. */
    static final int MAX_PIECE_CHARS = 48;
    static final int MAX_ENTRIES = 1 << 16;

    private static final int SLOTS = MAX_ENTRIES * 2;
    private static final int MASK = SLOTS - 1;
    /** The bits of a slot that a lookup must match before comparing chars: the hash bits and the length. */
    private static final long MATCHED_BITS = 0xFFFF_00FF_0000_0000L;
    /** The most ids a slot can record (a 48-char piece has at most 144 UTF-8 bytes, one id each). */
    private static final int MAX_IDS = 0xFF;

    /**
     * Per slot, 0 when empty: bits 48 to 63 hold hash bits the slot's index does not use, 40 to 47
     * the number of ids, 32 to 39 the key's length (never 0), 0 to 31 where its chars start in
     * {@link #keyChars}.
     */
    private final long[] slots = new long[SLOTS];
    private final int[][] values = new int[SLOTS][];
    private char[] keyChars = new char[1 << 14];
    private int keyCharsUsed;
    private int size;

    /** The number of ids of {@code text[start, end)} when it is cached, else -1. */
    int count(char[] text, int start, int end) {
        int slot = find(text, start, end);
        return slot < 0 ? -1 : (int) (slots[slot] >>> 40) & MAX_IDS;
    }

    /** The cached ids of {@code text[start, end)}, or null. */
    int[] get(char[] text, int start, int end) {
        int slot = find(text, start, end);
        return slot < 0 ? null : values[slot];
    }

    /** Remembers the ids of {@code text[start, end)} while there is room and the piece is short. */
    void put(char[] text, int start, int end, int[] ids) {
        int length = end - start;
        if (length > MAX_PIECE_CHARS || length == 0 || ids.length > MAX_IDS || size >= MAX_ENTRIES) {
            return;
        }
        int hash = hash(text, start, end);
        int slot = hash & MASK;
        while (slots[slot] != 0) {
            slot = (slot + 1) & MASK;
        }
        if (keyCharsUsed + length > keyChars.length) {
            keyChars = Arrays.copyOf(keyChars, Math.max(keyChars.length * 2, keyCharsUsed + length));
        }
        System.arraycopy(text, start, keyChars, keyCharsUsed, length);
        slots[slot] = matchBits(hash, length) | ((long) ids.length << 40) | keyCharsUsed;
        values[slot] = ids;
        keyCharsUsed += length;
        size++;
    }

    /** The slot holding {@code text[start, end)}, or -1. */
    private int find(char[] text, int start, int end) {
        int length = end - start;
        if (length > MAX_PIECE_CHARS) {
            return -1;
        }
        int hash = hash(text, start, end);
        long wanted = matchBits(hash, length);
        for (int slot = hash & MASK; ; slot = (slot + 1) & MASK) {
            long entry = slots[slot];
            if (entry == 0) {
                return -1;
            }
            if ((entry & MATCHED_BITS) == wanted && same(keyChars, (int) entry, text, start, length)) {
                return slot;
            }
        }
    }

    private static long matchBits(int hash, int length) {
        return ((long) (hash >>> 17) << 48) | ((long) length << 32);
    }

    /** A plain loop: pieces are a few chars long, too short for a vectorised compare to pay off. */
    private static boolean same(char[] keys, int keyStart, char[] text, int start, int length) {
        for (int i = 0; i < length; i++) {
            if (keys[keyStart + i] != text[start + i]) {
                return false;
            }
        }
        return true;
    }

    /** A mixed hash: the low bits pick the slot, the high 15 go into the slot to be compared first. */
    private static int hash(char[] text, int start, int end) {
        int h = end - start;
        for (int i = start; i < end; i++) {
            h = 31 * h + text[i];
        }
        h *= 0x9E3779B9;
        return h ^ (h >>> 15);
    }
}
