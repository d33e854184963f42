package dev.tare.cache;

import java.io.BufferedOutputStream;
import java.io.IOException;
import java.io.OutputStream;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.attribute.FileTime;
import java.util.Comparator;
import java.util.List;
import java.util.stream.Stream;

/** The {@code .tare/cache} folder of a root: where it is, and writing files there whole. */
public final class CacheFolder {
    /** Caches of other builds or configurations kept beside the one written, newest first, per kind. */
    public static final int KEPT_OTHERS = 3;

    private CacheFolder() {
    }

    static Path of(Path root) {
        return root.resolve(".tare").resolve("cache");
    }

    /** Creates the folder, and the {@code .gitignore} that keeps it out of git (and out of every walk), when missing. */
    static Path prepare(Path root) throws IOException {
        Path folder = Files.createDirectories(of(root));
        Path ignore = folder.getParent().resolve(".gitignore");
        if (!Files.exists(ignore)) {
            Files.writeString(ignore, "# Tare's cache of measurements; safe to delete.\n*\n");
        }
        return folder;
    }

    /** What writes a file's contents (a cache) to a stream. */
    interface Body {
        void writeTo(OutputStream out) throws IOException;
    }

    /**
     * Writes {@code contents} to a temporary file beside {@code target} and moves it into place: a
     * cache of a large repository is tens of megabytes, written as it is made rather than held.
     */
    static void replace(Path target, Body contents) throws IOException {
        Path folder = Files.createDirectories(target.getParent());
        Path temporary = Files.createTempFile(folder, "write-", ".partial");
        try {
            try (OutputStream out = new BufferedOutputStream(Files.newOutputStream(temporary), 1 << 16)) {
                contents.writeTo(out);
            }
            try {
                Files.move(temporary, target, StandardCopyOption.ATOMIC_MOVE, StandardCopyOption.REPLACE_EXISTING);
            } catch (AtomicMoveNotSupportedException e) {
                Files.move(temporary, target, StandardCopyOption.REPLACE_EXISTING);
            }
        } finally {
            Files.deleteIfExists(temporary);
        }
    }

    /**
     * Deletes all but the newest few other files named {@code prefix*.bin}: each build and
     * configuration makes its own, and a developer rebuilding Tare all day would otherwise leave one
     * per build.
     */
    static void pruneOthers(Path kept, String prefix) throws IOException {
        List<Path> others;
        try (Stream<Path> files = Files.list(kept.getParent())) {
            others = files.filter(f -> !f.equals(kept))
                    .filter(f -> f.getFileName().toString().startsWith(prefix) && f.getFileName().toString().endsWith(".bin"))
                    .sorted(Comparator.comparing(CacheFolder::modified).reversed())
                    .toList();
        }
        for (Path old : others.subList(Math.min(KEPT_OTHERS, others.size()), others.size())) {
            Files.deleteIfExists(old);
        }
    }

    private static FileTime modified(Path file) {
        try {
            return Files.getLastModifiedTime(file);
        } catch (IOException e) {
            return FileTime.fromMillis(0);
        }
    }
}
