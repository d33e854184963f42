package dev.tare.app;

import dev.tare.lint.Baseline;
import dev.tare.lint.Finding;
import dev.tare.lint.Severity;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;


import dev.tare.tokenize.TokenizerRegistry;
import dev.tare.workspace.Workspace;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
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
 * The check's cache: a warm check finds exactly what a fresh one finds (rewrites, related places,
 * directives and all), reuses what it may (shown by planting an edit that keeps a file's size and
 * time, which the cache is allowed to miss), and notices every change it must: a template, a
 * partial, a tool file, a new partial, a rule pack, the baseline, the configuration. A broken cache
 * never breaks a check.
 */
class CheckCacheTest {
    private static final Path DEMO = Path.of("corpora/demo");
    private static final String BLOCK = "Never promise a refund, a repair time or a bill credit that the account notes"
            + " do not show, and never read out a full account number, a bank detail or a password.";
    /** The same length as {@link #BLOCK}, and shared with no other template. */
    private static final String OTHER = ("Read the meter number back to the caller, ask when the supply stopped,"
            + " and say which streets the crews are working on today, street by street, before anything else"
            + " at all.").substring(0, BLOCK.length() - 1) + ".";

    @TempDir
    Path root;
    private StampedFiles stamped;

    @BeforeEach
    void repository() throws IOException {
        stamped = new StampedFiles(root);
        stamped.write("tare.yaml", "templates:\n  include: [\"prompts/**/*.md\", \"tools/*.json\"]\n  partials: prompts/partials\n"
                + "targets:\n  - {name: hosted, tokenizer: o200k_base}\n"
                + "rules: {limits: {shared_block_tokens: 20}, packs: [house]}\n");
        stamped.write("house/style.yaml", "rules:\n  - id: shouting\n    summary: \"Repeated exclamation marks.\"\n"
                + "    why: \"They cost tokens.\"\n    class: review\n    severity: info\n    scope: prose\n"
                + "    find: '!!+'\n    replace: '!'\n    examples:\n      - before: \"Now!!\\n\"\n        after: \"Now!\\n\"\n");
        stamped.write("prompts/partials/policy.md", "Never share a customer's account number.");
        stamped.write("prompts/billing.md", "# Billing\n\n" + BLOCK + "\n\nExplain the bill!!  Use  plain words.\n");
        stamped.write("prompts/outages.md", "# Outages\n\n" + BLOCK + "\n\nGive the area.\n");
        stamped.write("prompts/quiet.md", "{# tare-ignore-file shared-block #}\n# Quiet\n\n" + BLOCK + "\n\nBe brief.\n");
        stamped.write("prompts/reply.md", "---\nbudget: 20\ntools: [tools/lookup.json]\n---\nDear customer, {{> policy }}"
                + " Answer briefly.\n");
        stamped.write("tools/lookup.json", "[{\"name\": \"lookup\", \"description\": \"Finds an account.\","
                + " \"parameters\": {\"type\": \"object\", \"properties\": {\"id\": {\"type\": \"string\"}}}}]");
        stamped.ageEveryFile();
    }

    @Test
    void aWarmCheckOfTheDemoFindsWhatAFreshOneFinds() throws IOException {
        copyDemo();
        CheckResult fresh = check(false);
        CheckResult cold = check(true);
        CheckResult warm = check(true);
        assertTrue(fresh.findings().stream().anyMatch(f -> f.rewrite().isPresent())
                && fresh.findings().stream().anyMatch(f -> !f.related().isEmpty()),
                "the demo's findings offer rewrites and name related places, which the cache must keep exactly");
        assertEquals(fresh, cold);
        assertEquals(fresh, warm);
        assertEquals(1, cacheFiles().size());
        assertTrue(Files.isRegularFile(root.resolve(".tare/.gitignore")), "the cache folder ignores itself");
    }

    @Test
    void aWarmCheckHereFindsWhatAFreshOneFinds() {
        CheckResult fresh = check(false);
        assertTrue(rules(fresh).containsAll(List.of("shared-block", "shouting", "space-run")), rules(fresh).toString());
        assertEquals(fresh, check(true));
        assertEquals(fresh, check(true));
    }

    @Test
    void anUnchangedSizeAndOldTimeVouchForAFileSoItIsNotLintedAgain() throws IOException {
        CheckResult before = check(true);
        // Same size, same old time, one more finding: the cache may trust the file's stamp, as it does.
        stamped.replaceKeepingStamp("prompts/outages.md", stamped.read("prompts/outages.md").replace("Give the area.", "Give it!!!!!!!"));
        assertNotEquals(before.findings(), check(false).findings(), "the planted edit changes the findings");
        assertEquals(before.findings(), check(true).findings(), "the warm check answered from the cache");
    }

