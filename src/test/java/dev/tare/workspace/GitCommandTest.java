package dev.tare.workspace;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.nio.file.Path;
import java.util.HashMap;
import java.util.Map;
import org.junit.jupiter.api.Test;

/** What the git command line is started with. */
class GitCommandTest {
    @Test
    void pathsGitGaveRelativeToTheHooksFolderAreMadeAbsolute() {
        // Observed with git 2.x: a plain 'git commit' runs the pre-commit hook with GIT_INDEX_FILE=.git/index.
        Map<String, String> environment = new HashMap<>(Map.of("GIT_INDEX_FILE", ".git/index", "GIT_DIR",
                "/repo/.git/worktrees/wt", "GIT_WORK_TREE", "../tree", "GIT_AUTHOR_NAME", "a/b", "GIT_COMMON_DIR", ""));
        GitCommand.absolutePaths(environment, Path.of("/repo/top"));
        assertEquals("/repo/top/.git/index", environment.get("GIT_INDEX_FILE"));
        assertEquals("/repo/.git/worktrees/wt", environment.get("GIT_DIR"), "absolute already");
        assertEquals("/repo/tree", environment.get("GIT_WORK_TREE"));
        assertEquals("a/b", environment.get("GIT_AUTHOR_NAME"), "not a path variable");
        assertEquals("", environment.get("GIT_COMMON_DIR"), "empty stays empty");
    }
}
