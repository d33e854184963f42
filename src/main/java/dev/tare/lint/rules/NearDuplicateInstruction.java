package dev.tare.lint.rules;

import dev.tare.lint.Edit;
import dev.tare.lint.EditKind;
import dev.tare.lint.Example;
import dev.tare.lint.Finding;
import dev.tare.lint.LintContext;
import dev.tare.lint.MessageView;
import dev.tare.lint.Rewrite;
import dev.tare.lint.Rule;
import dev.tare.lint.RuleDescriptor;
import dev.tare.lint.Severity;
import dev.tare.lint.TemplateView;
import dev.tare.template.Template;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;

/**
 * Two instructions of one message and one conditional branch that say nearly the same thing (only
 * sentences the structure model reads as instructions, as for repeated-instruction): the cosine similarity of their
 * content-word counts (computed as commons-text's {@code CosineSimilarity} computes it; common
 * function words left out, number words read as digits) is at least
 * {@value #MIN_COSINE} and their Levenshtein similarity (one minus the edit distance over the longer
 * length) at least {@value #MIN_LEVENSHTEIN}. The thresholds were chosen on the demo corpus so that a
 * reworded rule is caught and unrelated rules are not (common practice, no source). The later
 * sentence is flagged; dropping it is offered for review.
 */
final class NearDuplicateInstruction implements Rule {
    static final double MIN_COSINE = 0.7;
    static final double MIN_LEVENSHTEIN = 0.5;
    /** Templates with more sentences than this are compared only over their first this-many. */
    static final int MAX_SENTENCES = 1500;
    /** How far below {@link #MIN_COSINE} the candidate index still guarantees a pair is found. */
    static final double INDEX_MARGIN = 0.01;
    private static final Map<String, String> NUMBERS = numbers();
    private static final java.util.Set<String> FUNCTION_WORDS = java.util.Set.of("a", "an", "the", "to", "of", "in",
            "on", "at", "for", "and", "or", "is", "are", "be", "it", "its", "this", "that", "any", "do", "not", "no",
            "with", "as", "by", "from", "up", "if", "then", "so", "you", "your", "we", "our", "they", "their", "them",
            "s", "what", "when", "where", "who", "how", "which", "than", "all", "each", "every", "will", "can", "may",
            "must", "should", "would", "only", "also", "into", "out", "about");

    static final RuleDescriptor DESCRIPTOR = RuleDescriptor.builtIn("near-duplicate-instruction", Severity.INFO,
            EditKind.TEXT,
            "An instruction that nearly repeats an earlier one in the same message.",
            "Saying a rule twice in other words costs tokens on every call and leaves the model two versions"
                    + " to reconcile when they differ in detail.",
            "Keep the clearer sentence and delete the other.",
            Example.of("Never agree to a plan longer than twelve months without a supervisor.\n\n"
                            + "Do not agree to any plan longer than 12 months unless a supervisor approves it.\n",
                    "Never agree to a plan longer than twelve months without a supervisor.\n"));

    /** How the sentences are paired; the exhaustive comparison stands in for it in a test. */
    private final java.util.function.Function<List<Compared>, List<Pair>> pairing;

    NearDuplicateInstruction() {
        this(NearDuplicateInstruction::pairs);
    }

    NearDuplicateInstruction(java.util.function.Function<List<Compared>, List<Pair>> pairing) {
        this.pairing = pairing;
    }

    @Override
    public RuleDescriptor descriptor() {
        return DESCRIPTOR;
    }

    @Override
    public List<Finding> check(Template template, LintContext context) {
        TemplateView text = context.text(template);
        List<SentenceSite> all = new ArrayList<>();
        List<Compared> compared = new ArrayList<>();
        Map<String, Integer> vocabulary = new HashMap<>();
        Map<List<Object>, Integer> groups = new HashMap<>();
        for (MessageView message : text.messages()) {
            if (all.size() >= MAX_SENTENCES) {
                break;
            }
            List<Sentences.Sentence> sentences = Sentences.of(message);
            for (int index = 0; index < sentences.size() && all.size() < MAX_SENTENCES; index++) {
                Sentences.Sentence sentence = sentences.get(index);
                if (sentence.instruction() && sentence.words() >= Sentences.MIN_WORDS + 2) {
                    all.add(new SentenceSite(message, sentence, sentences, index));
                    // Message views are told apart by identity: one group per message and branch.
                    int group = groups.computeIfAbsent(List.of(message, sentence.branch()), g -> groups.size());
                    compared.add(new Compared(group, sentence.text(), sentence.text().toLowerCase(Locale.ROOT),
                            WordVector.of(words(sentence.text()), vocabulary)));
                }
            }
        }
        List<Finding> findings = new ArrayList<>();
        for (Pair pair : pairing.apply(compared)) {
            findings.add(finding(text, all.get(pair.earlier()), all.get(pair.later()), pair.similarity(), context,
                    template));
        }
        return findings;
    }

