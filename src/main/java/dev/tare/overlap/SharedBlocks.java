package dev.tare.overlap;

import dev.tare.TareException;
import dev.tare.template.Template;
import dev.tare.tokenize.Tokenizer;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Comparator;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.function.Function;

/**
 * Finds the blocks of literal text that two or more templates share, in near-linear time and without
 * comparing templates pair by pair.
 *
 * <p>How: every template's words are laid end to end as numbers ({@link RepositoryWords}; comparing words,
 * not characters, makes whitespace-only differences the same block). One suffix array over that text
 * and its longest-common-prefix array ({@link SuffixArray}, linear time) list every repeated run of
 * words as an interval of sorted suffixes; walking the intervals bottom-up (Abouelhoda, Kurtz and
 * Ohlebusch, "Replacing suffix trees with enhanced suffix arrays", Journal of Discrete Algorithms 2,
 * 2004) gives each maximal repeat once: a run that cannot be made longer on either side without
 * losing a place. Rolling hashes over fixed-length windows were the other choice; they find seeds,
 * not maximal runs, and would still need every pair of places extended and grouped, which is where
 * the time goes when one block stands in thousands of templates.
 *
 * <p>Which repeats are blocks: those in at least two templates with at least the minimum of tokens.
 * A repeat nested in a more widely shared one (a template pair sharing a paragraph around a sentence
 * that many templates share) is a block of its own only when it adds at least the minimum of tokens
 * beyond the more widely shared blocks inside it, so a shared heading above a shared paragraph does
 * not make a second, nearly equal finding.
 */
public final class SharedBlocks {
    /**
     * Repeats estimated below this share of the minimum are not counted exactly. The estimate adds
     * each word's tokens with a space before it and what the whitespace between words likely costs;
     * on the benchmark corpus an exact count was between 0.8 and 1.2 times it, so 0.75 leaves room.
     */
    private static final double ESTIMATE_SLACK = 0.75;

    private SharedBlocks() {
    }

    /**
     * The shared blocks of {@code templates} (tool files are left out), each of at least
     * {@code minTokens} tokens on {@code tokenizer}, ordered by their first place.
     */
    public static List<RepeatedBlock> find(List<Template> templates, Tokenizer tokenizer, int minTokens) {
        RepositoryWords words = new RepositoryWords();
        Map<String, Template> byPath = new HashMap<>();
        for (Template template : templates) {
            words.add(template);
            byPath.put(template.path(), template);
        }
        return find(words, byPath::get, tokenizer, minTokens);
    }

    /**
     * The shared blocks of the templates whose words were gathered in {@code words}, each of at
     * least {@code minTokens} tokens on {@code tokenizer}, ordered by their first place. Only the
     * templates that hold a candidate block are asked of {@code templates}, by path, each at most
     * twice and one at a time, so they need not be held; each must be the template whose words were
     * gathered.
     *
     * @throws TareException when a template given back holds other words than those gathered (its
     *                       file changed in between)
     */
    public static List<RepeatedBlock> find(RepositoryWords words, Function<String, Template> templates, Tokenizer tokenizer,
                                         int minTokens) {
        List<String> paths = words.paths();
        if (paths.size() < 2) {
            return List.of();
        }
        // Only the long runs are sorted; the whole text is dropped once they are copied out.
        LongRuns runs = runs(words.text(), tokenizer, minTokens);
        int[] sa = SuffixArray.of(runs.text, runs.upper);
        int[] plcp = SuffixArray.plcp(runs.text, sa, RepositoryWords.SEPARATOR);
        Finder finder = new Finder(paths, templates, runs, sa, tokenizer, minTokens);
        walkIntervals(runs, sa, plcp, finder);
        plcp = null;
        return finder.blocks();
    }

    private static LongRuns runs(RepositoryWords.Text words, Tokenizer tokenizer, int minTokens) {
        return LongRuns.of(words, weights(words, tokenizer), minTokens * ESTIMATE_SLACK);
    }

