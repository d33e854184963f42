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
 * of them afterwards without the parsed templates being held: two to four bytes a word instead of
 * the text, its messages and their segments. Tool files are left out. The words are handed over to
 * the one analysis that uses them.
 *
 * <p>A template's word numbers are kept as {@link VarInts}, not as an {@code int} each: the
 * numbers are given in the order words are first met, so the common words, which are most of any
 * text, have small numbers and take one byte, and the rare ones two or three. On the benchmark
 * corpus the live heap at the end of a full check's rules was 30 to 40 MB smaller for it
 * ({@code -Xlog:gc}, two runs of each).
 */
public final class RepositoryWords {
    private final WordTable table = new WordTable();
    private final Map<String, Words> words = new TreeMap<>();
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
                    sequence.add(WordStream.SEPARATOR, 0);
                }

                @Override
                public void word(int message, int start, int end, int gap) {
                    sequence.add(table.intern(template.messages().get(message).content(), start, end), gap);
                }
            });
            words.put(template.path(), sequence.copy());
        }
    }

    /** The paths of the templates added, sorted. */
    public synchronized List<String> paths() {
        return new ArrayList<>(words.keySet());
    }

    /**
     * The words laid end to end in path order, numbered again by first use in that order (so the
     * numbers do not depend on the order templates were added in). Each template's own numbers are
     * released as they are numbered again; the stream can be made once.
     */
    synchronized WordStream stream() {
        if (used) {
            throw new IllegalStateException("the words were already analysed");
        }
        used = true;
        int templates = words.size();
        int[] starts = new int[templates + 1];
        byte[][] ids = new byte[templates][];
        byte[][] gaps = new byte[templates][];
        int[] renumbered = new int[table.size() + 1];
        int[] counts = new int[table.size() + 1];
        WordTable ordered = new WordTable();
        VarInts.Writer numbers = new VarInts.Writer();
        int size = 0;
        int t = 0;
        for (String path : new ArrayList<>(words.keySet())) {
            Words list = words.remove(path);
            starts[t] = size;
            VarInts.Reader reader = new VarInts.Reader(list.ids);
            numbers.clear();
            for (byte gap : list.gaps) {
                int id = reader.next();
                if (id != WordStream.SEPARATOR && renumbered[id] == 0) {
                    String word = table.word(id);
                    renumbered[id] = ordered.intern(word, 0, word.length());
                }
                int number = id == WordStream.SEPARATOR ? id : renumbered[id];
                counts[number]++;
                numbers.write(number);
            }
            ids[t] = numbers.toArray();
            gaps[t++] = list.gaps;
            size += list.gaps.length;
        }
        starts[t] = size;
        // The closing break.
        counts[WordStream.SEPARATOR]++;
        return new WordStream(starts, ordered, ids, gaps, counts);
    }

    /** A template's word numbers, as {@link VarInts}, and the gap before each word. */
    private record Words(byte[] ids, byte[] gaps) {
    }

    /** A growing list of word numbers and gaps. */
    private static final class Sequence {
        private final VarInts.Writer ids = new VarInts.Writer();
        private byte[] gaps = new byte[256];
        private int size;

        void add(int id, int gap) {
            ids.write(id);
            if (size == gaps.length) {
                gaps = Arrays.copyOf(gaps, gaps.length * 2);
            }
            gaps[size++] = (byte) gap;
        }

        Words copy() {
            return new Words(ids.toArray(), Arrays.copyOf(gaps, size));
        }
    }
}
