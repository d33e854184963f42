import dev.tare.TareException;
import dev.tare.overlap.SharedBlock;
import dev.tare.overlap.SharedBlocks;
import dev.tare.scan.TemplateLoader;
import dev.tare.scan.Workspace;
import dev.tare.source.FileSelection;
import dev.tare.template.Template;
import dev.tare.tokenize.Tokenizer;
import dev.tare.tokenize.TokenizerRegistry;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;

/**
 * Times Tare's overlap analysis (the shared blocks behind the {@code shared-block} rule) on a
 * repository, apart from reading and parsing it: the templates are loaded first, then
 * {@link SharedBlocks#find} runs over all of them at once, as {@code tare check} runs it.
 *
 * <p>Run with {@code java -cp target/tare.jar bench/Overlap.java CORPUS [MIN_TOKENS] [RUNS]}
 * after {@code mvn -q package -DskipTests}; {@code bench/overlap.sh} does both.
 */
public final class Overlap {
    public static void main(String[] args) {
        if (args.length < 1 || args.length > 3) {
            System.err.println("usage: java -cp target/tare.jar bench/Overlap.java CORPUS [MIN_TOKENS] [RUNS]");
            System.exit(2);
        }
        int minTokens = args.length > 1 ? Integer.parseInt(args[1]) : 50;
        int runs = args.length > 2 ? Integer.parseInt(args[2]) : 1;
        Workspace workspace = Workspace.open(List.of(Path.of(args[0])), Optional.empty());
        TemplateLoader loader = new TemplateLoader(workspace);
        long loadStart = System.nanoTime();
        FileSelection selection = loader.find();
        List<Template> templates = new ArrayList<>();
        long chars = 0;
        for (String path : selection.paths()) {
            try {
                Template template = loader.load(path);
                templates.add(template);
                chars += template.source().length();
            } catch (TareException e) {
                // Skipped as the check skips it.
            }
        }
        double loadSeconds = (System.nanoTime() - loadStart) / 1e9;
        Tokenizer tokenizer = new TokenizerRegistry().get(workspace.config().targets().isEmpty()
                ? TokenizerRegistry.DEFAULT : workspace.config().targets().get(0).tokenizer(), workspace.root());
        System.gc();
        Runtime runtime = Runtime.getRuntime();
        System.out.printf(Locale.ROOT, "templates: %,d (%,d characters), read and parsed in %.2f s; they take %,d MiB"
                        + " of heap%n", templates.size(), chars, loadSeconds, (runtime.totalMemory() - runtime.freeMemory()) >> 20);
        System.out.printf(Locale.ROOT, "machine: %d cores, Java %s, max heap %,d MiB%n",
                Runtime.getRuntime().availableProcessors(), System.getProperty("java.version"),
                Runtime.getRuntime().maxMemory() >> 20);
        for (int run = 1; run <= runs; run++) {
            long start = System.nanoTime();
            List<SharedBlock> blocks = SharedBlocks.find(templates, tokenizer, minTokens);
            double seconds = (System.nanoTime() - start) / 1e9;
            long places = blocks.stream().mapToLong(b -> b.places().size()).sum();
            System.out.printf(Locale.ROOT, "run %d: %,d shared blocks of %d+ tokens in %,d places, %.2f s,"
                            + " %.1f MB of template text per second%n",
                    run, blocks.size(), minTokens, places, seconds, chars / 1e6 / seconds);
        }
    }
}
