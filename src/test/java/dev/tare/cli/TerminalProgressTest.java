package dev.tare.cli;

import static org.junit.jupiter.api.Assertions.assertSame;

import dev.tare.app.ScanProgress;
import org.junit.jupiter.api.Test;

class TerminalProgressTest {
    @Test
    void machineReadableOutputNeverGetsABar() {
        assertSame(ScanProgress.NONE, TerminalProgress.forOutput(true));
    }

    @Test
    void withoutATerminalThereIsNoBar() {
        // Under the build tool, standard input and output are not a terminal, so System.console() is null.
        org.junit.jupiter.api.Assumptions.assumeTrue(System.console() == null, "run without a terminal");
        assertSame(ScanProgress.NONE, TerminalProgress.forOutput(false));
    }
}
