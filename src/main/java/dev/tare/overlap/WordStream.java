package dev.tare.overlap;

import java.util.Arrays;

/**
 * Every template's words laid end to end as numbers, one text for the whole repository, with
 * {@link #SEPARATOR} at every break (the start of each template and message, each placeholder) and
 * in place of each word that occurs only once in the repository, which no shared block can hold.
 *
 * <p>The text is read front to back through a {@link Reader} and never laid out as one array: each
 * template's numbers stay {@link VarInts}, one to three bytes a word, where one {@code int} array of
 * the whole text would take four, on top of the templates' own numbers while it was filled.
 */
final class WordStream {
    /** The number that stands for a break. */
    static final int SEPARATOR = 0;

    /** Where each template's words start in the text, and one more: where the closing break stands. */
    final int[] starts;
    final WordTable table;
    /** Each template's word numbers as {@link VarInts}, in the order of {@link #starts}. */
    private final byte[][] ids;
    /**
     * Per template, the tokens the whitespace before each word likely adds beyond one space (see
     * {@link TemplateWords.Sink#word}).
     */
    private final byte[][] gaps;
    /** How often each word number occurs in the text. */
    private final int[] counts;

    WordStream(int[] starts, WordTable table, byte[][] ids, byte[][] gaps, int[] counts) {
        this.starts = starts;
        this.table = table;
        this.ids = ids;
        this.gaps = gaps;
        this.counts = counts;
    }

    /** The number of positions: every template's words and breaks, then the closing break. */
    int length() {
        return starts[starts.length - 1] + 1;
    }

    /** A reader at the text's first position. */
    Reader reader() {
        return new Reader();
    }

    /** Reads the text position by position. */
    final class Reader {
        private int template = -1;
        private int index;
        private VarInts.Reader numbers;
        private int gap;
        private boolean closed;

        private Reader() {
        }

        /**
         * The number at the next position ({@link #SEPARATOR} at a break or for a word that occurs
         * once), or -1 past the closing break.
         */
        int next() {
            while (numbers == null || index == gaps[template].length) {
                if (template + 1 == ids.length) {
                    gap = 0;
                    if (closed) {
                        return -1;
                    }
                    closed = true;
                    return SEPARATOR;
                }
                template++;
                index = 0;
                numbers = new VarInts.Reader(ids[template]);
            }
            int id = numbers.next();
            gap = gaps[template][index++];
            return counts[id] == 1 ? SEPARATOR : id;
        }

        /** The gap before the word {@link #next} read last. */
        int gap() {
            return gap;
        }
    }

    /** The index of the template whose words include {@code position}, given where each template starts. */
    static int templateAt(int[] starts, int position) {
        int found = Arrays.binarySearch(starts, position);
        int t = found >= 0 ? found : -found - 2;
        // A template without messages starts where the next one does; the position belongs to the last of them.
        while (t + 1 < starts.length && starts[t + 1] <= position) {
            t++;
        }
        return t;
    }
}
