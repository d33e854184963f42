package dev.tare.workspace;

import dev.tare.TareException;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.function.Predicate;

/**
 * Reads what is staged for the next commit, from the git index rather than the working tree: the
 * files added or changed against {@code HEAD} (all of them before the first commit), with their
 * staged bytes. Reading goes through the {@code git} command line (three short runs: the work tree's
 * top, the staged changes, the wanted files' bytes in one batch), which starts in a few milliseconds
 * and reads exactly the index git itself would commit.
 */
public final class GitIndex {
    private static final String REGULAR_FILE = "100644";
    private static final String EXECUTABLE_FILE = "100755";

    private final Path workTree;
    private final List<StagedFile> files;

    private GitIndex(Path workTree, List<StagedFile> files) {
        this.workTree = workTree;
        this.files = List.copyOf(files);
    }

    /**
     * Reads the index of the repository that {@code inside} belongs to.
     *
     * @throws TareException when {@code inside} is not in a git work tree or the index cannot be read
     */
    public static GitIndex read(Path inside) {
        return read(inside, file -> true);
    }

    /**
     * Reads the index of the repository that {@code inside} belongs to, keeping only the staged files
     * that {@code wanted} accepts (given their absolute, normalized paths). Only those are read from
     * the object database and compared with the working tree, so a commit that also stages large
     * files that are not templates costs no more than one that does not.
     *
     * @throws TareException when {@code inside} is not in a git work tree or the index cannot be read
     */
    public static GitIndex read(Path inside, Predicate<Path> wanted) {
        GitCommand git = topOf(inside, "--staged needs one");
        Path top = git.folder();
        List<Change> changes = stagedChanges(git).stream().filter(change -> wanted.test(top.resolve(change.path()).normalize())).toList();
        List<byte[]> contents = blobs(git, changes);
        List<StagedFile> staged = new ArrayList<>();
        for (int i = 0; i < changes.size(); i++) {
            String path = changes.get(i).path();
            byte[] bytes = contents.get(i);
            staged.add(new StagedFile(path, bytes, sameOnDisk(top.resolve(path), bytes)));
        }
        return new GitIndex(top, staged);
    }

    /**
     * Stages {@code paths} (relative to {@code root}, a folder of the work tree) as they now are on disk.
     *
     * @throws TareException when the index cannot be written
     */
    public static void stage(Path root, List<String> paths) {
        if (paths.isEmpty()) {
            return;
        }
        GitCommand git = topOf(root, "the fixed files cannot be staged");
        Path top = git.folder();
        List<String> command = new ArrayList<>(List.of("add", "--"));
        for (String path : paths) {
            command.add(top.relativize(root.toAbsolutePath().normalize().resolve(path)).toString().replace('\\', '/'));
        }
        try {
            git.run(new byte[0], command.toArray(String[]::new));
        } catch (GitCommand.Failed e) {
            throw new TareException("the fixed files cannot be staged (" + e.getMessage() + "); stage them with git add", e);
        }
    }

    private static GitCommand topOf(Path inside, String consequence) {
        Path folder = inside.toAbsolutePath().normalize();
        if (!Files.isDirectory(folder)) {
            folder = folder.getParent();
        }
        try {
            // The top as a way up from the folder, not git's own absolute path, which resolves links:
            // the paths Tare compares with it are spelt the way the user reached the repository.
            String up = new String(new GitCommand(folder).run(new byte[0], "rev-parse", "--is-inside-work-tree", "--show-cdup"),
                    StandardCharsets.UTF_8);
            List<String> lines = up.lines().toList();
            if (lines.isEmpty() || !lines.get(0).equals("true")) {
                throw new GitCommand.Failed("not in a work tree");
            }
            String cdup = lines.size() > 1 ? lines.get(1).strip() : "";
            return new GitCommand(folder.resolve(cdup).normalize());
        } catch (GitCommand.Failed e) {
            throw new TareException(inside + " is not inside a git work tree (" + e.getMessage() + "); " + consequence);
        }
    }

    /** A staged regular file that differs from {@code HEAD}: its object id and its path from the top. */
    private record Change(String id, String path) {
    }

    private static List<Change> stagedChanges(GitCommand git) {
        byte[] raw;
        try {
            raw = git.run(new byte[0], "diff", "--cached", "--raw", "-z", "--no-renames", "--no-abbrev", "--no-color",
                    "--no-ext-diff", "--ignore-submodules=all");
        } catch (GitCommand.Failed e) {
            throw new TareException("the git index cannot be read (" + e.getMessage() + ")", e);
        }
        // -z records: ":SRC_MODE DST_MODE SRC_ID DST_ID STATUS" NUL "PATH" NUL
        String[] fields = new String(raw, StandardCharsets.UTF_8).split("\0");
        List<Change> changes = new ArrayList<>();
        for (int i = 0; i + 1 < fields.length; i += 2) {
            String[] meta = fields[i].split(" ");
            if (meta.length != 5 || !meta[0].startsWith(":")) {
                throw new TareException("git printed a staged change Tare cannot read: '" + fields[i] + "'");
            }
            String mode = meta[1];
            if (mode.equals(REGULAR_FILE) || mode.equals(EXECUTABLE_FILE)) {
                changes.add(new Change(meta[3], fields[i + 1]));
            }
        }
        return changes;
    }

    /** The bytes of each change's staged object, in order, read with one batch. */
    private static List<byte[]> blobs(GitCommand git, List<Change> changes) {
        if (changes.isEmpty()) {
            return List.of();
        }
        StringBuilder ids = new StringBuilder();
        for (Change change : changes) {
            ids.append(change.id()).append('\n');
        }
        byte[] out;
        try {
            out = git.run(ids.toString().getBytes(StandardCharsets.US_ASCII), "cat-file", "--batch");
        } catch (GitCommand.Failed e) {
            throw new TareException("the staged files cannot be read from git (" + e.getMessage() + ")", e);
        }
        List<byte[]> blobs = new ArrayList<>();
        int at = 0;
        for (Change change : changes) {
            // Each answer: "ID TYPE SIZE" LF, SIZE bytes, LF; or "ID missing" LF.
            int end = indexOf(out, (byte) '\n', at);
            String[] head = new String(out, at, Math.max(0, end - at), StandardCharsets.US_ASCII).split(" ");
            if (end < 0 || head.length != 3 || !head[1].equals("blob")) {
                throw new TareException("the staged version of " + change.path() + " cannot be read from git ("
                        + String.join(" ", head).strip() + "); run git fsck");
            }
            int size = Integer.parseInt(head[2]);
            blobs.add(Arrays.copyOfRange(out, end + 1, end + 1 + size));
            at = end + 1 + size + 1;
        }
        return blobs;
    }

    private static int indexOf(byte[] bytes, byte wanted, int from) {
        for (int i = from; i < bytes.length; i++) {
            if (bytes[i] == wanted) {
                return i;
            }
        }
        return -1;
    }

    private static boolean sameOnDisk(Path file, byte[] staged) {
        try {
            return Files.isRegularFile(file) && Files.size(file) == staged.length && Arrays.equals(staged, Files.readAllBytes(file));
        } catch (IOException e) {
            throw new TareException(file + " cannot be read (" + e.getMessage() + "); check its permissions", e);
        }
    }

    /** The work tree's top folder. */
    public Path workTree() {
        return workTree;
    }

    /** The staged files that differ from {@code HEAD}, by path. */
    public List<StagedFile> files() {
        return files;
    }
}
