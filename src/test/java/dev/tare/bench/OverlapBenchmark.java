package dev.tare.bench;

import dev.tare.app.TemplateLoader;
import dev.tare.overlap.RepeatedBlock;
import dev.tare.overlap.SharedBlocks;
import dev.tare.template.Template;
import dev.tare.tokenize.Tokenizer;
import dev.tare.tokenize.TokenizerRegistry;
import dev.tare.workspace.Workspace;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.SplittableRandom;
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
 * The overlap analysis behind the {@code shared-block} rule ({@link SharedBlocks#find}: every
 * template's words, one suffix sort over all of them, the maximal runs two or more templates hold)
 * over a generated set of templates, each a few paragraphs drawn from a shared pool plus text of its
 * own, as prompt repositories that copy boilerplate look. Two sizes, four times apart: the ratio of
 * their times shows how the analysis grows with the repository (linear would be about 4).
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.SingleShotTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 2)
@Measurement(iterations = 5)
@Fork(value = 1, jvmArgsAppend = {"-Xms1g", "-Xmx1g"})
public class OverlapBenchmark {
    private static final int POOL = 40;
    private static final int MIN_TOKENS = 50;

    /** How many templates. */
    @Param({"500", "2000"})
    public int templates;

    private Path folder;
    private List<Template> parsed;
    private Tokenizer tokenizer;

    @Setup(Level.Trial)
    public void writeRepository() throws IOException {
        folder = Files.createTempDirectory("tare-overlap-bench");
        Files.writeString(folder.resolve("tare.yaml"), "templates:\n  include: [\"*.md\"]\n", StandardCharsets.UTF_8);
        List<String> pool = new ArrayList<>();
        for (int i = 0; i < POOL; i++) {
            pool.add(words(BenchTexts.ordinary(600, 1_000L + i)));
        }
        SplittableRandom random = new SplittableRandom(7L);
        for (int t = 0; t < templates; t++) {
            StringBuilder text = new StringBuilder(words(BenchTexts.ordinary(1_200, 50_000L + t)));
            for (int p = 0; p < 3; p++) {
                text.append("\n\n").append(pool.get(random.nextInt(POOL)));
            }
            Files.writeString(folder.resolve(String.format("t%05d.md", t)), text.append('\n').toString(), StandardCharsets.UTF_8);
        }
        Workspace workspace = Workspace.open(List.of(folder), Optional.empty());
        TemplateLoader loader = new TemplateLoader(workspace);
        parsed = new ArrayList<>();
        for (String path : loader.find().paths()) {
            parsed.add(loader.load(path));
        }
        tokenizer = new TokenizerRegistry().defaultTokenizer();
        List<RepeatedBlock> blocks = SharedBlocks.find(parsed, tokenizer, MIN_TOKENS);
        if (parsed.size() != templates || blocks.isEmpty()) {
            throw new IllegalStateException("the benchmark repository has " + parsed.size() + " templates and "
                    + blocks.size() + " shared blocks");
        }
        System.out.printf("%n%,d templates, %,d shared blocks%n", parsed.size(), blocks.size());
    }

    /** Prompt prose without its placeholders, which a cut at a byte count could leave half open. */
    private static String words(String text) {
        return text.replace("{{", "").replace("}}", "");
    }

    @TearDown(Level.Trial)
    public void removeRepository() throws IOException {
        BenchFolders.delete(folder);
    }

    @Benchmark
    public List<RepeatedBlock> sharedBlocks() {
        return SharedBlocks.find(parsed, tokenizer, MIN_TOKENS);
    }
}