    @Test
    void theCrossTemplateFindingsAreReusedWhileNoTemplateChanges() throws IOException {
        CheckResult before = check(true);
        assertEquals(1, count(before, "shared-block"), "billing and outages share the block; quiet silences it");
        // The block leaves outages.md, keeping its size and time: a fresh check finds it in billing only.
        stamped.replaceKeepingStamp("prompts/outages.md", stamped.read("prompts/outages.md").replace(BLOCK, OTHER));
        assertEquals(0, count(check(false), "shared-block"), "the planted edit removes the shared block");
        assertEquals(before.findings(), check(true).findings(), "the cross-template findings came from the cache");
    }

    @Test
    void anEditedTemplateIsLintedAgainAndTheCrossTemplateRulesRunAgain() throws IOException {
        check(true);
        stamped.write("prompts/outages.md", "# Outages\n\n" + OTHER + "\n\nGive the area, then the time of the next update.\n");
        CheckResult warm = check(true);
        assertEquals(check(false), warm);
        assertEquals(0, count(warm, "shared-block"));
    }

    @Test
    void directivesOfUnchangedFilesStillSilenceTheCrossTemplateFindings() throws IOException {
        check(true);
        // billing.md changes, so the cross-template rules run again; quiet.md comes from the cache, and
        // its file-wide directive must still silence the shared block there.
        stamped.write("prompts/billing.md", "# Billing\n\n" + BLOCK + "\n\nExplain the bill in two short sentences.\n");
        CheckResult warm = check(true);
        assertEquals(check(false), warm);
        assertEquals(1, count(warm, "shared-block"));
        assertTrue(warm.findings().stream().noneMatch(f -> f.path().equals("prompts/quiet.md")
                && f.rule().equals("shared-block")), warm.findings().toString());
    }

    @Test
    void anEditedPartialOrToolFileRelintsWhatDependsOnIt() throws IOException {
        CheckResult before = check(true);
        assertEquals(0, count(before, "over-budget"));
        stamped.write("prompts/partials/policy.md", "Never share a customer's account number, never guess a balance, never"
                + " quote a tariff from memory and never promise a visit on a given day.");
        CheckResult afterPartial = check(true);
        assertEquals(check(false), afterPartial);
        assertEquals(1, count(afterPartial, "over-budget"), "reply.md grew through its partial");
        stamped.write("tools/lookup.json", "[\n  {\n    \"name\": \"lookup\",\n    \"description\": \"Finds an account.\"\n  }\n]\n");
        CheckResult afterTool = check(true);
        assertEquals(check(false), afterTool);
        assertNotEquals(afterPartial.findings(), afterTool.findings());
    }

    @Test
    void aNewPartialThatChangesWhatAnIncludeMeansIsNoticed() throws IOException {
        stamped.write("prompts/greeting.md", "Hello! {{> sign-off }}");
        stamped.write("prompts/sign-off.md", "Bye.");
        stamped.ageEveryFile();
        check(true);
        stamped.write("prompts/partials/sign-off.md", "With kind regards,   the customer care team of the water utility.");
        assertEquals(check(false), check(true));
    }

    @Test
    void aTemplateWhoseIncludeDoesNotResolveIsNotRemembered() throws IOException {
        stamped.write("prompts/broken.md", "Hello {{> missing }} and goodbye.\n");
        stamped.ageEveryFile();
        CheckResult before = check(true);
        assertEquals(1, count(before, "unresolved-include"));
        // Which file would fix the include is not known, so nothing vouches for the template: even an
        // edit that keeps its size and time is seen.
        stamped.replaceKeepingStamp("prompts/broken.md", "Hello {{> missing }} and bye!!!!!\n");
        assertEquals(check(false), check(true));
        assertTrue(check(true).findings().stream().anyMatch(f -> f.path().equals("prompts/broken.md")
                && f.rule().equals("shouting")), "the planted edit was linted");
    }

    @Test
    void anEditedRulePackBaselineOrConfigurationMakesANewCache() throws IOException {
        check(true);
        stamped.write("house/style.yaml", stamped.read("house/style.yaml").replace("severity: info", "severity: error"));
        assertEquals(check(false), check(true));

        Workspace workspace = Workspace.open(List.of(root), Optional.empty());
        Baseline small = new TemplateScan(workspace, new TokenizerRegistry())
                .run(new ScanOptions(List.of(), Optional.empty(), false)).baseline();
        BaselineFile.write(root.resolve("tare-baseline.json"), small);
        CheckResult recorded = check(true);
        assertEquals(check(false), recorded);
        java.util.Map<String, java.util.Map<String, Integer>> tokens = new java.util.TreeMap<>(small.tokens());
        tokens.put("prompts/billing.md", java.util.Map.of("hosted", 1));
        BaselineFile.write(root.resolve("tare-baseline.json"), new Baseline(tokens));
        CheckResult shrunk = check(true);
        assertEquals(check(false), shrunk);
        assertNotEquals(recorded.findings(), shrunk.findings(), "billing.md now grew far beyond its baseline");

        stamped.write("tare.yaml", stamped.read("tare.yaml").replace("shared_block_tokens: 20", "shared_block_tokens: 2000"));
        CheckResult reconfigured = check(true);
        assertEquals(check(false), reconfigured);
        assertEquals(0, count(reconfigured, "shared-block"));
    }

