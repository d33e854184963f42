package dev.tare.workspace;

import dev.tare.TareException;
import dev.tare.config.Glob;
import java.io.IOException;
import java.nio.file.FileSystemLoopException;
import java.nio.file.FileVisitOption;
import java.nio.file.FileVisitResult;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.SimpleFileVisitor;
import java.nio.file.attribute.BasicFileAttributes;
import java.util.ArrayList;
import java.util.EnumSet;
import java.util.List;
import java.util.Set;
import java.util.TreeSet;

/**
 * Finds template files below a root: those matching an include glob and no exclude glob, not
 * ignored by git, reached without leaving the root through a symbolic link. Links inside the root
 * are followed; a link loop or a link out of the root is reported and not followed.
 */
public final class TemplateFinder {
    /** Files Tare itself writes or reads as configuration, never templates. */
    private static final Set<String> OWN_FILES = Set.of("tare.yaml", "tare.yml", "tare-baseline.json");

    private final Path root;
    private final Path realRoot;
    private final List<Glob> include;
    private final List<Glob> exclude;

    /**
     * @param root    the scanned root; paths in results are relative to it
     * @param include globs a file must match one of to be a template
     * @param exclude globs that remove files (and whole folders, for patterns ending in {@code /**})
     */
    public TemplateFinder(Path root, List<Glob> include, List<Glob> exclude) {
        this.root = root.toAbsolutePath().normalize();
        try {
            this.realRoot = this.root.toRealPath();
        } catch (IOException e) {
            throw new TareException(root + ": cannot be read as a folder (" + e.getMessage() + ")", e);
        }
        this.include = List.copyOf(include);
        this.exclude = List.copyOf(exclude);
    }

    /**
     * Walks {@code starts} (files or folders inside the root; the root itself when empty). A file
     * named directly is taken even if no include glob matches it, as a user who names a file means it.
     */
    public FileSelection find(List<Path> starts) {
        Set<String> paths = new TreeSet<>();
        List<SkippedFile> skipped = new ArrayList<>();
        List<Path> from = starts.isEmpty() ? List.of(root) : starts;
        GitIgnores ignores;
        try {
            ignores = GitIgnores.above(root);
            for (Path start : from) {
                Path absolute = start.toAbsolutePath().normalize();
                if (!absolute.startsWith(root)) {
                    throw new TareException(start + " is outside the scanned root " + root
                            + "; scan it on its own or give --config from its repository");
                }
                if (Files.isRegularFile(absolute)) {
                    String relative = relative(absolute);
                    if (isInsideRoot(absolute, relative, skipped)) {
                        paths.add(relative);
                    }
                    continue;
                }
                if (!Files.isDirectory(absolute)) {
                    throw new TareException(start + ": no such file or folder");
                }
                enterAncestors(ignores, absolute);
                Files.walkFileTree(absolute, EnumSet.of(FileVisitOption.FOLLOW_LINKS), Integer.MAX_VALUE,
                        new Walker(ignores, paths, skipped, absolute));
            }
        } catch (IOException e) {
            throw new TareException(root + ": the folder walk failed (" + e.getMessage() + ")", e);
        }
        skipped.sort(null);
        return new FileSelection(new ArrayList<>(paths), skipped);
    }

    /**
     * Whether a root-relative path would be selected by the globs (for files that come from
     * somewhere other than a walk, such as the git index). Git's ignore rules are not consulted:
     * a staged file is tracked whatever they say.
     */
    public boolean selects(String relative) {
        return !OWN_FILES.contains(relative) && Glob.anyMatches(include, relative) && !excluded(relative, false)
                && !relative.startsWith(".git/") && !relative.startsWith(".tare/");
    }

    private void enterAncestors(GitIgnores ignores, Path start) throws IOException {
        List<Path> chain = new ArrayList<>();
        for (Path dir = start.getParent(); dir != null && dir.startsWith(root); dir = dir.getParent()) {
            chain.add(0, dir);
        }
        for (Path dir : chain) {
            ignores.enter(dir);
        }
    }