    /**
     * A later sentence and the earlier one it nearly repeats, by their indexes among the sentences
     * compared, with their cosine similarity.
     */
    record Pair(int earlier, int later, double similarity) {
    }

    /**
     * For each sentence, the first earlier sentence of its message and branch that it nearly repeats,
     * unless an exact copy of it comes first (repeated-instruction's case).
     *
     * <p>Only candidates are compared. Each sentence is indexed under a prefix of its words, taken
     * rarest first (by how many sentences of the template hold each word), that leaves out a suffix
     * whose sum of squared counts is below {@code (MIN_COSINE - INDEX_MARGIN)^2} times the whole sum
     * (prefix filtering: Bayardo, Ma and Srikant, "Scaling up all pairs similarity search", WWW 2007).
     * A later sentence is compared with every earlier one that indexed a word it holds. No pair at or
     * above the threshold is missed: if sentence x shares no word of its prefix with y, their dot
     * product is a sum over x's suffix alone, at most |x suffix| |y| (Cauchy-Schwarz), so their
     * cosine is below {@code MIN_COSINE - INDEX_MARGIN}; the margin is far wider than the rounding of
     * the computed cosine. An exact copy has a cosine of 1, so it is a candidate too, and candidates
     * are visited in order as the exhaustive comparison visits every earlier sentence.
     */
    static List<Pair> pairs(List<Compared> all) {
        int[] holders = holders(all);
        double bound = Math.pow(MIN_COSINE - INDEX_MARGIN, 2);
        Map<Long, IntList> index = new HashMap<>();
        int[] seen = new int[all.size()];
        java.util.Arrays.fill(seen, -1);
        List<Pair> pairs = new ArrayList<>();
        IntList candidates = new IntList();
        for (int j = 0; j < all.size(); j++) {
            Compared later = all.get(j);
            candidates.clear();
            for (int id : later.words().ids()) {
                IntList earlier = index.get(key(later.group(), id));
                for (int k = 0; earlier != null && k < earlier.size(); k++) {
                    int i = earlier.get(k);
                    if (seen[i] != j) {
                        seen[i] = j;
                        candidates.add(i);
                    }
                }
            }
            candidates.sort();
            for (int k = 0; k < candidates.size(); k++) {
                Compared earlier = all.get(candidates.get(k));
                if (earlier.text().equals(later.text())) {
                    break;
                }
                double similarity = earlier.words().cosine(later.words());
                if (similarity >= MIN_COSINE && nearInEdits(earlier.lowerCase(), later.lowerCase())) {
                    pairs.add(new Pair(candidates.get(k), j, similarity));
                    break;
                }
            }
            for (int id : prefix(later.words(), holders, bound)) {
                index.computeIfAbsent(key(later.group(), id), x -> new IntList()).add(j);
            }
        }
        return pairs;
    }

    /** Whether the Levenshtein similarity of two lower-case sentences reaches {@value #MIN_LEVENSHTEIN}. */
    static boolean nearInEdits(String a, String b) {
        int longer = Math.max(a.length(), b.length());
        // A distance above half the longer length fails the threshold whatever its exact value.
        int limit = longer / 2 + 1;
        return 1.0 - (double) editDistance(a, b, limit) / longer >= MIN_LEVENSHTEIN;
    }

    private static long key(int group, int word) {
        return (long) group << 32 | word & 0xffffffffL;
    }

    /** How many of the sentences hold each word number. */
    private static int[] holders(List<Compared> all) {
        int size = 0;
        for (Compared one : all) {
            for (int id : one.words().ids()) {
                size = Math.max(size, id + 1);
            }
        }
        int[] holders = new int[size];
        for (Compared one : all) {
            for (int id : one.words().ids()) {
                holders[id]++;
            }
        }
        return holders;
    }

