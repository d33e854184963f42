package dev.tare.lint;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.core.StreamReadFeature;
import com.fasterxml.jackson.databind.DeserializationFeature;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.json.JsonMapper;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import java.util.Optional;

/**
 * The one strict reading of JSON in prompt text, shared by the JSON rule and the rewrite engine's
 * check of it: duplicate keys and trailing text are refused and numbers are kept exact, so two texts
 * read to equal trees only when they hold the same JSON value.
 */
public final class StrictJson {
    private static final JsonMapper JSON = JsonMapper.builder()
            .enable(StreamReadFeature.STRICT_DUPLICATE_DETECTION)
            .enable(DeserializationFeature.USE_BIG_DECIMAL_FOR_FLOATS)
            .enable(DeserializationFeature.FAIL_ON_TRAILING_TOKENS)
            .nodeFactory(JsonNodeFactory.withExactBigDecimals(true))
            .build();

    private StrictJson() {
    }

    /** The object or array {@code text} holds, or empty when it is anything else or not strict JSON. */
    public static Optional<JsonNode> tree(String text) {
        try {
            JsonNode tree = JSON.readTree(text);
            return tree != null && (tree.isObject() || tree.isArray()) ? Optional.of(tree) : Optional.empty();
        } catch (JsonProcessingException e) {
            return Optional.empty();
        }
    }

    /** {@code tree} written on one line without spaces between members. */
    public static String minified(JsonNode tree) {
        try {
            return JSON.writeValueAsString(tree);
        } catch (JsonProcessingException e) {
            throw new IllegalStateException("a parsed JSON tree could not be written back", e);
        }
    }
}
