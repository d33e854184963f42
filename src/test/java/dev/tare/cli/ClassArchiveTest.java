package dev.tare.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Test;

/** How --timings reports the class-data archive. */
class ClassArchiveTest {
    @Test
    void reportsWhetherTheArchiveIsInUse() {
        assertEquals("none", ClassArchive.status(List.of("-Xmx1g"), "mixed mode, sharing"));
        assertEquals("in use", ClassArchive.status(List.of("-XX:SharedArchiveFile=/x/tare.jsa", "-Xshare:auto"), "mixed mode, sharing"));
        assertEquals("in use", ClassArchive.status(List.of("-XX:AOTCache=/x/tare.aot"), "mixed mode, sharing"));
        assertTrue(ClassArchive.status(List.of("-XX:AOTCache=/x/tare.aot"), "mixed mode").startsWith("not used"));
    }
}
