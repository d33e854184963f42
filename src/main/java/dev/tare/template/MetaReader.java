package dev.tare.template;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.TextNode;
import dev.tare.TareException;
import dev.tare.source.YamlDocument;
import java.util.Iterator;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.OptionalInt;

/**
 * Reads the template keys of front matter, of a chat file or of a serialized prompt object into a
 * {@link TemplateMeta}, located by line. Keys it does not read (a prompt format's model settings,
 * description, authors, ...) are metadata and never an error.
 */
final class MetaReader {
    /** The most loop items a declaration may expect: enough for any prompt, and a bound on rendering. */
    static final int MAX_ITEMS = 10_000;
    private final YamlDocument document;
    private final String where;
    private final boolean toolsAreFiles;

    /**
     * @param where         how messages name the place: "front matter", "chat file" or "tool file"
     * @param toolsAreFiles whether a {@code tools} key names tool files (not so in a tool file, where
     *                      it holds the definitions themselves)
     */
    MetaReader(YamlDocument document, String where, boolean toolsAreFiles) {
        this.document = document;
        this.where = where;
        this.toolsAreFiles = toolsAreFiles;
    }

    TemplateMeta read() {
        JsonNode root = document.root();
        if (root.isMissingNode() || root.isNull()) {
            return TemplateMeta.EMPTY;
        }
        if (!root.isObject()) {
            throw problem("", "must be a mapping of keys such as budget, target and variables");
        }
        java.util.List<String> toolFiles = new java.util.ArrayList<>();
        java.util.List<ToolDefinition> inlineTools = new java.util.ArrayList<>();
        if (toolsAreFiles) {
            tools(root.get("tools"), toolFiles, inlineTools);
        }
        return new TemplateMeta(
                text(root, "target"),
                wholeNumber(root, "budget", 1),
                wholeNumber(root, "output_tokens", 0),
                withSamples(variables(root.get("variables")), root),
                toolFiles,
                callsPerDay(root.get("calls_per_day")),
                inlineTools);
    }

    /**
     * The entries of {@code tools}: paths of tool files, and tool definitions written in place (as a
     * tool file holds them: {@code {name, description, parameters}}, bare or as
     * {@code {type: function, function: {...}}}), in any mix.
     */
    private void tools(JsonNode node, java.util.List<String> files, java.util.List<ToolDefinition> inline) {
        if (node == null || node.isNull()) {
            return;
        }
        if (!node.isArray()) {
            throw problem("tools", "tools must be a list of tool file paths (relative to the repository root)"
                    + " or tool definitions {name, description, parameters}");
        }
        for (int i = 0; i < node.size(); i++) {
            JsonNode item = node.get(i);
            String path = "tools[" + i + "]";
            if (item.isTextual() && !item.asText().isBlank()) {
                files.add(item.asText().strip());
            } else if (item.isObject()) {
                try {
                    inline.add(ToolFileParser.definition(document, path, item, i + 1));
                } catch (TareException e) {
                    throw new TareException(where + (e.getMessage().startsWith("line ") ? ", " : ": ") + e.getMessage(), e);
                }
            } else {
                throw problem(path, path + " must be the path of a tool file or a tool definition {name, description, parameters}");
            }
        }
    }

    /**
     * The declared variables, with a sample added for each other name that a single-file prompt
     * format gives a value: under {@code sample} (name to value), else under {@code inputs} (name to a
     * value, or to a mapping whose {@code sample}, {@code default} or {@code example} is one, in that
     * order). A name under {@code variables} takes nothing from them. A value that is a list or
     * mapping is sampled as its JSON. Either key in any other shape is the format's own metadata.
     */
    private Map<String, VariableSpec> withSamples(Map<String, VariableSpec> declared, JsonNode root) {
        Map<String, VariableSpec> all = new LinkedHashMap<>(declared);
        JsonNode sample = root.get("sample");
        if (sample != null && sample.isObject()) {
            for (Iterator<Map.Entry<String, JsonNode>> it = sample.fields(); it.hasNext(); ) {
                Map.Entry<String, JsonNode> entry = it.next();
                sampleText(entry.getValue()).ifPresent(text -> all.putIfAbsent(entry.getKey(),
                        variable("sample." + entry.getKey(), TextNode.valueOf(text))));
            }
        }
        // A serialized prompt object's partial variables are filled in when it is built, the same on
        // every call: their values are what those variables render to.
        JsonNode partial = root.get("partial_variables");
        if (partial != null && partial.isObject()) {
            for (Iterator<Map.Entry<String, JsonNode>> it = partial.fields(); it.hasNext(); ) {
                Map.Entry<String, JsonNode> entry = it.next();
                sampleText(entry.getValue()).ifPresent(text -> all.putIfAbsent(entry.getKey(),
                        variable("partial_variables." + entry.getKey(), TextNode.valueOf(text))));
            }
        }
        JsonNode inputs = root.get("inputs");
        if (inputs != null && inputs.isObject()) {
            for (Iterator<Map.Entry<String, JsonNode>> it = inputs.fields(); it.hasNext(); ) {
                Map.Entry<String, JsonNode> entry = it.next();
                JsonNode value = entry.getValue();
                if (value != null && value.isObject()) {
                    value = java.util.stream.Stream.of("sample", "default", "example").map(value::get)
                            .filter(v -> v != null && !v.isNull()).findFirst().orElse(null);
                }
                sampleText(value).ifPresent(text -> all.putIfAbsent(entry.getKey(),
                        variable("inputs." + entry.getKey(), TextNode.valueOf(text))));
            }
        }
        return all;
    }

