package dev.tare.overlap;

import java.util.Arrays;

/**
 * Suffix arrays and their longest-common-prefix arrays over integer texts, in linear time: the
 * suffixes are sorted by induced sorting (SA-IS: Nong, Zhang and Chan, "Two Efficient Algorithms for
 * Linear Time Suffix Array Construction", IEEE Transactions on Computers 60(10), 2011), and the
 * common prefixes of neighbours are found as Kasai et al. do ("Linear-Time Longest-Common-Prefix
 * Computation in Suffix Arrays and Its Applications", CPM 2001). Shared blocks are read off these
 * two arrays without comparing any two templates directly.
 */
final class SuffixArray {
    /** Below this length a plain comparison sort is quicker than the induced one. */
    private static final int NAIVE_BELOW = 16;

    private SuffixArray() {
    }

    /**
     * The start of every suffix of {@code text}, in lexicographic order of the suffixes (a proper
     * prefix sorts first).
     *
     * @param upper the largest value in {@code text}; every value must lie in {@code [0, upper]}
     */
    static int[] of(int[] text, int upper) {
        int n = text.length;
        if (n == 0) {
            return new int[0];
        }
        if (n == 1) {
            return new int[] {0};
        }
        if (n < NAIVE_BELOW) {
            return naive(text);
        }
        return induced(text, upper);
    }

    /**
     * The longest common prefix of each suffix and the one before it in {@code sa}, by text position
     * ({@code plcp[p]} for the suffix at {@code p}; 0 for the first in order), stopping at
     * {@code separator}, so no common prefix reaches across one; the sorted order is still right for
     * this, as the separator is an ordinary value there. Computed in text order through the
     * predecessor array, in place (Kärkkäinen, Manzini and Puglisi, "Permuted Longest-Common-Prefix
     * Array", CPM 2009): one array of the text's length. The common prefix of {@code sa[i - 1]} and
     * {@code sa[i]} is then {@code plcp[sa[i]]}.
     */
    static int[] plcp(int[] text, int[] sa, int separator) {
        int n = text.length;
        int[] plcp = new int[n];
        if (n == 0) {
            return plcp;
        }
        plcp[sa[0]] = -1;
        for (int i = 1; i < n; i++) {
            plcp[sa[i]] = sa[i - 1];
        }
        int h = 0;
        for (int p = 0; p < n; p++) {
            int before = plcp[p];
            if (before < 0) {
                plcp[p] = 0;
                h = 0;
                continue;
            }
            while (p + h < n && before + h < n && text[p + h] == text[before + h] && text[p + h] != separator) {
                h++;
            }
            plcp[p] = h;
            if (h > 0) {
                h--;
            }
        }
        return plcp;
    }

    /** The order by plain comparison of suffixes: for short texts, and as the tests' reference. */
    static int[] naive(int[] text) {
        Integer[] order = new Integer[text.length];
        for (int i = 0; i < order.length; i++) {
            order[i] = i;
        }
        Arrays.sort(order, (a, b) -> compareSuffixes(text, a, b));
        int[] sa = new int[order.length];
        for (int i = 0; i < sa.length; i++) {
            sa[i] = order[i];
        }
        return sa;
    }

    private static int compareSuffixes(int[] text, int a, int b) {
        if (a == b) {
            return 0;
        }
        while (a < text.length && b < text.length) {
            if (text[a] != text[b]) {
                return Integer.compare(text[a], text[b]);
            }
            a++;
            b++;
        }
        return a == text.length ? -1 : 1;
    }

