package dev.tare.overlap;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;

class SharedPrefixesTest {
    private static SharedPrefixes.Sequence seq(String head, int... ids) {
        return new SharedPrefixes.Sequence(head, ids);
    }

    @Test
    void sumsTheWeightsOfTheSequencesSharingEnoughLeadingIds() {
        List<SharedPrefixes.Sequence> sequences = List.of(seq("", 1, 2, 3, 4), seq("", 7), seq("", 1, 2, 3, 9),
                seq("", 1, 2, 8), seq("tools", 1, 2, 3, 4));
        double[] weights = {10, 20, 30, 40, 50};
        // The first and third share 1 2 3; at depth 2 the third also meets the fourth; another head never counts.
        assertArrayEquals(new double[] {40, 20, 80, 40, 50},
                SharedPrefixes.pooled(sequences, new int[] {3, 1, 2, 3, 4}, weights), 1e-12);
        // Depth 0: every sequence of the same head.
        assertArrayEquals(new double[] {100, 100, 100, 100, 50},
                SharedPrefixes.pooled(sequences, new int[] {0, 0, 0, 0, 0}, weights), 1e-12);
    }

    @Test
    void agreesWithComparingEveryPair() {
        Random random = new Random(20261205);
        for (int round = 0; round < 300; round++) {
            int n = 1 + random.nextInt(30);
            List<SharedPrefixes.Sequence> sequences = new ArrayList<>();
            int[] depths = new int[n];
            double[] weights = new double[n];
            for (int i = 0; i < n; i++) {
                int[] ids = new int[random.nextInt(6)];
                for (int k = 0; k < ids.length; k++) {
                    ids[k] = random.nextInt(3);
                }
                sequences.add(seq(random.nextInt(4) == 0 ? "a" : "", ids));
                depths[i] = random.nextInt(7) - 1;
                weights[i] = 1 + random.nextInt(100);
            }
            double[] pooled = SharedPrefixes.pooled(sequences, depths, weights);
            for (int i = 0; i < n; i++) {
                double expected = 0;
                for (int j = 0; j < n; j++) {
                    SharedPrefixes.Sequence a = sequences.get(i);
                    SharedPrefixes.Sequence b = sequences.get(j);
                    int mismatch = Arrays.mismatch(a.ids(), b.ids());
                    int common = mismatch < 0 ? a.ids().length : mismatch;
                    if (i == j || a.head().equals(b.head()) && common >= Math.max(depths[i], 0)) {
                        expected += weights[j];
                    }
                }
                assertEquals(expected, pooled[i], 1e-9, "round " + round + ", sequence " + i);
            }
        }
    }
}
