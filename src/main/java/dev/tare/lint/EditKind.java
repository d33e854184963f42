package dev.tare.lint;

import java.util.Locale;

/**
 * What a rule's edits do to text, declared once in its descriptor. The rewrite class follows from
 * it: the first three cannot change a word the model is told and are safe, within the regions the
 * structure model allows them; every text edit is review.
 */
public enum EditKind {
    /** Only whitespace between words, at line ends or between paragraphs of prose is removed or changed. */
    WHITESPACE,
    /** An invisible character (zero-width space, soft hyphen, stray byte-order mark, word joiner, a joiner no script needs) is removed, or a no-break space becomes a space. */
    INVISIBLE,
    /** JSON is laid out anew; both sides parse to equal values. */
    JSON_LAYOUT,
    /** Words or characters of the prompt may change. */
    TEXT;

    /** The class of rewrites made of such edits. */
    public RewriteClass rewriteClass() {
        return this == TEXT ? RewriteClass.REVIEW : RewriteClass.SAFE;
    }

    /** What such an edit does and where it may stand, in one sentence for {@code tare explain}. */
    public String meaning() {
        return switch (this) {
            case WHITESPACE -> "It removes or shortens whitespace in prose only (trailing spaces, a run of spaces or a tab"
                    + " between words, a run of blank lines), never indentation, code, tables, tab-separated or aligned"
                    + " text, examples or raw sections.";
            case INVISIBLE -> "It removes an invisible character (zero-width space, soft hyphen, stray byte-order mark,"
                    + " word joiner, a joiner no script or emoji needs) or turns a no-break space into a space.";
            case JSON_LAYOUT -> "It lays JSON out anew; the text before and after parses to the same value.";
            case TEXT -> "It changes words or characters the model reads.";
        };
    }

    /** The name used in output and rule packs: {@code whitespace}, {@code invisible}, {@code json-layout}, {@code text}. */
    public String label() {
        return name().toLowerCase(Locale.ROOT).replace('_', '-');
    }
}
