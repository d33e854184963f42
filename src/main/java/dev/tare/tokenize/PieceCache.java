package dev.tare.tokenize;

import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.atomic.AtomicInteger;

/**
 * The token ids of pieces already encoded, shared by every thread counting with one encoding.
 * Prompt text repeats the same words endlessly, so after the first few files nearly every piece is
 * found here and the merge never runs. Only short pieces are kept, and at most {@link #MAX_ENTRIES}
 * of them, so the memory it takes stays small and fixed; once full, it keeps what it has.
 */
final class PieceCache {
    /** Longer pieces are rare and unlikely to come again. */
    static final int MAX_PIECE_CHARS = 48;
    static final int MAX_ENTRIES = 1 << 17;

    private final ConcurrentHashMap<String, int[]> ids = new ConcurrentHashMap<>(1 << 12);
    private final AtomicInteger size = new AtomicInteger();

    /** The cached ids of {@code piece}, or null. */
    int[] get(String piece) {
        return ids.get(piece);
    }

    /** Remembers the ids of {@code piece} while there is room and the piece is short. */
    void put(String piece, int[] tokens) {
        if (piece.length() <= MAX_PIECE_CHARS && size.get() < MAX_ENTRIES && ids.putIfAbsent(piece, tokens) == null) {
            size.incrementAndGet();
        }
    }
}
