package dev.tare.app;

/** Hears how far a scan has got, for showing progress; called from the scanning threads. */
public interface ScanProgress {
    /** Hears nothing. */
    ScanProgress NONE = new ScanProgress() {
    };

    /** The scan is about to measure {@code files} files. */
    default void started(int files) {
    }

    /** One more file is done (measured or skipped). */
    default void advanced() {
    }

    /** Every file is done. */
    default void finished() {
    }
}
