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
 * Parses a file's text into a {@link Template}. A file whose name ends in {@code .yaml}, {@code .yml}
 * or {@code .json} is a document: a chat file, a tool file or a serialized prompt object. Any other
 * file is a text template (with optional front matter), split into chat messages at its role marker
 * lines unless role markers are off.
 */
public final class TemplateParser {
    private final PlaceholderSyntax syntax;
    private final RoleMarkers roles;

    /** A parser that reads role markers ({@link RoleMarkers#AUTO}). */
    public TemplateParser(PlaceholderSyntax syntax) {
        this(syntax, RoleMarkers.AUTO);
    }

    public TemplateParser(PlaceholderSyntax syntax, RoleMarkers roles) {
        this.syntax = syntax;
        this.roles = roles;
    }

    /** Whether a file of this name is read as a YAML or JSON document rather than as text. */
    public static boolean isDocumentFile(String path) {
        String lower = path.toLowerCase(Locale.ROOT);
        return lower.endsWith(".yaml") || lower.endsWith(".yml") || lower.endsWith(".json");
    }

    /**
     * Parses {@code source}.
     *
     * @param partial whether the file lives in the partials folder (a partial is pasted into other
     *                templates, so its role marker lines are text)
     * @throws TareException with a reason naming the line (not the path) when the file cannot be parsed
     */
    public Template parse(SourceText source, boolean partial) {
        if (isDocumentFile(source.path())) {
            return parseDocument(source);
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
        LineIndex lines = LineIndex.of(text);
        if (kind == TemplateKind.TEXT && roles == RoleMarkers.AUTO) {
            List<RoleMarkedText.Part> parts = RoleMarkedText.split(text, bodyStart, lines.starts());
            if (!parts.isEmpty()) {
                List<Message> messages = new ArrayList<>();
                for (RoleMarkedText.Part part : parts) {
                    String content = text.substring(part.start(), part.end());
                    LineIndex at = LineIndex.of(content, lines.line(part.start()), lines.column(part.start()));
                    messages.add(new Message(part.role(), content, syntax.parse(content, 0, content.length(), at),
                            new ContentOrigin.FileText(part.start())));
                }
                return new Template(source.path(), kind, meta, messages, text, bodyStart, syntax);
            }
        }
        List<Segment> segments = syntax.parse(text, bodyStart, text.length(), lines);
        Message message = new Message(Message.TEXT_ROLE, text.substring(bodyStart), segments,
                new ContentOrigin.FileText(bodyStart));
        return new Template(source.path(), kind, meta, List.of(message), text, bodyStart, syntax);
    }

    private Template parseDocument(SourceText source) {
        boolean json = source.path().toLowerCase(Locale.ROOT).endsWith(".json");
        YamlDocument document = json ? YamlDocument.parseJson(source.text()) : YamlDocument.parseYaml(source.text());
        JsonNode root = document.root();
        if (ToolFileParser.isToolFile(root)) {
            return parseTools(source, document);
        }
        if (root.isObject() && root.has("messages")) {
            return parseChat(source, document);
        }
        if (PromptObject.isPromptObject(root)) {
            PlaceholderSyntax format = PromptObject.syntax(document, "template_format");
            Message message = message(document, Message.TEXT_ROLE, "template", "", format);
            TemplateMeta meta = new MetaReader(document, "prompt object", true).read();
            return new Template(source.path(), TemplateKind.TEXT, meta, List.of(message), source.text(), 0, format);
        }
        throw new TareException("neither a chat file (a top-level 'messages' list of {role, content}), a tool file"
                + " (a list of tools, or a top-level 'tools' list) nor a serialized prompt object (a 'template'"
                + " string with 'input_variables')");
    }

    /**
     * A chat file. A message holds its text under {@code content}, or, in a serialized chat prompt
     * object, under {@code prompt.template}, written in the {@code template_format} of the prompt or
     * of the object (f-string unless stated).
     */
    private Template parseChat(SourceText source, YamlDocument document) {
        JsonNode messagesNode = document.root().get("messages");
        if (!messagesNode.isArray()) {
            throw located(document, "messages", "'messages' must be a list of {role, content}");
        }
        List<Message> messages = new ArrayList<>();
        PlaceholderSyntax templateSyntax = null;
        for (int i = 0; i < messagesNode.size(); i++) {
            String path = "messages[" + i + "]";
            JsonNode node = messagesNode.get(i);
            if (!node.isObject()) {
                throw located(document, path, path + " must be a mapping with role and content");
            }
            JsonNode role = node.get("role");
            if (role == null || !role.isTextual() || role.asText().isBlank()) {
                throw located(document, path, path + " has no role (system, user, assistant, ...)");
            }
            if (!node.has("content") && PromptObject.isPromptMessage(node)) {
                PlaceholderSyntax format = PromptObject.syntax(document,
                        node.get("prompt").has("template_format") ? path + ".prompt.template_format" : "template_format");
                templateSyntax = templateSyntax == null ? format : templateSyntax;
                messages.add(message(document, role.asText().strip(), path + ".prompt.template", path, format));
            } else {
                messages.add(message(document, role.asText().strip(), path + ".content", path, syntax));
            }
        }
        TemplateMeta meta = new MetaReader(document, "chat file", true).read();
        return new Template(source.path(), TemplateKind.CHAT, meta, messages, source.text(), 0,
                templateSyntax == null ? syntax : templateSyntax);
    }

    /** A tool file as a template: one message per tool, its minified JSON, literal text. */
    private Template parseTools(SourceText source, YamlDocument document) {
        List<Message> messages = ToolFileParser.messages(ToolFileParser.definitions(document));
        TemplateMeta meta = document.root().isObject() ? new MetaReader(document, "tool file", false).read() : TemplateMeta.EMPTY;
        return new Template(source.path(), TemplateKind.TOOLS, meta, messages, source.text(), 0, PlaceholderSyntax.NONE);
    }

    /**
     * The message whose text is the string at {@code contentPath} of the document, parsed with
     * {@code with}; its segments count offsets from the start of that text and carry the file's lines.
     *
     * @param ownerPath where to point when the text itself has no known place ({@code ""} for the root)
     */
    private static Message message(YamlDocument document, String role, String contentPath, String ownerPath,
                                   PlaceholderSyntax with) {
        JsonNode node = document.at(contentPath);
        String content = ChatContent.text(node.isMissingNode() ? null : node).orElseThrow(() -> located(document,
                contentPath, contentPath + " must be text or a list of {type: text, text} parts (got "
                        + node.getNodeType().name().toLowerCase(Locale.ROOT) + ")"));
        int line = document.line(contentPath).orElse(document.line(ownerPath).orElse(1));
        int column = document.column(contentPath).orElse(1);
        List<Segment> segments;
        try {
            segments = with.parse(content, 0, content.length(), LineIndex.of(content, line, column));
        } catch (TemplateSyntaxException e) {
            throw new TareException(e.getMessage() + " (in " + contentPath + ")", e);
        }
        return new Message(role, content, segments, new ContentOrigin.DocumentValue(contentPath));
    }

    private static TareException located(YamlDocument document, String path, String message) {
        OptionalInt line = document.line(path);
        return new TareException((line.isPresent() ? "line " + line.getAsInt() + ": " : "") + message);
    }
}
