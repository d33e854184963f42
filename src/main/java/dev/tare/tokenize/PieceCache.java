package dev.tare.tokenize;

import java.util.Arrays;

/**
 * The token ids of pieces already encoded, for one thread counting with one encoding. Prompt text
 * repeats the same words endlessly, so after the first few files nearly every piece is found here
 * and the merge never runs. Pieces are looked up by their place in the text being counted, without
 * copying them out, in an open-addressing table. Only short pieces are kept, and at most
 * {@link #MAX_ENTRIES} of them, so the memory it takes stays small and bounded; once full, it keeps
 * what it has. Not thread-safe: each counting thread has its own.
 *
 * <p>The table is laid out for the memory, not the arithmetic: profiles of the benchmark scan put a
 * sixth of its samples in comparing a found key's chars, which is the first touch of memory the
 * lookup did not have at hand. A lookup through a key array and an id array of their own reads four
 * places in a row (the slot's key reference, the key, the value reference, the ids). Here a slot is
 * one {@code long} holding where the key's chars are, its length, its number of ids and a few bits
 * of its hash, and the keys' chars lie one after another in one array: a hit while counting reads
 * the slot and the chars, and a piece of another length or hash is passed over without reading its
 * chars at all.
 *
 * <p>Most pieces of prompt text are a few ASCII characters, and those have a table of their own
 * whose key is the piece itself: up to {@link #PACKED_CHARS} characters of seven bits, packed into
 * two {@code long}s. Packing is one short loop over the piece, where hashing and comparing were
 * two, and a hit compares two numbers that lie next to the ids' count.
 */
final class PieceCache {
    /** Longer pieces are rare and unlikely to come again. */
    static final int MAX_PIECE_CHARS = 48;
    static final int MAX_ENTRIES = 1 << 16;

    /** The table's size when full: it stays at most half full, so that a lookup seldom probes far. */
    private static final int MAX_SLOTS = MAX_ENTRIES * 2;
    private static final int FIRST_SLOTS = 1 << 12;
    /** The bits of a slot that a lookup must match before comparing chars: the hash bits and the length. */
    private static final long MATCHED_BITS = 0xFFFF_00FF_0000_0000L;
    /** The most ids a slot can record (a 48-char piece has at most 144 UTF-8 bytes, one id each). */
    private static final int MAX_IDS = 0xFF;
    /** The longest piece packed: nine chars of seven bits in the first long, eight in the second. */
    static final int PACKED_CHARS = 17;
    private static final int FIRST_LONG_CHARS = 9;
    /** The bits of a packed slot's second long that hold chars; the top byte holds the count. */
    private static final long PACKED_CHAR_BITS = 0x00FF_FFFF_FFFF_FFFFL;

    /**
     * Per slot, 0 when empty: bits 48 to 63 hold hash bits the slot's index does not use, 40 to 47
     * the number of ids, 32 to 39 the key's length (never 0), 0 to 31 where its chars start in
     * {@link #keyChars}. The table starts small and doubles as it fills: a few tens of thousands
     * of pieces spread over the largest table would touch a different cache line for nearly every
     * lookup, and prompt text has far fewer distinct pieces than that.
     */
    private long[] slots = new long[FIRST_SLOTS];
    private int[][] values = new int[FIRST_SLOTS][];
    private int mask = FIRST_SLOTS - 1;
    private char[] keyChars = new char[1 << 14];
    private int keyCharsUsed;
    /** Entries in both tables together. */
    private int size;

    /**
     * The table of packed pieces: per slot, the first long holds the piece's first nine chars (0
     * when the slot is empty) and the second the rest, with the number of ids in its top byte.
     */
    private long[] packed = new long[FIRST_SLOTS * 2];
    private int[][] packedValues = new int[FIRST_SLOTS][];
    private int packedMask = FIRST_SLOTS - 1;
    private int packedSize;
    /** The second long of the piece {@link #pack} packed last. */
    private long packedHigh;

    /** The number of ids of {@code text[start, end)} when it is cached, else -1. */
    int count(char[] text, int start, int end) {
        long low = pack(text, start, end);
        if (low != 0) {
            int slot = findPacked(low, packedHigh);
            return slot < 0 ? -1 : (int) (packed[2 * slot + 1] >>> 56);
        }
        int slot = find(text, start, end);
        return slot < 0 ? -1 : (int) (slots[slot] >>> 40) & MAX_IDS;
    }

    /** The cached ids of {@code text[start, end)}, or null. */
    int[] get(char[] text, int start, int end) {
        long low = pack(text, start, end);
        if (low != 0) {
            int slot = findPacked(low, packedHigh);
            return slot < 0 ? null : packedValues[slot];
        }
        int slot = find(text, start, end);
        return slot < 0 ? null : values[slot];
    }

