package dev.tare.tokenize;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * Token counts against the reference BPE implementation.
 *
 * <p>Source of the expected values: the npm package {@code tiktoken} (the WASM build of the
 * reference tokenizer), run by {@code scripts/reference-counts/generate.mjs}; the package version
 * and generation date are in the header of {@code reference-counts/tiktoken-vectors.json}.
 */
class TiktokenReferenceTest {
    private static JsonNode vectors;
    private static JsonNode source;
    private final TokenizerRegistry registry = new TokenizerRegistry();

    @BeforeAll
    static void load() throws IOException {
        try (InputStream in = TiktokenReferenceTest.class.getResourceAsStream("/reference-counts/tiktoken-vectors.json")) {
            JsonNode root = new ObjectMapper().readTree(in);
            vectors = root.get("vectors");
            source = root.get("source");
        }
    }

    @Test
    void vectorsComeFromTheReferencePackageAndAreVaried() {
        assertEquals("tiktoken", source.get("package").asText());
        assertTrue(vectors.size() >= 200, "at least 200 reference strings, got " + vectors.size());
    }

    @ParameterizedTest(name = "{0}")
    @ValueSource(strings = {"o200k_base", "cl100k_base", "p50k_base", "r50k_base"})
    void countsEqualTheReference(String encoding) {
        Tokenizer tokenizer = registry.get(encoding, Path.of("."));
        List<String> mismatches = new ArrayList<>();
        for (JsonNode vector : vectors) {
            String text = vector.get("text").asText();
            int expected = vector.get(encoding).asInt();
            int actual = tokenizer.count(text);
            if (actual != expected) {
                mismatches.add(vector.get("id").asText() + ": expected " + expected + ", got " + actual);
            }
            assertEquals(actual, tokenizer.encode(text).length, "count and encode agree for " + vector.get("id").asText());
        }
        assertEquals(List.of(), mismatches, encoding + " counts differing from tiktoken " + source.get("version").asText());
    }

    @ParameterizedTest(name = "{0}")
    @ValueSource(strings = {"o200k_base", "r50k_base"})
    void tokenIdsEqualTheReference(String encoding) {
        Tokenizer tokenizer = registry.get(encoding, Path.of("."));
        List<String> mismatches = new ArrayList<>();
        int compared = 0;
        for (JsonNode vector : vectors) {
            JsonNode ids = vector.get(encoding + "_ids");
            if (ids == null) {
                continue;
            }
            compared++;
            int[] expected = new int[ids.size()];
            for (int i = 0; i < expected.length; i++) {
                expected[i] = ids.get(i).asInt();
            }
            if (!java.util.Arrays.equals(expected, tokenizer.encode(vector.get("text").asText()))) {
                mismatches.add(vector.get("id").asText());
            }
        }
        assertTrue(compared > 200, "ids compared for most vectors");
        assertEquals(List.of(), mismatches, encoding + " token ids differing from the reference");
    }
}
