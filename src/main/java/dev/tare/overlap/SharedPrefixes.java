package dev.tare.overlap;

import java.util.Arrays;
import java.util.Comparator;
import java.util.List;

/**
 * Sums over the sequences that begin alike: for each of a set of leading-token sequences, the weight
 * (calls a day) of every sequence that shares at least a given number of leading tokens with it,
 * itself included. Sorted, the sequences sharing a prefix with one stand next to it in a run, found
 * by two binary searches over the common-prefix lengths of neighbours, so the work is n log n.
 */
public final class SharedPrefixes {
    private SharedPrefixes() {
    }

    /**
     * A sequence's leading tokens.
     *
     * @param head what must be equal before the tokens are compared at all (the tool files a template is
     *             sent with, which come first in a request)
     * @param ids  the leading token ids
     */
    public record Sequence(String head, int[] ids) {
    }

    /**
     * For each sequence, in input order, the sum of {@code weights} over the sequences with the same
     * head whose first {@code depths[i]} ids equal its own (any depth of 0 or less: the same head is
     * enough).
     */
    public static double[] pooled(List<Sequence> sequences, int[] depths, double[] weights) {
        int n = sequences.size();
        Integer[] order = new Integer[n];
        for (int i = 0; i < n; i++) {
            order[i] = i;
        }
        Arrays.sort(order, Comparator.comparing((Integer i) -> sequences.get(i).head())
                .thenComparing(i -> sequences.get(i).ids(), Arrays::compare));
        int[] position = new int[n];
        double[] sums = new double[n + 1];
        for (int k = 0; k < n; k++) {
            position[order[k]] = k;
            sums[k + 1] = sums[k] + weights[order[k]];
        }
        // common[k]: leading ids sorted sequences k - 1 and k share, -1 across heads.
        int[] common = new int[n];
        for (int k = 1; k < n; k++) {
            Sequence a = sequences.get(order[k - 1]);
            Sequence b = sequences.get(order[k]);
            common[k] = a.head().equals(b.head()) ? common(a.ids(), b.ids()) : -1;
        }
        RangeMinimum minimum = new RangeMinimum(common);
        double[] pooled = new double[n];
        for (int i = 0; i < n; i++) {
            int depth = Math.max(depths[i], 0);
            int k = position[i];
            int low = 0;
            int high = k;
            while (low < high) { // the first start whose neighbours up to k all share depth ids
                int mid = (low + high) >>> 1;
                if (minimum.of(mid + 1, k) >= depth) {
                    high = mid;
                } else {
                    low = mid + 1;
                }
            }
            int first = low;
            low = k;
            high = n - 1;
            while (low < high) { // the last end likewise
                int mid = (low + high + 1) >>> 1;
                if (minimum.of(k + 1, mid) >= depth) {
                    low = mid;
                } else {
                    high = mid - 1;
                }
            }
            pooled[i] = sums[low + 1] - sums[first];
        }
        return pooled;
    }

    private static int common(int[] a, int[] b) {
        int mismatch = Arrays.mismatch(a, b);
        return mismatch < 0 ? a.length : mismatch;
    }

    /** The least value of a range of an array, in constant time after n log n preparation (a sparse table). */
    private static final class RangeMinimum {
        private final int[][] table;

        RangeMinimum(int[] values) {
            int levels = 1;
            while ((1 << levels) <= values.length) {
                levels++;
            }
            table = new int[levels][];
            table[0] = values.clone();
            for (int level = 1; level < levels; level++) {
                int span = 1 << level;
                int[] row = new int[Math.max(values.length - span + 1, 0)];
                for (int i = 0; i < row.length; i++) {
                    row[i] = Math.min(table[level - 1][i], table[level - 1][i + span / 2]);
                }
                table[level] = row;
            }
        }

        /** The least value from {@code from} to {@code to}, both included; no value at all is no limit. */
        int of(int from, int to) {
            if (from > to) {
                return Integer.MAX_VALUE;
            }
            int level = 31 - Integer.numberOfLeadingZeros(to - from + 1);
            return Math.min(table[level][from], table[level][to - (1 << level) + 1]);
        }
    }
}
