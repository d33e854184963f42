package dev.tare.lint;

import dev.tare.source.YamlDocument;
import dev.tare.structure.Structure;
import dev.tare.template.ContentOrigin;
import dev.tare.template.Message;
import dev.tare.template.Template;
import dev.tare.tokenize.Tokenizer;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

/**
 * A template prepared once for every rule: each message's protected regions and fenced blocks, and
 * the mapping from message offsets to the file's lines and columns. Rules locate findings and build
 * rewrites through it, so every finding points into the file and every rewrite edits the file.
 */
public final class TemplateView {
    /** Characters of context on each side of an edit when its token saving is measured. */
    private static final int SAVING_WINDOW = 1000;

    private final Template template;
    private final SourceLines lines;
    private final List<MessageView> messages;
    private Optional<YamlDocument> meta;

    TemplateView(Template template) {
        this.template = template;
        this.lines = new SourceLines(template.source());
        ChatContentMaps values = null;
        List<MessageView> built = new ArrayList<>();
        for (int i = 0; i < template.messages().size(); i++) {
            Message message = template.messages().get(i);
            int base = template.isChat() ? 0 : template.bodyStart();
            Structure structure = Structure.of(message.content(), message.segments(), base, i);
            int length = message.content().length();
            ContentMap map;
            if (message.origin() instanceof ContentOrigin.FileText text) {
                map = ContentMap.shifted(text.offset(), length);
            } else if (message.origin() instanceof ContentOrigin.DocumentValue value) {
                values = values == null ? ChatContentMaps.of(template, lines) : values;
                map = values.map(value.key(), message.content());
            } else if (message.origin() instanceof ContentOrigin.Literal literal) {
                map = ContentMap.ofLiteral(literal.map());
            } else {
                // A tool's text is its definition re-serialized as minified JSON, not the file's text:
                // findings point at the tool's first line and no edit can be written back.
                map = ContentMap.approximate(lines.lineStart(((ContentOrigin.Made) message.origin()).line()), length);
            }
            built.add(new MessageView(i, message, structure, map));
        }
        this.messages = List.copyOf(built);
    }

    /** The template prepared as rules see it, outside any check (for verifying a rewrite's result). */
    public static TemplateView of(Template template) {
        return new TemplateView(template);
    }

    /**
     * The 1-based line of a key of the template's metadata (front matter, or the keys beside a chat
     * file's messages), such as {@code variables.account}, when it is there.
     */
    public synchronized java.util.OptionalInt metaLine(String key) {
        if (meta == null) {
            meta = readMeta();
        }
        return meta.isPresent() ? meta.get().line(key) : java.util.OptionalInt.empty();
    }

    private Optional<YamlDocument> readMeta() {
        String source = template.source();
        try {
            if (template.isDocument()) {
                return Optional.of(template.path().toLowerCase(java.util.Locale.ROOT).endsWith(".json")
                        ? YamlDocument.parseJson(source) : YamlDocument.parseYaml(source));
            }
            if (template.bodyStart() == 0) {
                return Optional.empty();
            }
            return Optional.of(YamlDocument.parseYaml(source.substring(0, template.bodyStart())));
        } catch (dev.tare.TareException e) {
            return Optional.empty();
        }
    }

    /** The offset where 1-based {@code line} of the file starts. */
    public int lineStart(int line) {
        return lines.lineStart(line);
    }

    /** The template. */
    public Template template() {
        return template;
    }

    /** Its messages, in order; one for a text template. */
    public List<MessageView> messages() {
        return messages;
    }

    /** The 1-based line of content offset {@code offset} in {@code message}. */
    public int line(MessageView message, int offset) {
        return lines.line(message.sourceOffset(offset));
    }

    /** The 1-based line of a file offset. */
    public int lineOfSource(int offset) {
        return lines.line(offset);
    }

    /** A finding of {@code rule} over {@code [start, end)} of {@code message}. */
    public Finding finding(RuleDescriptor rule, MessageView message, int start, int end, String text,
                           Optional<Rewrite> rewrite, List<Related> related) {
        int from = message.sourceOffset(start);
        int to = Math.max(from, end > start ? message.sourceOffset(end - 1) + 1 : from);
        return new Finding(template.path(), lines.line(from), lines.column(from), lines.line(to), lines.column(to),
                rule.id(), rule.severity(), text, rule.rewriteClass(), rewrite, related);
    }

    /**
     * A finding of {@code rule} over {@code [start, end)} of {@code message} whose rewrite is the one
     * edit replacing exactly that text with {@code replacement}, its saving measured by
     * {@code tokenizer} (no rewrite when the edit cannot be written back to the file exactly).
     */
    public Finding edit(RuleDescriptor rule, MessageView message, int start, int end, String replacement, String text,
                        Tokenizer tokenizer) {
        return finding(rule, message, start, end, text, rewrite(message, new Edit(start, end, replacement), tokenizer),
                List.of());
    }

    /** A finding over {@code [start, end)} of the file's text (for front matter and other non-message text). */
    public Finding findingInSource(RuleDescriptor rule, int start, int end, String text) {
        return new Finding(template.path(), lines.line(start), lines.column(start), lines.line(end), lines.column(end),
                rule.id(), rule.severity(), text, rule.rewriteClass(), Optional.empty(), List.of());
    }

    /** A related place at content offset {@code offset} of {@code message}. */
    public Related related(MessageView message, int offset, String text) {
        int at = message.sourceOffset(offset);
        return new Related(template.path(), lines.line(at), lines.column(at), text);
    }

    /**
     * The rewrite made of {@code edits} (content offsets of {@code message}), moved onto the file,
     * with its saving measured by {@code tokenizer} over the text around the edits; empty when the
     * edits cannot be written back to the file exactly.
     */
    public Optional<Rewrite> rewrite(MessageView message, List<Edit> edits, Tokenizer tokenizer) {
        List<Edit> sorted = new ArrayList<>(edits);
        sorted.sort(null);
        Optional<List<Edit>> moved = message.toSource(sorted);
        if (moved.isEmpty() || sorted.isEmpty()) {
            return Optional.empty();
        }
        String content = message.content();
        int from = windowStart(content, sorted.get(0).start());
        int to = windowEnd(content, sorted.get(sorted.size() - 1).end());
        String before = content.substring(from, to);
        List<Edit> local = sorted.stream().map(e -> e.shift(-from)).toList();
        String after = Rewrite.apply(before, local);
        return Optional.of(new Rewrite(moved.get(), tokenizer.count(before) - tokenizer.count(after)));
    }

    /** The rewrite made of the one edit {@code edit}, as {@link #rewrite(MessageView, List, Tokenizer)} makes it. */
    public Optional<Rewrite> rewrite(MessageView message, Edit edit, Tokenizer tokenizer) {
        return rewrite(message, List.of(edit), tokenizer);
    }

    /**
     * The start of the window: the start of the line, or {@value #SAVING_WINDOW} characters back.
     * Only the window itself is searched for the line break, so edits on a very long line each cost
     * the window and not the line.
     */
    private static int windowStart(String content, int offset) {
        int limit = Math.max(0, offset - SAVING_WINDOW);
        for (int i = offset - 1; i >= limit; i--) {
            if (content.charAt(i) == '\n') {
                return i + 1;
            }
        }
        return limit;
    }

    /** The end of the window: the end of the line, or {@value #SAVING_WINDOW} characters on. */
    private static int windowEnd(String content, int offset) {
        int limit = Math.min(content.length(), offset + SAVING_WINDOW);
        for (int i = offset; i < limit; i++) {
            if (content.charAt(i) == '\n') {
                return i;
            }
        }
        return limit;
    }
}
