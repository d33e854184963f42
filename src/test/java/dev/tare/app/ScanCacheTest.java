package dev.tare.app;

import dev.tare.cache.CacheFolder;
import dev.tare.workspace.Workspace;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.tokenize.TokenizerRegistry;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.FileTime;
import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.stream.Stream;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The scan cache: a warm scan gives exactly what a fresh one gives, reuses what it may (shown by
 * planting a change the cache is allowed to miss), and notices every change it must (a template, a
 * partial, a tool file, a file edited within the racy window), while a broken or unwritable cache
 * never breaks a scan.
 */
class ScanCacheTest {
    @TempDir
    Path root;
    private StampedFiles stamped;

    @BeforeEach
    void repository() throws IOException {
        stamped = new StampedFiles(root);
        stamped.write("tare.yaml", "templates: {include: [\"prompts/**/*.md\", \"tools/*.json\"]}\n"
                + "targets:\n  - {name: hosted, tokenizer: o200k_base, price: {input: 2.0, cached_input: 0.5, output: 8.0},"
                + " output_tokens: 100, prefix_cache: {min_tokens: 3}, calls_per_day: 1000}\n"
                + "  - {name: lite, tokenizer: cl100k_base, message_overhead_tokens: 4}\n");
        stamped.write("prompts/partials/policy.md", "Never share a customer's account number.");
        stamped.write("prompts/reply.md", "---\ntools: [tools/lookup.json]\nvariables: {name: {sample: \"Ada\"}}\n---\n"
                + "Dear {{ name }}, {{> policy }} Answer briefly.");
        stamped.write("prompts/other.md", "Summarise the meter reading dispute in two sentences.");
        stamped.write("prompts/sibling.md", "Summarise the meter reading history for {{ account }}.");
        stamped.write("tools/lookup.json", "[{\"name\": \"lookup\", \"description\": \"Finds an account.\","
                + " \"parameters\": {\"type\": \"object\", \"properties\": {}}}]");
        stamped.ageEveryFile();
    }

    @Test
    void aWarmScanEqualsAFreshOneAndKeepsItsCacheOutOfGit() {
        ScanResult cold = scan(true);
        ScanResult warm = scan(true);
        assertEquals(fresh().templates(), cold.templates());
        assertEquals(cold.templates(), warm.templates());
        assertEquals(cold.skipped(), warm.skipped());
        assertTrue(warm.templates().stream().anyMatch(t -> t.targets().get("hosted").cachedInputTokens().orElse(0) > 0),
                "prefix sharing survives the cache: " + warm.templates());
        assertTrue(Files.isRegularFile(root.resolve(".tare/.gitignore")), "the cache folder ignores itself");
        assertEquals(1, cacheFiles().size());
    }

    @Test
    void anUnchangedSizeAndOldTimeVouchForAFileSoItIsNotReadAgain() throws IOException {
        int before = tokens(scan(true), "prompts/other.md");
        // Same size, same old time, other words: the cache may trust the file's stamp, as it does.
        String text = Files.readString(root.resolve("prompts/other.md"));
        stamped.replaceKeepingStamp("prompts/other.md", text.replace("meter reading dispute", "bill, in Welsh & Gaelic"
                .substring(0, 21)));
        assertNotEquals(before, tokens(fresh(), "prompts/other.md"), "the planted edit changes the count");
        assertEquals(before, tokens(scan(true), "prompts/other.md"), "the warm scan answered from the cache");
    }

    @Test
    void anEditedTemplateIsMeasuredAgain() throws IOException {
        scan(true);
        stamped.write("prompts/other.md", "Summarise the meter reading dispute in two sentences, then list the next steps.");
        assertEquals(fresh().templates(), scan(true).templates());
    }

    @Test
    void anEditedPartialOrToolFileRemeasuresWhatDependsOnIt() throws IOException {
        ScanResult before = scan(true);
        stamped.write("prompts/partials/policy.md", "Never share a customer's account number, and never guess a balance.");
        ScanResult afterPartial = scan(true);
        assertEquals(fresh().templates(), afterPartial.templates());
        assertNotEquals(tokens(before, "prompts/reply.md"), tokens(afterPartial, "prompts/reply.md"));
        stamped.write("tools/lookup.json", "[{\"name\": \"lookup\", \"description\": \"Finds a customer's account by number.\","
                + " \"parameters\": {\"type\": \"object\", \"properties\": {}}}]");
        ScanResult afterTool = scan(true);
        assertEquals(fresh().templates(), afterTool.templates());
        assertNotEquals(afterPartial.templates(), afterTool.templates());
    }

