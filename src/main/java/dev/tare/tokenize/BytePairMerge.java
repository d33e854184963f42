package dev.tare.tokenize;

import java.util.Arrays;

/**
 * Byte-pair encoding of one piece: start from single bytes and, again and again, merge the adjacent
 * pair whose joined bytes have the lowest rank (the leftmost such pair on a tie), until no adjacent
 * pair is a token. This is the reference encoder's rule. Short pieces rescan their parts after each
 * merge; long ones (a run of thousands of letters, say) keep the candidate pairs in a binary heap,
 * so the work stays n log n rather than n squared.
 */
final class BytePairMerge {
    /** Above this many bytes a piece is merged with the heap. */
    static final int LONG_PIECE = 128;

    private static final int NONE = Integer.MAX_VALUE;

    private BytePairMerge() {
    }

    /** The token ids of {@code piece}, which must be non-empty. */
    static int[] encode(Vocabulary vocabulary, byte[] piece) {
        int whole = vocabulary.rank(piece, 0, piece.length);
        if (whole >= 0) {
            return new int[] {whole};
        }
        return piece.length > LONG_PIECE ? encodeLong(vocabulary, piece) : encodeShort(vocabulary, piece);
    }

    static int[] encodeShort(Vocabulary vocabulary, byte[] piece) {
        int n = piece.length;
        // Part i starts at starts[i]; ranks[i] is the rank of parts i and i + 1 joined.
        int[] starts = new int[n + 1];
        int[] ranks = new int[n + 1];
        for (int i = 0; i <= n; i++) {
            starts[i] = i;
        }
        for (int i = 0; i < n - 1; i++) {
            ranks[i] = rankOrNone(vocabulary, piece, i, i + 2);
        }
        ranks[n - 1] = NONE;
        ranks[n] = NONE;
        int parts = n + 1;
        while (true) {
            int best = NONE;
            int at = -1;
            for (int i = 0; i < parts - 1; i++) {
                if (ranks[i] < best) {
                    best = ranks[i];
                    at = i;
                }
            }
            if (at < 0) {
                break;
            }
            System.arraycopy(starts, at + 2, starts, at + 1, parts - at - 2);
            System.arraycopy(ranks, at + 2, ranks, at + 1, parts - at - 2);
            parts--;
            ranks[at] = at + 2 < parts ? rankOrNone(vocabulary, piece, starts[at], starts[at + 2]) : NONE;
            if (at > 0) {
                ranks[at - 1] = rankOrNone(vocabulary, piece, starts[at - 1], starts[at + 1]);
            }
        }
        int[] ids = new int[parts - 1];
        for (int i = 0; i < ids.length; i++) {
            ids[i] = vocabulary.rank(piece, starts[i], starts[i + 1]);
        }
        return ids;
    }

    static int[] encodeLong(Vocabulary vocabulary, byte[] piece) {
        int n = piece.length;
        // Parts form a linked list over their start offsets; rankAt[s] is the rank of the part
        // starting at s joined with the next part, NONE when they do not make a token.
        int[] nextStart = new int[n + 1];
        int[] previousStart = new int[n + 1];
        int[] rankAt = new int[n + 1];
        LongHeap queue = new LongHeap(2 * n);
        for (int s = 0; s < n; s++) {
            nextStart[s] = s + 1;
            previousStart[s] = s - 1;
            rankAt[s] = s + 2 <= n ? rankOrNone(vocabulary, piece, s, s + 2) : NONE;
            offer(queue, rankAt[s], s);
        }
        nextStart[n] = n;
        rankAt[n] = NONE;
        boolean[] merged = new boolean[n + 1];
        while (!queue.isEmpty()) {
            long entry = queue.poll();
            int rank = (int) (entry >>> 32);
            int s = (int) entry;
            if (merged[s] || rankAt[s] != rank) {
                continue;
            }
            int gone = nextStart[s];
            merged[gone] = true;
            int after = nextStart[gone];
            nextStart[s] = after;
            if (after < n) {
                previousStart[after] = s;
            }
            rankAt[s] = after < n ? rankOrNone(vocabulary, piece, s, nextStart[after]) : NONE;
            offer(queue, rankAt[s], s);
            int before = previousStart[s];
            if (before >= 0) {
                rankAt[before] = rankOrNone(vocabulary, piece, before, after);
                offer(queue, rankAt[before], before);
            }
        }
        int[] ids = new int[n];
        int count = 0;
        for (int s = 0; s < n; s = nextStart[s]) {
            ids[count++] = vocabulary.rank(piece, s, nextStart[s]);
        }
        return Arrays.copyOf(ids, count);
    }

    private static void offer(LongHeap queue, int rank, int start) {
        if (rank != NONE) {
            queue.add(((long) rank << 32) | start);
        }
    }

    /** A binary min-heap of longs: the candidate pairs, rank in the high half and start in the low. */
    private static final class LongHeap {
        private long[] items;
        private int size;

        LongHeap(int capacity) {
            items = new long[Math.max(16, capacity)];
        }

        boolean isEmpty() {
            return size == 0;
        }

        void add(long item) {
            if (size == items.length) {
                items = Arrays.copyOf(items, size * 2);
            }
            int at = size++;
            while (at > 0) {
                int parent = (at - 1) >>> 1;
                if (items[parent] <= item) {
                    break;
                }
                items[at] = items[parent];
                at = parent;
            }
            items[at] = item;
        }

        long poll() {
            long top = items[0];
            long last = items[--size];
            int at = 0;
            while (true) {
                int child = 2 * at + 1;
                if (child >= size) {
                    break;
                }
                if (child + 1 < size && items[child + 1] < items[child]) {
                    child++;
                }
                if (items[child] >= last) {
                    break;
                }
                items[at] = items[child];
                at = child;
            }
            items[at] = last;
            return top;
        }
    }

    private static int rankOrNone(Vocabulary vocabulary, byte[] piece, int from, int to) {
        int rank = vocabulary.rank(piece, from, to);
        return rank < 0 ? NONE : rank;
    }
}
