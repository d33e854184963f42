package dev.tare.overlap;

import dev.tare.template.Template;
import dev.tare.template.TemplateKind;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;

/**
 * Every template's words as numbers, gathered one template at a time while the templates pass
 * through a check (from any thread, in any order), so that {@link SharedBlocks} can look across all
 * of them afterwards without the parsed templates being held: a number a word instead of the text,
 * its messages and their segments. Tool files are left out. The words are handed over to the one
 * analysis that uses them.
 */
public final class RepositoryWords {
    /** The number that stands for a break: the start of each template and message, each placeholder. */
    static final int SEPARATOR = 0;

    /** The number of each word met so far. */
    private final Map<String, Integer> numbers = new HashMap<>();
    /** Each number's word; the separator's is empty. */
    private final List<String> words = new ArrayList<>(List.of(""));
    private final Map<String, Words> templates = new TreeMap<>();
    private boolean used;

    /** Adds the words of {@code template}, replacing those of an earlier template at its path. */
    public void add(Template template) {
        if (template.kind() == TemplateKind.TOOLS) {
            return;
        }
        Sequence sequence = new Sequence();
        // Numbers are given under the lock; a template's walk is short beside the rules run on it.
        synchronized (this) {
            if (used) {
                throw new IllegalStateException("the words were already analysed");
            }
            TemplateWords.walk(template, new TemplateWords.Sink() {
                @Override
                public void separator() {
                    sequence.add(SEPARATOR, 0);
                }

                @Override
                public void word(int message, int start, int end, int gap) {
                    sequence.add(number(template.messages().get(message).content().substring(start, end)), gap);
                }
            });
            templates.put(template.path(), sequence.copy());
        }
    }

    private int number(String word) {
        return numbers.computeIfAbsent(word, w -> {
            words.add(w);
            return words.size() - 1;
        });
    }

    /** The paths of the templates added, sorted. */
    public synchronized List<String> paths() {
        return new ArrayList<>(templates.keySet());
    }

    /**
     * Every template's words laid end to end in path order, with {@link #SEPARATOR} at every break,
     * in place of each word that occurs only once (no shared block can hold it), and closing the text.
     *
     * @param text   the numbers, from 1 up by first use in path order, so that they do not depend on
     *               the order the templates were added in
     * @param gaps   at each position, the tokens the whitespace before the word likely adds beyond one
     *               space (see {@link TemplateWords.Sink#word})
     * @param starts where each template's words start in {@code text}, then where the closing break stands
     * @param words  the word of each number (the separator's is empty)
     */
    record Text(int[] text, byte[] gaps, int[] starts, String[] words) {
    }

    /** The words laid out; each template's own numbers are released as they are laid out, so this can be asked once. */
    synchronized Text text() {
        if (used) {
            throw new IllegalStateException("the words were already analysed");
        }
        used = true;
        int size = 1;
        for (Words one : templates.values()) {
            size += one.ids().length;
        }
        int[] text = new int[size];
        byte[] gaps = new byte[size];
        int[] starts = new int[templates.size() + 1];
        int[] renumbered = new int[words.size()];
        String[] ordered = new String[words.size()];
        ordered[SEPARATOR] = "";
        int[] counts = new int[words.size()];
        int next = 1;
        int p = 0;
        int t = 0;
        for (String path : new ArrayList<>(templates.keySet())) {
            Words one = templates.remove(path);
            starts[t++] = p;
            for (int i = 0; i < one.ids().length; i++) {
                int id = one.ids()[i];
                if (id != SEPARATOR && renumbered[id] == 0) {
                    renumbered[id] = next;
                    ordered[next++] = words.get(id);
                }
                int number = id == SEPARATOR ? SEPARATOR : renumbered[id];
                counts[number]++;
                text[p] = number;
                gaps[p++] = one.gaps()[i];
            }
        }
        starts[t] = p;
        text[p] = SEPARATOR;
        for (int q = 0; q < p; q++) {
            if (counts[text[q]] == 1) {
                text[q] = SEPARATOR;
            }
        }
        return new Text(text, gaps, starts, Arrays.copyOf(ordered, next));
    }

    /** A template's word numbers and the gap before each word. */
    private record Words(int[] ids, byte[] gaps) {
    }

    /** A growing list of word numbers and gaps. */
    private static final class Sequence {
        private int[] ids = new int[256];
        private byte[] gaps = new byte[256];
        private int size;

        void add(int id, int gap) {
            if (size == ids.length) {
                ids = Arrays.copyOf(ids, size * 2);
                gaps = Arrays.copyOf(gaps, size * 2);
            }
            ids[size] = id;
            gaps[size++] = (byte) gap;
        }

        Words copy() {
            return new Words(Arrays.copyOf(ids, size), Arrays.copyOf(gaps, size));
        }
    }
}
