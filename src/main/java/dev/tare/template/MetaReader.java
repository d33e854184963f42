package dev.tare.template;

import com.fasterxml.jackson.databind.JsonNode;
import dev.tare.TareException;
import dev.tare.source.YamlDocument;
import java.util.Iterator;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalInt;

/** Reads the template keys of front matter or of a chat file into a {@link TemplateMeta}, located by line. */
final class MetaReader {
    private final YamlDocument document;
    private final String where;

    /** @param where how messages name the place: "front matter" or "chat file" */
    MetaReader(YamlDocument document, String where) {
        this.document = document;
        this.where = where;
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
                variables(root.get("variables")));
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

    private Map<String, VariableSpec> variables(JsonNode node) {
        Map<String, VariableSpec> variables = new LinkedHashMap<>();
        if (node == null || node.isNull()) {
            return variables;
        }
        if (!node.isObject()) {
            throw problem("variables", "variables must map each variable name to {tokens: N} or {sample: \"...\"}");
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
            throw problem(path, lastKey(path) + " must be {tokens: N} or {sample: \"...\"}");
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
        return new VariableSpec(tokens, sample);
    }

    private OptionalInt wholeNumberAt(String path, JsonNode node) {
        if (!node.isIntegralNumber() || !node.canConvertToInt() || node.asInt() < 0) {
            throw problem(path, "tokens must be a whole number, zero or more (got " + node + ")");
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
