package dev.tare.template;

import com.fasterxml.jackson.databind.JsonNode;
import dev.tare.TareException;
import dev.tare.source.SourceText;
import dev.tare.source.YamlDocument;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.OptionalInt;

/**
 * Parses a file's text into a {@link Template}: a chat file when its name ends in {@code .yaml},
 * {@code .yml} or {@code .json}, a text template (with optional front matter) otherwise.
 */
public final class TemplateParser {
    private final PlaceholderSyntax syntax;

    public TemplateParser(PlaceholderSyntax syntax) {
        this.syntax = syntax;
    }

    /** Whether a file of this name is read as a chat file. */
    public static boolean isChatFile(String path) {
        String lower = path.toLowerCase(Locale.ROOT);
        return lower.endsWith(".yaml") || lower.endsWith(".yml") || lower.endsWith(".json");
    }

    /**
     * Parses {@code source}.
     *
     * @param partial whether the file lives in the partials folder
     * @throws TareException with a reason naming the line (not the path) when the file cannot be parsed
     */
    public Template parse(SourceText source, boolean partial) {
        if (isChatFile(source.path())) {
            return parseChat(source);
        }
        return parseText(source, partial ? TemplateKind.PARTIAL : TemplateKind.TEXT);
    }

    private Template parseText(SourceText source, TemplateKind kind) {
        String text = source.text();
        FrontMatter frontMatter = FrontMatter.find(text);
        TemplateMeta meta = TemplateMeta.EMPTY;
        if (frontMatter != null) {
            String padded = "\n".repeat(frontMatter.firstLine() - 1) + frontMatter.yaml();
            YamlDocument document;
            try {
                document = YamlDocument.parseYaml(padded);
            } catch (TareException e) {
                throw new TareException("front matter: " + e.getMessage(), e);
            }
            meta = new MetaReader(document, "front matter", true).read();
        }
        int bodyStart = frontMatter == null ? 0 : frontMatter.bodyStart();
        List<Segment> segments = syntax.parse(text, bodyStart, text.length(), LineIndex.of(text));
        Message message = new Message(Message.TEXT_ROLE, text.substring(bodyStart), segments);
        return new Template(source.path(), kind, meta, List.of(message), text, bodyStart, syntax);
    }

    private Template parseChat(SourceText source) {
        boolean json = source.path().toLowerCase(Locale.ROOT).endsWith(".json");
        YamlDocument document = json ? YamlDocument.parseJson(source.text()) : YamlDocument.parseYaml(source.text());
        JsonNode root = document.root();
        if (ToolFileParser.isToolFile(root)) {
            return parseTools(source, document);
        }
        if (!root.isObject() || !root.has("messages")) {
            throw new TareException("neither a chat file (a top-level 'messages' list of {role, content})"
                    + " nor a tool file (a list of tools, or a top-level 'tools' list)");
        }
        JsonNode messagesNode = root.get("messages");
        if (!messagesNode.isArray()) {
            throw located(document, "messages", "'messages' must be a list of {role, content}");
        }
        List<Message> messages = new ArrayList<>();
        for (int i = 0; i < messagesNode.size(); i++) {
            messages.add(message(document, "messages[" + i + "]", messagesNode.get(i)));
        }
        TemplateMeta meta = new MetaReader(document, "chat file", true).read();
        return new Template(source.path(), TemplateKind.CHAT, meta, messages, source.text(), 0, syntax);
    }

    /** A tool file as a template: one message per tool, its minified JSON, literal text. */
    private Template parseTools(SourceText source, YamlDocument document) {
        List<Message> messages = new ArrayList<>();
        for (ToolDefinition tool : ToolFileParser.definitions(document)) {
            Span span = new Span(0, tool.json().length(), tool.line(), 1);
            messages.add(new Message(Message.TOOL_ROLE, tool.json(), List.of(new Segment.Text(tool.json(), span))));
        }
        TemplateMeta meta = document.root().isObject() ? new MetaReader(document, "tool file", false).read() : TemplateMeta.EMPTY;
        return new Template(source.path(), TemplateKind.TOOLS, meta, messages, source.text(), 0, PlaceholderSyntax.NONE);
    }

    private Message message(YamlDocument document, String path, JsonNode node) {
        if (!node.isObject()) {
            throw located(document, path, path + " must be a mapping with role and content");
        }
        JsonNode role = node.get("role");
        if (role == null || !role.isTextual() || role.asText().isBlank()) {
            throw located(document, path, path + " has no role (system, user, assistant, ...)");
        }
        String content = content(document, path + ".content", node.get("content"));
        String contentPath = path + ".content";
        int line = document.line(contentPath).orElse(document.line(path).orElse(1));
        int column = document.column(contentPath).orElse(1);
        List<Segment> segments;
        try {
            segments = syntax.parse(content, 0, content.length(), LineIndex.of(content, line, column));
        } catch (TemplateSyntaxException e) {
            throw new TareException(e.getMessage() + " (in " + contentPath + ")", e);
        }
        return new Message(role.asText().strip(), content, segments);
    }

    private static String content(YamlDocument document, String path, JsonNode node) {
        return ChatContent.text(node).orElseThrow(() -> located(document, path, path
                + " must be text or a list of {type: text, text} parts (got "
                + node.getNodeType().name().toLowerCase(Locale.ROOT) + ")"));
    }

    private static TareException located(YamlDocument document, String path, String message) {
        OptionalInt line = document.line(path);
        return new TareException((line.isPresent() ? "line " + line.getAsInt() + ": " : "") + message);
    }
}
