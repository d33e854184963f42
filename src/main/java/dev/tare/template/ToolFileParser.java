package dev.tare.template;

import com.fasterxml.jackson.databind.JsonNode;
import dev.tare.TareException;
import dev.tare.source.YamlDocument;
import java.util.ArrayList;
import java.util.Iterator;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * Reads tool files: YAML or JSON holding a list of tool definitions, either at the top level or
 * under a {@code tools} key. Each definition has {@code name}, {@code description} and
 * {@code parameters} as JSON Schema, bare or wrapped as {@code {type: function, function: {...}}}.
 */
public final class ToolFileParser {
    private ToolFileParser() {
    }

    /** Whether a parsed YAML or JSON document is a tool file rather than a chat file. */
    static boolean isToolFile(JsonNode root) {
        return root.isArray() || root.isObject() && root.has("tools") && !root.has("messages");
    }

    /**
     * The definitions of a tool file.
     *
     * @throws TareException naming the line when a definition has no name or is not a mapping
     */
    public static List<ToolDefinition> definitions(YamlDocument document) {
        JsonNode root = document.root();
        String base = root.isArray() ? "" : "tools";
        JsonNode list = root.isArray() ? root : root.get("tools");
        if (!list.isArray()) {
            throw located(document, base, "'tools' must be a list of tool definitions");
        }
        List<ToolDefinition> tools = new ArrayList<>();
        for (int i = 0; i < list.size(); i++) {
            tools.add(definition(document, base + "[" + i + "]", list.get(i), i + 1));
        }
        return tools;
    }

    /**
     * The definition {@code node}, at {@code path} of a document and the {@code number}th of its list.
     *
     * @throws TareException naming the line when it has no name or is not a mapping
     */
    static ToolDefinition definition(YamlDocument document, String path, JsonNode node, int number) {
        if (!node.isObject()) {
            throw located(document, path, "tool " + number + " must be a mapping with name, description and parameters");
        }
        boolean wrapped = node.path("function").isObject();
        JsonNode body = wrapped ? node.get("function") : node;
        String bodyPath = wrapped ? path + ".function" : path;
        JsonNode name = body.get("name");
        if (name == null || !name.isTextual() || name.asText().isBlank()) {
            throw located(document, path, "tool " + number + " has no name");
        }
        List<ToolDefinition.Parameter> parameters = new ArrayList<>();
        JsonNode schema = body.get("parameters");
        if (schema != null && schema.isObject()) {
            collect(document, schema, bodyPath + ".parameters", "", parameters);
        }
        return new ToolDefinition(name.asText(), text(body.get("description")), node.toString(), parameters,
                document.line(path).orElse(1));
    }

    /** The messages of a tool template: one per definition, its minified JSON as literal text. */
    static List<Message> messages(List<ToolDefinition> tools) {
        List<Message> messages = new ArrayList<>();
        for (ToolDefinition tool : tools) {
            Span span = new Span(0, tool.json().length(), tool.line(), 1);
            messages.add(new Message(Message.TOOL_ROLE, tool.json(), List.of(new Segment.Text(tool.json(), span)),
                    new ContentOrigin.Made(tool.line())));
        }
        return messages;
    }

    private static void collect(YamlDocument document, JsonNode schema, String schemaPath, String prefix,
                                List<ToolDefinition.Parameter> out) {
        JsonNode properties = schema.get("properties");
        if (properties == null || !properties.isObject()) {
            return;
        }
        for (Iterator<Map.Entry<String, JsonNode>> it = properties.fields(); it.hasNext(); ) {
            Map.Entry<String, JsonNode> property = it.next();
            String name = prefix.isEmpty() ? property.getKey() : prefix + "." + property.getKey();
            String at = schemaPath + ".properties." + property.getKey();
            JsonNode value = property.getValue();
            List<String> values = new ArrayList<>();
            if (value.path("enum").isArray()) {
                value.get("enum").forEach(v -> values.add(v.isTextual() ? v.asText() : v.toString()));
            }
            out.add(new ToolDefinition.Parameter(name, text(value.get("description")), values, document.line(at).orElse(1)));
            if (value.isObject()) {
                collect(document, value, at, name, out);
                JsonNode items = value.get("items");
                if (items != null && items.isObject()) {
                    collect(document, items, at + ".items", name + "[]", out);
                }
            }
        }
    }

    private static Optional<String> text(JsonNode node) {
        return node != null && node.isTextual() && !node.asText().isBlank() ? Optional.of(node.asText()) : Optional.empty();
    }

    private static TareException located(YamlDocument document, String path, String message) {
        java.util.OptionalInt line = document.line(path);
        return new TareException((line.isPresent() ? "line " + line.getAsInt() + ": " : "") + message);
    }
}
