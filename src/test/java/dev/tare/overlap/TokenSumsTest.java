package dev.tare.overlap;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.Random;
import org.junit.jupiter.api.Test;

/** Every position sums the estimates of the words before it, long unbroken words included. */
class TokenSumsTest {
    @Test
    void everyPositionSumsTheWordsBeforeIt() {
        Random random = new Random(7);
        for (int length : new int[] {0, 1, 15, 16, 17, 33, 1000}) {
            int[] weight = {0, 1, 2, 3, 300, 70_000};
            int[] text = new int[length];
            byte[] gaps = new byte[length];
            for (int p = 0; p < length; p++) {
                text[p] = random.nextInt(weight.length);
                gaps[p] = (byte) random.nextInt(3);
            }
            int[] plain = new int[length + 1];
            for (int p = 0; p < length; p++) {
                plain[p + 1] = plain[p] + (text[p] == RepositoryWords.SEPARATOR ? 0 : weight[text[p]] + gaps[p]);
            }
            TokenSums sums = TokenSums.of(text, weight, gaps);
            for (int p = 0; p <= length; p++) {
                assertEquals(plain[p], sums.at(p), "length " + length + ", position " + p);
            }
        }
    }
}