    private String relative(Path absolute) {
        return relative(root, absolute);
    }

    /**
     * {@code path} relative to {@code folder}, with {@code /}: for a path below the folder (both
     * normalized, as a walk makes them), the rest of its text, which costs far less than
     * {@link Path#relativize} on every file of a walk.
     */
    static String relative(Path folder, Path path) {
        String inside = path.toString();
        String outside = folder.toString();
        if (inside.length() > outside.length() && inside.startsWith(outside)
                && inside.charAt(outside.length()) == folder.getFileSystem().getSeparator().charAt(0)) {
            return inside.substring(outside.length() + 1).replace('\\', '/');
        }
        return folder.relativize(path).toString().replace('\\', '/');
    }

    private boolean isInsideRoot(Path absolute, String relative, List<SkippedFile> skipped) throws IOException {
        if (absolute.toRealPath().startsWith(realRoot)) {
            return true;
        }
        skipped.add(new SkippedFile(relative, "symbolic link to a place outside the scanned root; not followed"));
        return false;
    }

    private boolean excluded(String relative, boolean directory) {
        if (Glob.anyMatches(exclude, relative)) {
            return true;
        }
        return directory && Glob.anyMatches(exclude, relative + "/");
    }

    private final class Walker extends SimpleFileVisitor<Path> {
        private final GitIgnores ignores;
        private final Set<String> paths;
        private final List<SkippedFile> skipped;

        /** Where this walk started, which the caller did not check: it may lie below a link. */
        private final Path start;

        Walker(GitIgnores ignores, Set<String> paths, List<SkippedFile> skipped, Path start) {
            this.start = start;
            this.ignores = ignores;
            this.paths = paths;
            this.skipped = skipped;
        }

        @Override
        public FileVisitResult preVisitDirectory(Path dir, BasicFileAttributes attrs) throws IOException {
            String relative = relative(dir);
            if (!dir.equals(root)) {
                if (dir.getFileName().toString().equals(".git") || dir.getFileName().toString().equals(".tare")) {
                    return FileVisitResult.SKIP_SUBTREE;
                }
                if (ignores.isIgnored(dir, true) || excluded(relative, true)) {
                    return FileVisitResult.SKIP_SUBTREE;
                }
                // Below a folder known to be inside the root only a link can lead out of it, and
                // resolving every folder's real path costs a system call per path component.
                boolean mayLeave = dir.equals(start) || Files.isSymbolicLink(dir);
                if (mayLeave && !isInsideRoot(dir, relative, skipped)) {
                    return FileVisitResult.SKIP_SUBTREE;
                }
            }
            ignores.enter(dir);
            return FileVisitResult.CONTINUE;
        }

        @Override
        public FileVisitResult postVisitDirectory(Path dir, IOException failure) {
            ignores.leave(dir);
            return FileVisitResult.CONTINUE;
        }

        @Override
        public FileVisitResult visitFile(Path file, BasicFileAttributes attrs) throws IOException {
            String relative = relative(file);
            if (!attrs.isRegularFile() || OWN_FILES.contains(relative) || ignores.isIgnored(file, false)) {
                return FileVisitResult.CONTINUE;
            }
            if (!Glob.anyMatches(include, relative) || excluded(relative, false)) {
                return FileVisitResult.CONTINUE;
            }
            if (Files.isSymbolicLink(file) && !isInsideRoot(file, relative, skipped)) {
                return FileVisitResult.CONTINUE;
            }
            paths.add(relative);
            return FileVisitResult.CONTINUE;
        }

        @Override
        public FileVisitResult visitFileFailed(Path file, IOException failure) {
            String relative = relative(file);
            if (failure instanceof FileSystemLoopException) {
                skipped.add(new SkippedFile(relative, "symbolic link loop; not followed"));
            } else {
                skipped.add(new SkippedFile(relative, "cannot be read (" + failure.getMessage() + ")"));
            }
            return FileVisitResult.CONTINUE;
        }
    }
}
