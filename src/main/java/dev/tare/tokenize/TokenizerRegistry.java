package dev.tare.tokenize;

import dev.tare.TareException;
import java.nio.file.Path;
import java.util.Collection;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.concurrent.CompletableFuture;
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

    /**
     * The splitting pattern encoding {@code name} uses, or null for a name that is not built in.
     * A switch rather than a map of constructors, so that only the splitters a run uses are loaded:
     * while one is, the first JIT tier calls it directly from the counting loop, where a second or a
     * third loaded makes that an interface call per piece.
     */
    private static Pretokenizer splitter(String name) {
        return switch (name) {
            case "o200k_base" -> new O200kPieces();
            case "cl100k_base" -> new Cl100kPieces();
            case "p50k_base", "r50k_base" -> new Gpt2Pieces();
            default -> null;
        };
    }

    private final Map<String, Tokenizer> loaded = new ConcurrentHashMap<>();
    /** Time spent loading tokenizers in this process, for {@code --timings}. */
    private static final AtomicLong LOAD_NANOS = new AtomicLong();
    private static final ThreadLocal<Boolean> IN_BACKGROUND = ThreadLocal.withInitial(() -> false);

    /**
     * The tokenizer for {@code spec}: a built-in name, or a path to a {@code tokenizer.json} file,
     * resolved against {@code baseDir} when relative.
     *
     * @throws TareException when the name is unknown or the file cannot be used
     */
    public Tokenizer get(String spec, Path baseDir) {
        if (BUILT_IN.contains(spec)) {
            return loaded.computeIfAbsent(spec, name -> new BytePairEncoding(name, () -> Vocabulary.load(name), splitter(name)));
        }
        if (!namesFile(spec)) {
            throw new TareException("unknown tokenizer '" + spec + "': use one of " + String.join(", ", BUILT_IN)
                    + ", or the path of a tokenizer.json file");
        }
        Path file = baseDir.resolve(spec).toAbsolutePath().normalize();
        Tokenizer ready = loaded.get(file.toString());
        return ready != null ? ready : timed(() -> loaded.computeIfAbsent(file.toString(), key -> TokenizerFile.load(spec, file)));
    }

    /**
     * Starts loading the tokenizers {@code specs} name (built-in vocabularies included) on a background
     * thread, so that a command sure to need them all, such as the pre-commit hook, does its other work
     * meanwhile. {@link #get} then returns them, waiting for one still loading; a tokenizer that fails
     * to load here is loaded again there, on the command's own thread, which reports the error.
     *
     * @return done when every one has loaded or failed to
     */
    public CompletableFuture<Void> preload(Collection<String> specs, Path baseDir) {
        List<String> wanted = List.copyOf(new LinkedHashSet<>(specs));
        return inBackground(wanted.stream().<Runnable>map(spec -> () -> get(spec, baseDir).prepare()).toList());
    }

    /**
     * Has {@code tokenizers} read what they read lazily ({@link Tokenizer#prepare}) one after another on a
     * background thread, as {@link #preload} does for tokenizers already made.
     *
     * @return done when every one has loaded or failed to
     */
    public static CompletableFuture<Void> prepare(Collection<Tokenizer> tokenizers) {
        List<Tokenizer> wanted = List.copyOf(new LinkedHashSet<>(tokenizers));
        return inBackground(wanted.stream().<Runnable>map(tokenizer -> tokenizer::prepare).toList());
    }

    /** Runs {@code loads} in turn on a daemon thread whose loading time {@link #loadMillis} leaves out. */
    private static CompletableFuture<Void> inBackground(List<Runnable> loads) {
        CompletableFuture<Void> done = new CompletableFuture<>();
        Thread loader = new Thread(() -> {
            IN_BACKGROUND.set(true);
            for (Runnable load : loads) {
                try {
                    load.run();
                } catch (RuntimeException e) {
                    // Left for the tokenizer's first use, on the command's own thread, to report.
                }
            }
            done.complete(null);
        }, "tare-tokenizer-preload");
        loader.setDaemon(true);
        loader.start();
        return done;
    }

    /**
     * Milliseconds this process's commands have spent loading tokenizers or waiting for them, across
     * every registry; loading on the background thread of {@link #preload} counts only where a command
     * had to wait for it.
     */
    public static double loadMillis() {
        return LOAD_NANOS.get() / 1e6;
    }

    /** Runs {@code load}, adding its time to {@link #loadMillis} unless it runs in the background. */
    static <T> T timed(Supplier<T> load) {
        if (IN_BACKGROUND.get()) {
            return load.get();
        }
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
