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
