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
import java.util.function.BiPredicate;

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
     * named directly is taken even if no include glob matches it, as a user who names a file means it;
     * so is a named folder: where the globs select nothing in it, the files in it that look like
     * prompts ({@link PromptLikeness}) are taken.
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
                Set<String> found = new TreeSet<>();
                walk(absolute, new Walker(ignores, found, skipped, absolute, this::selected));
                if (found.isEmpty() && !starts.isEmpty()) {
                    // The first walk reported the links it would not follow.
                    walk(absolute, new Walker(ignores, found, new ArrayList<>(), absolute, this::promptLike));
                }
                paths.addAll(found);
            }
        } catch (IOException e) {
            throw new TareException(root + ": the folder walk failed (" + e.getMessage() + ")", e);
        }
        skipped.sort(null);
        return new FileSelection(new ArrayList<>(paths), skipped);
    }

    /**
     * The files below the root that look like prompts ({@link PromptLikeness}), whatever the include
     * globs say, outside excluded folders and what git ignores, sorted.
     */
    public List<String> promptLikeFiles() {
        Set<String> paths = new TreeSet<>();
        try {
            walk(root, new Walker(GitIgnores.above(root), paths, new ArrayList<>(), root, this::promptLike));
        } catch (IOException e) {
            throw new TareException(root + ": the folder walk failed (" + e.getMessage() + ")", e);
        }
        return new ArrayList<>(paths);
    }

    private static void walk(Path start, Walker walker) throws IOException {
        Files.walkFileTree(start, EnumSet.of(FileVisitOption.FOLLOW_LINKS), Integer.MAX_VALUE, walker);
    }

    private boolean selected(Path file, String relative) {
        return Glob.anyMatches(include, relative) && !excluded(relative, false);
    }

    private boolean promptLike(Path file, String relative) {
        return !excluded(relative, false) && PromptLikeness.test(file, relative);
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
        private final BiPredicate<Path, String> selects;

        Walker(GitIgnores ignores, Set<String> paths, List<SkippedFile> skipped, Path start,
               BiPredicate<Path, String> selects) {
            this.start = start;
            this.selects = selects;
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
            if (!selects.test(file, relative)) {
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
