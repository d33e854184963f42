package dev.tare.config;

import com.fasterxml.jackson.databind.JsonNode;
import dev.tare.TareException;
import dev.tare.source.YamlDocument;
import java.util.ArrayList;
import java.util.Iterator;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.OptionalInt;
import java.util.Set;

/** Typed, located reads from a configuration document; every failure names the file, line and key. */
final class ConfigReader {
    private final String fileName;
    private final YamlDocument document;

    ConfigReader(String fileName, YamlDocument document) {
        this.fileName = fileName;
        this.document = document;
    }

    TareException problem(String path, String message) {
        OptionalInt line = document.line(path);
        String where = fileName + (line.isPresent() ? ", line " + line.getAsInt() : "");
        return new TareException(where + ": " + (path.isEmpty() ? "" : path + ": ") + message);
    }

    /** Fails on keys of {@code node} outside {@code known}, suggesting the nearest known key. */
    void onlyKeys(JsonNode node, String path, Set<String> known) {
        for (Iterator<String> it = node.fieldNames(); it.hasNext(); ) {
            String key = it.next();
            if (!known.contains(key)) {
                String child = path.isEmpty() ? key : path + "." + key;
                throw problem(child, "unknown key" + Suggestion.nearest(key, known).map(k -> "; did you mean '" + k + "'?")
                        .orElse("; known keys here: " + String.join(", ", new java.util.TreeSet<>(known))));
            }
        }
    }

    JsonNode object(JsonNode parent, String key, String path) {
        JsonNode node = parent.get(key);
        if (node == null || node.isNull()) {
            return null;
        }
        if (!node.isObject()) {
            throw problem(path, "must be a mapping of keys to values");
        }
        return node;
    }

    Optional<String> text(JsonNode parent, String key, String path) {
        JsonNode node = parent.get(key);
        if (node == null || node.isNull()) {
            return Optional.empty();
        }
        if (!node.isTextual() || node.asText().isBlank()) {
            throw problem(path, "must be non-empty text");
        }
        return Optional.of(node.asText().strip());
    }

    List<String> texts(JsonNode parent, String key, String path) {
        JsonNode node = parent.get(key);
        List<String> values = new ArrayList<>();
        if (node == null || node.isNull()) {
            return values;
        }
        if (node.isTextual()) {
            values.add(node.asText());
            return values;
        }
        if (!node.isArray()) {
            throw problem(path, "must be a list of text values");
        }
        for (int i = 0; i < node.size(); i++) {
            JsonNode item = node.get(i);
            if (!item.isTextual() || item.asText().isBlank()) {
                throw problem(path + "[" + i + "]", "must be non-empty text");
            }
            values.add(item.asText().strip());
        }
        return values;
    }

    OptionalDouble number(JsonNode parent, String key, String path, double min) {
        JsonNode node = parent.get(key);
        if (node == null || node.isNull()) {
            return OptionalDouble.empty();
        }
        if (!node.isNumber() || node.asDouble() < min || !Double.isFinite(node.asDouble())) {
            throw problem(path, "must be a number of at least " + trim(min) + " (got " + node + ")");
        }
        return OptionalDouble.of(node.asDouble());
    }

    OptionalInt wholeNumber(JsonNode parent, String key, String path, long min) {
        JsonNode node = parent.get(key);
        if (node == null || node.isNull()) {
            return OptionalInt.empty();
        }
        if (!node.isIntegralNumber() || !node.canConvertToInt() || node.asLong() < min) {
            throw problem(path, "must be a whole number of at least " + min + " (got " + node + ")");
        }
        return OptionalInt.of(node.asInt());
    }

    Optional<Boolean> bool(JsonNode parent, String key, String path) {
        JsonNode node = parent.get(key);
        if (node == null || node.isNull()) {
            return Optional.empty();
        }
        if (!node.isBoolean()) {
            throw problem(path, "must be true or false (got " + node + ")");
        }
        return Optional.of(node.asBoolean());
    }

    static Iterable<Map.Entry<String, JsonNode>> fields(JsonNode node) {
        return node::fields;
    }

    private static String trim(double value) {
        return value == Math.rint(value) ? String.valueOf((long) value) : String.valueOf(value);
    }
}
