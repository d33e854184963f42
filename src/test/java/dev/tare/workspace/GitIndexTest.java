package dev.tare.workspace;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.TareException;
import dev.tare.testing.Git;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The staged content of real repositories made with the git command line. */
class GitIndexTest {
    @TempDir
    Path repo;

    @Test
    void listsWhatDiffersFromHeadWithTheStagedBytes() throws Exception {
        Git.run(repo, "init", "-q");
        Files.writeString(repo.resolve("a.md"), "committed");
        Git.run(repo, "add", "a.md");
        Git.run(repo, "commit", "-q", "-m", "first");
        Files.writeString(repo.resolve("b.md"), "new and staged");
        Files.writeString(repo.resolve("c.md"), "staged version");
        Git.run(repo, "add", "b.md", "c.md");
        Files.writeString(repo.resolve("c.md"), "edited after staging");
        Files.writeString(repo.resolve("d.md"), "not staged at all");

        GitIndex index = GitIndex.read(repo);
        assertEquals(repo.toRealPath(), index.workTree().toRealPath());
        List<String> paths = index.files().stream().map(StagedFile::path).toList();
        assertEquals(List.of("b.md", "c.md"), paths);
        StagedFile c = index.files().get(1);
        assertEquals("staged version", new String(c.staged(), StandardCharsets.UTF_8), "the index, not the working tree");
        assertEquals(false, c.matchesWorkTree(), "partially staged");
        assertEquals(true, index.files().get(0).matchesWorkTree());
    }

    @Test
    void readsNothingOfTheStagedFilesItIsNotAskedFor() throws Exception {
        Git.run(repo, "init", "-q");
        Files.writeString(repo.resolve("keep.md"), "a template");
        Files.writeString(repo.resolve("asset.bin"), "a large file that is not a template");
        Git.run(repo, "add", "keep.md", "asset.bin");
        // With its object gone, reading asset.bin would fail: the test passes only if it is never read.
        String blob = Git.run(repo, "rev-parse", ":asset.bin").strip();
        Files.delete(repo.resolve(".git/objects/" + blob.substring(0, 2) + "/" + blob.substring(2)));

        GitIndex index = GitIndex.read(repo, file -> file.getFileName().toString().endsWith(".md"));
        assertEquals(List.of("keep.md"), index.files().stream().map(StagedFile::path).toList());
        assertEquals("a template", new String(index.files().get(0).staged(), StandardCharsets.UTF_8));
        assertThrows(TareException.class, () -> GitIndex.read(repo), "the missing object is there to be noticed");
    }

    @Test
    void beforeTheFirstCommitEveryStagedFileCounts() throws Exception {
        Git.run(repo, "init", "-q");
        Files.createDirectories(repo.resolve("prompts"));
        Files.writeString(repo.resolve("prompts/x.md"), "x");
        Git.run(repo, "add", ".");
        assertEquals(List.of("prompts/x.md"), GitIndex.read(repo.resolve("prompts")).files().stream().map(StagedFile::path).toList());
    }

    @Test
    void unusualNamesAreReadAndStagedLiterally() throws Exception {
        Git.run(repo, "init", "-q");
        Files.writeString(repo.resolve("base.md"), "base");
        Git.run(repo, "add", ".");
        Git.run(repo, "commit", "-q", "-m", "first");
        // A space, a non-ASCII letter, and a glob character that would also match the neighbour as a pattern.
        String odd = "brief d\u00e9j\u00e0 *.md";
        Files.writeString(repo.resolve(odd), "staged");
        Files.writeString(repo.resolve("brief d\u00e9j\u00e0 x.md"), "never staged");
        Git.run(repo, "add", "--", odd);
        GitIndex index = GitIndex.read(repo);
        assertEquals(List.of(odd), index.files().stream().map(StagedFile::path).toList());

        Files.writeString(repo.resolve(odd), "changed on disk");
        GitIndex.stage(repo, List.of(odd));
        String names = Git.run(repo, "diff", "--cached", "--name-only", "-z");
        assertEquals(List.of(odd), List.of(names.split("\0")), "only the literal path is staged");
        assertEquals("changed on disk", new String(GitIndex.read(repo).files().get(0).staged(), StandardCharsets.UTF_8));
    }

    @Test
    void deletionsAndLinksAreNotStagedFiles() throws Exception {
        Git.run(repo, "init", "-q");
        Files.writeString(repo.resolve("gone.md"), "committed");
        Files.writeString(repo.resolve("kept.md"), "committed");
        Git.run(repo, "add", ".");
        Git.run(repo, "commit", "-q", "-m", "first");
        Git.run(repo, "rm", "-q", "gone.md");
        Files.createSymbolicLink(repo.resolve("link.md"), Path.of("kept.md"));
        Files.writeString(repo.resolve("kept.md"), "edited");
        Git.run(repo, "add", "link.md", "kept.md");
        assertEquals(List.of("kept.md"), GitIndex.read(repo).files().stream().map(StagedFile::path).toList());
    }

    @Test
    void aRepositoryReachedThroughALinkKeepsThePathItWasReachedBy(@TempDir Path base) throws Exception {
        Path real = Files.createDirectories(base.resolve("real"));
        Path link = Files.createSymbolicLink(base.resolve("link"), real);
        Git.run(real, "init", "-q");
        Files.createDirectories(real.resolve("prompts"));
        Files.writeString(real.resolve("prompts/a.md"), "staged");
        Git.run(real, "add", ".");
        GitIndex index = GitIndex.read(link.resolve("prompts"));
        assertEquals(link, index.workTree(), "the way the user came, not git's resolved path");
        assertEquals(List.of("prompts/a.md"), index.files().stream().map(StagedFile::path).toList());

        Files.writeString(real.resolve("prompts/a.md"), "changed");
        GitIndex.stage(link.resolve("prompts"), List.of("a.md"));
        assertEquals("changed", new String(GitIndex.read(link).files().get(0).staged(), StandardCharsets.UTF_8));
    }

    @Test
    void outsideGitIsAClearError(@TempDir Path plain) {
        TareException e = assertThrows(TareException.class, () -> GitIndex.read(plain));
        assertTrue(e.getMessage().contains("not inside a git work tree"), e.getMessage());
    }
}