    @Test
    void aCorruptCacheIsIgnoredAndReplaced() throws IOException {
        CheckResult fresh = check(false);
        check(true);
        Path cache = cacheFiles().get(0);
        byte[] bytes = Files.readAllBytes(cache);
        bytes[bytes.length / 2] ^= 0x5a;
        Files.write(cache, bytes);
        assertEquals(fresh, check(true));
        Files.writeString(cache, "not a cache");
        assertEquals(fresh, check(true));
        assertTrue(Files.size(cache) > 100, "rewritten whole");
        assertEquals(fresh, check(true));
    }

    @Test
    void concurrentChecksEachFindWhatAFreshOneFinds() throws Exception {
        CheckResult fresh = check(false);
        ExecutorService pool = Executors.newFixedThreadPool(4);
        try {
            List<Future<CheckResult>> runs = Stream.generate(() -> pool.submit(() -> check(true))).limit(8).toList();
            for (Future<CheckResult> run : runs) {
                assertEquals(fresh, run.get());
            }
        } finally {
            pool.shutdown();
        }
        assertEquals(fresh, check(true));
    }

    @Test
    void withoutTheCacheNothingIsWritten() {
        check(false);
        assertFalse(Files.exists(root.resolve(".tare")));
    }

    @Test
    void everyChangeThatCanChangeTheFindingsIsSeenByTheWarmCheck() throws IOException {
        check(true);
        List<Change> changes = List.of(
                () -> stamped.write("prompts/outages.md", "# Outages\n\nGive the area, street by street.\n"),
                () -> stamped.write("prompts/partials/policy.md", "Never share a customer's account number or balance."),
                () -> stamped.write("tools/lookup.json", "[{\"name\": \"lookup\", \"description\": \"Finds it.\"}]"),
                () -> stamped.write("prompts/new.md", "A new template!!\n"),
                () -> Files.delete(root.resolve("prompts/new.md")),
                () -> stamped.write("prompts/.gitignore", "quiet.md\n"),
                () -> stamped.write("house/style.yaml", stamped.read("house/style.yaml").replace("severity: info", "severity: warning")),
                () -> stamped.write("tare-baseline.json", "{\"tool\": \"tare\", \"format\": 1, \"templates\": {}}\n"),
                () -> stamped.write("tare.yaml", stamped.read("tare.yaml").replace("shared_block_tokens: 20", "shared_block_tokens: 25")));
        for (Change change : changes) {
            stamped.ageEveryFile();
            change.make();
            CheckResult warm = check(true);
            assertEquals(check(false), warm);
            stamped.ageEveryFile();
            assertEquals(warm, check(true));
        }
    }

    @Test
    void anEditedPartialOutsideTheTemplatesIsSeenByTheWarmCheck() throws IOException {
        stamped.write("tare.yaml", stamped.read("tare.yaml").replace("\"prompts/**/*.md\"", "\"prompts/*.md\""));
        stamped.ageEveryFile();
        CheckResult before = check(true);
        assertTrue(before.findings().stream().noneMatch(f -> f.path().equals("prompts/partials/policy.md")),
                "the partial is no template of the run");
        stamped.write("prompts/partials/policy.md", "Never share a customer's account number, never guess a balance, never"
                + " quote a tariff from memory and never promise a visit on a given day.");
        stamped.ageEveryFile();
        CheckResult after = check(true);
        assertEquals(check(false), after);
        assertTrue(after.failed() && !before.failed(), "reply.md is over its budget through its partial");
    }

    /** A change to the repository, made by a test. */
    private interface Change {
        void make() throws IOException;
    }

    private CheckResult check(boolean cache) {
        return new Check(Workspace.open(List.of(root), Optional.empty()), new TokenizerRegistry())
                .run(new CheckOptions(Severity.ERROR, cache));
    }

    private static List<String> rules(CheckResult result) {
        return result.findings().stream().map(Finding::rule).distinct().toList();
    }

    private static long count(CheckResult result, String rule) {
        return result.findings().stream().filter(f -> f.rule().equals(rule)).count();
    }

    private void copyDemo() throws IOException {
        try (Stream<Path> files = Files.walk(root)) {
            for (Path file : files.sorted(java.util.Comparator.reverseOrder()).toList()) {
                if (!file.equals(root)) {
                    Files.delete(file);
                }
            }
        }
        try (Stream<Path> files = Files.walk(DEMO)) {
            // Other tests' runs on the demo leave their caches in its .tare folder.
            for (Path file : files.filter(Files::isRegularFile).filter(f -> !f.startsWith(DEMO.resolve(".tare"))).toList()) {
                Path target = root.resolve(DEMO.relativize(file).toString());
                Files.createDirectories(target.getParent());
                Files.copy(file, target);
            }
        }
        stamped.ageEveryFile();
    }

    private List<Path> cacheFiles() {
        try (Stream<Path> files = Files.list(root.resolve(".tare/cache"))) {
            return files.filter(f -> f.getFileName().toString().startsWith("check-")).toList();
        } catch (IOException e) {
            throw new AssertionError(e);
        }
    }
}
