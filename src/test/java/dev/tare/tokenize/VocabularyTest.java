package dev.tare.tokenize;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.charset.StandardCharsets;
import org.junit.jupiter.api.Test;

/** The hand-written reader of {@code .tiktoken} lines: base64 token, a space, its rank. */
class VocabularyTest {
    private static Vocabulary parse(String text) {
        return Vocabulary.parse("test", text.getBytes(StandardCharsets.US_ASCII));
    }

    private static byte[] bytes(String text) {
        return text.getBytes(StandardCharsets.UTF_8);
    }

    @Test
    void readsTokensByRankWithGapsBlankLinesAndCarriageReturns() {
        // "YQ==" is "a", "Yg==" is "b", "YWI=" is "ab", "IGFi" is " ab" (base64, RFC 4648).
        Vocabulary vocabulary = parse("YQ== 0\r\nYg== 1\n\nYWI= 3\nIGFi 2\n");
        assertEquals(4, vocabulary.ranks());
        assertArrayEquals(bytes("ab"), vocabulary.token(3));
        assertEquals(2, vocabulary.rank(bytes(" ab"), 0, 3));
        assertEquals(3, vocabulary.rank(bytes("xab"), 1, 3));
        assertEquals(-1, vocabulary.rank(bytes("ba"), 0, 2));
        assertArrayEquals(new int[] {1, 0}, BytePairMerge.encode(vocabulary, bytes("ba")), "no token joins them");
    }

    @Test
    void mergesByRankAsTheReferenceRuleSays() {
        // "ab" (rank 2) merges before "bc" (rank 3), so "abc" is "ab" + "c", never "a" + "bc".
        Vocabulary vocabulary = parse("YQ== 0\nYg== 1\nYw== 4\nYWI= 2\nYmM= 3\n");
        assertArrayEquals(new int[] {2, 4}, BytePairMerge.encode(vocabulary, bytes("abc")));
        assertArrayEquals(new int[] {2, 4}, BytePairMerge.encodeLong(vocabulary, bytes("abc")));
    }

    @Test
    void theCompactFormRoundTripsGapsAndAll() {
        Vocabulary vocabulary = parse("YQ== 0\nYg== 1\nYWI= 3\nIGFi 2\n");
        Vocabulary again = Vocabulary.readCompact("test", vocabulary.compact());
        assertEquals(vocabulary.ranks(), again.ranks());
        for (int rank = 0; rank < vocabulary.ranks(); rank++) {
            assertArrayEquals(vocabulary.token(rank), again.token(rank), "rank " + rank);
        }
        assertEquals(2, again.rank(bytes(" ab"), 0, 3));
        assertEquals(-1, again.rank(bytes("ba"), 0, 2));
    }

    @Test
    void damagedCompactFormsAreRefused() {
        byte[] good = parse("YQ== 0\nYg== 1\nYWI= 2\n").compact();
        byte[] magic = good.clone();
        magic[0] = 'X';
        assertThrows(IllegalStateException.class, () -> Vocabulary.readCompact("test", magic));
        assertThrows(IllegalStateException.class, () -> Vocabulary.readCompact("test", java.util.Arrays.copyOf(good, good.length - 1)));
        byte[] lengths = good.clone();
        lengths[16] = 2; // the first token claims two bytes: the lengths no longer add up to the byte count
        assertThrows(IllegalStateException.class, () -> Vocabulary.readCompact("test", lengths));
        assertThrows(IllegalStateException.class, () -> Vocabulary.readCompact("test", new byte[3]));
    }

    @Test
    void theBuildMadeACompactFormOfEveryBuiltInEncodingWithJtokkitsTokens() {
        // The source is jtokkit's .tiktoken file of each encoding; the compact form must hold exactly its tokens.
        for (String encoding : TokenizerRegistry.BUILT_IN) {
            assertTrue(Vocabulary.class.getResource(String.format(Vocabulary.COMPACT, encoding)) != null,
                    encoding + ": the build step (process-classes) wrote no compact form");
            Vocabulary loaded = Vocabulary.load(encoding);
            Vocabulary source = Vocabulary.fromTiktoken(encoding);
            assertEquals(source.ranks(), loaded.ranks(), encoding);
            for (int rank = 0; rank < source.ranks(); rank++) {
                byte[] token = source.token(rank);
                assertArrayEquals(token, loaded.token(rank), encoding + " rank " + rank);
                if (token.length > 0) {
                    assertEquals(rank, loaded.rank(token, 0, token.length), encoding + " rank " + rank);
                }
            }
        }
    }

    @Test
    void malformedLinesAreRefusedWithTheirPlace() {
        assertThrows(IllegalStateException.class, () -> parse("YQ==\n"));
        assertThrows(IllegalStateException.class, () -> parse("YQ== 1x\n"));
        assertThrows(IllegalStateException.class, () -> parse("Y!== 0\n"));
    }
}
