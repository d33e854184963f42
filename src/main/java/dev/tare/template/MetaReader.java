package dev.tare.template;

import com.fasterxml.jackson.databind.JsonNode;
import dev.tare.TareException;
import dev.tare.source.YamlDocument;
import java.util.Iterator;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.OptionalInt;

/** Reads the template keys of front matter or of a chat file into a {@link TemplateMeta}, located by line. */
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
        return new TemplateMeta(
                text(root, "target"),
                wholeNumber(root, "budget", 1),
                wholeNumber(root, "output_tokens", 0),
                variables(root.get("variables")),
                toolsAreFiles ? toolFiles(root.get("tools")) : java.util.List.of(),
                callsPerDay(root.get("calls_per_day")));
    }

    private java.util.List<String> toolFiles(JsonNode node) {
        java.util.List<String> files = new java.util.ArrayList<>();
        if (node == null || node.isNull()) {
            return files;
        }
        if (!node.isArray()) {
            throw problem("tools", "tools must be a list of tool file paths, relative to the repository root");
        }
        for (int i = 0; i < node.size(); i++) {
            if (!node.get(i).isTextual() || node.get(i).asText().isBlank()) {
                throw problem("tools[" + i + "]", "tools[" + i + "] must be the path of a tool file");
            }
            files.add(node.get(i).asText().strip());
        }
        return files;
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