    @Test
    void aNewPartialThatChangesWhatAnIncludeMeansIsNoticed() throws IOException {
        stamped.write("prompts/greeting.md", "Hello! {{> sign-off }}");
        stamped.write("prompts/sign-off.md", "Bye.");
        stamped.ageEveryFile();
        scan(true);
        stamped.write("prompts/partials/sign-off.md", "With kind regards, the customer care team of the water utility.");
        assertEquals(fresh().templates(), scan(true).templates());
    }

    @Test
    void aFileEditedWithinTheClockTickOfTheScanIsHashedNotTrusted() throws IOException {
        stamped.write("prompts/recent.md", "Reply in English.");
        FileTime stamp = Files.getLastModifiedTime(root.resolve("prompts/recent.md"));
        scan(true);
        Files.writeString(root.resolve("prompts/recent.md"), "a b c d e f g h i"); // same size, more tokens
        Files.setLastModifiedTime(root.resolve("prompts/recent.md"), stamp);
        assertEquals(fresh().templates(), scan(true).templates());
    }

    @Test
    void aCorruptCacheIsIgnoredAndReplaced() throws IOException {
        scan(true);
        Path cache = cacheFiles().get(0);
        byte[] bytes = Files.readAllBytes(cache);
        bytes[bytes.length / 2] ^= 0x5a;
        Files.write(cache, bytes);
        assertEquals(fresh().templates(), scan(true).templates());
        Files.writeString(cache, "not a cache");
        assertEquals(fresh().templates(), scan(true).templates());
        assertTrue(Files.size(cache) > 100, "rewritten whole");
    }

    @Test
    void anUnwritableCacheFolderOnlyMeansNoCache() throws IOException {
        Files.writeString(root.resolve(".tare"), "a file where the cache folder would go");
        assertEquals(fresh().templates(), scan(true).templates());
        assertEquals(fresh().templates(), scan(true).templates());
    }

    @Test
    void cachesOfOtherBuildsAndConfigurationsArePrunedToTheNewestFew() throws IOException {
        Path folder = Files.createDirectories(root.resolve(".tare/cache"));
        for (int i = 0; i < CacheFolder.KEPT_OTHERS + 3; i++) {
            Path old = folder.resolve("scan-old" + i + ".bin");
            Files.writeString(old, "from another build");
            Files.setLastModifiedTime(old, FileTime.from(Instant.now().minus(10 + i, ChronoUnit.MINUTES)));
        }
        scan(true);
        assertEquals(CacheFolder.KEPT_OTHERS + 1, cacheFiles().size());
        assertTrue(Files.exists(folder.resolve("scan-old0.bin")), "the newest others are kept");
    }

    @Test
    void withoutTheCacheNothingIsWritten() {
        scan(false);
        assertTrue(Files.notExists(root.resolve(".tare")));
    }

    @Test
    void aWarmScanInAGitWorktreeWhoseGitEntryIsAFileEqualsAFreshOne() throws IOException {
        // In a linked worktree .git is a file naming the real folder, so .git/info/exclude cannot exist.
        stamped.write(".git", "gitdir: /somewhere/else/.git/worktrees/other\n");
        ageEverything();
        assertEquals(fresh().templates(), scan(true).templates());
        assertEquals(fresh().templates(), scan(true).templates());
        assertEquals(1, cacheFiles().size());
    }

    @Test
    void everyChangeThatCanChangeTheResultIsSeenByTheWarmScan() throws IOException {
        Files.createDirectories(root.resolve(".git"));
        List<Change> changes = List.of(
                new Change("an edited template", () -> stamped.write("prompts/other.md", "Summarise the dispute, then list the next steps.")),
                new Change("a new template", () -> stamped.write("prompts/new.md", "Greet the customer by name.")),
                new Change("a template in a new folder", () -> stamped.write("prompts/billing/late.md", "Explain the late fee.")),
                new Change("a removed template", () -> Files.delete(root.resolve("prompts/sibling.md"))),
                new Change("an edited partial", () -> stamped.write("prompts/partials/policy.md", "Never guess a customer's balance.")),
                new Change("an edited tool file", () -> stamped.write("tools/lookup.json", "[{\"name\": \"lookup\", \"description\":"
                        + " \"Finds a customer's account by number.\", \"parameters\": {\"type\": \"object\"}}]")),
                new Change("a new .gitignore", () -> stamped.write("prompts/billing/.gitignore", "late.md\n")),
                new Change("an edited .gitignore", () -> stamped.write("prompts/billing/.gitignore", "other.md\n")),
                new Change("a root .gitignore", () -> stamped.write(".gitignore", "prompts/new.md\n")),
                new Change("git's own exclude file", () -> stamped.write(".git/info/exclude", "prompts/billing/\n")));
        for (Change change : changes) {
            ageEverything();
            ScanResult before = scan(true);
            change.apply().run();
            ScanResult after = scan(true);
            assertNotEquals(content(before), content(after), change.name() + " changes the scan");
            assertEquals(content(fresh()), content(after), change.name());
        }
    }