    /** The estimated tokens of each word that occurs more than once, with a space before it. */
    private static int[] weights(RepositoryWords.Text words, Tokenizer tokenizer) {
        int[] weight = new int[words.words().length];
        Arrays.fill(weight, -1);
        weight[RepositoryWords.SEPARATOR] = 0;
        for (int id : words.text()) {
            if (weight[id] < 0) {
                weight[id] = tokenizer.count(" " + words.words()[id]);
            }
        }
        return weight;
    }

    /** Receives each interval of suffixes that share {@code length} leading words. */
    private interface IntervalSink {
        /**
         * @param leftDiverse    whether the words before the suffixes are not all the same word (a break
         *                       differs from everything), so the run cannot grow to the left
         * @param manyTemplates  whether the suffixes lie in more than one template
         */
        void interval(int length, int lb, int rb, boolean leftDiverse, boolean manyTemplates);
    }

    /** No word or template seen yet in an interval. */
    private static final int UNSET = -2;
    /** Several different words (or templates) seen. */
    private static final int MIXED = -1;

    /**
     * Reports every interval with a common prefix of at least one word, children before parents,
     * carrying up from the children the word before each suffix and the template it lies in, so that
     * each suffix is looked at once.
     */
    private static void walkIntervals(LongRuns runs, int[] sa, int[] plcp, IntervalSink sink) {
        int n = sa.length;
        int[] text = runs.text;
        int capacity = 64;
        int[] stackLength = new int[capacity];
        int[] stackLb = new int[capacity];
        int[] stackLeft = new int[capacity];
        int[] stackTemplate = new int[capacity];
        int top = 0;
        stackLeft[0] = UNSET;
        stackTemplate[0] = UNSET;
        for (int i = 1; i <= n; i++) {
            int suffix = sa[i - 1];
            int before = suffix == 0 ? RepositoryWords.SEPARATOR : text[suffix - 1];
            int left = before == RepositoryWords.SEPARATOR ? MIXED : before;
            int template = text[suffix] == RepositoryWords.SEPARATOR ? UNSET : runs.templateAt(suffix);
            int h = i < n ? plcp[sa[i]] : 0;
            int lb = i - 1;
            while (h < stackLength[top]) {
                stackLeft[top] = merge(stackLeft[top], left);
                stackTemplate[top] = merge(stackTemplate[top], template);
                left = stackLeft[top];
                template = stackTemplate[top];
                lb = stackLb[top];
                sink.interval(stackLength[top], lb, i - 1, left == MIXED, template == MIXED);
                top--;
            }
            if (h > stackLength[top]) {
                top++;
                if (top == capacity) {
                    capacity *= 2;
                    stackLength = Arrays.copyOf(stackLength, capacity);
                    stackLb = Arrays.copyOf(stackLb, capacity);
                    stackLeft = Arrays.copyOf(stackLeft, capacity);
                    stackTemplate = Arrays.copyOf(stackTemplate, capacity);
                }
                stackLength[top] = h;
                stackLb[top] = lb;
                stackLeft[top] = left;
                stackTemplate[top] = template;
            } else {
                stackLeft[top] = merge(stackLeft[top], left);
                stackTemplate[top] = merge(stackTemplate[top], template);
            }
        }
    }

    private static int merge(int seen, int next) {
        if (seen == UNSET) {
            return next;
        }
        if (next == UNSET) {
            return seen;
        }
        return seen == next ? seen : MIXED;
    }

    /** A maximal repeat found in the intervals, before it is measured and filtered. */
    private record Candidate(int length, int[] positions, int estimate, int tokens) {
    }

    /**
     * Collects maximal repeats, measures them, and keeps the blocks. Positions are those of the long
     * runs' text; {@link #templateAt} and {@link #local} lead back to the templates.
     */
    private static final class Finder implements IntervalSink {
        private final List<String> paths;
        private final Function<String, Template> templates;
        private final LongRuns runs;
        private int[] sa;
        private final Tokenizer tokenizer;
        private final int minTokens;
        private final TokenSums sums;
        private final List<Candidate> candidates = new ArrayList<>();

