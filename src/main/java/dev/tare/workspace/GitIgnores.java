package dev.tare.workspace;

import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayDeque;
import java.util.Deque;
import java.util.Iterator;
import org.eclipse.jgit.ignore.IgnoreNode;

/**
 * The {@code .gitignore} files in force while walking a tree: those of the folders between the git
 * work tree's top and the scanned root, the repository's {@code .git/info/exclude}, and each nested
 * {@code .gitignore} as the walk enters its folder. The deepest rule that speaks decides, as in git.
 * Pattern matching itself is JGit's.
 */
final class GitIgnores {
    private record Level(Path dir, IgnoreNode rules) {
    }

    private final Deque<Level> levels = new ArrayDeque<>();

    /** Loads the rules that apply above {@code root}: its ancestors up to the git top, and info/exclude. */
    static GitIgnores above(Path root) throws IOException {
        GitIgnores ignores = new GitIgnores();
        Path top = ignores.gitTop(root);
        if (top == null) {
            return ignores;
        }
        ignores.push(top, top.resolve(".git").resolve("info").resolve("exclude"));
        Deque<Path> chain = new ArrayDeque<>();
        for (Path dir = root.getParent(); dir != null && dir.startsWith(top); dir = dir.getParent()) {
            chain.push(dir);
        }
        for (Path dir : chain) {
            ignores.enter(dir);
        }
        return ignores;
    }

    /** Starts the rules of {@code dir}'s own {@code .gitignore}, if any, until {@link #leave}. */
    void enter(Path dir) throws IOException {
        push(dir, dir.resolve(".gitignore"));
    }

    /** Ends the rules started by the matching {@link #enter}. */
    void leave(Path dir) {
        Level top = levels.peek();
        if (top != null && top.dir().equals(dir)) {
            levels.pop();
        }
    }

    /** Whether git would ignore {@code path}. */
    boolean isIgnored(Path path, boolean directory) {
        for (Iterator<Level> it = levels.iterator(); it.hasNext(); ) {
            Level level = it.next();
            if (!path.startsWith(level.dir()) || path.equals(level.dir())) {
                continue;
            }
            String relative = TemplateFinder.relative(level.dir(), path);
            IgnoreNode.MatchResult result = level.rules().isIgnored(relative, directory);
            if (result == IgnoreNode.MatchResult.IGNORED) {
                return true;
            }
            if (result == IgnoreNode.MatchResult.NOT_IGNORED) {
                return false;
            }
        }
        return false;
    }

    private void push(Path dir, Path rulesFile) throws IOException {
        if (!Files.isRegularFile(rulesFile)) {
            return;
        }
        IgnoreNode node = new IgnoreNode();
        try (InputStream in = Files.newInputStream(rulesFile)) {
            node.parse(rulesFile.toString(), in);
        }
        levels.push(new Level(dir, node));
    }

    private Path gitTop(Path root) {
        for (Path dir = root; dir != null; dir = dir.getParent()) {
            if (Files.exists(dir.resolve(".git"))) {
                return dir;
            }
        }
        return null;
    }
}
