package dev.tare.tokenize;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;

import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Random;
import org.junit.jupiter.api.Test;

/** The piece cache against a plain map: found where it was stored, never confused, full when full. */
class PieceCacheTest {
    /** Pieces of both tables, the packed (short ASCII) and the other, from an alphabet of four. */
    @Test
    void findsWhatItStoredAndNothingElseUntilFull() {
        findsWhatItStoredAndNothingElseUntilFull("ab\u00e9\u4e2d", PieceCache.MAX_PIECE_CHARS);
    }

    /**
     * ASCII pieces around the packed table's edges: the lowest and highest chars it packs, NUL and
     * the first char past ASCII, which it leaves to the other table, and lengths on both sides of
     * where the first long fills and of the longest packed piece.
     */
    @Test
    void findsWhatItStoredAndNothingElseUntilFullAmongPackedPieces() {
        findsWhatItStoredAndNothingElseUntilFull("\u0001\u007fa\u0000\u0080", PieceCache.PACKED_CHARS + 3);
    }

    private void findsWhatItStoredAndNothingElseUntilFull(String alphabet, int longest) {
        Random random = new Random(7);
        PieceCache cache = new PieceCache();
        Map<String, int[]> stored = new LinkedHashMap<>();
        // Short pieces from a small alphabet, so that many share a length and most of their chars.
        while (stored.size() < PieceCache.MAX_ENTRIES + 5_000) {
            String piece = randomPiece(random, alphabet, longest);
            if (stored.containsKey(piece)) {
                continue;
            }
            int[] ids = new int[1 + random.nextInt(5)];
            for (int i = 0; i < ids.length; i++) {
                ids[i] = random.nextInt(200_000);
            }
            // Each piece stands inside a longer text, as while counting.
            char[] text = ("<<" + piece + ">>").toCharArray();
            cache.put(text, 2, 2 + piece.length(), ids);
            stored.put(piece, ids);
        }
        int kept = 0;
        for (Map.Entry<String, int[]> entry : stored.entrySet()) {
            char[] text = (" " + entry.getKey()).toCharArray();
            int[] found = cache.get(text, 1, text.length);
            if (kept < PieceCache.MAX_ENTRIES) {
                assertArrayEquals(entry.getValue(), found, entry.getKey());
                assertEquals(entry.getValue().length, cache.count(text, 1, text.length), entry.getKey());
            } else {
                assertNull(found, () -> "stored after the cache was full: " + entry.getKey());
                assertEquals(-1, cache.count(text, 1, text.length));
            }
            kept++;
        }
        for (int i = 0; i < 10_000; i++) {
            String piece = randomPiece(random, alphabet, longest) + "z";
            char[] text = piece.toCharArray();
            assertNull(cache.get(text, 0, text.length), piece);
            assertEquals(-1, cache.count(text, 0, text.length), piece);
        }
    }

    @Test
    void piecesWhoseHashesAreEqualAreToldApartByTheirChars() {
        // "\u00e9a" and "\u00eaB" have the same polynomial hash with multiplier 31 (233 * 31 + 97 =
        // 234 * 31 + 66), so the same slot and hash bits in the table of pieces that are not ASCII.
        PieceCache cache = new PieceCache();
        char[] text = "\u00e9a\u00eaB".toCharArray();
        cache.put(text, 0, 2, new int[] {1});
        assertNull(cache.get(text, 2, 4));
        assertEquals(-1, cache.count(text, 2, 4));
        cache.put(text, 2, 4, new int[] {2, 3});
        assertArrayEquals(new int[] {1}, cache.get(text, 0, 2));
        assertArrayEquals(new int[] {2, 3}, cache.get(text, 2, 4));
        assertEquals(2, cache.count(text, 2, 4));
    }

    @Test
    void longPiecesAreNotKept() {
        PieceCache cache = new PieceCache();
        char[] text = "a".repeat(PieceCache.MAX_PIECE_CHARS + 1).toCharArray();
        cache.put(text, 0, text.length, new int[] {1});
        assertNull(cache.get(text, 0, text.length));
        cache.put(text, 1, text.length, new int[] {2});
        assertArrayEquals(new int[] {2}, cache.get(text, 1, text.length));
        assertEquals(1, cache.count(text, 1, text.length));
    }

    @Test
    void packedPiecesOfEveryLengthAreToldApart() {
        PieceCache cache = new PieceCache();
        // Pieces that are prefixes of one another, and pieces that differ only in their last char.
        String chars = "\u0001bcdefghijklmnopqrstu\u007f";
        for (int length = 1; length <= chars.length(); length++) {
            char[] text = chars.substring(0, length).toCharArray();
            cache.put(text, 0, length, new int[length]);
        }
        for (int length = 1; length <= chars.length(); length++) {
            char[] text = chars.substring(0, length).toCharArray();
            assertEquals(length, cache.count(text, 0, length), "length " + length);
            text[length - 1] = 'z';
            assertEquals(-1, cache.count(text, 0, length), "length " + length + " with its last char changed");
        }
    }

    private static String randomPiece(Random random, String alphabet, int longest) {
        int length = 1 + random.nextInt(random.nextInt(10) == 0 ? longest : 6);
        StringBuilder piece = new StringBuilder();
        for (int i = 0; i < length; i++) {
            piece.append(alphabet.charAt(random.nextInt(alphabet.length())));
        }
        return piece.toString();
    }
}
