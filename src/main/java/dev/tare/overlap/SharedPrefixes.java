package dev.tare.overlap;

import java.util.Arrays;
import java.util.Comparator;
import java.util.List;

/**
 * For each of a set of token-id sequences, the longest run of leading ids it shares with at least
 * one other sequence. Sorting puts the best partner of every sequence next to it, so the work is
 * n log n comparisons rather than one per pair.
 */
public final class SharedPrefixes {
    private SharedPrefixes() {
    }

    /** The shared prefix length of each sequence, in input order; 0 for one sequence alone. */
    public static int[] lengths(List<int[]> sequences) {
        int n = sequences.size();
        Integer[] order = new Integer[n];
        for (int i = 0; i < n; i++) {
            order[i] = i;
        }
        Arrays.sort(order, Comparator.comparing(sequences::get, Arrays::compare));
        int[] shared = new int[n];
        for (int k = 1; k < n; k++) {
            int a = order[k - 1];
            int b = order[k];
            int common = common(sequences.get(a), sequences.get(b));
            shared[a] = Math.max(shared[a], common);
            shared[b] = Math.max(shared[b], common);
        }
        return shared;
    }

    private static int common(int[] a, int[] b) {
        int mismatch = Arrays.mismatch(a, b);
        return mismatch < 0 ? a.length : mismatch;
    }
}
