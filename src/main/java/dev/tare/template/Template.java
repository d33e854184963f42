package dev.tare.template;

import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Set;

/**
 * One parsed prompt source, immutable. Segments keep their source positions so that rules can
 * point at lines and rewrites can edit the file.
 *
 * @param path       the path relative to the scanned root, with {@code /} separators
 * @param kind       text, chat or partial
 * @param meta       front matter (or the keys beside {@code messages})
 * @param messages   one message for text templates; the chat messages in order otherwise
 * @param source     the file's full text, without a byte-order mark
 * @param bodyStart  the offset in {@code source} where the prompt text starts (after front matter);
 *                   0 for chat files
 * @param syntax     the placeholder syntax the template was parsed with
 */
public record Template(String path, TemplateKind kind, TemplateMeta meta, List<Message> messages, String source,
                       int bodyStart, PlaceholderSyntax syntax) {
    public Template {
        messages = List.copyOf(messages);
    }

    /** Every segment of every message, in order. */
    public List<Segment> segments() {
        List<Segment> all = new ArrayList<>();
        for (Message message : messages) {
            all.addAll(message.segments());
        }
        return all;
    }

    /**
     * Names of the variables used directly in this template (not in its includes), in order of first
     * use: its variables and the variables its function calls are passed.
     */
    public Set<String> variableNames() {
        Set<String> names = new LinkedHashSet<>();
        for (Segment segment : segments()) {
            if (segment instanceof Segment.PerCall part) {
                names.addAll(part.variableNames());
            }
        }
        return names;
    }

    /** Whether this is a chat file, whose messages each carry framing tokens on a chat target. */
    public boolean isChat() {
        return kind == TemplateKind.CHAT;
    }
}
