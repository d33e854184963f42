package dev.tare.template;

import java.util.Locale;

/** What sort of file a template is; shown as {@code kind} in every output. */
public enum TemplateKind {
    /** A text or Markdown prompt file. */
    TEXT,
    /** A YAML or JSON file holding a list of chat messages. */
    CHAT,
    /** A text template under the partials folder, pasted into others through includes. */
    PARTIAL,
    /** A YAML or JSON list of tool definitions sent with calls. */
    TOOLS;

    /** The lower-case name used in output. */
    public String label() {
        return name().toLowerCase(Locale.ROOT);
    }
}
