package dev.tare.cli;

import dev.tare.app.ScanProgress;
import java.io.PrintStream;
import java.util.concurrent.atomic.AtomicInteger;

/**
 * A one-line progress bar on standard error, redrawn at most ten times a second, for scans a person
 * watches: only when a terminal is attached and the output is for reading, never in machine-readable
 * output. Small scans (under {@value #MIN_FILES} files) show nothing.
 */
final class TerminalProgress implements ScanProgress {
    static final int MIN_FILES = 200;
    private static final int WIDTH = 30;
    private static final long REDRAW_NANOS = 100_000_000L;

    private final PrintStream err;
    private final AtomicInteger done = new AtomicInteger();
    private volatile int total;
    private volatile long lastDraw;

    private TerminalProgress(PrintStream err) {
        this.err = err;
    }

    /** A bar when a person is watching a text report, else nothing. */
    static ScanProgress forOutput(boolean machineReadable) {
        return !machineReadable && System.console() != null ? new TerminalProgress(System.err) : ScanProgress.NONE;
    }

    @Override
    public void started(int files) {
        total = files;
    }

    @Override
    public void advanced() {
        int now = done.incrementAndGet();
        long time = System.nanoTime();
        if (total >= MIN_FILES && time - lastDraw > REDRAW_NANOS) {
            lastDraw = time;
            draw(now);
        }
    }

    @Override
    public void finished() {
        if (total >= MIN_FILES) {
            synchronized (err) {
                err.print("\r" + " ".repeat(WIDTH + 40) + "\r");
                err.flush();
            }
        }
    }

    private void draw(int now) {
        int filled = (int) ((long) WIDTH * now / Math.max(1, total));
        synchronized (err) {
            err.print("\r[" + "#".repeat(filled) + ".".repeat(WIDTH - filled) + "] " + now + "/" + total + " templates");
            err.flush();
        }
    }
}
