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
    TOOLS,
    /**
     * Prompts written as string literals in a source file: the file as a whole has one message per
     * prompt, and each prompt is a template of its own ({@link Template#prompts()}).
     */
    CODE;

    /** The lower-case name used in output. */
    public String label() {
        return name().toLowerCase(Locale.ROOT);
    }
}
