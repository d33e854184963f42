package dev.tare.workspace;

import java.io.IOException;
import java.nio.file.Path;
import java.nio.file.attribute.PosixFilePermission;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.Arrays;
import java.util.Optional;
import java.util.Set;

/**
 * Replaces a file's content so that it is either fully rewritten or left exactly as it was: the new
 * bytes go to a temporary file in the same folder, are forced to disk, take the original's POSIX
 * permissions, and are renamed over the original in one atomic step (the folder then synced), but
 * only if the original still has the bytes the rewrite was computed from. The temporary file never
 * survives a failure.
 */
public final class SafeFileWriter {
    /** What became of one write. */
    public enum Outcome {
        /** The file now holds the new bytes. */
        WRITTEN,
        /** The new bytes equal the old: the file was not touched (its modification time stays). */
        UNCHANGED,
        /** The file changed on disk after it was read; it was left alone. */
        CHANGED_MEANWHILE
    }

    private final FileSystemOps files;

    public SafeFileWriter(FileSystemOps files) {
        this.files = files;
    }

    /** A writer on the real file system. */
    public SafeFileWriter() {
        this(FileSystemOps.DEFAULT);
    }

    /**
     * Replaces {@code file}'s content with {@code updated}, provided it still holds {@code original}.
     *
     * @throws IOException when a step fails; the original is then intact and no temporary file remains
     */
    public Outcome replace(Path file, byte[] original, byte[] updated) throws IOException {
        if (Arrays.equals(original, updated)) {
            return Outcome.UNCHANGED;
        }
        Path folder = file.toAbsolutePath().getParent();
        Optional<Set<PosixFilePermission>> permissions = files.permissions(file);
        Path temp = files.createTemp(folder, "." + file.getFileName() + ".tare-");
        boolean moved = false;
        try {
            files.writeAndSync(temp, updated);
            if (permissions.isPresent()) {
                files.setPermissions(temp, permissions.get());
            }
            if (!Arrays.equals(sha256(files.read(file)), sha256(original))) {
                return Outcome.CHANGED_MEANWHILE;
            }
            files.moveAtomically(temp, file);
            moved = true;
            files.syncFolder(folder);
            return Outcome.WRITTEN;
        } finally {
            if (!moved) {
                files.deleteIfExists(temp);
            }
        }
    }

    /**
     * Creates {@code file} holding {@code bytes}, all at once: it appears whole or not at all.
     * A file that is there, or appears meanwhile, is left alone: it is never replaced.
     *
     * @throws IOException when a step fails; no temporary file remains
     */
    public Outcome create(Path file, byte[] bytes) throws IOException {
        return create(file, bytes, Optional.empty());
    }

    /**
     * Creates {@code file} as {@link #create(Path, byte[])} does, with the given POSIX permissions
     * (a temporary file is otherwise readable by its owner only).
     */
    public Outcome create(Path file, byte[] bytes, Optional<Set<PosixFilePermission>> permissions) throws IOException {
        Path temp = files.createTemp(file.toAbsolutePath().getParent(), "." + file.getFileName() + ".tare-");
        boolean moved = false;
        try {
            files.writeAndSync(temp, bytes);
            if (permissions.isPresent()) {
                files.setPermissions(temp, permissions.get());
            }
            if (!files.moveIfAbsent(temp, file)) {
                return Outcome.CHANGED_MEANWHILE;
            }
            moved = true;
            files.syncFolder(file.toAbsolutePath().getParent());
            return Outcome.WRITTEN;
        } finally {
            if (!moved) {
                files.deleteIfExists(temp);
            }
        }
    }

    private static byte[] sha256(byte[] bytes) {
        try {
            return MessageDigest.getInstance("SHA-256").digest(bytes);
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("every Java runtime has SHA-256", e);
        }
    }
}
