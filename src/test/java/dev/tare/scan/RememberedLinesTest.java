package dev.tare.scan;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.FileTime;
import java.util.List;
import java.util.Optional;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Lines remembered under a key: given back only for that key, and never from a damaged file. */
class RememberedLinesTest {
    private static final List<String> LINES = List.of("json", "", "a line\nwith a break", "ünïcödé ✓", "-");

    @Test
    void linesComeBackForTheirKeyOnly(@TempDir Path root) {
        RememberedLines.write(root, "args-test", "key one", LINES);
        RememberedLines.write(root, "args-test", "key two", List.of("other"));
        assertEquals(Optional.of(LINES), RememberedLines.read(root, "args-test", "key one"));
        assertEquals(Optional.of(List.of("other")), RememberedLines.read(root, "args-test", "key two"));
        assertEquals(Optional.empty(), RememberedLines.read(root, "args-test", "key three"));
        assertEquals(Optional.empty(), RememberedLines.read(root, "args-other", "key one"), "another kind");
        assertEquals(Optional.empty(), RememberedLines.read(root.resolve("elsewhere"), "args-test", "key one"));
        assertTrue(Files.exists(root.resolve(".tare/.gitignore")), "the cache folder is made as the others are");
    }

    @Test
    void theSameLinesAreNotWrittenAgain(@TempDir Path root) throws IOException {
        RememberedLines.write(root, "args-test", "key", LINES);
        Path file = onlyFile(root);
        Files.setLastModifiedTime(file, StampedFiles.LONG_AGO);
        RememberedLines.write(root, "args-test", "key", LINES);
        assertEquals(StampedFiles.LONG_AGO, Files.getLastModifiedTime(file));
        RememberedLines.write(root, "args-test", "key", List.of("changed"));
        assertEquals(Optional.of(List.of("changed")), RememberedLines.read(root, "args-test", "key"));
    }

    @Test
    void aDamagedOrTruncatedFileGivesNothingBack(@TempDir Path root) throws IOException {
        RememberedLines.write(root, "args-test", "key", LINES);
        Path file = onlyFile(root);
        byte[] bytes = Files.readAllBytes(file);
        for (int at = 0; at < bytes.length; at += 7) {
            byte[] damaged = bytes.clone();
            damaged[at] ^= 0x20;
            Files.write(file, damaged);
            assertEquals(Optional.empty(), RememberedLines.read(root, "args-test", "key"), "byte " + at + " flipped");
        }
        for (int length : new int[] {0, 3, 8, bytes.length - 1}) {
            Files.write(file, java.util.Arrays.copyOf(bytes, length));
            assertEquals(Optional.empty(), RememberedLines.read(root, "args-test", "key"), length + " bytes");
        }
        Files.delete(file);
        Files.createDirectory(file);
        assertEquals(Optional.empty(), RememberedLines.read(root, "args-test", "key"), "a folder in its place");
    }

    @Test
    void onlyTheNewestFewOfAKindAreKept(@TempDir Path root) throws IOException {
        for (int i = 0; i < 8; i++) {
            RememberedLines.write(root, "args-test", "key " + i, List.of(Integer.toString(i)));
            try (Stream<Path> files = Files.list(root.resolve(".tare/cache"))) {
                for (Path file : files.toList()) {
                    // Older than anything written from here on, so the newest is the last one written.
                    Files.setLastModifiedTime(file, FileTime.fromMillis(Files.getLastModifiedTime(file).toMillis() - 60_000));
                }
            }
        }
        try (Stream<Path> files = Files.list(root.resolve(".tare/cache"))) {
            assertEquals(CacheFolder.KEPT_OTHERS + 1, files.count());
        }
        assertEquals(Optional.of(List.of("7")), RememberedLines.read(root, "args-test", "key 7"));
        assertEquals(Optional.empty(), RememberedLines.read(root, "args-test", "key 0"));
    }

    private static Path onlyFile(Path root) throws IOException {
        try (Stream<Path> files = Files.list(root.resolve(".tare/cache"))) {
            List<Path> all = files.toList();
            assertEquals(1, all.size(), all.toString());
            return all.get(0);
        }
    }
}
