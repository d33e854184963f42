package dev.tare.overlap;

import java.util.HashMap;
import java.util.Map;

/**
 * Prefix sums of the estimated tokens of the long runs' words, asked at any position: one byte a
 * word and a sum every {@value #STEP} words, a quarter of the memory of a sum at every word, which on
 * a large repository is tens of megabytes while the suffixes are walked. A word estimated at
 * {@value #LARGE} tokens or more (a long unbroken string) keeps its estimate aside.
 */
final class TokenSums {
    private static final int STEP = 16;
    private static final int LARGE = 255;

    private final byte[] costs;
    private final int[] checkpoints;
    private final Map<Integer, Integer> large;

    /**
     * @param costs each position's estimate, which may be overwritten here and must not be used
     *              after; read unsigned, {@value #LARGE} meaning "see {@code large}"
     * @param large the estimates of the positions whose byte is {@value #LARGE}
     */
    private TokenSums(byte[] costs, Map<Integer, Integer> large) {
        this.costs = costs;
        this.large = large;
        this.checkpoints = new int[costs.length / STEP + 1];
        int sum = 0;
        for (int p = 0; p < costs.length; p++) {
            if (p % STEP == 0) {
                checkpoints[p / STEP] = sum;
            }
            sum += cost(p);
        }
        if (costs.length % STEP == 0) {
            checkpoints[costs.length / STEP] = sum;
        }
    }

    /**
     * The sums over {@code text} where a word costs {@code weight[word] + gaps[p]} and a break costs
     * nothing; {@code gaps} is taken over and overwritten.
     */
    static TokenSums of(int[] text, int[] weight, byte[] gaps) {
        Map<Integer, Integer> large = new HashMap<>();
        for (int p = 0; p < text.length; p++) {
            int cost = text[p] == RepositoryWords.SEPARATOR ? 0 : weight[text[p]] + gaps[p];
            if (cost >= LARGE) {
                large.put(p, cost);
                cost = LARGE;
            }
            gaps[p] = (byte) cost;
        }
        return new TokenSums(gaps, large);
    }

    /** The estimate of the words before position {@code p} (0 to the text's length). */
    int at(int p) {
        int from = p / STEP * STEP;
        int sum = checkpoints[p / STEP];
        for (int q = from; q < p; q++) {
            sum += cost(q);
        }
        return sum;
    }

    private int cost(int p) {
        int cost = costs[p] & 0xFF;
        return cost == LARGE ? large.get(p) : cost;
    }
}
