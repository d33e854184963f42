import java.lang.reflect.Method;
import java.net.URL;
import java.net.URLClassLoader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;

/**
 * Compares the counting of two or more builds of Tare in one JVM: each jar is loaded by a class
 * loader of its own, and their passes over the same texts alternate, so that a machine whose speed
 * drifts slows them alike. Counting alone: the texts are read first, and each pass calls
 * {@code Tokenizer.count(String)} (which every build has) on every text for every encoding named.
 *
 * <p>{@code java -XX:+UseSerialGC -XX:TieredStopAtLevel=1 bench/CountSideBySide.java LIST ENCODINGS
 * PASSES JAR...}: LIST names one file a line (bench/common.sh's {@code bench_templates} writes one),
 * ENCODINGS is a comma-separated list of built-in encodings, and the JVM options are the launcher's
 * for {@code tare count}. Prints, per jar, the tokens and the fastest and median pass.
 */
public final class CountSideBySide {
    private CountSideBySide() {
    }

    public static void main(String[] args) throws Exception {
        if (args.length < 4 || !args[2].matches("[1-9][0-9]*")) {
            System.err.println("usage: java bench/CountSideBySide.java LIST ENCODING[,ENCODING...] PASSES JAR...");
            System.exit(2);
        }
        List<String> texts = new ArrayList<>();
        for (String line : Files.readAllLines(Path.of(args[0]), StandardCharsets.UTF_8)) {
            if (!line.isBlank()) {
                texts.add(Files.readString(Path.of(line), StandardCharsets.UTF_8));
            }
        }
        String[] encodings = args[1].split(",");
        int passes = Integer.parseInt(args[2]);
        int jars = args.length - 3;
        Object[][] tokenizers = new Object[jars][encodings.length];
        Method[] count = new Method[jars];
        for (int j = 0; j < jars; j++) {
            Path jar = Path.of(args[3 + j]);
            if (!Files.isRegularFile(jar)) {
                System.err.println("CountSideBySide: " + jar + ": no such jar; build one with mvn package");
                System.exit(2);
            }
            URLClassLoader loader = new URLClassLoader(new URL[] {jar.toUri().toURL()}, null);
            Class<?> registry = loader.loadClass("dev.tare.tokenize.TokenizerRegistry");
            Object made = registry.getConstructor().newInstance();
            Method get = registry.getMethod("get", String.class, Path.class);
            for (int e = 0; e < encodings.length; e++) {
                tokenizers[j][e] = get.invoke(made, encodings[e], Path.of("."));
            }
            count[j] = loader.loadClass("dev.tare.tokenize.Tokenizer").getMethod("count", String.class);
        }
        double[][] seconds = new double[jars][passes];
        long[] tokens = new long[jars];
        for (int pass = 0; pass < passes; pass++) {
            for (int j = 0; j < jars; j++) {
                long start = System.nanoTime();
                long total = 0;
                for (String text : texts) {
                    for (Object tokenizer : tokenizers[j]) {
                        total += (int) count[j].invoke(tokenizer, text);
                    }
                }
                seconds[j][pass] = (System.nanoTime() - start) / 1e9;
                tokens[j] = total;
            }
        }
        for (int j = 0; j < jars; j++) {
            double[] sorted = seconds[j].clone();
            Arrays.sort(sorted);
            System.out.printf(Locale.ROOT, "%s: %d tokens, fastest pass %.3f s, median %.3f s%n",
                    args[3 + j], tokens[j], sorted[0], sorted[passes / 2]);
        }
    }
}
