package dev.tare.bench;

import com.knuddels.jtokkit.Encodings;
import com.knuddels.jtokkit.api.Encoding;
import dev.tare.tokenize.Tokenizer;
import dev.tare.tokenize.TokenizerRegistry;
import java.nio.file.Path;
import java.util.concurrent.TimeUnit;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Warmup;

/**
 * Counting ordinary prompt text (about 5 KB, the synthetic corpus's average template) through
 * Tare's {@link TokenizerRegistry} and {@link Tokenizer#count}, beside jtokkit's own
 * {@code countTokensOrdinary} on the same text: the difference is the wrapper's overhead. One thread;
 * multiply the score by {@link #TEXT_BYTES} for bytes per second.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.Throughput)
@OutputTimeUnit(TimeUnit.SECONDS)
@Warmup(iterations = 3, time = 2)
@Measurement(iterations = 5, time = 2)
@Fork(1)
public class TokenizerBenchmark {
    static final int TEXT_BYTES = 5_000;

    /** A built-in encoding, as named in {@link TokenizerRegistry#BUILT_IN}. */
    @Param({"o200k_base", "cl100k_base", "p50k_base", "r50k_base"})
    public String encoding;

    private String text;
    private Tokenizer tokenizer;
    private Encoding raw;

    @Setup
    public void load() {
        text = BenchTexts.ordinary(TEXT_BYTES, 5L);
        tokenizer = new TokenizerRegistry().get(encoding, Path.of("."));
        raw = Encodings.newLazyEncodingRegistry().getEncoding(encoding)
                .orElseThrow(() -> new IllegalArgumentException("jtokkit has no encoding " + encoding));
        if (tokenizer.count(text) != raw.countTokensOrdinary(text)) {
            throw new IllegalStateException(encoding + ": the wrapper and jtokkit disagree on the benchmark text");
        }
    }

    @Benchmark
    public int tareTokenizer() {
        return tokenizer.count(text);
    }

    @Benchmark
    public int jtokkitDirect() {
        return raw.countTokensOrdinary(text);
    }
}