    /**
     * The words a sentence is indexed under: all but its most widely held words whose squared counts
     * sum below {@code bound} times the whole sum.
     */
    private static int[] prefix(WordVector words, int[] holders, double bound) {
        Integer[] order = new Integer[words.ids().length];
        for (int k = 0; k < order.length; k++) {
            order[k] = k;
        }
        java.util.Arrays.sort(order, java.util.Comparator.comparingInt((Integer k) -> holders[words.ids()[k]])
                .thenComparingInt(k -> words.ids()[k]));
        double suffix = 0.0;
        int kept = order.length;
        while (kept > 0) {
            int count = words.counts()[order[kept - 1]];
            if (suffix + (double) count * count >= bound * words.squares()) {
                break;
            }
            suffix += (double) count * count;
            kept--;
        }
        int[] prefix = new int[kept];
        for (int k = 0; k < kept; k++) {
            prefix[k] = words.ids()[order[k]];
        }
        return prefix;
    }

    /**
     * One sentence as the comparison sees it.
     *
     * @param group     its message and branch: only sentences of one group are compared
     * @param text      its text, for exact copies
     * @param lowerCase its lower-case text, for the edit distance
     * @param words     its content-word counts
     */
    record Compared(int group, String text, String lowerCase, WordVector words) {
    }

    /** A growing list of ints. */
    private static final class IntList {
        private int[] values = new int[8];
        private int size;

        void add(int value) {
            if (size == values.length) {
                values = java.util.Arrays.copyOf(values, size * 2);
            }
            values[size++] = value;
        }

        int get(int k) {
            return values[k];
        }

        int size() {
            return size;
        }

        void clear() {
            size = 0;
        }

        void sort() {
            java.util.Arrays.sort(values, 0, size);
        }
    }

    private Finding finding(TemplateView text, SentenceSite earlier, SentenceSite later, double similarity, LintContext context,
                            Template template) {
        MessageView message = later.message();
        Optional<Rewrite> rewrite = message.isProtected(later.sentence().start(), later.sentence().end()) ? Optional.empty()
                : Sentences.removal(message.content(), later.sentences(), later.index(), true)
                        .filter(r -> !message.isProtected(r[0], r[1]))
                        .flatMap(r -> text.rewrite(message, new Edit(r[0], r[1], ""), context.tokenizer(template)));
        int line = text.line(earlier.message(), earlier.sentence().start());
        return text.finding(DESCRIPTOR, message, later.sentence().start(), later.sentence().end(),
                "nearly repeats the sentence on line " + line + " (word similarity "
                        + String.format(Locale.ROOT, "%.2f", similarity) + "); keep one of them",
                rewrite, List.of(text.related(earlier.message(), earlier.sentence().start(), "similar sentence")));
    }

    /**
     * The Levenshtein distance of two strings in UTF-16 units, as commons-text's
     * {@code LevenshteinDistance.getDefaultInstance()} gives it (a test compares them), when it is at
     * most {@code limit}, else some number above {@code limit}. Only the cells within {@code limit} of
     * the diagonal are computed (Ukkonen, "Algorithms for approximate string matching", Information
     * and Control 64, 1985): a path through any other cell costs more than the limit. The rows are
     * plain ints: the library boxes every character it compares.
     */
    static int editDistance(String a, String b, int limit) {
        if (a.length() < b.length()) {
            String swap = a;
            a = b;
            b = swap;
        }
        int n = a.length();
        int m = b.length();
        int over = limit + 1;
        if (n - m > limit) {
            return over;
        }
        int[] previous = new int[m + 1];
        int[] current = new int[m + 1];
        for (int j = 0; j <= m; j++) {
            previous[j] = Math.min(j, over);
        }
        for (int i = 1; i <= n; i++) {
            int low = Math.max(1, i - limit);
            int high = Math.min(m, i + limit);
            current[0] = Math.min(i, over);
            if (low > 1) {
                current[low - 1] = over;
            }
            int best = low == 1 ? current[0] : over;
            char c = a.charAt(i - 1);
            for (int j = low; j <= high; j++) {
                int substitute = previous[j - 1] + (c == b.charAt(j - 1) ? 0 : 1);
                int value = Math.min(over, Math.min(substitute, Math.min(previous[j], current[j - 1]) + 1));
                current[j] = value;
                best = Math.min(best, value);
            }
            if (high < m) {
                current[high + 1] = over;
            }
            if (best > limit) {
                return over;
            }
            int[] swap = previous;
            previous = current;
            current = swap;
        }
        return previous[m];
    }

