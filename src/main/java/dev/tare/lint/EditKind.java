package dev.tare.lint;

/**
 * What a rule's rewrites change, declared by the rule so that the rewrite engine knows which
 * invariants to verify beyond the ones every rewrite keeps (variables, includes, code, paragraph
 * breaks, line endings, final newline).
 */
public enum EditKind {
    /** Only whitespace is added, removed or changed: the file's non-whitespace characters must stay as they are. */
    WHITESPACE,
    /**
     * JSON in a fenced {@code json} block (or a message that is all JSON) is laid out anew: the text
     * may change, but both sides must parse to equal JSON trees.
     */
    JSON_LAYOUT,
    /** Words or characters of the prompt may change. */
    TEXT
}
