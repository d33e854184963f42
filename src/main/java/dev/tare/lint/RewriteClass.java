package dev.tare.lint;

import dev.tare.TareException;
import java.util.Locale;

/** What kind of rewrite a rule offers: none, one a person must review, or one that is provably meaning-preserving. */
public enum RewriteClass {
    /** Provably meaning-preserving; may be applied unattended. */
    SAFE,
    /** Needs a person to look at it before it is applied. */
    REVIEW,
    /** The rule only reports; it offers no rewrite. */
    NONE;

    /** What the class promises, in one sentence for {@code tare rules} and {@code tare explain}. */
    public String meaning() {
        return switch (this) {
            case SAFE -> "Safe rewrites change no word the model is told: only whitespace in prose, invisible characters"
                    + " or JSON layout. 'tare fix' applies them unattended after checking exactly that, and drops any that"
                    + " fails the check.";
            case REVIEW -> "Review rewrites change what the prompt says. 'tare fix' applies them only with"
                    + " --include-review; read the diff and evaluate the prompt before it ships.";
            case NONE -> "The rule only reports; it offers no rewrite.";
        };
    }

    /** The lower-case name used in rule packs and output. */
    public String label() {
        return name().toLowerCase(Locale.ROOT);
    }

    /**
     * The class called {@code label}.
     *
     * @param where names the place in the message
     * @throws TareException naming the accepted values when there is none
     */
    public static RewriteClass parse(String label, String where) {
        for (RewriteClass value : values()) {
            if (value.label().equals(label.strip().toLowerCase(Locale.ROOT))) {
                return value;
            }
        }
        throw new TareException(where + ": unknown class '" + label + "'; use safe, review or none");
    }
}
