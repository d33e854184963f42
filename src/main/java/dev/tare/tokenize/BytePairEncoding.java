package dev.tare.tokenize;

import java.nio.charset.StandardCharsets;
import java.util.Arrays;
import java.util.function.Supplier;

/**
 * A built-in byte-level BPE encoding ({@code o200k_base} and the others): the text is split into
 * pieces by the encoding's pattern, each piece's UTF-8 bytes are merged by rank, and the ids are
 * concatenated. Special-token strings are ordinary text here. The vocabulary is the one jtokkit
 * ships, read by {@link Vocabulary}; {@code TiktokenReferenceTest} holds the results to the reference
 * encoder's, and {@code BytePairEncodingTest} to jtokkit's own encoder on a large mixed corpus.
 */
final class BytePairEncoding implements Tokenizer {
    private final String name;
    private final Supplier<Vocabulary> load;
    private volatile Vocabulary vocabulary;
    private final Pretokenizer pretokenizer;
    /** Each thread's piece cache and text buffer, so counting needs no locks. */
    private final ThreadLocal<Scratch> scratch = ThreadLocal.withInitial(Scratch::new);

    /**
     * An encoding whose vocabulary is read by {@code load} the first time a piece is not in the
     * cache, so that a run that counts nothing (a scan answered from its cache) never reads it.
     */
    BytePairEncoding(String name, Supplier<Vocabulary> load, Pretokenizer pretokenizer) {
        this.name = name;
        this.load = load;
        this.pretokenizer = pretokenizer;
    }

    @Override
    public String name() {
        return name;
    }

    @Override
    public int count(String text) {
        Scratch own = scratch.get();
        return count(own, own.chars(text), text.length());
    }

    @Override
    public int count(char[] text, int length) {
        return count(scratch.get(), text, length);
    }

    private int count(Scratch own, char[] chars, int length) {
        int total = 0;
        for (int start = 0; start < length; ) {
            int end = pretokenizer.pieceEnd(chars, start, length);
            int ids = own.cache.count(chars, start, end);
            total += ids >= 0 ? ids : piece(own.cache, chars, start, end).length;
            start = end;
        }
        return total;
    }

    @Override
    public LineCounts countLines(String text) {
        if (!pretokenizer.keepsLinesApart()) {
            return LineCounts.whole(count(text));
        }
        Scratch own = scratch.get();
        int length = text.length();
        char[] chars = own.chars(text);
        int[] starts = new int[16];
        int[] before = new int[16];
        int lines = 0;
        int total = 0;
        for (int start = 0; start < length; ) {
            if (Pretokenizer.isSafeLineStart(chars, start, length)) {
                if (lines == starts.length) {
                    starts = Arrays.copyOf(starts, lines * 2);
                    before = Arrays.copyOf(before, lines * 2);
                }
                starts[lines] = start;
                before[lines++] = total;
            }
            int end = pretokenizer.pieceEnd(chars, start, length);
            int ids = own.cache.count(chars, start, end);
            total += ids >= 0 ? ids : piece(own.cache, chars, start, end).length;
            start = end;
        }
        return new LineCounts(total, Arrays.copyOf(starts, lines), Arrays.copyOf(before, lines));
    }

    @Override
    public int[] encode(String text) {
        Scratch own = scratch.get();
        int length = text.length();
        char[] chars = own.chars(text);
        int[] out = new int[Math.max(16, length / 3)];
        int size = 0;
        for (int start = 0; start < length; ) {
            int end = pretokenizer.pieceEnd(chars, start, length);
            int[] ids = piece(own.cache, chars, start, end);
            if (size + ids.length > out.length) {
                out = Arrays.copyOf(out, Math.max(out.length * 2, size + ids.length));
            }
            System.arraycopy(ids, 0, out, size, ids.length);
            size += ids.length;
            start = end;
        }
        return Arrays.copyOf(out, size);
    }

    private int[] piece(PieceCache cache, char[] text, int start, int end) {
        int[] ids = cache.get(text, start, end);
        if (ids == null) {
            ids = BytePairMerge.encode(vocabulary(), new String(text, start, end - start).getBytes(StandardCharsets.UTF_8));
            cache.put(text, start, end, ids);
        }
        return ids;
    }

    @Override
    public void prepare() {
        vocabulary();
    }

    private Vocabulary vocabulary() {
        Vocabulary loaded = vocabulary;
        return loaded != null ? loaded : TokenizerRegistry.timed(this::loadOnce);
    }

    /** Loads the vocabulary unless another thread has (or is loading it, which this then waits for). */
    private synchronized Vocabulary loadOnce() {
        Vocabulary loaded = vocabulary;
        if (loaded == null) {
            loaded = load.get();
            vocabulary = loaded;
        }
        return loaded;
    }

    @Override
    public String toString() {
        return name;
    }

    /** One thread's working memory. */
    private static final class Scratch {
        /** Texts up to this many chars reuse one buffer; a longer one gets its own array. */
        private static final int KEPT_BUFFER_CHARS = 1 << 20;

        final PieceCache cache = new PieceCache();
        private char[] buffer = new char[8192];

        char[] chars(String text) {
            int length = text.length();
            if (length > buffer.length) {
                if (length > KEPT_BUFFER_CHARS) {
                    return text.toCharArray();
                }
                buffer = new char[Math.max(length, buffer.length * 2)];
            }
            text.getChars(0, length, buffer, 0);
            return buffer;
        }
    }
}