    @Test
    void anEditedPartialOrToolFileOutsideTheTemplatesIsSeenByTheWarmScan() throws IOException {
        stamped.write("tare.yaml", "templates: {include: [\"prompts/*.md\"], partials: shared}\n"
                + "targets:\n  - {name: lite, tokenizer: cl100k_base}\n");
        stamped.write("shared/policy.md", "Never share a customer's account number.");
        ageEverything();
        ScanResult before = scan(true);
        assertEquals(List.of("prompts/other.md", "prompts/reply.md", "prompts/sibling.md"),
                fresh().templates().stream().map(ScannedTemplate::path).toList(),
                "the partial and the tool file are no templates here, only dependencies");
        stamped.write("shared/policy.md", "Never share a customer's account number, and never guess a balance.");
        ScanResult afterPartial = scan(true);
        assertNotEquals(content(before), content(afterPartial));
        assertEquals(content(fresh()), content(afterPartial));
        ageEverything();
        stamped.write("tools/lookup.json", "[{\"name\": \"lookup\", \"description\": \"Finds a customer's account by number.\","
                + " \"parameters\": {\"type\": \"object\", \"properties\": {}}}]");
        ScanResult afterTool = scan(true);
        assertNotEquals(content(afterPartial), content(afterTool));
        assertEquals(content(fresh()), content(afterTool));
    }

    @Test
    void concurrentScansEachGiveWhatAFreshOneGivesAndLeaveAUsableCache() throws Exception {
        String expected = content(fresh());
        ExecutorService pool = Executors.newFixedThreadPool(4);
        try {
            List<Future<ScanResult>> runs = new ArrayList<>();
            for (int i = 0; i < 8; i++) {
                runs.add(pool.submit(() -> scan(true)));
            }
            for (Future<ScanResult> run : runs) {
                assertEquals(expected, content(run.get()));
            }
        } finally {
            pool.shutdown();
        }
        assertEquals(expected, content(scan(true)));
        assertEquals(1, cacheFiles().size());
        try (Stream<Path> files = Files.list(root.resolve(".tare/cache"))) {
            assertTrue(files.noneMatch(f -> f.getFileName().toString().endsWith(".partial")), "no half-written file left");
        }
    }

    private record Change(String name, IoAction apply) {
    }

    private interface IoAction {
        void run() throws IOException;
    }

    private static String content(ScanResult result) {
        return result.templates() + "\n" + result.skipped();
    }

    /** Puts every file's and folder's time an hour back, out of the window in which a stamp cannot vouch for it. */
    private void ageEverything() throws IOException {
        FileTime old = FileTime.from(Instant.now().minus(1, ChronoUnit.HOURS));
        try (Stream<Path> files = Files.walk(root)) {
            for (Path file : files.filter(f -> !f.startsWith(root.resolve(".tare"))).toList()) {
                Files.setLastModifiedTime(file, old);
            }
        }
    }

    private ScanResult scan(boolean cache) {
        return new TemplateScan(Workspace.open(List.of(root), Optional.empty()), new TokenizerRegistry())
                .run(new ScanOptions(List.of(), Optional.empty(), cache));
    }

    private ScanResult fresh() {
        return scan(false);
    }

    private static int tokens(ScanResult result, String path) {
        return result.templates().stream().filter(t -> t.path().equals(path)).findFirst().orElseThrow().staticTokens();
    }

    private List<Path> cacheFiles() {
        try (Stream<Path> files = Files.list(root.resolve(".tare/cache"))) {
            return files.filter(f -> f.getFileName().toString().endsWith(".bin")).toList();
        } catch (IOException e) {
            throw new AssertionError(e);
        }
    }
}
