package dev.tare.tokenize;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.knuddels.jtokkit.Encodings;
import com.knuddels.jtokkit.api.Encoding;
import com.knuddels.jtokkit.api.EncodingRegistry;
import com.knuddels.jtokkit.api.EncodingType;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * Tare's encoder against an independent one on the same vocabulary: jtokkit 1.1.0's
 * {@code encodeOrdinary} (its own splitting regex and merge loop), on random tricky text, on every
 * file of the demo and hostile corpora, and on pieces long enough to take the priority-queue merge.
 * {@code TiktokenReferenceTest} checks both against the reference encoder on its vectors; this test
 * covers far more text than those vectors can.
 */
class BytePairEncodingTest {
    private static final EncodingRegistry JTOKKIT = Encodings.newLazyEncodingRegistry();
    private final TokenizerRegistry registry = new TokenizerRegistry();

    @ParameterizedTest(name = "{0}")
    @ValueSource(strings = {"o200k_base", "cl100k_base", "p50k_base", "r50k_base"})
    void idsEqualJtokkitsOnRandomText(String name) {
        Tokenizer ours = registry.get(name, Path.of("."));
        Encoding theirs = jtokkit(name);
        SplittableRandom random = new SplittableRandom(4_2026L);
        for (int i = 0; i < 4_000; i++) {
            // jtokkit refuses a lone surrogate on cl100k_base; text read from files never holds one.
            String text = TrickyText.next(random, 60).replace("\uD800", "");
            assertArrayEquals(theirs.encodeOrdinary(text).toArray(), ours.encode(text), () -> name + " on " + text);
            assertEquals(theirs.countTokensOrdinary(text), ours.count(text), () -> name + " count on " + text);
            // Counted where it lies in a longer array, whose chars past the text must not be read.
            char[] array = (text + "word 123 !?").toCharArray();
            assertEquals(theirs.countTokensOrdinary(text), ours.count(array, text.length()), () -> name + " count of chars " + text);
        }
    }

    @ParameterizedTest(name = "{0}")
    @ValueSource(strings = {"o200k_base", "cl100k_base", "r50k_base"})
    void idsEqualJtokkitsOnEveryCorpusFile(String name) throws IOException {
        Tokenizer ours = registry.get(name, Path.of("."));
        Encoding theirs = jtokkit(name);
        Path project = Path.of(System.getProperty("tare.project.dir", "."));
        List<Path> files = new ArrayList<>();
        for (String corpus : List.of("corpora/demo", "corpora/hostile")) {
            try (Stream<Path> walk = Files.walk(project.resolve(corpus))) {
                walk.filter(Files::isRegularFile).filter(f -> f.toFile().length() < 1_000_000).sorted().forEach(files::add);
            }
        }
        assertTrue(files.size() > 30, "the corpora hold their files");
        for (Path file : files) {
            String text = new String(Files.readAllBytes(file), StandardCharsets.UTF_8);
            assertArrayEquals(theirs.encodeOrdinary(text).toArray(), ours.encode(text), () -> name + " on " + file);
        }
    }

    @ParameterizedTest(name = "{0}")
    @ValueSource(strings = {"o200k_base", "cl100k_base", "r50k_base"})
    void longPiecesMergeAsJtokkitDoes(String name) {
        Tokenizer ours = registry.get(name, Path.of("."));
        Encoding theirs = jtokkit(name);
        SplittableRandom random = new SplittableRandom(7L);
        List<String> texts = new ArrayList<>(List.of("a".repeat(5_000), "ab".repeat(3_000), " ".repeat(4_000),
                "!".repeat(2_500) + "?", "中文".repeat(700), "\uD83D\uDE00".repeat(600), "9".repeat(1_000)));
        for (int i = 0; i < 40; i++) {
            StringBuilder word = new StringBuilder();
            int length = 130 + random.nextInt(3_000);
            for (int j = 0; j < length; j++) {
                word.append((char) ((random.nextBoolean() ? 'a' : 'A') + random.nextInt(26)));
            }
            texts.add(word.toString());
        }
        for (String text : texts) {
            assertArrayEquals(theirs.encodeOrdinary(text).toArray(), ours.encode(text),
                    () -> name + " on a piece of " + text.length() + " chars starting " + text.substring(0, 20));
        }
    }

    @Test
    void shortAndLongMergesAgreeOnEveryPieceLength() {
        Vocabulary vocabulary = Vocabulary.load("o200k_base");
        SplittableRandom random = new SplittableRandom(11L);
        for (int i = 0; i < 3_000; i++) {
            int length = 2 + random.nextInt(BytePairMerge.LONG_PIECE);
            byte[] piece = TrickyText.next(random, length).getBytes(StandardCharsets.UTF_8);
            if (piece.length < 2) {
                continue;
            }
            assertArrayEquals(BytePairMerge.encodeShort(vocabulary, piece), BytePairMerge.encodeLong(vocabulary, piece));
        }
    }

    @ParameterizedTest(name = "{0}")
    @ValueSource(strings = {"o200k_base", "cl100k_base", "p50k_base", "r50k_base"})
    void everyTokenIsFoundByItsBytesAndDecodesAsJtokkitDoes(String name) {
        Vocabulary vocabulary = Vocabulary.load(name);
        Encoding theirs = jtokkit(name);
        int found = 0;
        for (int rank = 0; rank < vocabulary.ranks(); rank++) {
            byte[] token = vocabulary.token(rank);
            if (token.length == 0) {
                continue;
            }
            assertEquals(rank, vocabulary.rank(token, 0, token.length), name + " rank " + rank);
            var ids = new com.knuddels.jtokkit.api.IntArrayList();
            ids.add(rank);
            assertArrayEquals(theirs.decodeBytes(ids), token, name + " bytes of rank " + rank);
            found++;
        }
        assertTrue(found >= 50_000, name + " has its tokens: " + found);
        assertEquals(-1, vocabulary.rank(new byte[] {(byte) 0xff, (byte) 0xfe, 'x', 'y', 'z', 'q'}, 0, 6));
    }

    private static Encoding jtokkit(String name) {
        return JTOKKIT.getEncoding(EncodingType.fromName(name).orElseThrow());
    }
}
