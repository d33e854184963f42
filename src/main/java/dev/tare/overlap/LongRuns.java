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

    private LongRuns(int[] text, int[] origin, int[] sums) {
        this.text = text;
        this.origin = origin;
        this.sums = sums;
    }

    /**
     * The runs of {@code stream} whose estimate reaches {@code minimum}.
     *
     * @param weight the estimated tokens of each word number, with a space before it
     */
    static LongRuns of(WordStream stream, int[] weight, double minimum) {
        int[] source = stream.text;
        int n = source.length;
        int[] text = new int[n + 1];
        int[] origin = new int[n + 1];
        int size = 0;
        int p = 0;
        while (p < n) {
            if (source[p] == WordStream.SEPARATOR) {
                p++;
                continue;
            }
            int end = p;
            long estimate = 0;
            while (end < n && source[end] != WordStream.SEPARATOR) {
                estimate += weight[source[end]] + stream.gaps[end];
                end++;
            }
            if (estimate >= minimum) {
                text[size] = WordStream.SEPARATOR;
                origin[size++] = p;
                for (int q = p; q < end; q++) {
                    text[size] = source[q];
                    origin[size++] = q;
                }
            }
            p = end;
        }
        text[size] = WordStream.SEPARATOR;
        origin[size++] = n;
        text = Arrays.copyOf(text, size);
        origin = Arrays.copyOf(origin, size);
        int[] sums = new int[size + 1];
        for (int k = 0; k < size; k++) {
            int id = text[k];
            sums[k + 1] = sums[k] + (id == WordStream.SEPARATOR ? 0 : weight[id] + stream.gaps[origin[k]]);
        }
        return new LongRuns(text, origin, sums);
    }
}
