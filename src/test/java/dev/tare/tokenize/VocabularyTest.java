package dev.tare.tokenize;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

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
    void malformedLinesAreRefusedWithTheirPlace() {
        assertThrows(IllegalStateException.class, () -> parse("YQ==\n"));
        assertThrows(IllegalStateException.class, () -> parse("YQ== 1x\n"));
        assertThrows(IllegalStateException.class, () -> parse("Y!== 0\n"));
    }
}
