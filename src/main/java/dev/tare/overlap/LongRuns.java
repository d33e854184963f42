package dev.tare.overlap;

import java.util.Arrays;

/**
 * The runs of words (between breaks) of a {@link WordStream} that are long enough to hold a block,
 * laid end to end with a break before each, and where each word came from. A block never spans a
 * break, so a run estimated below the minimum can be left out whole: in a repository most runs are
 * short (a heading, a list item, the words between two placeholders), and the suffix sort then
 * works on a fraction of the words.
 */
final class LongRuns {
    /** The words kept, as numbers, with {@link WordStream#SEPARATOR} before each run and at the end. */
    final int[] text;
    /** The position in the {@link WordStream} of each position here (of a break: of the word after it). */
    final int[] origin;
    /** Prefix sums of estimated tokens: {@code sums[p]} is the estimate of the words before position p. */
    final int[] sums;
    /** Where each template's words start in the {@link WordStream}, and one more (see {@link WordStream#starts}). */
    final int[] starts;
    /** The largest word number. */
    final int upper;

    private LongRuns(int[] text, int[] origin, int[] sums, int[] starts, int upper) {
        this.text = text;
        this.origin = origin;
        this.sums = sums;
        this.starts = starts;
        this.upper = upper;
    }

    /** The index of the template whose words include position {@code p} here. */
    int templateAt(int p) {
        return WordStream.templateAt(starts, origin[p]);
    }

    /** The index, among template {@code t}'s words and breaks, of position {@code p} here. */
    int local(int t, int p) {
        return origin[p] - starts[t];
    }

    /**
     * The runs of {@code stream} whose estimate reaches {@code minimum}.
     *
     * @param weight the estimated tokens of each word number, with a space before it
     */
    static LongRuns of(WordStream stream, int[] weight, double minimum) {
        int[] source = stream.text;
        int n = source.length;
        // First pass: how much is kept, so that the arrays are made once at their size.
        int size = 1;
        for (int p = 0; p < n; ) {
            int end = runEnd(source, p);
            if (end > p && estimate(stream, weight, p, end) >= minimum) {
                size += 1 + end - p;
            }
            p = Math.max(end, p + 1);
        }
        int[] text = new int[size];
        int[] origin = new int[size];
        int k = 0;
        for (int p = 0; p < n; ) {
            int end = runEnd(source, p);
            if (end > p && estimate(stream, weight, p, end) >= minimum) {
                text[k] = WordStream.SEPARATOR;
                origin[k++] = p;
                for (int q = p; q < end; q++) {
                    text[k] = source[q];
                    origin[k++] = q;
                }
            }
            p = Math.max(end, p + 1);
        }
        text[k] = WordStream.SEPARATOR;
        origin[k] = n;
        int[] sums = new int[size + 1];
        for (int q = 0; q < size; q++) {
            int id = text[q];
            sums[q + 1] = sums[q] + (id == WordStream.SEPARATOR ? 0 : weight[id] + stream.gaps[origin[q]]);
        }
        return new LongRuns(text, origin, sums, stream.starts, stream.table.size());
    }

    /** The end of the run of words starting at {@code p} ({@code p} itself at a break). */
    private static int runEnd(int[] source, int p) {
        int end = p;
        while (end < source.length && source[end] != WordStream.SEPARATOR) {
            end++;
        }
        return end;
    }

    private static long estimate(WordStream stream, int[] weight, int from, int to) {
        long estimate = 0;
        for (int q = from; q < to; q++) {
            estimate += weight[stream.text[q]] + stream.gaps[q];
        }
        return estimate;
    }
}
