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
 * @param kind       text, chat, partial or tools
 * @param meta       front matter (or the keys beside {@code messages} or {@code template})
 * @param messages   one message for a text template, or one per role marker; the chat messages in
 *                   order otherwise
 * @param source     the file's full text, without a byte-order mark
 * @param bodyStart  the offset in {@code source} where the prompt text starts (after front matter);
 *                   0 for YAML and JSON files
 * @param syntax     the placeholder syntax the template was parsed with
 * @param name       for one prompt of a source file, the name it was found under (unique in the file);
 *                   empty for a template file, and for a source file as a whole
 */
public record Template(String path, TemplateKind kind, TemplateMeta meta, List<Message> messages, String source,
                       int bodyStart, PlaceholderSyntax syntax, String name) {
    public Template {
        messages = List.copyOf(messages);
    }

    /** A template file, or a source file as a whole. */
    public Template(String path, TemplateKind kind, TemplateMeta meta, List<Message> messages, String source,
                    int bodyStart, PlaceholderSyntax syntax) {
        this(path, kind, meta, messages, source, bodyStart, syntax, "");
    }

    /**
     * What reports, baselines and caches know the template by: its path, or for a prompt of a source
     * file its path and name ({@code app/agent.py#SYSTEM_PROMPT}).
     */
    public String key() {
        return name.isEmpty() ? path : path + "#" + name;
    }

    /**
     * The prompts this template holds, each a template of its own: the template itself, or for a
     * source file as a whole one template per prompt written in it, with its own name, settings and
     * message. Budgets, estimates and the rules that read a whole template apply to each.
     */
    public List<Template> prompts() {
        if (kind != TemplateKind.CODE || !name.isEmpty()) {
            return List.of(this);
        }
        List<Template> prompts = new ArrayList<>();
        for (Message message : messages) {
            ContentOrigin.Literal literal = (ContentOrigin.Literal) message.origin();
            prompts.add(new Template(path, kind, literal.meta(), List.of(message), source, 0, syntax, literal.name()));
        }
        return prompts;
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

    /**
     * Whether its messages each carry framing tokens on a chat target: a chat file, or a text
     * template split into messages by role markers. Segment offsets count from the start of each
     * message's content, except in a plain text template (neither a chat template nor a YAML or JSON
     * document), where they count from the start of the file and its one message starts at
     * {@link #bodyStart()}; a document's {@code bodyStart} is 0, so {@code isChat() ? 0 : bodyStart()}
     * turns any segment offset into an offset in its message.
     */
    public boolean isChat() {
        return kind == TemplateKind.CHAT
                || (kind == TemplateKind.TEXT || kind == TemplateKind.CODE) && !messages.isEmpty()
                && !messages.get(0).role().equals(Message.TEXT_ROLE);
    }

    /**
     * Whether the file is a YAML or JSON document (a chat file, a tool file or a serialized prompt
     * object) whose keys beside the prompt are its metadata, rather than text with front matter.
     */
    public boolean isDocument() {
        return TemplateParser.isDocumentFile(path);
    }

    /**
     * The tools this template defines in place ({@link TemplateMeta#inlineTools()}) as the tool file
     * they would make: kind tools, one message per definition, at this template's path. Empty when
     * it defines none.
     */
    public java.util.Optional<Template> inlineToolFile() {
        if (meta.inlineTools().isEmpty()) {
            return java.util.Optional.empty();
        }
        return java.util.Optional.of(new Template(path, TemplateKind.TOOLS, TemplateMeta.EMPTY,
                ToolFileParser.messages(meta.inlineTools()), source, 0, PlaceholderSyntax.NONE, name));
    }
}
