package dev.tare.rewrite;

/**
 * A file's tokens on one tokenizer before and after its rewrite: the tokens of the prompt text the
 * file itself holds (its messages as written, includes not expanded), a planning estimate.
 *
 * @param tokenizer the tokenizer's name
 * @param before    tokens of the original
 * @param after     tokens of the rewritten text
 */
public record TokenChange(String tokenizer, int before, int after) {
    /** Tokens saved; negative when the rewrite costs more. */
    public int saved() {
        return before - after;
    }
}
