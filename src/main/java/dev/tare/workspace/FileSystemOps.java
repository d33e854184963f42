package dev.tare.workspace;

import java.io.IOException;
import java.nio.channels.FileChannel;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.StandardOpenOption;
import java.nio.file.attribute.PosixFileAttributeView;
import java.nio.file.attribute.PosixFilePermission;
import java.util.Optional;
import java.util.Set;

/**
 * The file-system steps a crash-safe write is made of, behind one seam so that tests can make any
 * step fail. {@link #DEFAULT} is the real file system.
 */
public interface FileSystemOps {
    /** The real file system. */
    FileSystemOps DEFAULT = new FileSystemOps() {
    };

    /** Reads a file whole. */
    default byte[] read(Path file) throws IOException {
        return Files.readAllBytes(file);
    }

    /** Creates a new, empty temporary file in {@code folder}. */
    default Path createTemp(Path folder, String prefix) throws IOException {
        return Files.createTempFile(folder, prefix, ".tmp");
    }

    /** Writes {@code bytes} to {@code file} and forces them to the storage device. */
    default void writeAndSync(Path file, byte[] bytes) throws IOException {
        try (FileChannel channel = FileChannel.open(file, StandardOpenOption.WRITE, StandardOpenOption.TRUNCATE_EXISTING)) {
            java.nio.ByteBuffer buffer = java.nio.ByteBuffer.wrap(bytes);
            while (buffer.hasRemaining()) {
                channel.write(buffer);
            }
            channel.force(true);
        }
    }

    /**
     * Whether this process may write {@code file}, as the operating system decides it: for the
     * file's owner that follows its write bit, and a superuser may write a file whose bits say
     * read-only, as every other Unix tool does.
     */
    default boolean isWritable(Path file) {
        return Files.isWritable(file);
    }

    /** The POSIX permissions of a file, where the file system has them. */
    default Optional<Set<PosixFilePermission>> permissions(Path file) throws IOException {
        PosixFileAttributeView view = Files.getFileAttributeView(file, PosixFileAttributeView.class);
        return view == null ? Optional.empty() : Optional.of(view.readAttributes().permissions());
    }

    /** Sets POSIX permissions. */
    default void setPermissions(Path file, Set<PosixFilePermission> permissions) throws IOException {
        Files.setPosixFilePermissions(file, permissions);
    }

    /** Replaces {@code target} with {@code source} in one step. */
    default void moveAtomically(Path source, Path target) throws IOException {
        Files.move(source, target, StandardCopyOption.ATOMIC_MOVE, StandardCopyOption.REPLACE_EXISTING);
    }

    /**
     * Forces a folder's entries to the storage device, so that a rename survives a crash. Best effort:
     * file systems that cannot open a folder for this are left as they are.
     */
    default void syncFolder(Path folder) {
        try (FileChannel channel = FileChannel.open(folder, StandardOpenOption.READ)) {
            channel.force(true);
        } catch (IOException e) {
            // Some platforms (Windows among them) cannot sync a folder; the rename itself is still atomic.
        }
    }

    /**
     * Puts {@code source} at {@code target} in one step, unless a file is there: a hard link, which
     * the file system refuses when the name is taken, then the temporary name removed. Where links
     * are not supported, an atomic rename after a check (a narrow window remains there).
     *
     * @return whether {@code target} now holds the file; false when a file was there
     */
    default boolean moveIfAbsent(Path source, Path target) throws IOException {
        try {
            Files.createLink(target, source);
            Files.delete(source);
            return true;
        } catch (java.nio.file.FileAlreadyExistsException e) {
            return false;
        } catch (UnsupportedOperationException | java.nio.file.FileSystemException e) {
            if (Files.exists(target, java.nio.file.LinkOption.NOFOLLOW_LINKS)) {
                return false;
            }
            Files.move(source, target, StandardCopyOption.ATOMIC_MOVE);
            return true;
        }
    }

    /** Creates a folder and the folders above it that are missing. */
    default void createFolders(Path folder) throws IOException {
        Files.createDirectories(folder);
    }

    /** Removes a file if it is there. */
    default void deleteIfExists(Path file) throws IOException {
        Files.deleteIfExists(file);
    }
}
