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
    /** One cache per thread, so lookups need no locks; each fills with the same common pieces. */
    private final ThreadLocal<PieceCache> caches = ThreadLocal.withInitial(PieceCache::new);

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
        PieceCache cache = caches.get();
        int total = 0;
        int n = text.length();
        for (int start = 0; start < n; ) {
            int end = pretokenizer.pieceEnd(text, start);
            total += piece(cache, text, start, end).length;
            start = end;
        }
        return total;
    }

    @Override
    public int[] encode(String text) {
        int[] out = new int[Math.max(16, text.length() / 3)];
        PieceCache cache = caches.get();
        int size = 0;
        int n = text.length();
        for (int start = 0; start < n; ) {
            int end = pretokenizer.pieceEnd(text, start);
            int[] ids = piece(cache, text, start, end);
            if (size + ids.length > out.length) {
                out = Arrays.copyOf(out, Math.max(out.length * 2, size + ids.length));
            }
            System.arraycopy(ids, 0, out, size, ids.length);
            size += ids.length;
            start = end;
        }
        return Arrays.copyOf(out, size);
    }

    private int[] piece(PieceCache cache, String text, int start, int end) {
        int[] ids = cache.get(text, start, end);
        if (ids == null) {
            ids = BytePairMerge.encode(vocabulary, text.substring(start, end).getBytes(StandardCharsets.UTF_8));
            cache.put(text, start, end, ids);
        }
        return ids;
    }

    @Override
    public String toString() {
        return name;
    }
}
