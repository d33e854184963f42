package dev.tare.source;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.io.IOException;
import java.nio.file.AccessDeniedException;
import java.nio.file.FileSystemException;
import java.nio.file.NoSuchFileException;
import org.junit.jupiter.api.Test;

/** File errors read as words, never as the name of a Java exception. */
class IoProblemTest {
    @Test
    void commonErrorsInWords() {
        assertEquals("no such file or folder", IoProblem.describe(new NoSuchFileException("/tmp/x")));
        assertEquals("permission denied", IoProblem.describe(new AccessDeniedException("/tmp/x")));
        assertEquals("No space left on device", IoProblem.describe(new FileSystemException("/tmp/x", null,
                "No space left on device")));
        assertEquals("disk on fire", IoProblem.describe(new IOException("disk on fire")));
    }
}
