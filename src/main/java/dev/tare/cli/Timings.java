package dev.tare.cli;

import dev.tare.tokenize.TokenizerRegistry;
import java.io.PrintWriter;
import java.lang.management.ManagementFactory;
import java.util.Locale;

/** The {@code --timings} breakdown: how long the JVM took to reach Tare, tokenizer loading, and the rest. */
final class Timings {
    private Timings() {
    }

    /** Prints the breakdown of a command that started running at {@code commandStartNanos}. */
    static void print(PrintWriter err, long commandStartNanos) {
        long now = System.nanoTime();
        double commandMillis = (now - commandStartNanos) / 1e6;
        double uptimeMillis = ManagementFactory.getRuntimeMXBean().getUptime();
        double startMillis = Math.max(0, uptimeMillis - commandMillis);
        double loadMillis = TokenizerRegistry.loadMillis();
        err.println(String.format(Locale.ROOT, "timings: start %.0f ms, tokenizer load %.0f ms, work %.0f ms, total %.0f ms",
                startMillis, loadMillis, Math.max(0, commandMillis - loadMillis), uptimeMillis));
        err.flush();
    }
}
