package dev.tare.scan;

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
import java.util.List;
import java.util.Optional;
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

    @BeforeEach
    void repository() throws IOException {
        write("tare.yaml", "templates: {include: [\"prompts/**/*.md\", \"tools/*.json\"]}\n"
                + "targets:\n  - {name: hosted, tokenizer: o200k_base, price: {input: 2.0, cached_input: 0.5, output: 8.0},"
                + " output_tokens: 100, prefix_cache_min_tokens: 3, calls_per_day: 1000}\n"
                + "  - {name: lite, tokenizer: cl100k_base, message_overhead_tokens: 4}\n");
        write("prompts/partials/policy.md", "Never share a customer's account number.");
        write("prompts/reply.md", "---\ntools: [tools/lookup.json]\nvariables: {name: {sample: \"Ada\"}}\n---\n"
                + "Dear {{ name }}, {{> policy }} Answer briefly.");
        write("prompts/other.md", "Summarise the meter reading dispute in two sentences.");
        write("prompts/sibling.md", "Summarise the meter reading history for {{ account }}.");
        write("tools/lookup.json", "[{\"name\": \"lookup\", \"description\": \"Finds an account.\","
                + " \"parameters\": {\"type\": \"object\", \"properties\": {}}}]");
        ageEveryFile();
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
        replaceKeepingStamp("prompts/other.md", text.replace("meter reading dispute", "bill, in Welsh & Gaelic"
                .substring(0, 21)));
        assertNotEquals(before, tokens(fresh(), "prompts/other.md"), "the planted edit changes the count");
        assertEquals(before, tokens(scan(true), "prompts/other.md"), "the warm scan answered from the cache");
    }

    @Test
    void anEditedTemplateIsMeasuredAgain() throws IOException {
        scan(true);
        write("prompts/other.md", "Summarise the meter reading dispute in two sentences, then list the next steps.");
        assertEquals(fresh().templates(), scan(true).templates());
    }

    @Test
    void anEditedPartialOrToolFileRemeasuresWhatDependsOnIt() throws IOException {
        ScanResult before = scan(true);
        write("prompts/partials/policy.md", "Never share a customer's account number, and never guess a balance.");
        ScanResult afterPartial = scan(true);
        assertEquals(fresh().templates(), afterPartial.templates());
        assertNotEquals(tokens(before, "prompts/reply.md"), tokens(afterPartial, "prompts/reply.md"));
        write("tools/lookup.json", "[{\"name\": \"lookup\", \"description\": \"Finds a customer's account by number.\","
                + " \"parameters\": {\"type\": \"object\", \"properties\": {}}}]");
        ScanResult afterTool = scan(true);
        assertEquals(fresh().templates(), afterTool.templates());
        assertNotEquals(afterPartial.templates(), afterTool.templates());
    }

    @Test
    void aNewPartialThatChangesWhatAnIncludeMeansIsNoticed() throws IOException {
        write("prompts/greeting.md", "Hello! {{> sign-off }}");
        write("prompts/sign-off.md", "Bye.");
        ageEveryFile();
        scan(true);
        write("prompts/partials/sign-off.md", "With kind regards, the customer care team of the water utility.");
        assertEquals(fresh().templates(), scan(true).templates());
    }

    @Test
    void aFileEditedWithinTheClockTickOfTheScanIsHashedNotTrusted() throws IOException {
        write("prompts/recent.md", "Reply in English.");
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
        for (int i = 0; i < ScanCache.KEPT_OTHERS + 3; i++) {
            Path old = folder.resolve("scan-old" + i + ".bin");
            Files.writeString(old, "from another build");
            Files.setLastModifiedTime(old, FileTime.from(Instant.now().minus(10 + i, ChronoUnit.MINUTES)));
        }
        scan(true);
        assertEquals(ScanCache.KEPT_OTHERS + 1, cacheFiles().size());
        assertTrue(Files.exists(folder.resolve("scan-old0.bin")), "the newest others are kept");
    }

    @Test
    void withoutTheCacheNothingIsWritten() {
        scan(false);
        assertTrue(Files.notExists(root.resolve(".tare")));
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

    private void write(String path, String text) throws IOException {
        Path file = root.resolve(path);
        Files.createDirectories(file.getParent());
        Files.writeString(file, text);
    }

    private void replaceKeepingStamp(String path, String text) throws IOException {
        Path file = root.resolve(path);
        FileTime stamp = Files.getLastModifiedTime(file);
        assertEquals(Files.size(file), text.length(), "the planted text keeps the file's size");
        Files.writeString(file, text);
        Files.setLastModifiedTime(file, stamp);
    }

    /** Puts every file's time an hour back, out of the window in which a stamp cannot vouch for it. */
    private void ageEveryFile() throws IOException {
        FileTime old = FileTime.from(Instant.now().minus(1, ChronoUnit.HOURS));
        try (Stream<Path> files = Files.walk(root)) {
            for (Path file : files.filter(Files::isRegularFile).toList()) {
                Files.setLastModifiedTime(file, old);
            }
        }
    }

    private List<Path> cacheFiles() {
        try (Stream<Path> files = Files.list(root.resolve(".tare/cache"))) {
            return files.filter(f -> f.getFileName().toString().endsWith(".bin")).toList();
        } catch (IOException e) {
            throw new AssertionError(e);
        }
    }
}
