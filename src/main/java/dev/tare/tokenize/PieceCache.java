package dev.tare.tokenize;

import java.util.Arrays;

/**
 * The token ids of pieces already encoded, for one thread counting with one encoding. Prompt text
 * repeats the same words endlessly, so after the first few files nearly every piece is found here
 * and the merge never runs. Pieces are looked up by their place in the text being counted, without
 * copying them out, in an open-addressing table. Only short pieces are kept, and at most
 * {@link #MAX_ENTRIES} of them, so the memory it takes stays small and fixed; once full, it keeps
 * what it has. Not thread-safe: each counting thread has its own.
 */
final class PieceCache {
    /** Longer pieces are rare and unlikely to come again. */
    static final int MAX_PIECE_CHARS = 48;
    static final int MAX_ENTRIES = 1 << 16;

    private static final int SLOTS = MAX_ENTRIES * 2;
    private final char[][] keys = new char[SLOTS][];
    private final int[][] values = new int[SLOTS][];
    private int size;

    /** The cached ids of {@code text[start, end)}, or null. */
    int[] get(char[] text, int start, int end) {
        if (end - start > MAX_PIECE_CHARS) {
            return null;
        }
        for (int slot = hash(text, start, end); ; slot = (slot + 1) & (SLOTS - 1)) {
            char[] key = keys[slot];
            if (key == null) {
                return null;
            }
            if (key.length == end - start && same(key, text, start)) {
                return values[slot];
            }
        }
    }

    /** Remembers the ids of {@code text[start, end)} while there is room and the piece is short. */
    void put(char[] text, int start, int end, int[] ids) {
        if (end - start > MAX_PIECE_CHARS || size >= MAX_ENTRIES) {
            return;
        }
        int slot = hash(text, start, end);
        while (keys[slot] != null) {
            slot = (slot + 1) & (SLOTS - 1);
        }
        keys[slot] = Arrays.copyOfRange(text, start, end);
        values[slot] = ids;
        size++;
    }

    /** A plain loop: pieces are a few chars long, too short for a vectorised compare to pay off. */
    private static boolean same(char[] key, char[] text, int start) {
        for (int i = 0; i < key.length; i++) {
            if (key[i] != text[start + i]) {
                return false;
            }
        }
        return true;
    }

    private static int hash(char[] text, int start, int end) {
        int h = end - start;
        for (int i = start; i < end; i++) {
            h = 31 * h + text[i];
        }
        h *= 0x9E3779B9;
        return (h ^ (h >>> 15)) & (SLOTS - 1);
    }
}
