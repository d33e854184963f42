package dev.tare.lint.rules;

import dev.tare.lint.Edit;
import dev.tare.lint.Example;
import dev.tare.lint.Finding;
import dev.tare.lint.LintContext;
import dev.tare.lint.MessageText;
import dev.tare.lint.Rewrite;
import dev.tare.lint.RewriteClass;
import dev.tare.lint.Rule;
import dev.tare.lint.RuleDescriptor;
import dev.tare.lint.Severity;
import dev.tare.lint.TemplateText;
import dev.tare.template.Template;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.regex.Pattern;
import org.apache.commons.text.similarity.LevenshteinDistance;

/**
 * Two sentences of one template that say nearly the same thing: the cosine similarity of their
 * content-word counts (as commons-text's {@code CosineSimilarity} computes it; common function words
 * left out, number words read as digits) is at least
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
    private static final Pattern NON_WORD = Pattern.compile("[^\\p{L}\\p{N}]+");
    private static final java.util.Set<String> FUNCTION_WORDS = java.util.Set.of("a", "an", "the", "to", "of", "in",
            "on", "at", "for", "and", "or", "is", "are", "be", "it", "its", "this", "that", "any", "do", "not", "no",
            "with", "as", "by", "from", "up", "if", "then", "so", "you", "your", "we", "our", "they", "their", "them",
            "s", "what", "when", "where", "who", "how", "which", "than", "all", "each", "every", "will", "can", "may",
            "must", "should", "would", "only", "also", "into", "out", "about");

    static final RuleDescriptor DESCRIPTOR = RuleDescriptor.builtIn("near-duplicate-instruction", Severity.INFO,
            RewriteClass.REVIEW,
            "A sentence that nearly repeats an earlier one in the same template.",
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
        TemplateText text = context.text(template);
        List<Located> all = new ArrayList<>();
        for (MessageText message : text.messages()) {
            List<Sentences.Sentence> sentences = Sentences.of(message);
            for (Sentences.Sentence sentence : sentences) {
                if (sentence.words() >= Sentences.MIN_WORDS + 2 && all.size() < MAX_SENTENCES) {
                    all.add(new Located(message, sentence, sentences, words(sentence.text())));
                }
            }
        }
        LevenshteinDistance distance = LevenshteinDistance.getDefaultInstance();
        List<Finding> findings = new ArrayList<>();
        for (int j = 1; j < all.size(); j++) {
            Located later = all.get(j);
            for (int i = 0; i < j; i++) {
                Located earlier = all.get(i);
                if (earlier.sentence().text().equals(later.sentence().text())) {
                    break;
                }
                double similarity = earlier.words().cosine(later.words());
                if (similarity < MIN_COSINE) {
                    continue;
                }
                String a = earlier.sentence().text().toLowerCase(Locale.ROOT);
                String b = later.sentence().text().toLowerCase(Locale.ROOT);
                double edit = 1.0 - (double) distance.apply(a, b) / Math.max(a.length(), b.length());
                if (edit < MIN_LEVENSHTEIN) {
                    continue;
                }
                findings.add(finding(text, earlier, later, similarity, context, template));
                break;
            }
        }
        return findings;
    }

    private Finding finding(TemplateText text, Located earlier, Located later, double similarity, LintContext context,
                            Template template) {
        MessageText message = later.message();
        Optional<Rewrite> rewrite = message.isProtected(later.sentence().start(), later.sentence().end()) ? Optional.empty()
                : Sentences.removal(message.content(), later.sentence(), later.sentences(), true)
                        .filter(r -> !message.isProtected(r[0], r[1]))
                        .flatMap(r -> text.rewrite(message, List.of(new Edit(r[0], r[1], "")), context.tokenizer(template)));
        int line = text.line(earlier.message(), earlier.sentence().start());
        return text.finding(DESCRIPTOR, message, later.sentence().start(), later.sentence().end(),
                "nearly repeats the sentence on line " + line + " (word similarity "
                        + String.format(Locale.ROOT, "%.2f", similarity) + "); keep one of them",
                rewrite, List.of(text.related(earlier.message(), earlier.sentence().start(), "similar sentence")));
    }

    private static Words words(String sentence) {
        Map<String, Integer> counts = new HashMap<>();
        for (String word : NON_WORD.split(sentence.toLowerCase(Locale.ROOT))) {
            if (!word.isEmpty() && !FUNCTION_WORDS.contains(word)) {
                counts.merge(NUMBERS.getOrDefault(word, word), 1, Integer::sum);
            }
        }
        double squares = 0;
        for (int count : counts.values()) {
            squares += (double) count * count;
        }
        return new Words(counts, squares);
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

    /** A sentence with its message, its message's sentences and its word counts. */
    record Located(MessageText message, Sentences.Sentence sentence, List<Sentences.Sentence> sentences, Words words) {
    }

    /**
     * A sentence's content-word counts and the sum of their squares, computed once per sentence rather
     * than once per pair: every pair of sentences in a template is compared, so this is the rule's cost.
     */
    record Words(Map<String, Integer> counts, double squares) {
        /**
         * The cosine similarity with {@code other}, exactly as commons-text's {@code CosineSimilarity}
         * gives it for these two maps in this order: the dot product and the squares are sums of whole
         * numbers, exact in a long and a double, so only the final division rounds, the same way.
         */
        double cosine(Words other) {
            if (squares <= 0 || other.squares <= 0) {
                return 0.0;
            }
            Map<String, Integer> fewer = counts.size() <= other.counts.size() ? counts : other.counts;
            Map<String, Integer> more = fewer == counts ? other.counts : counts;
            long dot = 0;
            for (Map.Entry<String, Integer> entry : fewer.entrySet()) {
                Integer count = more.get(entry.getKey());
                if (count != null) {
                    dot += (long) entry.getValue() * count;
                }
            }
            return dot / (Math.sqrt(squares) * Math.sqrt(other.squares));
        }
    }
}
