package dev.tare.tokenize;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import dev.tare.TareException;
import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Counting through {@code tokenizer.json} files with DJL's tokenizers library. */
class TokenizerFileTest {
    /**
     * A byte-level BPE with seven tokens and three merges, small enough to encode by hand: the
     * byte-level pre-tokenizer splits text into contractions, letter runs, digit runs, other runs and
     * whitespace, each with its leading space, and writes a space as {@code Ġ}; merges
     * apply lowest rank first ("a b" before "ab c" before "Ġ a").
     */
    private static final String TINY = """
            {"version": "1.0", "truncation": null, "padding": null, "added_tokens": [], "normalizer": null,
             "pre_tokenizer": {"type": "ByteLevel", "add_prefix_space": false, "trim_offsets": true, "use_regex": true},
             "post_processor": null,
             "decoder": {"type": "ByteLevel", "add_prefix_space": false, "trim_offsets": true, "use_regex": true},
             "model": {"type": "BPE", "dropout": null, "unk_token": null, "continuing_subword_prefix": null,
                       "end_of_word_suffix": null, "fuse_unk": false, "byte_fallback": false,
                       "vocab": {"a": 0, "b": 1, "c": 2, "Ġ": 3, "ab": 4, "abc": 5, "Ġa": 6},
                       "merges": ["a b", "ab c", "Ġ a"]}}
            """;

    @TempDir
    static Path folder;
    private static Path r50k;
    private final TokenizerRegistry registry = new TokenizerRegistry();

    @BeforeAll
    static void convert() throws IOException {
        r50k = folder.resolve("r50k/tokenizer.json");
        Files.createDirectories(r50k.getParent());
        TiktokenToTokenizerJson.write("r50k_base", Integer.MAX_VALUE, r50k);
    }

    @Test
    void tinyByteLevelBpeEncodesAsWorkedByHand() throws IOException {
        Path file = Files.writeString(folder.resolve("tiny.json"), TINY, StandardCharsets.UTF_8);
        Tokenizer tiny = registry.get(file.toString(), Path.of("."));
        // Pre-tokens "abc", " ab", " abcab", " a" (letter runs with their leading space). By the merge ranks above:
        // abc -> a b c -> ab c -> abc = [5]; Ġab -> Ġ a b -> Ġ ab (a b outranks Ġ a) = [3, 4];
        // Ġabcab -> Ġ ab c ab -> Ġ abc ab = [3, 5, 4]; Ġa -> Ġa = [6].
        assertArrayEquals(new int[] {5, 3, 4, 3, 5, 4, 6}, tiny.encode("abc ab abcab a"));
        assertEquals(7, tiny.count("abc ab abcab a"));
        assertEquals(0, tiny.count(""));
    }

    @Test
    void theLibrarysUsageReportsAreSwitchedOffBeforeItMakesATokenizer() throws IOException {
        Path file = Files.writeString(folder.resolve("tiny-quiet.json"), TINY, StandardCharsets.UTF_8);
        registry.get(file.toString(), Path.of("."));
        // The library reads the switch as an environment variable or a system property; a value the
        // person running Tare set is theirs to keep.
        String set = System.getenv(TokenizerFile.NO_REPORTING);
        assertEquals(set == null ? "true" : null, System.getProperty(TokenizerFile.NO_REPORTING));
    }

    @Test
    void noTruncationOnLongText() throws IOException {
        Path file = Files.writeString(folder.resolve("tiny-long.json"), TINY, StandardCharsets.UTF_8);
        Tokenizer tiny = registry.get(file.toString(), Path.of("."));
        // "abc " repeated: the first pre-token is "abc" and each later one " abc", which the merges
        // leave as Ġ + abc (there is no merge of Ġ with ab), so 1 + 2 × 2,999 = 5,999 tokens, far past
        // the 512-token limit a truncating tokenizer would stop at.
        assertEquals(5_999, tiny.count("abc ".repeat(3_000).strip()));
    }

    /**
     * Source of the expected values: the npm package {@code tiktoken} (the reference encoder; version
     * in the header of {@code reference-counts/tiktoken-vectors.json}), field {@code r50k_base}; the
     * tokenizer file is jtokkit 1.1.0's r50k_base ranks converted by {@link TiktokenToTokenizerJson}.
     * DJL's tokenizers library agreeing with the reference on every vector shows the file path counts
     * as the library does and that the conversion loses nothing.
     */
    @Test
    void convertedR50kCountsEqualTheReference() throws IOException {
        JsonNode root;
        try (InputStream in = getClass().getResourceAsStream("/reference-counts/tiktoken-vectors.json")) {
            root = new ObjectMapper().readTree(in);
        }
        Tokenizer file = registry.get(r50k.toString(), Path.of("."));
        Tokenizer builtIn = registry.get("r50k_base", Path.of("."));
        List<String> mismatches = new ArrayList<>();
        int idsCompared = 0;
        for (JsonNode vector : root.get("vectors")) {
            String text = vector.get("text").asText();
            int expected = vector.get("r50k_base").asInt();
            int actual = file.count(text);
            if (actual != expected || builtIn.count(text) != expected) {
                mismatches.add(vector.get("id").asText() + ": expected " + expected + ", tokenizer.json " + actual
                        + ", jtokkit " + builtIn.count(text));
            }
            JsonNode ids = vector.get("r50k_base_ids");
            if (ids != null) {
                idsCompared++;
                int[] expectedIds = new int[ids.size()];
                for (int i = 0; i < expectedIds.length; i++) {
                    expectedIds[i] = ids.get(i).asInt();
                }
                if (!java.util.Arrays.equals(expectedIds, file.encode(text))) {
                    mismatches.add(vector.get("id").asText() + ": token ids differ");
                }
            }
        }
        assertTrue(root.get("vectors").size() >= 200, "the reference has at least 200 vectors");
        assertTrue(idsCompared > 200, "ids compared for most vectors");
        assertEquals(List.of(), mismatches, "tokenizer.json counts differing from tiktoken "
                + root.get("source").get("version").asText());
    }

    @Test
    void demoTokenizerFileIsTheConversionOfTheFirstR50kRanks() throws IOException {
        Path demo = Path.of(System.getProperty("tare.project.dir", "."), "corpora/demo/models/small/tokenizer.json");
        assertEquals(TiktokenToTokenizerJson.convert("r50k_base", 3000), Files.readString(demo),
                "regenerate the demo file as corpora/demo/models/small/README.md says");
    }

    @Test
    void missingFileNamesThePath() {
        TareException e = assertThrows(TareException.class,
                () -> registry.get("models/none/tokenizer.json", folder));
        assertTrue(e.getMessage().contains("models/none/tokenizer.json") && e.getMessage().contains("no such file"),
                e.getMessage());
    }

    @Test
    void fileThatIsNotATokenizerIsRefused() throws IOException {
        Path file = Files.writeString(folder.resolve("broken.json"), "{\"model\": 3}", StandardCharsets.UTF_8);
        TareException e = assertThrows(TareException.class, () -> registry.get(file.toString(), Path.of(".")));
        assertTrue(e.getMessage().contains("broken.json") && e.getMessage().contains("not a tokenizer definition"),
                e.getMessage());
    }
}