    /** Remembers the ids of {@code text[start, end)} while there is room and the piece is short. */
    void put(char[] text, int start, int end, int[] ids) {
        int length = end - start;
        if (length > MAX_PIECE_CHARS || length == 0 || ids.length > MAX_IDS || size >= MAX_ENTRIES) {
            return;
        }
        long low = pack(text, start, end);
        if (low != 0) {
            putPacked(low, packedHigh, ids);
            return;
        }
        if ((size - packedSize + 1) * 2 > slots.length) {
            grow();
        }
        if (keyCharsUsed + length > keyChars.length) {
            keyChars = Arrays.copyOf(keyChars, Math.max(keyChars.length * 2, keyCharsUsed + length));
        }
        System.arraycopy(text, start, keyChars, keyCharsUsed, length);
        int hash = hash(text, start, end);
        place(matchBits(hash, length) | ((long) ids.length << 40) | keyCharsUsed, hash, ids);
        keyCharsUsed += length;
        size++;
    }

    private void place(long entry, int hash, int[] ids) {
        int slot = hash & mask;
        while (slots[slot] != 0) {
            slot = (slot + 1) & mask;
        }
        slots[slot] = entry;
        values[slot] = ids;
    }

    /**
     * {@code text[start, end)} packed when it is at most {@link #PACKED_CHARS} ASCII chars and none
     * is NUL: the first long, with the second left in {@link #packedHigh}; else 0. Each long holds
     * its chars as the digits of a number in base 128 whose first digit is not 0, so the number
     * also tells how many chars it holds, and two pieces pack alike only when they are equal.
     */
    private long pack(char[] text, int start, int end) {
        if (end - start > PACKED_CHARS) {
            return 0;
        }
        int split = Math.min(end, start + FIRST_LONG_CHARS);
        long low = 0;
        for (int i = start; i < split; i++) {
            char c = text[i];
            if (c == 0 || c > 0x7F) {
                return 0;
            }
            low = low << 7 | c;
        }
        long high = 0;
        for (int i = split; i < end; i++) {
            char c = text[i];
            if (c == 0 || c > 0x7F) {
                return 0;
            }
            high = high << 7 | c;
        }
        packedHigh = high;
        return low;
    }

    private int findPacked(long low, long high) {
        for (int slot = packedHash(low, high) & packedMask; ; slot = (slot + 1) & packedMask) {
            long first = packed[2 * slot];
            if (first == 0) {
                return -1;
            }
            if (first == low && (packed[2 * slot + 1] & PACKED_CHAR_BITS) == high) {
                return slot;
            }
        }
    }

    private void putPacked(long low, long high, int[] ids) {
        if ((packedSize + 1) * 2 > packedValues.length) {
            growPacked();
        }
        placePacked(low, high | (long) ids.length << 56, ids);
        packedSize++;
        size++;
    }

    private void placePacked(long low, long highAndCount, int[] ids) {
        int slot = packedHash(low, highAndCount & PACKED_CHAR_BITS) & packedMask;
        while (packed[2 * slot] != 0) {
            slot = (slot + 1) & packedMask;
        }
        packed[2 * slot] = low;
        packed[2 * slot + 1] = highAndCount;
        packedValues[slot] = ids;
    }

    private void growPacked() {
        long[] oldPacked = packed;
        int[][] oldValues = packedValues;
        int doubled = Math.min(oldValues.length * 2, MAX_SLOTS);
        packed = new long[doubled * 2];
        packedValues = new int[doubled][];
        packedMask = doubled - 1;
        for (int i = 0; i < oldValues.length; i++) {
            if (oldPacked[2 * i] != 0) {
                placePacked(oldPacked[2 * i], oldPacked[2 * i + 1], oldValues[i]);
            }
        }
    }

    /** A mixed hash of a packed piece, whose low bits pick the slot. */
    private static int packedHash(long low, long high) {
        long h = (low ^ Long.rotateLeft(high, 32)) * 0x9E3779B97F4A7C15L;
        return (int) (h >>> 32) ^ (int) h;
    }

    /** Doubles the table, placing every entry again by the hash of its chars. */
    private void grow() {
        long[] oldSlots = slots;
        int[][] oldValues = values;
        int doubled = Math.min(oldSlots.length * 2, MAX_SLOTS);
        slots = new long[doubled];
        values = new int[doubled][];
        mask = doubled - 1;
        for (int i = 0; i < oldSlots.length; i++) {
            long entry = oldSlots[i];
            if (entry != 0) {
                int keyStart = (int) entry;
                int length = (int) (entry >>> 32) & 0xFF;
                place(entry, hash(keyChars, keyStart, keyStart + length), oldValues[i]);
            }
        }
    }

    /** The slot holding {@code text[start, end)}, or -1. */
    private int find(char[] text, int start, int end) {
        int length = end - start;
        if (length > MAX_PIECE_CHARS) {
            return -1;
        }
        int hash = hash(text, start, end);
        long wanted = matchBits(hash, length);
        for (int slot = hash & mask; ; slot = (slot + 1) & mask) {
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
