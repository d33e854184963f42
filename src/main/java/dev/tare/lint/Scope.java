package dev.tare.lint;

import dev.tare.TareException;
import java.util.Locale;

/**
 * Where a pattern rule looks. Either way it never touches variables, includes or tags, and never
 * front matter (which is not prompt text).
 */
public enum Scope {
    /** All prompt text, code and URLs included. */
    EVERYWHERE,
    /** Prose only: fenced code, inline code and URLs are left alone. */
    PROSE;

    /** The lower-case name used in rule packs. */
    public String label() {
        return name().toLowerCase(Locale.ROOT);
    }

    /** The scope called {@code label}; throws naming the accepted values when there is none. */
    public static Scope parse(String label, String where) {
        for (Scope value : values()) {
            if (value.label().equals(label.strip().toLowerCase(Locale.ROOT))) {
                return value;
            }
        }
        throw new TareException(where + ": unknown scope '" + label + "'; use everywhere or prose");
    }
}