    /** The Levenshtein distance of two strings in UTF-16 units, with no limit. */
    static int editDistance(String a, String b) {
        return editDistance(a, b, Math.max(a.length(), b.length()));
    }

    /** The content words of {@code sentence} with how often each occurs. */
    static Map<CharSequence, Integer> words(String sentence) {
        Map<CharSequence, Integer> counts = new HashMap<>();
        String lower = sentence.toLowerCase(Locale.ROOT);
        // The runs of letters and numbers (\\p{L} and \\p{N}), as splitting at everything else gives them.
        int i = 0;
        while (i < lower.length()) {
            int start = i;
            while (i < lower.length() && isWordPoint(lower.codePointAt(i))) {
                i += Character.charCount(lower.codePointAt(i));
            }
            if (i > start) {
                String word = lower.substring(start, i);
                if (!FUNCTION_WORDS.contains(word)) {
                    counts.merge(NUMBERS.getOrDefault(word, word), 1, Integer::sum);
                }
            } else {
                i += Character.charCount(lower.codePointAt(i));
            }
        }
        return counts;
    }

    static boolean isFunctionWord(String word) {
        return FUNCTION_WORDS.contains(word);
    }

    /** The word with a number word read as digits. */
    static String number(String word) {
        return NUMBERS.getOrDefault(word, word);
    }

    private static boolean isWordPoint(int point) {
        if (Character.isLetter(point)) {
            return true;
        }
        int type = Character.getType(point);
        return type == Character.DECIMAL_DIGIT_NUMBER || type == Character.LETTER_NUMBER || type == Character.OTHER_NUMBER;
    }

    private static Map<String, String> numbers() {
        String[] names = {"zero", "one", "two", "three", "four", "five", "six", "seven", "eight", "nine", "ten",
                "eleven", "twelve", "thirteen", "fourteen", "fifteen", "sixteen", "seventeen", "eighteen", "nineteen",
                "twenty"};
        Map<String, String> map = new HashMap<>();
        for (int i = 0; i < names.length; i++) {
            map.put(names[i], String.valueOf(i));
        }
        return map;
    }

    /** A sentence with its message, its message's sentences and its index among them. */
    record SentenceSite(MessageView message, Sentences.Sentence sentence, List<Sentences.Sentence> sentences, int index) {
    }

    /**
     * Word counts as parallel arrays sorted by word number, with the sum of squared counts kept, so
     * comparing two sentences is one merge of two short arrays.
     *
     * @param ids     word numbers (from one vocabulary per template), ascending
     * @param counts  how often each word occurs
     * @param squares the sum of the squared counts
     */
    record WordVector(int[] ids, int[] counts, double squares) {
        static WordVector of(Map<CharSequence, Integer> words, Map<String, Integer> vocabulary) {
            int[][] pairs = new int[words.size()][];
            int i = 0;
            double squares = 0.0;
            for (Map.Entry<CharSequence, Integer> word : words.entrySet()) {
                Integer id = vocabulary.computeIfAbsent(word.getKey().toString(), w -> vocabulary.size());
                pairs[i++] = new int[] {id, word.getValue()};
                squares += Math.pow(word.getValue(), 2);
            }
            java.util.Arrays.sort(pairs, java.util.Comparator.comparingInt(pair -> pair[0]));
            int[] ids = new int[pairs.length];
            int[] counts = new int[pairs.length];
            for (int k = 0; k < pairs.length; k++) {
                ids[k] = pairs[k][0];
                counts[k] = pairs[k][1];
            }
            return new WordVector(ids, counts, squares);
        }

        /**
         * The cosine similarity with {@code other}, with the same arithmetic as commons-text's
         * {@code CosineSimilarity}: a whole-number dot product, sums of squared counts, and
         * {@code dot / (sqrt(a) * sqrt(b))}, or 0 when either vector is empty; so the same sentences
         * give the same value to the last bit.
         */
        double cosine(WordVector other) {
            if (squares <= 0.0 || other.squares <= 0.0) {
                return 0.0;
            }
            long dot = 0;
            int i = 0;
            int j = 0;
            while (i < ids.length && j < other.ids.length) {
                if (ids[i] == other.ids[j]) {
                    dot += counts[i++] * (long) other.counts[j++];
                } else if (ids[i] < other.ids[j]) {
                    i++;
                } else {
                    j++;
                }
            }
            return dot / (Math.sqrt(squares) * Math.sqrt(other.squares));
        }
    }
}
