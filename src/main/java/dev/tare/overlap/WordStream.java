package dev.tare.overlap;

import java.util.Arrays;

/**
 * Every template's words laid end to end as numbers, one text for the whole repository, with
 * {@link #SEPARATOR} at every break (the start of each template and message, each placeholder) and
 * in place of each word that occurs only once in the repository, which no shared block can hold.
 */
final class WordStream {
    /** The number that stands for a break. */
    static final int SEPARATOR = 0;

    final int[] text;
    /** The tokens the whitespace before each word likely adds beyond one space (see {@link TemplateWords.Sink#word}). */
    final byte[] gaps;
    /** Where each template's words start in {@link #text}, and one more: where the closing break stands. */
    final int[] starts;
    final WordTable table;

    private WordStream(int[] text, byte[] gaps, int[] starts, WordTable table) {
        this.text = text;
        this.gaps = gaps;
        this.starts = starts;
        this.table = table;
    }

    /**
     * The stream over words already laid end to end, with the closing break still to come: a word
     * that occurs once becomes a break.
     */
    static WordStream of(int[] words, byte[] gaps, int[] starts, WordTable table) {
        int[] text = words;
        text[text.length - 1] = SEPARATOR;
        int[] counts = new int[table.size() + 1];
        for (int id : text) {
            counts[id]++;
        }
        for (int i = 0; i < text.length; i++) {
            if (counts[text[i]] == 1) {
                text[i] = SEPARATOR;
            }
        }
        return new WordStream(text, gaps, starts, table);
    }

    /** The index of the template whose words include position {@code position}. */
    int templateAt(int position) {
        return templateAt(starts, position);
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
