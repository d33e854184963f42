package dev.tare.workspace;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.FileTime;
import java.nio.file.attribute.PosixFilePermissions;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class SafeFileWriterTest {
    @TempDir
    Path dir;

    private static byte[] bytes(String text) {
        return text.getBytes(StandardCharsets.UTF_8);
    }

    private List<String> folderContents() throws IOException {
        try (Stream<Path> files = Files.list(dir)) {
            return files.map(p -> p.getFileName().toString()).sorted().toList();
        }
    }

    @Test
    void replacesTheContentAndKeepsTheMode() throws IOException {
        Path file = Files.write(dir.resolve("run.md"), bytes("old\r\n"));
        Files.setPosixFilePermissions(file, PosixFilePermissions.fromString("rwxr-x---"));
        assertEquals(SafeFileWriter.Outcome.WRITTEN, new SafeFileWriter().replace(file, bytes("old\r\n"), bytes("new\r\n")));
        assertArrayEquals(bytes("new\r\n"), Files.readAllBytes(file));
        assertEquals("rwxr-x---", PosixFilePermissions.toString(Files.getPosixFilePermissions(file)));
        assertEquals(List.of("run.md"), folderContents(), "no temporary file is left behind");
    }

    @Test
    void leavesAnUnchangedFileUntouched() throws IOException {
        Path file = Files.write(dir.resolve("a.md"), bytes("same"));
        FileTime old = FileTime.fromMillis(1_000_000_000_000L);
        Files.setLastModifiedTime(file, old);
        assertEquals(SafeFileWriter.Outcome.UNCHANGED, new SafeFileWriter().replace(file, bytes("same"), bytes("same")));
        assertEquals(old, Files.getLastModifiedTime(file));
    }

    @Test
    void leavesAFileThatChangedMeanwhileAlone() throws IOException {
        Path file = Files.write(dir.resolve("a.md"), bytes("edited by someone else"));
        assertEquals(SafeFileWriter.Outcome.CHANGED_MEANWHILE,
                new SafeFileWriter().replace(file, bytes("what we read"), bytes("our rewrite")));
        assertArrayEquals(bytes("edited by someone else"), Files.readAllBytes(file));
        assertEquals(List.of("a.md"), folderContents());
    }

    @Test
    void aFailureAfterTheTempFileIsWrittenLeavesTheOriginalAndNoTempFile() throws IOException {
        Path file = Files.write(dir.resolve("a.md"), bytes("original"));
        FileSystemOps failingPermissions = new FileSystemOps() {
            @Override
            public void setPermissions(Path target, java.util.Set<java.nio.file.attribute.PosixFilePermission> p) throws IOException {
                throw new IOException("injected failure after the temporary file was written");
            }
        };
        assertThrows(IOException.class, () -> new SafeFileWriter(failingPermissions).replace(file, bytes("original"), bytes("new")));
        assertArrayEquals(bytes("original"), Files.readAllBytes(file));
        assertEquals(List.of("a.md"), folderContents());
    }

    @Test
    void aFailureAtTheRenameLeavesTheOriginalAndNoTempFile() throws IOException {
        Path file = Files.write(dir.resolve("a.md"), bytes("original"));
        FileSystemOps failingRename = new FileSystemOps() {
            @Override
            public void moveAtomically(Path source, Path target) throws IOException {
                throw new IOException("injected failure at the rename");
            }
        };
        assertThrows(IOException.class, () -> new SafeFileWriter(failingRename).replace(file, bytes("original"), bytes("new")));
        assertArrayEquals(bytes("original"), Files.readAllBytes(file));
        assertEquals(List.of("a.md"), folderContents());
    }
}
