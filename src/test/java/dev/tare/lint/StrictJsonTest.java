package dev.tare.lint;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.core.StreamReadFeature;
import com.fasterxml.jackson.databind.DeserializationFeature;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.json.JsonMapper;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.SplittableRandom;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;

/**
 * Tare's strict JSON reading and writing against Jackson's object mapper configured for the same
 * strictness (duplicate keys and trailing tokens refused, floats as exact decimals): the reference
 * implementation, from the same library, for every input here.
 */
class StrictJsonTest {
    private static final JsonMapper REFERENCE = JsonMapper.builder()
            .enable(StreamReadFeature.STRICT_DUPLICATE_DETECTION)
            .enable(DeserializationFeature.USE_BIG_DECIMAL_FOR_FLOATS)
            .enable(DeserializationFeature.FAIL_ON_TRAILING_TOKENS)
            .nodeFactory(JsonNodeFactory.withExactBigDecimals(true))
            .build();

    private static Optional<JsonNode> reference(String text) {
        try {
            JsonNode tree = REFERENCE.readTree(text);
            return tree != null && (tree.isObject() || tree.isArray()) ? Optional.of(tree) : Optional.empty();
        } catch (JsonProcessingException e) {
            return Optional.empty();
        }
    }

    private static void agrees(String text) throws JsonProcessingException {
        Optional<JsonNode> ours = StrictJson.tree(text);
        Optional<JsonNode> theirs = reference(text);
        assertEquals(theirs, ours, text);
        if (ours.isPresent()) {
            assertEquals(REFERENCE.writeValueAsString(theirs.get()), StrictJson.minified(ours.get()), text);
        }
    }

    @Test
    void agreesWithTheObjectMapperOnHandPickedCases() throws JsonProcessingException {
        for (String text : List.of("{}", "[]", "  {\"a\": 1}  ", "{\"a\": 1, \"a\": 2}", "[1] x", "[1] [2]", "42", "\"text\"",
                "", "   ", "null", "{\"n\": [1, -0, 2147483648, 9223372036854775808, 1.50, 1e400, -0.0, 2E-3, 0.1e1]}",
                "{\"s\": \"caf\\u00e9 \\\"q\\\" \\n\\t \\ud83d\\ude00 </tag> \\u0001\"}", "{\"t\": true, \"f\": false, \"z\": null}",
                "[{\"a\": [[], {}]}, [\"b\"]]", "{\"a\": 1,}", "[1,]", "{'a': 1}", "{\"a\": NaN}", "[01]", "{\"a\" 1}",
                "[\"unterminated", "{\"deep\": " + "[".repeat(50) + "]".repeat(50) + "}")) {
            agrees(text);
        }
    }

    @Test
    void agreesWithTheObjectMapperOnTheDemoChatFiles() throws IOException {
        List<Path> files;
        try (Stream<Path> walk = Files.walk(Path.of("corpora/demo/prompts"))) {
            files = walk.filter(p -> p.toString().endsWith(".json")).toList();
        }
        assertTrue(!files.isEmpty());
        for (Path file : files) {
            agrees(Files.readString(file));
        }
    }

    @Test
    void agreesWithTheObjectMapperOnRandomDocuments() throws JsonProcessingException {
        SplittableRandom random = new SplittableRandom(17);
        List<String> broken = new ArrayList<>();
        for (int i = 0; i < 3_000; i++) {
            String text = value(random, 0);
            agrees(text);
            // A damaged copy: one character dropped or doubled.
            int at = random.nextInt(text.length());
            String damaged = random.nextBoolean() ? text.substring(0, at) + text.substring(at + 1)
                    : text.substring(0, at) + text.charAt(at) + text.substring(at);
            agrees(damaged);
            broken.add(damaged);
        }
        assertTrue(broken.stream().filter(t -> reference(t).isEmpty()).count() > 300, "damage is often fatal");
    }

    private static String value(SplittableRandom random, int depth) {
        int kind = depth > 3 ? 2 + random.nextInt(4) : random.nextInt(6);
        return switch (kind) {
            case 0 -> {
                StringBuilder object = new StringBuilder("{");
                int size = random.nextInt(4);
                for (int i = 0; i < size; i++) {
                    object.append(i > 0 ? ", " : "").append('"').append("k").append(random.nextInt(5)).append("\": ")
                            .append(value(random, depth + 1));
                }
                yield object.append('}').toString();
            }
            case 1 -> {
                StringBuilder array = new StringBuilder("[");
                int size = random.nextInt(4);
                for (int i = 0; i < size; i++) {
                    array.append(i > 0 ? "," : "").append(value(random, depth + 1));
                }
                yield array.append(']').toString();
            }
            case 2 -> List.of("0", "-7", "123456789012", "99999999999999999999", "3.14", "-2.50", "6.02e23", "1E-7")
                    .get(random.nextInt(8));
            case 3 -> "\"" + List.of("plain", "with \\\"quotes\\\"", "\\u00e9t\\u00e9", "tab\\there", "").get(random.nextInt(5)) + "\"";
            case 4 -> List.of("true", "false", "null").get(random.nextInt(3));
            default -> depth == 0 ? "[]" : "\"x\"";
        };
    }
}
