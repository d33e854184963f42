package dev.tare.overlap;

/** Prefix sums of the estimated tokens of the long runs' words, asked at any position. */
final class TokenSums {
    /** At {@code p}, the estimate of the words before position {@code p}. */
    private final int[] sums;

    private TokenSums(int[] sums) {
        this.sums = sums;
    }

    /** The sums over {@code text} where a word costs {@code weight[word] + gaps[p]} and a break costs nothing. */
    static TokenSums of(int[] text, int[] weight, byte[] gaps) {
        int[] sums = new int[text.length + 1];
        for (int p = 0; p < text.length; p++) {
            sums[p + 1] = sums[p] + (text[p] == RepositoryWords.SEPARATOR ? 0 : weight[text[p]] + gaps[p]);
        }
        return new TokenSums(sums);
    }

    /** The estimate of the words before position {@code p} (0 to the text's length). */
    int at(int p) {
        return sums[p];
    }
}
