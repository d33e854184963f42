package dev.tare.lint;

import dev.tare.TareException;
import java.util.Locale;

/** How loudly a finding speaks; {@code check} fails on findings at or above a chosen severity. */
public enum Severity {
    /** Something to know, such as an estimate that leaves a variable out. */
    INFO,
    /** Waste worth removing. */
    WARNING,
    /** A broken template or a breached budget. */
    ERROR;

    /** The lower-case name used in configuration and output. */
    public String label() {
        return name().toLowerCase(Locale.ROOT);
    }

    /** Whether this severity is at least as loud as {@code other}. */
    public boolean atLeast(Severity other) {
        return compareTo(other) >= 0;
    }

    /**
     * The severity called {@code label}.
     *
     * @param where names the setting in the message, for example {@code "rules.severity.blank-lines"}
     * @throws TareException naming the accepted values when there is none
     */
    public static Severity parse(String label, String where) {
        for (Severity severity : values()) {
            if (severity.label().equals(label.strip().toLowerCase(Locale.ROOT))) {
                return severity;
            }
        }
        throw new TareException(where + ": unknown severity '" + label + "'; use error, warning or info");
    }
}
