package dev.tare.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The check, rules and explain commands, driven as the launcher drives them; exit codes per design.md's contract. */
class LintCommandsTest {
    private static final Path ROOT = Cli.projectDir();

    @TempDir
    Path dir;

    private static Cli.Run run(String... args) {
        return Cli.run(args);
    }

    private Path repo(String config, String template) throws IOException {
        Files.createDirectories(dir.resolve("prompts"));
        Files.writeString(dir.resolve("tare.yaml"), config);
        Files.writeString(dir.resolve("prompts/a.md"), template);
        return dir;
    }

    @Test
    void warningsPassByDefaultAndFailWithFailOnWarning() throws IOException {
        Path repo = repo("templates: {include: [\"prompts/**/*.md\"]}\n", "Be brief.  \n");
        Cli.Run passing = run("check", repo.toString());
        assertEquals(0, passing.exitCode(), passing.err());
        assertTrue(passing.out().startsWith("prompts/a.md:1:10: warning trailing-whitespace: "), passing.out());
        assertEquals(1, run("check", repo.toString(), "--fail-on", "warning").exitCode());
        assertEquals(0, run("check", repo.toString(), "--fail-on", "error").exitCode());
    }

    @Test
    void aCleanRepositoryExitsZeroEvenOnInfo() throws IOException {
        Path repo = repo("templates: {include: [\"prompts/**/*.md\"]}\n", "Be brief.\n");
        Cli.Run result = run("check", repo.toString(), "--fail-on", "info");
        assertEquals(0, result.exitCode(), result.out());
        assertTrue(result.out().contains("Passed"), result.out());
    }

    @Test
    void theDemoFailsOnItsBudgetBreach() {
        Cli.Run result = run("check", ROOT.resolve("corpora/demo").toString(), "--format", "json");
        assertEquals(1, result.exitCode());
        assertTrue(result.out().contains("\"rule\" : \"over-budget\""), result.out());
    }

    @Test
    void aSecondCheckAnswersFromTheCacheAndNoCacheNeitherReadsNorWritesIt() throws IOException {
        Path repo = repo("templates: {include: [\"prompts/**/*.md\"]}\n", "Be brief.  \n");
        Cli.Run uncached = run("check", repo.toString(), "--no-cache", "--format", "json");
        assertTrue(Files.notExists(repo.resolve(".tare")), "--no-cache writes nothing");
        Cli.Run first = run("check", repo.toString(), "--format", "json");
        try (java.util.stream.Stream<Path> cache = Files.list(repo.resolve(".tare/cache"))) {
            assertTrue(cache.anyMatch(f -> f.getFileName().toString().startsWith("check-")), "the check kept what it found");
        }
        Files.setLastModifiedTime(repo.resolve("prompts/a.md"), java.nio.file.attribute.FileTime.fromMillis(0));
        Cli.Run second = run("check", repo.toString(), "--format", "json");
        assertEquals(uncached, first);
        assertEquals(first, second);
        // An edit that keeps the file's size and time is one the cache may miss: the warm check shows
        // it answered from the cache, and --no-cache that it reads the file.
        Files.writeString(repo.resolve("prompts/a.md"), "Be brief!!!\n");
        Files.setLastModifiedTime(repo.resolve("prompts/a.md"), java.nio.file.attribute.FileTime.fromMillis(0));
        assertEquals(first, run("check", repo.toString(), "--format", "json"));
        assertTrue(!run("check", repo.toString(), "--no-cache", "--format", "json").out().contains("trailing-whitespace"),
                "--no-cache reads the edited file");
    }

    @Test
    void configurationAndUsageErrorsExitTwoWithOneLine() throws IOException {
        Path repo = repo("rules: {disable: [no-such-rule]}\n", "Text.\n");
        Cli.Run bad = run("check", repo.toString());
        assertEquals(2, bad.exitCode());
        assertTrue(bad.err().startsWith("tare: ") && bad.err().contains("rules.disable[0]: unknown rule 'no-such-rule'"), bad.err());
        assertEquals(1, bad.err().strip().lines().count(), bad.err());
        assertEquals(2, run("check", repo.toString(), "--fail-on", "loud").exitCode());
        assertEquals(2, run("check", repo.toString(), "--format", "xml").exitCode());
    }

