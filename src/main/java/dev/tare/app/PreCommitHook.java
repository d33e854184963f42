package dev.tare.app;

import dev.tare.TareException;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.attribute.PosixFilePermissions;
import java.util.concurrent.TimeUnit;

/**
 * Installs and removes Tare's git pre-commit hook. The hook runs {@code tare hook run} through the
 * command it is given at install (the {@code ./tare} launcher, or {@code java -jar} with a jar). A
 * hook Tare did not write is never replaced silently: it can be chained (kept, and run before
 * Tare's) or, with force, replaced after a backup copy is kept.
 */
public final class PreCommitHook {
    /** The line that marks a hook as Tare's own. */
    static final String MARKER = "# tare-managed-hook";
    /** Where a chained hook is kept; Tare's hook runs it first. */
    static final String CHAINED = "pre-commit.before-tare";
    /** Where a hook replaced with force is kept. */
    static final String BACKUP = "pre-commit.tare-backup";

    private final Path hooks;

    private PreCommitHook(Path hooks) {
        this.hooks = hooks;
    }

    /**
     * The hook of the repository that {@code inside} belongs to, honouring {@code core.hooksPath}
     * and linked work trees (asks {@code git rev-parse --git-path hooks}).
     */
    public static PreCommitHook of(Path inside) {
        return new PreCommitHook(hooksFolder(inside));
    }

    /** What {@link #install} did. */
    public enum Installed { NEW, UPDATED, CHAINED, REPLACED }

    /** What {@link #uninstall} did. */
    public enum Removed { REMOVED, RESTORED_CHAINED, NOTHING_INSTALLED }

    /** The hook file. */
    public Path file() {
        return hooks.resolve("pre-commit");
    }

    /**
     * Writes Tare's hook, which runs {@code command} (already shell-quoted).
     *
     * @param chain keep an existing foreign hook and run it first
     * @param force replace an existing foreign hook, keeping a backup copy
     * @throws TareException when a foreign hook is there and neither is asked for
     */
    public Installed install(String command, boolean chain, boolean force) throws IOException {
        Files.createDirectories(hooks);
        Path file = file();
        Installed outcome = Installed.NEW;
        if (Files.exists(file)) {
            if (isOurs(file)) {
                outcome = Installed.UPDATED;
            } else if (chain) {
                if (Files.exists(hooks.resolve(CHAINED))) {
                    throw new TareException(hooks.resolve(CHAINED) + " already exists; move it away before chaining another hook");
                }
                Files.move(file, hooks.resolve(CHAINED));
                outcome = Installed.CHAINED;
            } else if (force) {
                Files.copy(file, hooks.resolve(BACKUP), StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.COPY_ATTRIBUTES);
                outcome = Installed.REPLACED;
            } else {
                throw new TareException(file + " is a pre-commit hook Tare did not write; run 'tare hook install --chain'"
                        + " to keep it and run it first, or '--force' to replace it (a copy is kept as " + BACKUP + ")");
            }
        }
        writeExecutable(file, script(command));
        return outcome;
    }

    /**
     * Removes Tare's hook and puts a chained hook back in its place.
     *
     * @throws TareException when the hook there is not Tare's
     */
    public Removed uninstall() throws IOException {
        Path file = file();
        if (!Files.exists(file)) {
            return Removed.NOTHING_INSTALLED;
        }
        if (!isOurs(file)) {
            throw new TareException(file + " was not written by Tare; it is left alone");
        }
        Path chained = hooks.resolve(CHAINED);
        if (Files.exists(chained)) {
            Files.move(chained, file, StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.ATOMIC_MOVE);
            return Removed.RESTORED_CHAINED;
        }
        Files.delete(file);
        return Removed.REMOVED;
    }

    private static boolean isOurs(Path file) throws IOException {
        return Files.readString(file, StandardCharsets.ISO_8859_1).contains(MARKER);
    }

    static String script(String command) {
        return "#!/bin/sh\n"
                + MARKER + ": written by 'tare hook install'; 'tare hook uninstall' removes it.\n"
                + "hooks=$(dirname \"$0\")\n"
                + "if [ -x \"$hooks/" + CHAINED + "\" ]; then\n"
                + "  \"$hooks/" + CHAINED + "\" \"$@\" || exit $?\n"
                + "fi\n"
                + "exec " + command + " hook run\n";
    }

    private static void writeExecutable(Path file, String text) throws IOException {
        Path temp = Files.createTempFile(file.getParent(), ".pre-commit.", ".tmp");
        try {
            Files.writeString(temp, text, StandardCharsets.UTF_8);
            Files.setPosixFilePermissions(temp, PosixFilePermissions.fromString("rwxr-xr-x"));
            Files.move(temp, file, StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.ATOMIC_MOVE);
        } finally {
            Files.deleteIfExists(temp);
        }
    }

    private static Path hooksFolder(Path inside) {
        try {
            Process process = new ProcessBuilder("git", "rev-parse", "--git-path", "hooks")
                    .directory(inside.toFile()).redirectErrorStream(true).start();
            process.getOutputStream().close();
            String output = new String(process.getInputStream().readAllBytes(), StandardCharsets.UTF_8).strip();
            if (!process.waitFor(30, TimeUnit.SECONDS) || process.exitValue() != 0) {
                throw new TareException(inside + " is not inside a git work tree (git says: " + output + ")");
            }
            return inside.resolve(output).toAbsolutePath().normalize();
        } catch (IOException e) {
            throw new TareException("git cannot be run (" + e.getMessage() + "); install git to use hooks", e);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new TareException("interrupted while asking git for the hooks folder", e);
        }
    }
}
