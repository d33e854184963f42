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
 * The files are read before the clock starts, and a first pass over the leading few megabytes
 * warms the JIT up, so the figure is counting alone: no JVM start, no reading, no Tare.
 *
 * <p>{@code java -cp TEST_CLASSPATH dev.tare.bench.RawJtokkitCount LIST ENCODING...} prints one line
 * per encoding: the encoding, the total tokens and the seconds spent counting.
 */
public final class RawJtokkitCount {
    /** Characters counted once, untimed, before the timed pass. */
    private static final long WARM_UP_CHARS = 8_000_000;

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
            long warmed = 0;
            for (int i = 0; i < texts.size() && warmed < WARM_UP_CHARS; i++) {
                encoding.countTokensOrdinary(texts.get(i));
                warmed += texts.get(i).length();
            }
            long tokens = 0;
            long start = System.nanoTime();
            for (String text : texts) {
                tokens += encoding.countTokensOrdinary(text);
            }
            double seconds = (System.nanoTime() - start) / 1e9;
            System.out.println(name + " " + tokens + " " + String.format(Locale.ROOT, "%.3f", seconds));
        }
    }
}