    @Test
    void inlineDirectivesSilenceFindings() throws IOException {
        Path repo = repo("templates: {include: [\"prompts/**/*.md\"]}\n",
                "---\n# tare-ignore-file blank-lines\n---\nBe brief.\t{# tare-ignore prose-tab #}\n\n\n\nEnd.\n");
        Cli.Run result = run("check", repo.toString(), "--fail-on", "info");
        assertEquals(0, result.exitCode(), result.out());
    }

    @Test
    void rulesListsEveryRuleAndExplainShowsTheFourParts() {
        Cli.Run rules = run("rules");
        assertEquals(0, rules.exitCode(), rules.err());
        assertTrue(rules.out().contains("trailing-whitespace") && rules.out().contains("in-order-to"), rules.out());
        Cli.Run json = run("rules", "--format", "json");
        assertTrue(json.out().contains("\"id\" : \"pretty-json\""), json.out());
        Cli.Run explain = run("explain", "pretty-json");
        assertEquals(0, explain.exitCode());
        String text = explain.out();
        assertTrue(text.indexOf("What it flags") < text.indexOf("Why it costs"), text);
        assertTrue(text.indexOf("Why it costs") < text.indexOf("Example"), text);
        assertTrue(text.indexOf("Example") < text.indexOf("What to write instead"), text);
    }

    @Test
    void rulesAndExplainSayWhatSafeMeansAndWhichRulesAreReview() {
        Cli.Run rules = run("rules");
        assertTrue(rules.out().contains("Safe rewrites change no word the model is told"), rules.out());
        assertTrue(rules.out().lines().anyMatch(line -> line.startsWith("repeated-instruction ") && line.contains(" review ")
                && line.contains(" text ")), rules.out());
        assertTrue(rules.out().lines().anyMatch(line -> line.startsWith("trailing-whitespace ") && line.contains(" safe ")
                && line.contains(" whitespace ")), rules.out());
        Cli.Run json = run("rules", "--format", "json");
        assertTrue(json.out().contains("\"edit_kind\" : \"invisible\""), json.out());
        String explained = run("explain", "space-run").out();
        assertTrue(explained.contains("Its rewrite\n  It removes or shortens whitespace in prose only"), explained);
        assertTrue(run("explain", "repeated-instruction").out().contains("applies them only with --include-review"));
    }

    @Test
    void explainingAnUnknownRuleSuggestsTheNearestOne() {
        Cli.Run result = run("explain", "pretty-jsn");
        assertEquals(2, result.exitCode());
        assertTrue(result.err().contains("did you mean 'pretty-json'?"), result.err());
    }

    @Test
    void rulesTestRunsEveryExample() {
        Cli.Run result = run("rules", "test");
        assertEquals(0, result.exitCode(), result.out());
        assertTrue(result.out().matches("(?s).*\\d+ passed, 0 failed.*"), result.out());
    }

    @Test
    void rulesTestFailsOnABrokenPackExample() throws IOException {
        Files.createDirectories(dir.resolve("house"));
        Files.writeString(dir.resolve("house/p.yaml"), "rules:\n  - id: broken-example\n    summary: s\n    why: w\n"
                + "    class: review\n    severity: info\n    scope: prose\n    find: 'colour'\n    replace: 'color'\n"
                + "    examples: [{before: 'the colour', after: 'the colours'}]\n");
        Files.writeString(dir.resolve("tare.yaml"), "rules: {packs: [house]}\n");
        Cli.Run result = run("rules", "test", "--config", dir.resolve("tare.yaml").toString());
        assertEquals(1, result.exitCode(), result.out() + result.err());
        assertTrue(result.out().contains("FAIL broken-example example 1 (house/p.yaml)"), result.out());
    }
}
