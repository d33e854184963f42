package dev.tare.overlap;

import dev.tare.template.Template;
import java.util.Arrays;
import java.util.List;

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

    static WordStream of(List<Template> templates) {
        WordTable table = new WordTable();
        Builder builder = new Builder();
        int[] starts = new int[templates.size() + 1];
        for (int t = 0; t < templates.size(); t++) {
            starts[t] = builder.size;
            Template template = templates.get(t);
            TemplateWords.walk(template, new TemplateWords.Sink() {
                @Override
                public void separator() {
                    builder.add(SEPARATOR, 0);
                }

                @Override
                public void word(int message, int start, int end, int gap) {
                    builder.add(table.intern(template.messages().get(message).content(), start, end), gap);
                }
            });
        }
        starts[templates.size()] = builder.size;
        builder.add(SEPARATOR, 0);
        int[] text = Arrays.copyOf(builder.ids, builder.size);
        int[] counts = new int[table.size() + 1];
        for (int id : text) {
            counts[id]++;
        }
        for (int i = 0; i < text.length; i++) {
            if (counts[text[i]] == 1) {
                text[i] = SEPARATOR;
            }
        }
        return new WordStream(text, Arrays.copyOf(builder.gaps, builder.size), starts, table);
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

    private static final class Builder {
        private int[] ids = new int[1 << 16];
        private byte[] gaps = new byte[1 << 16];
        private int size;

        void add(int id, int gap) {
            if (size == ids.length) {
                ids = Arrays.copyOf(ids, ids.length * 2);
                gaps = Arrays.copyOf(gaps, gaps.length * 2);
            }
            gaps[size] = (byte) gap;
            ids[size++] = id;
        }
    }
}
