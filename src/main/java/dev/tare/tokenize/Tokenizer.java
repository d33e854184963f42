package dev.tare.tokenize;

/**
 * Turns text into the token ids a model sees. Implementations are thread-safe and treat
 * special-token strings such as {@code <|endoftext|>} as ordinary text: a template that mentions one
 * is counted, never rejected.
 */
public interface Tokenizer {

    /** The name this tokenizer was asked for by: a built-in encoding name or a file path. */
    String name();

    /** The number of tokens in {@code text}; the same as {@code encode(text).length}, often faster. */
    int count(String text);

    /**
     * The number of tokens in {@code text[0, length)}, the same as {@link #count(String)} of those
     * chars: for a caller that has the text in an array already, which an encoder can count where it
     * lies. The array is not kept or changed.
     */
    default int count(char[] text, int length) {
        return count(new String(text, 0, length));
    }

    /**
     * The count of {@code text} with the count before each of its safe line starts, from which
     * {@link LineCounts#countOf} counts a text that differs from it in a few lines; without them for
     * an encoding whose pieces may run from one line into the next.
     */
    default LineCounts countLines(String text) {
        return LineCounts.whole(count(text));
    }

    /** The token ids of {@code text}, in order. */
    int[] encode(String text);

    /** Loads now whatever this tokenizer would otherwise load on first use (a built-in encoding's vocabulary). */
    default void prepare() {
    }
}
