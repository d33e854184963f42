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

    @Override
    public RuleDescriptor descriptor() {
        return DESCRIPTOR;
    }

    @Override
    public List<Finding> check(Template template, LintContext context) {
        TemplateView text = context.text(template);
        List<SentenceSite> all = new ArrayList<>();
        Map<String, Integer> vocabulary = new HashMap<>();
        for (MessageView message : text.messages()) {
            if (all.size() >= MAX_SENTENCES) {
                break;
            }
            List<Sentences.Sentence> sentences = Sentences.of(message);
            for (int index = 0; index < sentences.size() && all.size() < MAX_SENTENCES; index++) {
                Sentences.Sentence sentence = sentences.get(index);
                if (sentence.instruction() && sentence.words() >= Sentences.MIN_WORDS + 2) {
                    all.add(new SentenceSite(message, sentence, sentences, index,
                            WordVector.of(words(sentence.text()), vocabulary), sentence.text().toLowerCase(Locale.ROOT)));
                }
            }
        }
        List<Finding> findings = new ArrayList<>();
        for (int j = 1; j < all.size(); j++) {
            SentenceSite later = all.get(j);
            for (int i = 0; i < j; i++) {
                SentenceSite earlier = all.get(i);
                if (earlier.message() != later.message() || earlier.sentence().branch() != later.sentence().branch()) {
                    continue;
                }
                if (earlier.sentence().text().equals(later.sentence().text())) {
                    break;
                }
                double similarity = earlier.words().cosine(later.words());
                if (similarity < MIN_COSINE) {
                    continue;
                }
                String a = earlier.lowerCase();
                String b = later.lowerCase();
                double edit = 1.0 - (double) editDistance(a, b) / Math.max(a.length(), b.length());
                if (edit < MIN_LEVENSHTEIN) {
                    continue;
                }
                findings.add(finding(text, earlier, later, similarity, context, template));
                break;
            }
        }
        return findings;
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
     * {@code LevenshteinDistance.getDefaultInstance()} gives it (a test compares them), in two rows of
     * plain ints: the library boxes every character it compares, which made this rule the costliest
     * part of a check.
     */
    static int editDistance(String a, String b) {
        if (a.length() < b.length()) {
            String swap = a;
            a = b;
            b = swap;
        }
        int[] previous = new int[b.length() + 1];
        int[] current = new int[b.length() + 1];
        for (int j = 0; j <= b.length(); j++) {
            previous[j] = j;
        }
        for (int i = 1; i <= a.length(); i++) {
            current[0] = i;
            char c = a.charAt(i - 1);
            for (int j = 1; j <= b.length(); j++) {
                int substitute = previous[j - 1] + (c == b.charAt(j - 1) ? 0 : 1);
                current[j] = Math.min(substitute, Math.min(previous[j], current[j - 1]) + 1);
            }
            int[] swap = previous;
            previous = current;
            current = swap;
        }
        return previous[b.length()];
    }

    /** The content words of {@code sentence} with how often each occurs. */
    static Map<CharSequence, Integer> words(String sentence) {
        Map<CharSequence, Integer> counts = new HashMap<>();
        for (String word : sentence.toLowerCase(Locale.ROOT).split("[^\\p{L}\\p{N}]+")) {
            if (!word.isEmpty() && !FUNCTION_WORDS.contains(word)) {
                counts.merge(NUMBERS.getOrDefault(word, word), 1, Integer::sum);
            }
        }
        return counts;
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

    /** A sentence with its message, its message's sentences, its index among them, its word counts and its lower-case text. */
    record SentenceSite(MessageView message, Sentences.Sentence sentence, List<Sentences.Sentence> sentences, int index,
                   WordVector words, String lowerCase) {
    }

    /**
     * Word counts as parallel arrays sorted by word number, with the sum of squared counts kept, so
     * comparing two sentences is one merge of two short arrays. A long template compares about a
     * million pairs (half of {@value #MAX_SENTENCES} squared); with maps of words that took seconds.
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
