package dev.tare.lint.rules;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.HashMap;
import java.util.Map;
import java.util.Random;
import org.apache.commons.text.similarity.CosineSimilarity;
import org.junit.jupiter.api.Test;

/** The rule's own cosine gives exactly what commons-text's {@code CosineSimilarity} gives, bit for bit. */
class NearDuplicateCosineTest {
    private static NearDuplicateInstruction.Words words(Map<String, Integer> counts) {
        double squares = 0;
        for (int count : counts.values()) {
            squares += (double) count * count;
        }
        return new NearDuplicateInstruction.Words(counts, squares);
    }

    private static Map<String, Integer> randomCounts(Random random) {
        Map<String, Integer> counts = new HashMap<>();
        int size = random.nextInt(12);
        for (int i = 0; i < size; i++) {
            counts.put("w" + random.nextInt(20), 1 + random.nextInt(random.nextBoolean() ? 3 : 400));
        }
        return counts;
    }

    @Test
    void equalsCommonsTextOnRandomWordCounts() {
        Random random = new Random(20261202L);
        CosineSimilarity reference = new CosineSimilarity();
        for (int i = 0; i < 20_000; i++) {
            Map<String, Integer> a = randomCounts(random);
            Map<String, Integer> b = randomCounts(random);
            Map<CharSequence, Integer> left = new HashMap<>(a);
            Map<CharSequence, Integer> right = new HashMap<>(b);
            double expected = reference.cosineSimilarity(left, right);
            assertEquals(Double.doubleToLongBits(expected), Double.doubleToLongBits(words(a).cosine(words(b))), a + " vs " + b);
        }
    }
}
