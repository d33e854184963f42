package dev.tare.overlap;

import java.util.Arrays;

/**
 * The runs of words (between breaks) of a {@link WordStream} that are long enough to hold a block,
 * laid end to end with a break before each, and where each run came from. A block never spans a
 * break, so a run estimated below the minimum can be left out whole: in a repository most runs are
 * short (a heading, a list item, the words between two placeholders), and the suffix sort then
 * works on a fraction of the words. Where a word came from is kept per run, not per word, as the
 * words of a run are consecutive in the stream: on a large repository that is one array of the
 * text's length less while the suffixes are sorted.
 */
final class LongRuns {
    /** The words kept, as numbers, with {@link WordStream#SEPARATOR} before each run and at the end. */
    final int[] text;
    /** The estimated tokens of each word number, with a space before it. */
    private final int[] weight;
    /** The tokens the whitespace before each word likely adds (see {@link WordStream#gaps}), until the sums are made. */
    private byte[] gaps;
    /** Prefix sums of estimated tokens, made once the suffixes are sorted (see {@link #sums()}). */
    private TokenSums sums;
    /** Where each template's words start in the {@link WordStream}, and one more (see {@link WordStream#starts}). */
    final int[] starts;
    /** The largest word number. */
    final int upper;
    /** Where each run's break stands here, in order, then the closing break. */
    private final int[] runStarts;
    /** The position in the {@link WordStream} of each run's first word, then the stream's length. */
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

    /** The position in the {@link WordStream} of position {@code p} here (of a break: of the word after it). */
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
        return WordStream.templateAt(starts, origin(p));
    }

    /** The index, among template {@code t}'s words and breaks, of position {@code p} here. */
    int local(int t, int p) {
        return origin(p) - starts[t];
    }

    /**
     * The runs of {@code stream} whose estimate reaches {@code minimum}.
     *
     * @param weight the estimated tokens of each word number, with a space before it
     */
    static LongRuns of(WordStream stream, int[] weight, double minimum) {
        // First pass: how much is kept, so that the arrays are made once at their size.
        int size = 1;
        int runs = 0;
        WordStream.Reader reader = stream.reader();
        long estimate = 0;
        int length = 0;
        for (int id = reader.next(); id >= 0; id = reader.next()) {
            if (id != WordStream.SEPARATOR) {
                estimate += weight[id] + reader.gap();
                length++;
                continue;
            }
            if (length > 0 && estimate >= minimum) {
                size += 1 + length;
                runs++;
            }
            estimate = 0;
            length = 0;
        }
        int[] text = new int[size];
        byte[] gaps = new byte[size];
        int[] runStarts = new int[runs + 1];
        int[] runOrigins = new int[runs + 1];
        // Second pass: each run is gathered until its break, then kept or dropped whole.
        int[] runIds = new int[64];
        byte[] runGaps = new byte[64];
        int k = 0;
        int r = 0;
        int p = 0;
        reader = stream.reader();
        for (int id = reader.next(); id >= 0; id = reader.next(), p++) {
            if (id != WordStream.SEPARATOR) {
                if (length == runIds.length) {
                    runIds = Arrays.copyOf(runIds, length * 2);
                    runGaps = Arrays.copyOf(runGaps, length * 2);
                }
                runIds[length] = id;
                runGaps[length++] = (byte) reader.gap();
                estimate += weight[id] + reader.gap();
                continue;
            }
            if (length > 0 && estimate >= minimum) {
                runStarts[r] = k;
                runOrigins[r++] = p - length;
                text[k++] = WordStream.SEPARATOR;
                System.arraycopy(runIds, 0, text, k, length);
                System.arraycopy(runGaps, 0, gaps, k, length);
                k += length;
            }
            estimate = 0;
            length = 0;
        }
        text[k] = WordStream.SEPARATOR;
        runStarts[r] = k;
        runOrigins[r] = stream.length();
        return new LongRuns(text, weight, gaps, stream.starts, stream.table.size(), runStarts, runOrigins);
    }
}
