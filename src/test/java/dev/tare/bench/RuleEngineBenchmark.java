package dev.tare.bench;

import dev.tare.app.Check;
import dev.tare.app.CheckOptions;
import dev.tare.app.CheckResult;
import dev.tare.tokenize.TokenizerRegistry;
import dev.tare.workspace.Workspace;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.TimeUnit;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Level;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.TearDown;
import org.openjdk.jmh.annotations.Warmup;

/**
 * The rule engine ({@link Check#run}: read, parse, every built-in rule and rule pack, suppressions,
 * sorting) over one file, pathological or ordinary. Each pathological input is paired with ordinary
 * prompt text of the same size, so the ratio of their times shows whether some rule or step grows
 * faster than the text: the goal is each pathological input within 3x of its ordinary twin.
 *
 * <ul>
 *   <li>{@code spaces}: 1 MiB of spaces between two words;</li>
 *   <li>{@code identical-lines}: 100,000 copies of one ordinary sentence line, one paragraph;</li>
 *   <li>{@code single-line}: 10 MiB of ordinary sentences on one line.</li>
 * </ul>
 *
 * <p>One invocation is seconds long, so each iteration times a single run ({@link Mode#SingleShotTime}).
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.SingleShotTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 2)
@Measurement(iterations = 5)
@Fork(value = 1, jvmArgsAppend = {"-Xms1g", "-Xmx1g"})
public class RuleEngineBenchmark {
    static final int SPACES_BYTES = 1 << 20;
    static final int IDENTICAL_LINES = 100_000;
    static final int SINGLE_LINE_BYTES = 10 << 20;
    private static final long SEED = 9_2026L;

    /** Which pathological input, and so which size. */
    @Param({"spaces", "identical-lines", "single-line"})
    public String shape;

    /** The pathological input itself, or ordinary prompt text of the same size. */
    @Param({"pathological", "ordinary"})
    public String text;

    private Path folder;
    private Check check;

    @Setup(Level.Trial)
    public void writeRepository() throws IOException {
        String input = input(shape, text.equals("ordinary"));
        folder = Files.createTempDirectory("tare-rule-bench");
        Files.writeString(folder.resolve("tare.yaml"), """
                templates:
                  include: ["*.md"]
                  max_file_bytes: 33554432
                targets:
                  - name: main
                    tokenizer: o200k_base
                  - name: lite
                    tokenizer: cl100k_base
                budgets: {default: 4000}
                """, StandardCharsets.UTF_8);
        Files.writeString(folder.resolve("input.md"), input, StandardCharsets.UTF_8);
        check = new Check(Workspace.open(List.of(folder), Optional.empty()), new TokenizerRegistry());
        CheckResult result = check.run(CheckOptions.defaults());
        if (result.templates() != 1 || !result.skipped().isEmpty()) {
            throw new IllegalStateException("the benchmark input was not checked: " + result.skipped());
        }
        System.out.printf("%n%s %s: %,d bytes, %,d findings%n", shape, text, BenchTexts.utf8Length(input),
                result.findings().size());
    }

    /** The input for {@code shape}: pathological, or ordinary text of the same UTF-8 size. */
    static String input(String shape, boolean ordinary) {
        String pathological = switch (shape) {
            case "spaces" -> BenchTexts.spaces(SPACES_BYTES);
            case "identical-lines" -> BenchTexts.identicalLines(IDENTICAL_LINES);
            case "single-line" -> BenchTexts.singleLine(SINGLE_LINE_BYTES, SEED);
            default -> throw new IllegalArgumentException("unknown shape " + shape);
        };
        return ordinary ? BenchTexts.ordinary(BenchTexts.utf8Length(pathological), SEED) : pathological;
    }

    @TearDown(Level.Trial)
    public void removeRepository() throws IOException {
        BenchFolders.delete(folder);
    }

    @Benchmark
    public CheckResult check() {
        return check.run(CheckOptions.defaults());
    }
}
