package dev.tare.rewrite;

/**
 * A rewrite across files that was not applied to one place, and why: a copy of a shared block that
 * differs from the others, cannot be replaced exactly, or would not render the same afterwards.
 *
 * @param path   the file's path relative to the root, with {@code /}
 * @param line   the 1-based line the place starts on
 * @param rule   the rule that offered the rewrite
 * @param reason why it was not applied, and what to do
 */
public record NotApplied(String path, int line, String rule, String reason) {
}
