package dev.tare.lint.rules;

import static dev.tare.lint.RuleHarness.findings;
import static dev.tare.lint.RuleHarness.fixed;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.lint.Finding;
import dev.tare.lint.RewriteClass;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.SplittableRandom;
import org.apache.commons.text.similarity.CosineSimilarity;
import org.junit.jupiter.api.Test;

/** Sentences that say nearly the same thing twice in one message; word-for-word repeats are another rule's. */
class NearDuplicateInstructionTest {
    private static final String FIRST = "Never agree to a plan longer than twelve months without a supervisor.";
    private static final String REWORDED = "Do not agree to any plan longer than 12 months unless a supervisor approves it.";

    private final NearDuplicateInstruction near = new NearDuplicateInstruction();

    @Test
    void theMessageNamesTheEarlierSentenceAndItsSimilarity() {
        List<Finding> found = findings(near, "Greet the caller.\n" + FIRST + "\n\n" + REWORDED + "\n");
        assertEquals(1, found.size());
        assertTrue(found.get(0).message().matches("nearly repeats the sentence on line 2 \\(word similarity 0\\.\\d\\d\\);"
                + " keep one of them"), found.get(0).message());
        assertEquals(1, found.get(0).column());
        assertEquals(REWORDED.length() + 1, found.get(0).endColumn());
        assertEquals(2, found.get(0).related().get(0).line());
        assertEquals("similar sentence", found.get(0).related().get(0).message());
    }

    @Test
    void copiesInDifferentBranchesOrMessagesOrInCodeAreNotCompared() {
        String branches = FIRST + "\n\n{% if premium %}\n" + REWORDED + "\n{% endif %}\n";
        assertTrue(findings(near, branches).isEmpty(), "the reworded copy is sent only with its branch");
        String chat = "messages:\n  - role: system\n    content: " + FIRST + "\n  - role: user\n    content: " + REWORDED + "\n";
        assertTrue(findings(near, "a.chat.yaml", chat, Map.of()).isEmpty(), "each message is read on its own");
        assertTrue(findings(near, FIRST + "\n```\n" + REWORDED + "\n```\n").isEmpty(), "code is not an instruction");
    }

    @Test
    void anExactRepeatIsNotANearDuplicate() {
        assertTrue(findings(near, FIRST + "\n\n" + FIRST + "\n").isEmpty());
    }

    @Test
    void aReworderRuleIsANearDuplicateForReview() {
        String text = "Never agree to a plan longer than twelve months without a supervisor.\n\n"
                + "Do not agree to any plan longer than 12 months unless a supervisor approves it.\n";
        List<Finding> found = findings(near, text);
        assertEquals(1, found.size());
        assertEquals(3, found.get(0).line());
        assertEquals(RewriteClass.REVIEW, found.get(0).rewriteClass());
        assertEquals("Never agree to a plan longer than twelve months without a supervisor.\n", fixed(near, text));
    }

    @Test
    void aNearDuplicateListItemIsOfferedForReviewAsAWholeItem() {
        String text = "- Never agree to a plan longer than twelve months without a supervisor.\n- Check the meter.\n"
                + "- Do not agree to any plan longer than 12 months unless a supervisor approves it.\n- Close.\n";
        assertEquals("- Never agree to a plan longer than twelve months without a supervisor.\n- Check the meter.\n- Close.\n",
                fixed(near, text));
    }

    @Test
    void sentencesThatShareOnlyTheirShapeAreNotNearDuplicates() {
        String text = "Everything from the water main up to and including the meter belongs to Brookmere Water.\n"
                + "Everything from the meter to the building belongs to the property owner.\n";
        assertTrue(findings(near, text).isEmpty());
    }

    @Test
    void wordVectorCosineIsCommonsTextCosineSimilarityToTheLastBit() {
        // Outside source: commons-text's CosineSimilarity over the same word counts, which the rule used before.
        List<String> words = List.of("meter", "reading", "bill", "twelve", "12", "months", "supervisor", "plan", "agree",
                "never", "refund", "water", "leak", "call", "back", "the", "a", "account", "number", "read");
        SplittableRandom random = new SplittableRandom(11);
        Map<String, Integer> vocabulary = new HashMap<>();
        CosineSimilarity reference = new CosineSimilarity();
        for (int pair = 0; pair < 2_000; pair++) {
            String a = sentence(words, random);
            String b = sentence(words, random);
            var left = NearDuplicateInstruction.words(a);
            var right = NearDuplicateInstruction.words(b);
            double expected = reference.cosineSimilarity(left, right);
            double actual = NearDuplicateInstruction.WordVector.of(left, vocabulary)
                    .cosine(NearDuplicateInstruction.WordVector.of(right, vocabulary));
            assertEquals(Double.doubleToLongBits(expected), Double.doubleToLongBits(actual), a + " / " + b);
        }
    }

    @Test
    void editDistanceIsCommonsTextLevenshteinDistance() {
        // Outside source: commons-text's LevenshteinDistance, which the rule used before.
        List<String> words = List.of("meter", "Reading", "bill", "twelve", "12", "months", "é", "🙂", "plan", "",
                "never", "refund", "water", "leak", "call", "back", "the", "a", "account", "number", "read");
        SplittableRandom random = new SplittableRandom(13);
        var reference = org.apache.commons.text.similarity.LevenshteinDistance.getDefaultInstance();
        for (int pair = 0; pair < 2_000; pair++) {
            String a = sentence(words, random);
            String b = sentence(words, random);
            assertEquals(reference.apply(a, b), NearDuplicateInstruction.editDistance(a, b), a + " / " + b);
        }
    }

    private static String sentence(List<String> words, SplittableRandom random) {
        StringBuilder sentence = new StringBuilder();
        int length = random.nextInt(12);
        for (int i = 0; i < length; i++) {
            sentence.append(words.get(random.nextInt(words.size()))).append(' ');
        }
        return sentence.toString();
    }
}
