package dev.tare.source;

import dev.tare.TareException;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.function.Predicate;
import org.eclipse.jgit.dircache.DirCache;
import org.eclipse.jgit.dircache.DirCacheIterator;
import org.eclipse.jgit.lib.Constants;
import org.eclipse.jgit.lib.ObjectId;
import org.eclipse.jgit.lib.ObjectReader;
import org.eclipse.jgit.lib.Repository;
import org.eclipse.jgit.revwalk.RevWalk;
import org.eclipse.jgit.storage.file.FileRepositoryBuilder;
import org.eclipse.jgit.treewalk.CanonicalTreeParser;
import org.eclipse.jgit.treewalk.EmptyTreeIterator;
import org.eclipse.jgit.treewalk.TreeWalk;
import org.eclipse.jgit.treewalk.filter.TreeFilter;

/**
 * Reads what is staged for the next commit, from the git index rather than the working tree: the
 * files added or changed against {@code HEAD} (all of them before the first commit), with their
 * staged bytes. Reading goes through JGit, so no {@code git} process is started.
 */
public final class GitIndex {
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
        FileRepositoryBuilder builder = new FileRepositoryBuilder().readEnvironment().findGitDir(inside.toAbsolutePath().toFile());
        if (builder.getGitDir() == null) {
            throw new TareException(inside + " is not inside a git work tree; --staged needs one");
        }
        try (Repository repository = builder.build()) {
            Path top = repository.getWorkTree().toPath().toAbsolutePath().normalize();
            return new GitIndex(top, staged(repository, top, wanted));
        } catch (IOException e) {
            throw new TareException("the git index cannot be read (" + e.getMessage() + ")", e);
        }
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
        FileRepositoryBuilder builder = new FileRepositoryBuilder().readEnvironment().findGitDir(root.toAbsolutePath().toFile());
        try (Repository repository = builder.build(); org.eclipse.jgit.api.Git git = org.eclipse.jgit.api.Git.wrap(repository)) {
            Path top = repository.getWorkTree().toPath().toAbsolutePath().normalize();
            org.eclipse.jgit.api.AddCommand add = git.add();
            for (String path : paths) {
                add.addFilepattern(top.relativize(root.toAbsolutePath().normalize().resolve(path)).toString().replace('\\', '/'));
            }
            add.call();
        } catch (IOException | org.eclipse.jgit.api.errors.GitAPIException e) {
            throw new TareException("the fixed files cannot be staged (" + e.getMessage() + "); stage them with git add", e);
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

    private static List<StagedFile> staged(Repository repository, Path top, Predicate<Path> wanted) throws IOException {
        List<StagedFile> staged = new ArrayList<>();
        DirCache index = repository.readDirCache();
        try (ObjectReader reader = repository.newObjectReader(); TreeWalk walk = new TreeWalk(repository, reader)) {
            ObjectId head = repository.resolve(Constants.HEAD);
            if (head == null) {
                walk.addTree(new EmptyTreeIterator());
            } else {
                try (RevWalk commits = new RevWalk(reader)) {
                    CanonicalTreeParser tree = new CanonicalTreeParser();
                    tree.reset(reader, commits.parseCommit(head).getTree());
                    walk.addTree(tree);
                }
            }
            int inIndex = walk.addTree(new DirCacheIterator(index));
            walk.setRecursive(true);
            walk.setFilter(TreeFilter.ANY_DIFF);
            while (walk.next()) {
                DirCacheIterator entry = walk.getTree(inIndex, DirCacheIterator.class);
                if (entry == null || entry.getDirCacheEntry().getFileMode().getObjectType() != Constants.OBJ_BLOB) {
                    continue;
                }
                String path = walk.getPathString();
                Path onDisk = top.resolve(path).normalize();
                if (!wanted.test(onDisk)) {
                    continue;
                }
                byte[] bytes = reader.open(entry.getDirCacheEntry().getObjectId()).getBytes();
                boolean same = Files.isRegularFile(onDisk) && Arrays.equals(bytes, Files.readAllBytes(onDisk));
                staged.add(new StagedFile(path, bytes, same));
            }
        }
        return staged;
    }
}