        Finder(List<String> paths, Function<String, Template> templates, LongRuns runs, int[] sa, Tokenizer tokenizer,
               int minTokens) {
            this.paths = paths;
            this.templates = templates;
            this.runs = runs;
            this.sa = sa;
            this.tokenizer = tokenizer;
            this.minTokens = minTokens;
            this.sums = runs.sums();
        }

        /** The index of the template holding position {@code p}. */
        private int templateAt(int p) {
            return runs.templateAt(p);
        }

        /** The index, among template {@code t}'s words and breaks, of position {@code p}. */
        private int local(int t, int p) {
            return runs.local(t, p);
        }

        @Override
        public void interval(int length, int lb, int rb, boolean leftDiverse, boolean manyTemplates) {
            if (!leftDiverse || !manyTemplates || sums.at(sa[lb] + length) - sums.at(sa[lb]) < minTokens * ESTIMATE_SLACK) {
                return;
            }
            int[] positions = Arrays.copyOfRange(sa, lb, rb + 1);
            Arrays.sort(positions);
            int first = positions[0];
            candidates.add(new Candidate(length, positions, Math.max(1, sums.at(first + length) - sums.at(first)), 0));
        }

        /**
         * The candidates with their first copy counted exactly, those below the minimum left out. The
         * copies are cut out template by template, so each template's words are located once.
         */
        private List<Candidate> measured() {
            Map<Integer, List<Integer>> byTemplate = new java.util.TreeMap<>();
            for (int k = 0; k < candidates.size(); k++) {
                byTemplate.computeIfAbsent(templateAt(candidates.get(k).positions()[0]), t -> new ArrayList<>()).add(k);
            }
            Candidate[] counted = new Candidate[candidates.size()];
            for (Map.Entry<Integer, List<Integer>> entry : byTemplate.entrySet()) {
                int t = entry.getKey();
                Template template = template(t);
                Positions where = locate(t, template);
                for (int k : entry.getValue()) {
                    Candidate c = candidates.get(k);
                    int local = local(t, c.positions()[0]);
                    String copy = template.messages().get(where.message()[local]).content()
                            .substring(where.start()[local], where.end()[local + c.length() - 1]);
                    counted[k] = new Candidate(c.length(), c.positions(), c.estimate(), tokenizer.count(copy));
                }
            }
            List<Candidate> kept = new ArrayList<>();
            for (Candidate c : counted) {
                if (c.tokens() >= minTokens) {
                    kept.add(c);
                }
            }
            return kept;
        }

        /** The template at index {@code t}, asked for again. */
        private Template template(int t) {
            String path = paths.get(t);
            Template template = templates.apply(path);
            if (template == null) {
                throw new IllegalArgumentException("no template at " + path);
            }
            return template;
        }

        private Positions locate(int t, Template template) {
            int size = runs.starts[t + 1] - runs.starts[t];
            int[] message = new int[size];
            int[] start = new int[size];
            int[] end = new int[size];
            int[] at = {0};
            TemplateWords.walk(template, new TemplateWords.Sink() {
                @Override
                public void separator() {
                    if (at[0] < size) {
                        message[at[0]] = -1;
                    }
                    at[0]++;
                }

                @Override
                public void word(int m, int from, int to, int gap) {
                    if (at[0] < size) {
                        message[at[0]] = m;
                        start[at[0]] = from;
                        end[at[0]] = to;
                    }
                    at[0]++;
                }
            });
            if (at[0] != size) {
                throw new TareException(template.path() + " changed while shared blocks were looked for;"
                        + " run the command again");
            }
            return new Positions(message, start, end);
        }

