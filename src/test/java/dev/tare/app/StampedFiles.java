package dev.tare.app;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.FileTime;
import java.time.Instant;
import java.util.stream.Stream;

/**
 * The files of a repository that a cache test edits: written, edited behind the cache's back
 * (keeping a file's size and time, an edit a cache may miss), and aged out of the window in which a
 * file's stamp cannot vouch for it.
 */
public final class StampedFiles {
    /** A moment long past; always the same, so that a file no test touched keeps its stamp. */
    public static final FileTime LONG_AGO = FileTime.from(Instant.parse("2026-01-05T09:00:00Z"));

    private final Path root;

    public StampedFiles(Path root) {
        this.root = root;
    }

    public void write(String path, String text) throws IOException {
        Path file = root.resolve(path);
        Files.createDirectories(file.getParent());
        Files.writeString(file, text);
    }

    public String read(String path) throws IOException {
        return Files.readString(root.resolve(path));
    }

    /** Replaces a file's text with {@code text} of the same length, keeping its modification time. */
    public void replaceKeepingStamp(String path, String text) throws IOException {
        Path file = root.resolve(path);
        FileTime stamp = Files.getLastModifiedTime(file);
        assertEquals(Files.size(file), text.length(), "the planted text keeps the file's size");
        Files.writeString(file, text);
        Files.setLastModifiedTime(file, stamp);
    }

    /** Puts every file's time at {@link #LONG_AGO}. */
    public void ageEveryFile() throws IOException {
        try (Stream<Path> files = Files.walk(root)) {
            for (Path file : files.filter(Files::isRegularFile).toList()) {
                Files.setLastModifiedTime(file, LONG_AGO);
            }
        }
    }
}
