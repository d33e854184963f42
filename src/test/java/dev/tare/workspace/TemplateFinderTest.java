package dev.tare.workspace;

import dev.tare.config.Glob;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.TareException;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class TemplateFinderTest {
    @TempDir
    Path root;

    private void write(String path, String text) throws IOException {
        Path file = root.resolve(path);
        Files.createDirectories(file.getParent());
        Files.writeString(file, text);
    }

    private FileSelection find(List<String> include, List<String> exclude) {
        return new TemplateFinder(root, Glob.all(include), Glob.all(exclude)).find(List.of());
    }

    @Test
    void aNamedFolderTheGlobsMissIsSearchedForFilesThatLookLikePrompts() throws IOException {
        write("templates/billing.md", "You answer questions about water bills, {{ name }}.");
        write("templates/sub/outage.txt", "Explain the outage.");
        write("templates/logo.png", "not text");
        write("prompts/a.md", "a");
        TemplateFinder finder = new TemplateFinder(root, Glob.all(List.of("prompts/**/*.md")), List.of());
        assertEquals(List.of("templates/billing.md", "templates/sub/outage.txt"),
                finder.find(List.of(root.resolve("templates"))).paths());
        // A named folder the globs select from is taken as they say.
        assertEquals(List.of("prompts/a.md"), finder.find(List.of(root.resolve("prompts"))).paths());
        // The whole root keeps to the globs, and says what else looks like a prompt.
        assertEquals(List.of("prompts/a.md"), finder.find(List.of()).paths());
        assertEquals(List.of("prompts/a.md", "templates/billing.md", "templates/sub/outage.txt"),
                finder.promptLikeFiles());
    }

    @Test
    void selectsByIncludeAndExcludeGlobsInPathOrder() throws IOException {
        write("prompts/b.md", "b");
        write("prompts/a.md", "a");
        write("prompts/drafts/c.md", "c");
        write("prompts/notes.txt", "n");
        write("src/Main.java", "x");
        FileSelection found = find(List.of("prompts/**/*.md"), List.of("**/drafts/**"));
        assertEquals(List.of("prompts/a.md", "prompts/b.md"), found.paths());
    }

    @Test
    void neverTakesItsOwnFilesOrGitFolders() throws IOException {
        write("tare.yaml", "templates: {}");
        write("tare-baseline.json", "{}");
        write(".git/HEAD.md", "ref");
        write("a.md", "a");
        assertEquals(List.of("a.md"), find(List.of("**/*"), List.of()).paths());
    }

    @Test
    void honoursRootAndNestedGitignoreFilesWithNegation() throws IOException {
        Files.createDirectories(root.resolve(".git"));
        write(".gitignore", "*.tmp.md\nbuild/\n");
        write("prompts/.gitignore", "secret-*.md\n!secret-ok.md\n");
        write("prompts/a.md", "a");
        write("prompts/x.tmp.md", "x");
        write("prompts/secret-1.md", "s");
        write("prompts/secret-ok.md", "ok");
        write("build/out.md", "o");
        write("other/secret-2.md", "not ignored here: the rule is nested under prompts/");
        assertEquals(List.of("other/secret-2.md", "prompts/a.md", "prompts/secret-ok.md"),
                find(List.of("**/*.md"), List.of()).paths());
    }

    @Test
    void appliesGitignoreFilesAboveTheScannedRoot() throws IOException {
        Path repo = root;
        Files.createDirectories(repo.resolve(".git"));
        write(".gitignore", "generated/\n");
        write("sub/prompts/a.md", "a");
        write("sub/prompts/generated/b.md", "b");
        FileSelection found = new TemplateFinder(repo.resolve("sub"), Glob.all(List.of("**/*.md")), List.of()).find(List.of());
        assertEquals(List.of("prompts/a.md"), found.paths());
    }

    @Test
    void reportsASymlinkLoopAndALinkOutOfTheRootWithoutFollowing(@TempDir Path outside) throws IOException {
        write("prompts/a.md", "a");
        Files.writeString(outside.resolve("secret.md"), "outside");
        Files.createSymbolicLink(root.resolve("prompts/loop"), root.resolve("prompts"));
        Files.createSymbolicLink(root.resolve("prompts/away"), outside);
        Files.createSymbolicLink(root.resolve("prompts/away.md"), outside.resolve("secret.md"));
        FileSelection found = find(List.of("**/*.md"), List.of());
        assertEquals(List.of("prompts/a.md"), found.paths());
        List<String> reasons = found.skipped().stream().map(s -> s.path() + ": " + s.reason()).toList();
        assertTrue(reasons.contains("prompts/loop: symbolic link loop; not followed"), reasons.toString());
        assertTrue(reasons.contains("prompts/away: symbolic link to a place outside the scanned root; not followed"), reasons.toString());
        assertTrue(reasons.contains("prompts/away.md: symbolic link to a place outside the scanned root; not followed"), reasons.toString());
    }

    @Test
    void followsLinksThatStayInsideTheRoot() throws IOException {
        write("shared/a.md", "a");
        Files.createDirectories(root.resolve("prompts"));
        Files.createSymbolicLink(root.resolve("prompts/shared"), root.resolve("shared"));
        assertEquals(List.of("prompts/shared/a.md"), find(List.of("prompts/**/*.md"), List.of()).paths());
    }

    @Test
    void aStartFolderReachedThroughALinkOutOfTheRootIsNotWalked(@TempDir Path outside) throws IOException {
        Files.createDirectories(outside.resolve("sub"));
        Files.writeString(outside.resolve("sub/secret.md"), "s");
        Files.createDirectories(root.resolve("prompts"));
        Files.createSymbolicLink(root.resolve("prompts/away"), outside);
        FileSelection found = new TemplateFinder(root, Glob.all(List.of("**/*.md")), List.of())
                .find(List.of(root.resolve("prompts/away/sub")));
        assertEquals(List.of(), found.paths());
        assertEquals(List.of(new SkippedFile("prompts/away/sub",
                "symbolic link to a place outside the scanned root; not followed")), found.skipped());
    }

    @Test
    void aNamedFileIsTakenEvenWhenNoGlobMatchesIt() throws IOException {
        write("notes/odd.txt", "x");
        FileSelection found = new TemplateFinder(root, Glob.all(List.of("**/*.md")), List.of())
                .find(List.of(root.resolve("notes/odd.txt")));
        assertEquals(List.of("notes/odd.txt"), found.paths());
    }

    @Test
    void refusesAStartOutsideTheRoot(@TempDir Path outside) {
        TareException e = assertThrows(TareException.class,
                () -> new TemplateFinder(root, List.of(), List.of()).find(List.of(outside)));
        assertTrue(e.getMessage().contains("outside the scanned root"), e.getMessage());
    }
}
