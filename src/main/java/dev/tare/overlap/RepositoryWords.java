package dev.tare.overlap;

import dev.tare.template.Template;
import dev.tare.template.TemplateKind;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;

/**
 * Every template's words as numbers, gathered one template at a time while the templates pass
 * through a check (from any thread, in any order), so that {@link SharedBlocks} can look across all
 * of them afterwards without the parsed templates being held: about five bytes a word instead of
 * the text, its messages and their segments. Tool files are left out. The words are handed over to
 * the one analysis that uses them.
 */
public final class RepositoryWords {
    private final WordTable table = new WordTable();
    private final Map<String, int[]> ids = new TreeMap<>();
    private final Map<String, byte[]> gaps = new TreeMap<>();
    private boolean used;

    /** Adds the words of {@code template}, replacing those of an earlier template at its path. */
    public void add(Template template) {
        if (template.kind() == TemplateKind.TOOLS) {
            return;
        }
        Sequence words = new Sequence();
        // Numbers are given under the lock; a template's walk is short beside the rules run on it.
        synchronized (this) {
            if (used) {
                throw new IllegalStateException("the words were already analysed");
            }
            TemplateWords.walk(template, new TemplateWords.Sink() {
                @Override
                public void separator() {
                    words.add(WordStream.SEPARATOR, 0);
                }

                @Override
                public void word(int message, int start, int end, int gap) {
                    words.add(table.intern(template.messages().get(message).content(), start, end), gap);
                }
            });
            ids.put(template.path(), Arrays.copyOf(words.ids, words.size));
            gaps.put(template.path(), Arrays.copyOf(words.gaps, words.size));
        }
    }

    /** The paths of the templates added, sorted. */
    public synchronized List<String> paths() {
        return new ArrayList<>(ids.keySet());
    }

    /**
     * The words laid end to end in path order, numbered again by first use in that order (so the
     * numbers do not depend on the order templates were added in). Each template's own arrays are
     * released as they are copied; the words can be laid out once.
     */
    synchronized WordStream stream() {
        if (used) {
            throw new IllegalStateException("the words were already analysed");
        }
        used = true;
        int total = 1;
        for (int[] list : ids.values()) {
            total += list.length;
        }
        int[] text = new int[total];
        byte[] gapText = new byte[total];
        int[] starts = new int[ids.size() + 1];
        int[] renumbered = new int[table.size() + 1];
        WordTable ordered = new WordTable();
        int size = 0;
        int t = 0;
        for (String path : new ArrayList<>(ids.keySet())) {
            int[] list = ids.remove(path);
            byte[] gapList = gaps.remove(path);
            starts[t++] = size;
            for (int i = 0; i < list.length; i++) {
                int id = list[i];
                if (id != WordStream.SEPARATOR && renumbered[id] == 0) {
                    String word = table.word(id);
                    renumbered[id] = ordered.intern(word, 0, word.length());
                }
                text[size] = id == WordStream.SEPARATOR ? id : renumbered[id];
                gapText[size++] = gapList[i];
            }
        }
        starts[t] = size;
        return WordStream.of(text, gapText, starts, ordered);
    }

    /** A growing list of word numbers and gaps. */
    private static final class Sequence {
        private int[] ids = new int[256];
        private byte[] gaps = new byte[256];
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
