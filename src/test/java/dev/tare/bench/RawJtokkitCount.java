package dev.tare.bench;

import com.knuddels.jtokkit.Encodings;
import com.knuddels.jtokkit.api.Encoding;
import com.knuddels.jtokkit.api.EncodingRegistry;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * The yardstick of bench/compare.sh for Tare's own overhead and parallel scaling: jtokkit alone,
 * one thread, counting the texts of every file named in LIST (one path a line) the way
 * {@code tare count} does (UTF-8, a leading byte-order mark left out, {@code countTokensOrdinary}).
 * The files are read before the clock starts, and the figure is jtokkit at its best: one whole pass
 * untimed, then the fastest of {@link #TIMED_PASSES} timed passes. jtokkit's JIT warm-up is long on
 * this corpus: its first two passes ran 1.5 to 3 times slower than the later ones, and a yardstick
 * timed after a short warm-up moved between 1.7 and 4.9 seconds from one run to the next.
 * So the figure is counting alone, at its steadiest: no JVM start, no reading, no Tare.
 *
 * <p>{@code java -cp TEST_CLASSPATH dev.tare.bench.RawJtokkitCount LIST ENCODING...} prints one line
 * per encoding: the encoding, the total tokens and the seconds of the fastest pass.
 */
public final class RawJtokkitCount {
    /** Passes timed after the untimed one; the fastest is reported. */
    private static final int TIMED_PASSES = 3;

    private RawJtokkitCount() {
    }

    public static void main(String[] args) throws IOException {
        if (args.length < 2) {
            System.err.println("usage: RawJtokkitCount LIST ENCODING...");
            System.exit(2);
        }
        List<String> texts = new ArrayList<>();
        for (String line : Files.readAllLines(Path.of(args[0]), StandardCharsets.UTF_8)) {
            if (!line.isEmpty()) {
                String text = Files.readString(Path.of(line), StandardCharsets.UTF_8);
                texts.add(text.startsWith("\uFEFF") ? text.substring(1) : text);
            }
        }
        EncodingRegistry registry = Encodings.newLazyEncodingRegistry();
        for (int e = 1; e < args.length; e++) {
            String name = args[e];
            Encoding encoding = registry.getEncoding(name)
                    .orElseThrow(() -> new IllegalArgumentException("jtokkit has no encoding " + name));
            count(encoding, texts);
            long tokens = 0;
            double seconds = Double.MAX_VALUE;
            for (int pass = 0; pass < TIMED_PASSES; pass++) {
                long start = System.nanoTime();
                tokens = count(encoding, texts);
                seconds = Math.min(seconds, (System.nanoTime() - start) / 1e9);
            }
            System.out.println(name + " " + tokens + " " + String.format(Locale.ROOT, "%.3f", seconds));
        }
    }

    private static long count(Encoding encoding, List<String> texts) {
        long tokens = 0;
        for (String text : texts) {
            tokens += encoding.countTokensOrdinary(text);
        }
        return tokens;
    }
}
