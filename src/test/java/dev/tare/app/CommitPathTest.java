package dev.tare.app;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.cli.Cli;
import dev.tare.testing.Git;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Real commits in repositories made here, with the hook installed by {@code tare hook install}. */
class CommitPathTest {
    private static final String LONG = "You answer billing questions for the city water utility, politely and briefly, in plain words.\n";

    @TempDir
    Path repo;

    private record Commit(int exitCode, String output) {
    }

    private Commit commit(String message, String... more) throws Exception {
        List<String> command = new java.util.ArrayList<>(List.of("git", "-c", "user.name=Test", "-c", "user.email=test@example.invalid",
                "-c", "commit.gpgsign=false", "commit", "-q", "-m", message));
        command.addAll(List.of(more));
        Process process = new ProcessBuilder(command)
                .directory(repo.toFile()).redirectErrorStream(true).start();
        process.getOutputStream().close();
        String output = new String(process.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
        assertTrue(process.waitFor(2, TimeUnit.MINUTES));
        return new Commit(process.exitValue(), output);
    }

    @BeforeEach
    void repositoryWithTheHook() throws Exception {
        Git.run(repo, "init", "-q");
        Files.createDirectories(repo.resolve("prompts"));
        Files.writeString(repo.resolve("tare.yaml"), "templates: {include: [\"prompts/*.md\"]}\nbudgets: {default: 12}\n");
        Files.writeString(repo.resolve("prompts/a.md"), "Answer billing questions.\n");
        Git.run(repo, "add", ".");
        Git.run(repo, "commit", "-q", "--no-verify", "-m", "start");
        Cli.Run install = Cli.run("hook", "install", repo.toString());
        assertEquals(0, install.exitCode(), install.err());
    }

    @Test
    void aBudgetBreachStopsTheCommitWithAClearMessage() throws Exception {
        Files.writeString(repo.resolve("prompts/a.md"), LONG);
        Git.run(repo, "add", "prompts/a.md");
        Commit blocked = commit("grow");
        assertEquals(1, blocked.exitCode(), blocked.output());
        assertTrue(blocked.output().contains("prompts/a.md:1:1: error over-budget"), blocked.output());
        assertTrue(blocked.output().contains("commit stopped by the pre-commit hook"), blocked.output());
        assertEquals("start\n", Git.run(repo, "log", "--format=%s"), "nothing was committed");
    }

    @Test
    void theHookReadsTheStagedContentNotTheWorkingTree() throws Exception {
        Files.writeString(repo.resolve("prompts/a.md"), "Answer billing questions briefly.\n");
        Git.run(repo, "add", "prompts/a.md");
        Files.writeString(repo.resolve("prompts/a.md"), LONG);
        Commit passed = commit("small change staged, large one not");
        assertEquals(0, passed.exitCode(), passed.output());

        Git.run(repo, "add", "prompts/a.md");
        Files.writeString(repo.resolve("prompts/a.md"), "Short again, but not staged.\n");
        Commit blocked = commit("large change staged");
        assertEquals(1, blocked.exitCode(), blocked.output());
    }

    @Test
    void commitAllAndCommitOfAPathAreCheckedThroughTheIndexGitMadeForThem() throws Exception {
        // For 'commit -a' and 'commit PATH' git builds a temporary index and names it in GIT_INDEX_FILE;
        // the real index still holds the small version, so reading it would let the breach through.
        Files.writeString(repo.resolve("prompts/a.md"), LONG);
        Commit all = commit("grow, with -a", "-a");
        assertEquals(1, all.exitCode(), all.output());
        assertTrue(all.output().contains("prompts/a.md:1:1: error over-budget"), all.output());
        Commit path = commit("grow, by path", "--", "prompts/a.md");
        assertEquals(1, path.exitCode(), path.output());
        assertTrue(path.output().contains("prompts/a.md:1:1: error over-budget"), path.output());
        assertEquals("start\n", Git.run(repo, "log", "--format=%s"), "nothing was committed");
    }

    @Test
    void aBaselineRegressionIsCaught() throws Exception {
        Files.writeString(repo.resolve("tare.yaml"), "templates: {include: [\"prompts/*.md\"]}\n");
        assertEquals(0, Cli.run("baseline", repo.toString()).exitCode());
        Git.run(repo, "add", ".");
        assertEquals(0, commit("record the baseline").exitCode());
        Files.writeString(repo.resolve("prompts/a.md"), LONG);
        Git.run(repo, "add", "prompts/a.md");
        Commit blocked = commit("grow past the baseline");
        assertEquals(1, blocked.exitCode(), blocked.output());
        assertTrue(blocked.output().contains("error baseline-growth: grew from"), blocked.output());
    }

    private static final String SPACED = "Reply  briefly.  Read  the  account  number  back.  Then  ask  one  question.\n";

    @Test
    void withHookFixACommitPassesAfterSafeRewritesAndTheFixIsStaged() throws Exception {
        dev.tare.tokenize.Tokenizer o200k = new dev.tare.tokenize.TokenizerRegistry().get("o200k_base", repo);
        String fixed = SPACED.replace("  ", " ");
        int budget = (o200k.count(SPACED) + o200k.count(fixed)) / 2;
        assertTrue(o200k.count(fixed) <= budget && budget < o200k.count(SPACED), "the budget lies between the two");
        Files.writeString(repo.resolve("tare.yaml"), "templates: {include: [\"prompts/*.md\"]}\nbudgets: {default: "
                + budget + "}\nhook: {fix: true}\n");
        Files.writeString(repo.resolve("prompts/a.md"), SPACED);
        Git.run(repo, "add", ".");
        Commit passed = commit("double spaces, made single by the hook");
        assertEquals(0, passed.exitCode(), passed.output());
        assertEquals(fixed, Files.readString(repo.resolve("prompts/a.md")));
        assertEquals(fixed, Git.run(repo, "show", "HEAD:prompts/a.md"), "the committed file is the fixed one");
    }

    @Test
    void aPartiallyStagedFileIsReportedAndLeftAlone() throws Exception {
        Files.writeString(repo.resolve("tare.yaml"), "templates: {include: [\"prompts/*.md\"]}\nhook: {fix: true}\n");
        Git.run(repo, "add", "tare.yaml");
        Files.writeString(repo.resolve("prompts/a.md"), "Answer billing questions.   \n");
        Git.run(repo, "add", "prompts/a.md");
        String unstaged = "Answer billing questions.   \nAnd one unstaged line.\n";
        Files.writeString(repo.resolve("prompts/a.md"), unstaged);
        Commit passed = commit("partially staged");
        assertEquals(0, passed.exitCode(), passed.output());
        assertTrue(passed.output().contains("partially staged"), passed.output());
        assertEquals(unstaged, Files.readString(repo.resolve("prompts/a.md")), "the working tree is untouched");
        assertEquals("Answer billing questions.   \n", Git.run(repo, "show", "HEAD:prompts/a.md"), "the staged text is committed as it was");
    }

    @Test
    void filesThatAreNotStagedAreNotChecked() throws Exception {
        Files.writeString(repo.resolve("prompts/other.md"), LONG);
        Files.writeString(repo.resolve("notes.txt"), "not a template");
        Git.run(repo, "add", "notes.txt");
        Commit passed = commit("an unstaged template over budget does not matter");
        assertEquals(0, passed.exitCode(), passed.output());
        assertEquals(List.of("notes.txt"), List.of(Git.run(repo, "show", "--name-only", "--format=", "HEAD").strip()));
    }
}
