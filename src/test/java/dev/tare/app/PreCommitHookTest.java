package dev.tare.app;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.TareException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.PosixFilePermissions;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Install and uninstall in real repositories made with the git command line. */
class PreCommitHookTest {
    @TempDir
    Path repo;
    private Path hookFile;

    @BeforeEach
    void initRepository() throws Exception {
        dev.tare.testing.Git.run(repo, "init", "-q");
        hookFile = repo.resolve(".git/hooks/pre-commit");
    }

    @Test
    void installsAnExecutableHookAndRemovesOnlyItsOwn() throws Exception {
        PreCommitHook hook = PreCommitHook.of(repo);
        assertEquals(hookFile.getParent().toRealPath(), hook.file().getParent().toRealPath());
        assertEquals(PreCommitHook.Installed.NEW, hook.install("tare", false, false));
        assertTrue(Files.readString(hookFile).contains(PreCommitHook.MARKER));
        assertTrue(Files.readString(hookFile).endsWith("exec tare hook run\n"));
        assertEquals("rwxr-xr-x", PosixFilePermissions.toString(Files.getPosixFilePermissions(hookFile)));
        assertEquals(PreCommitHook.Installed.UPDATED, hook.install("tare", false, false));
        assertEquals(PreCommitHook.Removed.REMOVED, hook.uninstall());
        assertFalse(Files.exists(hookFile));
        assertEquals(PreCommitHook.Removed.NOTHING_INSTALLED, hook.uninstall());
    }

    @Test
    void refusesAForeignHookUnlessChainedOrForced() throws Exception {
        Files.writeString(hookFile, "#!/bin/sh\necho theirs\n");
        PreCommitHook hook = PreCommitHook.of(repo);
        TareException refused = assertThrows(TareException.class, () -> hook.install("tare", false, false));
        assertTrue(refused.getMessage().contains("--chain") && refused.getMessage().contains("--force"), refused.getMessage());
        assertEquals("#!/bin/sh\necho theirs\n", Files.readString(hookFile), "left exactly as it was");
        assertThrows(TareException.class, hook::uninstall, "a foreign hook is not removed");

        assertEquals(PreCommitHook.Installed.CHAINED, hook.install("tare", true, false));
        assertEquals("#!/bin/sh\necho theirs\n", Files.readString(hookFile.resolveSibling(PreCommitHook.CHAINED)));
        assertTrue(Files.readString(hookFile).contains(PreCommitHook.CHAINED));
        assertEquals(PreCommitHook.Removed.RESTORED_CHAINED, hook.uninstall());
        assertEquals("#!/bin/sh\necho theirs\n", Files.readString(hookFile), "the chained hook is back");

        assertEquals(PreCommitHook.Installed.REPLACED, hook.install("tare", false, true));
        assertEquals("#!/bin/sh\necho theirs\n", Files.readString(hookFile.resolveSibling(PreCommitHook.BACKUP)));
    }

    @Test
    void theChainedHookRunsFirstAndCanStopTheCommit() throws Exception {
        Files.writeString(hookFile, "#!/bin/sh\necho ran >> \"$(dirname \"$0\")/../../chained.log\"\nexit 7\n");
        Files.setPosixFilePermissions(hookFile, PosixFilePermissions.fromString("rwxr-xr-x"));
        PreCommitHook.of(repo).install("echo never-reached", true, false);
        Process process = new ProcessBuilder("sh", hookFile.toString()).directory(repo.toFile()).start();
        assertEquals(7, process.waitFor());
        assertEquals("ran\n", Files.readString(repo.resolve("chained.log")));
    }
}
