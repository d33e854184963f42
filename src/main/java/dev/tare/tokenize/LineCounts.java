package dev.tare.tokenize;

/**
 * A text's token count with the count before each of its safe line starts: the places where the
 * encoding keeps lines apart (see {@link Pretokenizer#keepsLinesApart}). Cut there, a text's count is
 * the sum of its parts' counts, so a text that shares most of its lines with this one (another
 * rendering of the same template) needs counting only where it differs.
 *
 * @param total  the text's count
 * @param starts the safe line starts, ascending
 * @param before the count of the text before each of {@code starts}
 */
public record LineCounts(int total, int[] starts, int[] before) {
    /**
     * How many of this text's parts after the last one matched are tried for the next part of the
     * other text: enough to step over a branch of a template that the other rendering left out.
     */
    private static final int LOOK_AHEAD = 64;

    /** A count without safe line starts, for an encoding whose pieces may run from one line into the next. */
    public static LineCounts whole(int total) {
        return new LineCounts(total, new int[0], new int[0]);
    }

    /**
     * The count of {@code other}, given that this is the count of {@code text} by {@code tokenizer}.
     * Both are cut at their safe line starts; a part of {@code other} equal to a part of {@code text}
     * near where the last match was takes that part's count, and the parts between are counted.
     */
    public int countOf(String other, String text, Tokenizer tokenizer) {
        if (other.equals(text)) {
            return total;
        }
        if (starts.length == 0) {
            // One part, or an encoding that may join any two lines: nothing to share.
            return tokenizer.count(other);
        }
        int sum = 0;
        int next = 0;
        int unmatched = -1;
        int length = other.length();
        for (int from = 0; from < length; ) {
            int to = nextSafeStart(other, from);
            int match = find(text, next, other, from, to - from);
            if (match < 0) {
                unmatched = unmatched < 0 ? from : unmatched;
            } else {
                if (unmatched >= 0) {
                    sum += tokenizer.count(other.substring(unmatched, from));
                    unmatched = -1;
                }
                sum += countBefore(match + 1) - countBefore(match);
                next = match + 1;
            }
            from = to;
        }
        return unmatched < 0 ? sum : sum + tokenizer.count(other.substring(unmatched));
    }

    /** The first of this text's parts from {@code first} on (within the look-ahead) equal to {@code other[from, from + length)}. */
    private int find(String text, int first, String other, int from, int length) {
        int parts = starts.length + 1;
        for (int part = first; part < parts && part < first + LOOK_AHEAD; part++) {
            int start = partStart(part);
            if (partStart(part + 1, text) - start == length && text.regionMatches(start, other, from, length)) {
                return part;
            }
        }
        return -1;
    }

    private int partStart(int part) {
        return part == 0 ? 0 : starts[part - 1];
    }

    private int partStart(int part, String text) {
        return part <= starts.length ? partStart(part) : text.length();
    }

    /** The count of the text before its part {@code part}: 0 before the first, the total after the last. */
    private int countBefore(int part) {
        return part == 0 ? 0 : part <= starts.length ? before[part - 1] : total;
    }

    /** The first safe line start of {@code text} after {@code from}, or its length. */
    private static int nextSafeStart(String text, int from) {
        int length = text.length();
        for (int lineBreak = text.indexOf('\n', from); lineBreak >= 0 && lineBreak + 1 < length;
                lineBreak = text.indexOf('\n', lineBreak + 1)) {
            char c = text.charAt(lineBreak + 1);
            if (Pretokenizer.isSafeLineStart(c)) {
                return lineBreak + 1;
            }
        }
        return length;
    }
}
