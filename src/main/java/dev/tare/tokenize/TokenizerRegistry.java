package dev.tare.tokenize;

import dev.tare.TareException;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.atomic.AtomicLong;
import java.util.function.Supplier;

/**
 * The one place tokenizers come from. A tokenizer is named either by a built-in encoding name
 * ({@link #BUILT_IN}), counted by Tare's own byte-pair encoder over the vocabulary jtokkit ships, or
 * by the path of a {@code tokenizer.json} file, counted through DJL's tokenizers library. Each is
 * made once and shared by every thread; a built-in encoding reads its vocabulary only when it first
 * meets a piece it has not cached.
 */
public final class TokenizerRegistry {
    /** The encoding used when neither a target nor {@code --tokenizer} names one. */
    public static final String DEFAULT = "o200k_base";
    /** Built-in encoding names, in the order they are listed to users. */
    public static final List<String> BUILT_IN = List.of("o200k_base", "cl100k_base", "p50k_base", "r50k_base");

    /** Where jtokkit keeps each encoding's ranks, and the splitting pattern each one uses. */
    private static final String RANKS = "/com/knuddels/jtokkit/%s.tiktoken";
    private static final Map<String, Supplier<Pretokenizer>> SPLITTERS = Map.of(
            "o200k_base", O200kPieces::new,
            "cl100k_base", Cl100kPieces::new,
            "p50k_base", Gpt2Pieces::new,
            "r50k_base", Gpt2Pieces::new);

    private final Map<String, Tokenizer> loaded = new ConcurrentHashMap<>();
    /** Time spent loading tokenizers in this process, for {@code --timings}. */
    private static final AtomicLong LOAD_NANOS = new AtomicLong();

    /**
     * The tokenizer for {@code spec}: a built-in name, or a path to a {@code tokenizer.json} file,
     * resolved against {@code baseDir} when relative.
     *
     * @throws TareException when the name is unknown or the file cannot be used
     */
    public Tokenizer get(String spec, Path baseDir) {
        Supplier<Pretokenizer> splitter = SPLITTERS.get(spec);
        if (splitter != null) {
            return loaded.computeIfAbsent(spec, name -> new BytePairEncoding(name,
                    () -> timed(() -> Vocabulary.fromResource(String.format(RANKS, name))), splitter.get()));
        }
        if (!namesFile(spec)) {
            throw new TareException("unknown tokenizer '" + spec + "': use one of " + String.join(", ", BUILT_IN)
                    + ", or the path of a tokenizer.json file");
        }
        Path file = baseDir.resolve(spec).toAbsolutePath().normalize();
        return loaded.computeIfAbsent(file.toString(), key -> timed(() -> TokenizerFile.load(spec, file)));
    }

    /** Milliseconds this process has spent loading tokenizers, across every registry. */
    public static double loadMillis() {
        return LOAD_NANOS.get() / 1e6;
    }

    private static <T> T timed(Supplier<T> load) {
        long start = System.nanoTime();
        try {
            return load.get();
        } finally {
            LOAD_NANOS.addAndGet(System.nanoTime() - start);
        }
    }

    /** The built-in default tokenizer. */
    public Tokenizer defaultTokenizer() {
        return get(DEFAULT, Path.of("."));
    }

    /** Whether {@code spec} names a tokenizer file rather than a built-in encoding. */
    public static boolean namesFile(String spec) {
        return spec.contains("/") || spec.contains("\\") || spec.endsWith(".json");
    }
}
