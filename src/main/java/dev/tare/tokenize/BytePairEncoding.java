package dev.tare.tokenize;

import java.nio.charset.StandardCharsets;
import java.util.Arrays;

/**
 * A built-in byte-level BPE encoding ({@code o200k_base} and the others): the text is split into
 * pieces by the encoding's pattern, each piece's UTF-8 bytes are merged by rank, and the ids are
 * concatenated. Special-token strings are ordinary text here. The vocabulary is the one jtokkit
 * ships, read by {@link Vocabulary}; {@code TiktokenReferenceTest} holds the results to the reference
 * encoder's, and {@code BytePairEncodingTest} to jtokkit's own encoder on a large mixed corpus.
 */
final class BytePairEncoding implements Tokenizer {
    private final String name;
    private final Vocabulary vocabulary;
    private final Pretokenizer pretokenizer;
    private final PieceCache cache = new PieceCache();

    BytePairEncoding(String name, Vocabulary vocabulary, Pretokenizer pretokenizer) {
        this.name = name;
        this.vocabulary = vocabulary;
        this.pretokenizer = pretokenizer;
    }

    @Override
    public String name() {
        return name;
    }

    @Override
    public int count(String text) {
        int total = 0;
        int n = text.length();
        for (int start = 0; start < n; ) {
            int end = pretokenizer.pieceEnd(text, start);
            total += piece(text.substring(start, end)).length;
            start = end;
        }
        return total;
    }

    @Override
    public int[] encode(String text) {
        int[] out = new int[Math.max(16, text.length() / 3)];
        int size = 0;
        int n = text.length();
        for (int start = 0; start < n; ) {
            int end = pretokenizer.pieceEnd(text, start);
            int[] ids = piece(text.substring(start, end));
            if (size + ids.length > out.length) {
                out = Arrays.copyOf(out, Math.max(out.length * 2, size + ids.length));
            }
            System.arraycopy(ids, 0, out, size, ids.length);
            size += ids.length;
            start = end;
        }
        return Arrays.copyOf(out, size);
    }

    private int[] piece(String piece) {
        int[] ids = cache.get(piece);
        if (ids == null) {
            ids = BytePairMerge.encode(vocabulary, piece.getBytes(StandardCharsets.UTF_8));
            cache.put(piece, ids);
        }
        return ids;
    }

    @Override
    public String toString() {
        return name;
    }
}
