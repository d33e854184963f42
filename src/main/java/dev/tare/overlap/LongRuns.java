package dev.tare.overlap;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/**
 * The runs of words (between breaks) of the repository's words ({@link RepositoryWords.Text}) that
 * are long enough to hold a block, laid end to end with a break before each, and where each run came
 * from. A block never spans a break, so a run estimated below the minimum can be left out whole: in
 * a repository most runs are short (a heading, a list item, the words between two placeholders), and
 * the suffix sort then works on a fraction of the words. Where a word came from is kept per run, not
 * per word, as the words of a run are consecutive in the whole text.
 */
final class LongRuns {
    /** The words kept, as numbers, with {@link RepositoryWords#SEPARATOR} before each run and at the end. */
    final int[] text;
    /** The estimated tokens of each word number, with a space before it. */
    private final int[] weight;
    /** The tokens the whitespace before each word likely adds (see {@link RepositoryWords.Text}), until the sums are made. */
    private byte[] gaps;
    /** Prefix sums of estimated tokens, made once the suffixes are sorted (see {@link #sums()}). */
    private TokenSums sums;
    /** Where each template's words start in the whole text, and one more (see {@link RepositoryWords.Text#starts}). */
    final int[] starts;
    /** The largest word number. */
    final int upper;
    /** Where each run's break stands here, in order, then the closing break. */
    private final int[] runStarts;
    /** The position in the whole text of each run's first word, then the whole text's length. */
    private final int[] runOrigins;

    private LongRuns(int[] text, int[] weight, byte[] gaps, int[] starts, int upper, int[] runStarts, int[] runOrigins) {
        this.text = text;
        this.weight = weight;
        this.gaps = gaps;
        this.starts = starts;
        this.upper = upper;
        this.runStarts = runStarts;
        this.runOrigins = runOrigins;
    }

    /**
     * Prefix sums of estimated tokens: {@code sums().at(p)} is the estimate of the words before
     * position p. Made on first use, which should come after the suffix sort, so that the sort's work
     * arrays and these are never held at once.
     */
    TokenSums sums() {
        if (sums == null) {
            sums = TokenSums.of(text, weight, gaps);
            gaps = null;
        }
        return sums;
    }

    /** The position in the whole text of position {@code p} here (of a break: of the word after it). */
    int origin(int p) {
        int found = Arrays.binarySearch(runStarts, p);
        if (found >= 0) {
            return runOrigins[found];
        }
        int run = -found - 2;
        return runOrigins[run] + p - runStarts[run] - 1;
    }

    /** The index of the template whose words include position {@code p} here. */
    int templateAt(int p) {
        return templateAt(starts, origin(p));
    }

    /** The index, among template {@code t}'s words and breaks, of position {@code p} here. */
    int local(int t, int p) {
        return origin(p) - starts[t];
    }

    /**
     * The runs of {@code words} whose estimate reaches {@code minimum}.
     *
     * @param weight the estimated tokens of each word number, with a space before it
     */
    static LongRuns of(RepositoryWords.Text words, int[] weight, double minimum) {
        int[] all = words.text();
        byte[] allGaps = words.gaps();
        // First pass: which runs are kept, so that the arrays are made once at their size.
        List<int[]> kept = new ArrayList<>();
        int size = 1;
        long estimate = 0;
        int from = 0;
        for (int p = 0; p < all.length; p++) {
            if (all[p] != RepositoryWords.SEPARATOR) {
                estimate += weight[all[p]] + allGaps[p];
                continue;
            }
            if (p > from && estimate >= minimum) {
                kept.add(new int[] {from, p});
                size += 1 + p - from;
            }
            estimate = 0;
            from = p + 1;
        }
        // Second pass: each kept run, with a break before it.
        int[] text = new int[size];
        byte[] gaps = new byte[size];
        int[] runStarts = new int[kept.size() + 1];
        int[] runOrigins = new int[kept.size() + 1];
        int k = 0;
        for (int r = 0; r < kept.size(); r++) {
            int[] run = kept.get(r);
            int length = run[1] - run[0];
            runStarts[r] = k;
            runOrigins[r] = run[0];
            text[k++] = RepositoryWords.SEPARATOR;
            System.arraycopy(all, run[0], text, k, length);
            System.arraycopy(allGaps, run[0], gaps, k, length);
            k += length;
        }
        text[k] = RepositoryWords.SEPARATOR;
        runStarts[kept.size()] = k;
        runOrigins[kept.size()] = all.length;
        return new LongRuns(text, weight, gaps, words.starts(), words.words().length - 1, runStarts, runOrigins);
    }

    /** The index of the template whose words include {@code position}, given where each template starts. */
    private static int templateAt(int[] starts, int position) {
        int found = Arrays.binarySearch(starts, position);
        int t = found >= 0 ? found : -found - 2;
        // A template without messages starts where the next one does; the position belongs to the last of them.
        while (t + 1 < starts.length && starts[t + 1] <= position) {
            t++;
        }
        return t;
    }
}
