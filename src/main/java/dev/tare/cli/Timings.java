package dev.tare.cli;

import java.io.PrintWriter;
import java.lang.management.ManagementFactory;
import java.lang.management.RuntimeMXBean;
import java.util.Locale;

/**
 * The {@code --timings} breakdown: how long the JVM took to reach Tare's command (JVM start, class
 * loading, parsing the command line), tokenizer loading, the rest of the command's work, and whether
 * the class-data archive was in use.
 */
final class Timings {
    private Timings() {
    }

    /**
     * Prints the breakdown of a command that started running at {@code commandStartNanos} and spent
     * {@code loadMillis} of its time loading tokenizers.
     */
    static void print(PrintWriter err, long commandStartNanos, double loadMillis) {
        long now = System.nanoTime();
        // Reading the JVM's uptime loads the management classes; taking the clock right after it, not
        // before, keeps that loading out of the start figure.
        RuntimeMXBean runtime = ManagementFactory.getRuntimeMXBean();
        double uptimeMillis = runtime.getUptime();
        double jvmStartMillis = System.nanoTime() / 1e6 - uptimeMillis;
        double startMillis = Math.max(0, commandStartNanos / 1e6 - jvmStartMillis);
        double commandMillis = (now - commandStartNanos) / 1e6;
        String archive = ClassArchive.status(runtime.getInputArguments(), System.getProperty("java.vm.info", ""));
        err.println(String.format(Locale.ROOT, "timings: start %.0f ms, tokenizer load %.0f ms, work %.0f ms, total %.0f ms;"
                        + " class-data archive: %s",
                startMillis, loadMillis, Math.max(0, commandMillis - loadMillis), startMillis + commandMillis, archive));
        err.flush();
    }
}