        /**
         * The candidates that are blocks. The most widely shared are taken first; a candidate nested
         * around blocks already taken is kept only if what it adds beyond them, estimated, still
         * reaches the minimum.
         */
        List<RepeatedBlock> blocks() {
            // The suffix order is no longer needed once the candidates hold their positions.
            sa = null;
            List<Candidate> order = measured();
            order.sort(Comparator.comparingInt((Candidate c) -> -c.positions().length)
                    .thenComparingInt(c -> -c.tokens()).thenComparingInt(c -> c.positions()[0]));
            Map<Integer, List<int[]>> taken = new HashMap<>();
            List<Candidate> kept = new ArrayList<>();
            for (Candidate c : order) {
                int first = c.positions()[0];
                int covered = covered(taken.getOrDefault(templateAt(first), List.of()), first, first + c.length());
                if (covered > 0 && c.tokens() * (double) (c.estimate() - covered) / c.estimate() < minTokens) {
                    continue;
                }
                kept.add(c);
                for (int p : c.positions()) {
                    taken.computeIfAbsent(templateAt(p), t -> new ArrayList<>()).add(new int[] {p, p + c.length()});
                }
            }
            return places(kept);
        }

        /** The estimated tokens of {@code [from, to)} that the spans cover, each word once. */
        private int covered(List<int[]> spans, int from, int to) {
            List<int[]> inside = new ArrayList<>();
            for (int[] span : spans) {
                if (span[0] < to && from < span[1]) {
                    inside.add(new int[] {Math.max(from, span[0]), Math.min(to, span[1])});
                }
            }
            inside.sort(Comparator.comparingInt(span -> span[0]));
            int total = 0;
            int reached = from;
            for (int[] span : inside) {
                int start = Math.max(reached, span[0]);
                if (span[1] > start) {
                    total += sums.at(span[1]) - sums.at(start);
                    reached = span[1];
                }
            }
            return total;
        }

        /** The kept candidates as blocks with their places, each template's positions located once. */
        private List<RepeatedBlock> places(List<Candidate> kept) {
            Map<Integer, List<int[]>> byTemplate = new java.util.TreeMap<>();
            for (int k = 0; k < kept.size(); k++) {
                for (int p : kept.get(k).positions()) {
                    byTemplate.computeIfAbsent(templateAt(p), t -> new ArrayList<>()).add(new int[] {p, k});
                }
            }
            List<List<RepeatedBlock.Place>> places = new ArrayList<>();
            kept.forEach(c -> places.add(new ArrayList<>()));
            String[] texts = new String[kept.size()];
            for (Map.Entry<Integer, List<int[]>> entry : byTemplate.entrySet()) {
                int t = entry.getKey();
                Template template = template(t);
                Positions where = locate(t, template);
                String path = template.path();
                for (int[] item : entry.getValue()) {
                    Candidate c = kept.get(item[1]);
                    int local = local(t, item[0]);
                    List<RepeatedBlock.Place> list = places.get(item[1]);
                    RepeatedBlock.Place place = new RepeatedBlock.Place(path, where.message()[local], where.start()[local],
                            where.end()[local + c.length() - 1]);
                    RepeatedBlock.Place last = list.isEmpty() ? null : list.get(list.size() - 1);
                    if (last == null) {
                        // Templates come in order and positions in order within one: this is the block's first copy.
                        texts[item[1]] = template.messages().get(place.message()).content()
                                .substring(place.start(), place.end());
                    }
                    // A run repeated with overlap inside one message (periodic text) stands there once.
                    if (last == null || !last.path().equals(path) || last.message() != place.message()
                            || place.start() >= last.end()) {
                        list.add(place);
                    }
                }
            }
            List<RepeatedBlock> blocks = new ArrayList<>();
            for (int k = 0; k < kept.size(); k++) {
                Candidate c = kept.get(k);
                blocks.add(new RepeatedBlock(places.get(k), c.length(), c.tokens(), texts[k]));
            }
            blocks.sort(Comparator.comparing((RepeatedBlock b) -> b.places().get(0).path())
                    .thenComparingInt(b -> b.places().get(0).message()).thenComparingInt(b -> b.places().get(0).start())
                    .thenComparingInt(b -> -b.places().size()));
            return blocks;
        }
    }

    /** Where each position of one template's words stands in its messages. */
    private record Positions(int[] message, int[] start, int[] end) {
    }
}