    /** A value as sample text: a scalar as written, a list or mapping as its JSON; empty for null. */
    private static Optional<String> sampleText(JsonNode value) {
        if (value == null || value.isNull() || value.isMissingNode()) {
            return Optional.empty();
        }
        return Optional.of(value.isValueNode() ? value.asText() : value.toString());
    }

    private Optional<String> text(JsonNode root, String key) {
        JsonNode node = root.get(key);
        if (node == null || node.isNull()) {
            return Optional.empty();
        }
        if (!node.isTextual() || node.asText().isBlank()) {
            throw problem(key, key + " must be a target name");
        }
        return Optional.of(node.asText().strip());
    }

    private OptionalInt wholeNumber(JsonNode root, String path, int min) {
        JsonNode node = path.contains(".") ? root.at("/" + path.replace('.', '/')) : root.get(path);
        if (node == null || node.isMissingNode() || node.isNull()) {
            return OptionalInt.empty();
        }
        if (!node.canConvertToInt() || !node.isIntegralNumber() || node.asInt() < min) {
            throw problem(path, lastKey(path) + " must be a whole number of tokens"
                    + (min > 0 ? " above zero" : ", zero or more") + " (got " + node + ")");
        }
        return OptionalInt.of(node.asInt());
    }

    private OptionalDouble callsPerDay(JsonNode node) {
        if (node == null || node.isNull()) {
            return OptionalDouble.empty();
        }
        if (!node.isNumber() || !(node.asDouble() >= 0) || Double.isInfinite(node.asDouble())) {
            throw problem("calls_per_day", "calls_per_day must be a number of calls a day, zero or more (got " + node + ")");
        }
        return OptionalDouble.of(node.asDouble());
    }

    private Map<String, VariableSpec> variables(JsonNode node) {
        Map<String, VariableSpec> variables = new LinkedHashMap<>();
        if (node == null || node.isNull()) {
            return variables;
        }
        if (!node.isObject()) {
            throw problem("variables", "variables must map each variable name to {tokens: N}, {sample: \"...\"}"
                    + " or, for a list a loop walks, {items: N}");
        }
        for (Iterator<Map.Entry<String, JsonNode>> it = node.fields(); it.hasNext(); ) {
            Map.Entry<String, JsonNode> entry = it.next();
            variables.put(entry.getKey(), variable("variables." + entry.getKey(), entry.getValue()));
        }
        return variables;
    }

    private VariableSpec variable(String path, JsonNode value) {
        if (value == null || value.isNull()) {
            return VariableSpec.UNSIZED;
        }
        if (value.isIntegralNumber()) {
            return new VariableSpec(wholeNumberAt(path, value), Optional.empty());
        }
        if (value.isTextual()) {
            return new VariableSpec(OptionalInt.empty(), Optional.of(value.asText()));
        }
        if (!value.isObject()) {
            throw problem(path, lastKey(path) + " must be {tokens: N}, {sample: \"...\"} or {items: N}");
        }
        OptionalInt tokens = value.has("tokens") && !value.get("tokens").isNull()
                ? wholeNumberAt(path + ".tokens", value.get("tokens")) : OptionalInt.empty();
        Optional<String> sample = Optional.empty();
        JsonNode sampleNode = value.get("sample");
        if (sampleNode != null && !sampleNode.isNull()) {
            if (!sampleNode.isValueNode()) {
                throw problem(path + ".sample", "sample must be text");
            }
            sample = Optional.of(sampleNode.asText());
        }
        OptionalInt items = value.has("items") && !value.get("items").isNull()
                ? items(path + ".items", value.get("items")) : OptionalInt.empty();
        return new VariableSpec(tokens, sample, items);
    }

    private OptionalInt wholeNumberAt(String path, JsonNode node) {
        if (!node.isIntegralNumber() || !node.canConvertToInt() || node.asInt() < 0) {
            throw problem(path, "tokens must be a whole number, zero or more (got " + node + ")");
        }
        return OptionalInt.of(node.asInt());
    }

    /** How many items a loop over the variable is expected to walk: a whole number up to {@link #MAX_ITEMS}. */
    private OptionalInt items(String path, JsonNode node) {
        if (!node.isIntegralNumber() || !node.canConvertToInt() || node.asInt() < 0 || node.asInt() > MAX_ITEMS) {
            throw problem(path, "items must be a whole number of loop iterations from 0 to " + MAX_ITEMS
                    + " (got " + node + ")");
        }
        return OptionalInt.of(node.asInt());
    }

    private TareException problem(String path, String message) {
        OptionalInt line = document.line(path);
        return new TareException(where + (line.isPresent() ? ", line " + line.getAsInt() : "") + ": " + message);
    }

    private static String lastKey(String path) {
        return path.substring(path.lastIndexOf('.') + 1);
    }
}
