package dev.tare.bench;

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
 * Counting one long run of spaces between two words beside ordinary prose of the same size, at three
 * sizes: what is left of the rule engine's time on its 1 MiB-of-spaces input is this count, so this
 * shows how the tokenizer's time grows with the length of one whitespace piece.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 2, time = 2)
@Measurement(iterations = 3, time = 2)
@Fork(1)
public class LongWhitespaceBenchmark {
    /** The text's size in bytes. */
    @Param({"65536", "262144", "1048576"})
    public int bytes;

    /** One run of spaces between two words, or ordinary prose. */
    @Param({"spaces", "prose"})
    public String text;

    /** A built-in encoding. */
    @Param({"o200k_base"})
    public String encoding;

    private String input;
    private Tokenizer tokenizer;

    @Setup
    public void load() {
        input = text.equals("spaces") ? BenchTexts.spaces(bytes) : BenchTexts.ordinary(bytes, 7L);
        tokenizer = new TokenizerRegistry().get(encoding, Path.of("."));
    }

    @Benchmark
    public int count() {
        return tokenizer.count(input);
    }
}