    /**
     * SA-IS: classify each position as S (its suffix is smaller than the next one) or L, sort the
     * leftmost-S positions' substrings by induction, name them, sort the names recursively, and
     * induce the order of every suffix from the sorted leftmost-S suffixes.
     */
    private static int[] induced(int[] s, int upper) {
        int n = s.length;
        int[] sa = new int[n];
        // One bit per position: on a repository's words the work arrays are what bounds the memory.
        long[] sType = new long[(n + 63) >>> 6];
        for (int i = n - 2; i >= 0; i--) {
            if (s[i] == s[i + 1] ? isS(sType, i + 1) : s[i] < s[i + 1]) {
                sType[i >>> 6] |= 1L << i;
            }
        }
        // bucketL[c]: where bucket c starts; bucketS[c]: where its S-type part starts.
        int[] bucketL = new int[upper + 2];
        int[] bucketS = new int[upper + 2];
        for (int i = 0; i < n; i++) {
            if (!isS(sType, i)) {
                bucketS[s[i]]++;
            } else {
                bucketL[s[i] + 1]++;
            }
        }
        for (int c = 0; c <= upper; c++) {
            bucketS[c] += bucketL[c];
            bucketL[c + 1] += bucketS[c];
        }
        // The leftmost-S positions in text order; a position's rank among them is found by binary
        // search rather than kept in an array of the text's length.
        int m = 0;
        for (int i = 1; i < n; i++) {
            if (isLms(sType, i)) {
                m++;
            }
        }
        int[] lms = new int[m];
        for (int i = 1, k = 0; i < n; i++) {
            if (isLms(sType, i)) {
                lms[k++] = i;
            }
        }
        induce(s, sa, sType, bucketL, bucketS, lms);
        if (m > 0) {
            // The leftmost-S positions in sorted order are moved to the front of sa, which the last
            // induction fills again, rather than into an array of their own.
            int k = 0;
            for (int i = 0; i < n; i++) {
                int v = sa[i];
                if (v > 0 && isLms(sType, v)) {
                    sa[k++] = v;
                }
            }
            int[] names = new int[m];
            int name = 0;
            names[Arrays.binarySearch(lms, sa[0])] = 0;
            for (int i = 1; i < m; i++) {
                int l = sa[i - 1];
                int r = sa[i];
                int rankL = Arrays.binarySearch(lms, l);
                int rankR = Arrays.binarySearch(lms, r);
                int endL = rankL + 1 < m ? lms[rankL + 1] : n;
                int endR = rankR + 1 < m ? lms[rankR + 1] : n;
                boolean same = endL - l == endR - r;
                if (same) {
                    while (l < endL && s[l] == s[r]) {
                        l++;
                        r++;
                    }
                    // The last leftmost-S substring runs into the end of the text, which equals nothing.
                    same = l < n && r < n && s[l] == s[r];
                }
                if (!same) {
                    name++;
                }
                names[rankR] = name;
            }
            int[] sortedLms = of(names, name);
            for (int i = 0; i < m; i++) {
                sortedLms[i] = lms[sortedLms[i]];
            }
            induce(s, sa, sType, bucketL, bucketS, sortedLms);
        }
        return sa;
    }

    private static boolean isS(long[] sType, int i) {
        return (sType[i >>> 6] & 1L << i) != 0;
    }

    private static boolean isLms(long[] sType, int i) {
        return i > 0 && isS(sType, i) && !isS(sType, i - 1);
    }

    /** Places the leftmost-S positions in their buckets' S parts, then induces the L and S suffixes from them. */
    private static void induce(int[] s, int[] sa, long[] sType, int[] bucketL, int[] bucketS, int[] lms) {
        int n = s.length;
        Arrays.fill(sa, -1);
        int[] next = bucketS.clone();
        for (int d : lms) {
            sa[next[s[d]]++] = d;
        }
        next = bucketL.clone();
        sa[next[s[n - 1]]++] = n - 1;
        for (int i = 0; i < n; i++) {
            int v = sa[i];
            if (v >= 1 && !isS(sType, v - 1)) {
                sa[next[s[v - 1]]++] = v - 1;
            }
        }
        next = bucketL.clone();
        for (int i = n - 1; i >= 0; i--) {
            int v = sa[i];
            if (v >= 1 && isS(sType, v - 1)) {
                sa[--next[s[v - 1] + 1]] = v - 1;
            }
        }
    }
}
