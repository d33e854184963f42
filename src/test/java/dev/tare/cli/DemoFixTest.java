package dev.tare.cli;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.FileTime;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * {@code tare fix} on a copy of the demo corpus. What must go and what must stay is taken from
 * {@code corpora/demo/WASTE.md} (the corpus's own list of planted waste, positions in the original
 * files); the dry-run output is pinned by a golden file, which {@code -Dtare.golden.update=true}
 * rewrites from the current output (then review its diff before committing it).
 */
class DemoFixTest {
    private static final Path DEMO = Cli.projectDir().resolve("corpora/demo");
    private static final Path GOLDEN = Cli.projectDir().resolve("src/test/resources/dev/tare/cli/demo-fix-dry-run.txt");
    private static final Pattern PLACEHOLDER = Pattern.compile("\\{\\{.*?\\}\\}|\\{%.*?%\\}|\\{#.*?#\\}", Pattern.DOTALL);
    /** WASTE.md, "Pasted safety preamble": the copies identical to the partial (after YAML parsing for the chat file). */
    private static final List<String> BYTE_IDENTICAL_PREAMBLE = List.of("prompts/billing/explain-bill.md",
            "prompts/outages/outage-status.md", "prompts/quality/quality-notice.md", "prompts/connections/new-service.md",
            "prompts/billing/payment-plan.chat.yaml");

    @TempDir
    Path copy;

    @BeforeEach
    void copyTheDemo() throws IOException {
        try (Stream<Path> files = Files.walk(DEMO)) {
            for (Path from : files.toList()) {
                Path to = copy.resolve(DEMO.relativize(from).toString());
                if (Files.isDirectory(from)) {
                    Files.createDirectories(to);
                } else {
                    Files.copy(from, to);
                }
            }
        }
    }

    private String read(String path) throws IOException {
        return Files.readString(copy.resolve(path));
    }

    private static String original(String path) throws IOException {
        return Files.readString(DEMO.resolve(path));
    }

    private static String line(String text, int line) {
        return text.split("\n", -1)[line - 1];
    }

    @Test
    void theDryRunOutputMatchesTheGoldenFileAndWritesNothing() throws IOException {
        Map<String, byte[]> before = snapshot();
        Cli.Run run = Cli.run("fix", copy.toString(), "--dry-run");
        assertEquals(0, run.exitCode(), run.err());
        assertEquals("", run.err());
        if (Boolean.getBoolean("tare.golden.update")) {
            Files.createDirectories(GOLDEN.getParent());
            Files.writeString(GOLDEN, run.out());
        }
        assertEquals(Files.readString(GOLDEN), run.out(),
                "the dry-run output changed; if that is intended, rerun with -Dtare.golden.update=true and review the diff");
        assertFalse(run.out().contains("\u001b["), "no colour when output is not a terminal");
        Map<String, byte[]> after = snapshot();
        assertEquals(before.keySet(), after.keySet());
        before.forEach((path, bytes) -> assertArrayEquals(bytes, after.get(path), path + " is untouched by a dry run"));
    }

    @Test
    void thePlantedWhitespaceIsRemoved() throws IOException {
        assertEquals(0, Cli.run("fix", copy.toString()).exitCode());
        // WASTE.md, "Whitespace": trailing spaces and tabs.
        for (String path : List.of("prompts/billing/explain-bill.md", "prompts/leaks/leak-triage.md",
                "prompts/connections/new-service.md", "prompts/partials/account-lookup-notes.md",
                "prompts/agents/field-crew-work-order.md")) {
            for (String proseLine : proseLines(read(path))) {
                assertFalse(proseLine.endsWith(" ") || proseLine.endsWith("\t"), path + ": '" + proseLine + "'");
            }
        }
        // Runs of 3 and 4 blank lines.
        for (String path : List.of("prompts/outages/outage-status.md", "prompts/agents/field-crew-work-order.md")) {
            assertFalse(read(path).contains("\n\n\n"), path + " keeps no run of blank lines");
            assertTrue(original(path).contains("\n\n\n\n"));
        }
        // Spaces and tabs inside prose: the original line, collapsed, is now in the file.
        assertCollapsed("prompts/agents/field-crew-work-order.md", 42);
        assertCollapsed("prompts/meters/reading-dispute.md", 15);
        assertCollapsed("prompts/outages/outage-report.chat.yaml", 32);
        assertCollapsed("prompts/outages/outage-report.chat.yaml", 33);
        assertCollapsed("prompts/connections/connection-checklist.chat.json", 3);
        assertCollapsed("prompts/leaks/leak-triage.md", 37);
        assertCollapsed("prompts/agents/field-crew-work-order.md", 228);
    }

    private void assertCollapsed(String path, int line) throws IOException {
        String planted = line(original(path), line);
        String leading = planted.substring(0, planted.length() - planted.stripLeading().length());
        String collapsed = leading + planted.strip().replaceAll("[ \\t]+", " ");
        List<String> lines = List.of(read(path).split("\n", -1));
        assertTrue(lines.contains(collapsed), path + " line " + line + " should now read: " + collapsed);
        assertFalse(lines.contains(planted), path + " line " + line + " is gone as planted");
    }

    @Test
    void safeFixesRemoveInvisibleCharactersAndLeaveJsonBlocksAndRepeatsForReview() throws IOException {
        Cli.Run run = Cli.run("fix", copy.toString());
        assertEquals(0, run.exitCode(), run.out());
        // WASTE.md, "Invisible characters".
        assertFalse(read("prompts/leaks/leak-followup.chat.yaml").contains("\u200B"));
        assertFalse(read("prompts/meters/reading-dispute.md").contains("\u00AD"));
        assertFalse(read("prompts/quality/quality-notice.md").contains("\u00A0"));
        assertFalse(read("prompts/connections/new-service.md").contains("\uFEFF"));
        // A JSON block shown in a prompt and a repeated sentence are the model's text: review rewrites, not applied.
        for (String path : List.of("prompts/billing/explain-bill.md", "prompts/few-shot/intent-examples.md")) {
            assertEquals(jsonBlocks(original(path)), jsonBlocks(read(path)), path);
        }
        String sentence = "Ask whether the water is clear or discoloured before anything else.";
        assertEquals(2, count(read("prompts/leaks/leak-triage.md"), sentence));
        assertTrue(run.out().contains("pretty-json-block") && run.out().contains("repeated-instruction"),
                "the review rewrites left out are named: " + run.out());
    }

    @Test
    void reviewRewritesMinifyJsonBlocksAndDropTheExactRepeat() throws IOException {
        Cli.run("fix", copy.toString(), "--include-review");
        // WASTE.md, "Pretty-printed JSON in fenced json blocks": every block now holds one line of equal JSON.
        Map<String, Integer> blocks = Map.of("prompts/billing/explain-bill.md", 1, "prompts/leaks/leak-triage.md", 1,
                "prompts/meters/reading-dispute.md", 1, "prompts/connections/new-service.md", 1,
                "prompts/agents/field-crew-work-order.md", 1, "prompts/tools/lookup-account.md", 1,
                "prompts/tools/create-work-order.md", 1, "prompts/tools/schedule-meter-reread.md", 1,
                "prompts/few-shot/intent-examples.md", 20);
        ObjectMapper json = new ObjectMapper();
        for (Map.Entry<String, Integer> entry : blocks.entrySet()) {
            List<String> before = jsonBlocks(original(entry.getKey()));
            List<String> after = jsonBlocks(read(entry.getKey()));
            assertEquals(entry.getValue(), after.size(), entry.getKey());
            for (int i = 0; i < after.size(); i++) {
                assertEquals(1, after.get(i).split("\n").length, entry.getKey() + " block " + (i + 1) + " is one line");
                assertEquals(json.readTree(before.get(i)), json.readTree(after.get(i)), "RFC 8259: the same JSON value");
            }
        }
        // WASTE.md, "Repeated and near-duplicate instructions": the exact repeat is dropped.
        String sentence = "Ask whether the water is clear or discoloured before anything else.";
        assertEquals(2, count(original("prompts/leaks/leak-triage.md"), sentence));
        assertEquals(1, count(read("prompts/leaks/leak-triage.md"), sentence));
    }

    @Test
    void everyVariableIncludeAndTagSurvivesAndCleanFilesAreNotTouched() throws IOException {
        FileTime old = FileTime.fromMillis(1_000_000_000_000L);
        List<String> clean = List.of("prompts/system/after-hours.md", "prompts/meters/reread-confirmation.txt",
                "prompts/quality/boil-water-faq.chat.yaml", "prompts/agents/crew-handoff-summary.chat.yaml",
                "prompts/partials/brand-voice.md", "prompts/partials/escalation-policy.md",
                "prompts/partials/safety-preamble.md", "prompts/drafts/rate-change-announcement.md");
        for (String path : clean) {
            Files.setLastModifiedTime(copy.resolve(path), old);
        }
        Map<String, byte[]> before = snapshot();
        // Exit 1: the two copies of the pasted preamble that differ in whitespace are left (WASTE.md).
        assertEquals(1, Cli.run("fix", copy.toString(), "--include-review").exitCode());
        for (String path : before.keySet()) {
            if (path.startsWith("prompts/")) {
                Map<String, Integer> expected = placeholders(new String(before.get(path), StandardCharsets.UTF_8));
                if (BYTE_IDENTICAL_PREAMBLE.contains(path)) {
                    expected.merge("{{> safety-preamble }}", 1, Integer::sum);
                }
                assertEquals(expected, placeholders(read(path)), path);
            }
        }
        for (String path : clean) {
            assertArrayEquals(before.get(path), Files.readAllBytes(copy.resolve(path)), path);
            assertEquals(old, Files.getLastModifiedTime(copy.resolve(path)), path + " keeps its modification time");
        }
    }

    @Test
    void reviewRewritesWaitForIncludeReviewAndComeWithTheCaution() throws IOException {
        Cli.Run safe = Cli.run("fix", copy.toString());
        assertTrue(safe.out().contains("Review-class rewrites not applied: costly-character"), safe.out());
        // WASTE.md, "Decorative rulers": review-class, so still there after a safe fix.
        assertEquals("==========", line(read("prompts/system/assistant.md"), 16));
        assertTrue(safe.out().contains("shared-block (1)"), "the preamble's extraction waits too: " + safe.out());
        Cli.Run review = Cli.run("fix", copy.toString(), "--include-review");
        assertEquals(1, review.exitCode(), "the preamble copies that differ in whitespace stay: " + review.out());
        assertTrue(review.out().contains("Review-class rewrites applied: costly-character"), review.out());
        assertTrue(review.out().contains("evaluate the prompts they change before they ship"), review.out());
        assertEquals("===", line(read("prompts/system/assistant.md"), 16));
        assertFalse(read("prompts/system/assistant.md").contains("\u2192"), "WASTE.md, costly characters: the arrows");
    }

    @Test
    void theSavingIsReportedAndAddsUp() throws IOException {
        JsonNode report = new ObjectMapper().readTree(Cli.run("fix", copy.toString(), "--dry-run", "--format", "json").out());
        assertEquals("tare", report.get("tool").asText());
        JsonNode total = report.get("summary").get("tokens").get("o200k_base");
        assertTrue(total.get("saved").asInt() > 0, total.toString());
        int files = 0;
        for (JsonNode file : report.get("files")) {
            if (file.get("tokens").has("o200k_base")) {
                files += file.get("tokens").get("o200k_base").get("saved").asInt();
            }
        }
        assertEquals(total.get("saved").asInt(), files, "the total is the sum of the files");
        int rules = 0;
        for (JsonNode rule : report.get("summary").get("rules")) {
            rules += rule.get("saved_tokens").path("o200k_base").asInt();
        }
        assertEquals(total.get("saved").asInt(), rules, "per-rule savings add up to the total");
        assertTrue(report.get("summary").get("note").asText().contains("planning estimates"));
    }

    @Test
    void thePastedPreambleIsIncludedWhereItIsByteIdenticalAndLeftWhereItIsNot() throws IOException {
        String preamble = original("prompts/partials/safety-preamble.md");
        Cli.Run run = Cli.run("fix", copy.toString(), "--include-review", "--only", "shared-block");
        assertEquals(1, run.exitCode(), run.out());
        // WASTE.md, "Pasted safety preamble": the byte-identical copies become includes of the partial
        // that already holds the text; the two that differ only in whitespace stay, each named with its line.
        for (String path : BYTE_IDENTICAL_PREAMBLE) {
            assertFalse(read(path).contains("Never ask a customer to open a meter pit"), path);
            assertTrue(read(path).contains("{{> safety-preamble }}"), path);
        }
        assertTrue(read("prompts/billing/payment-plan.chat.yaml").contains("\n      {{> safety-preamble }}\n"));
        assertTrue(run.out().contains("prompts/leaks/leak-triage.md:14: shared-block not applied"), run.out());
        assertTrue(run.out().contains("prompts/meters/reading-dispute.md:15: shared-block not applied"), run.out());
        assertEquals(original("prompts/leaks/leak-triage.md"), read("prompts/leaks/leak-triage.md"));
        assertEquals(preamble, read("prompts/partials/safety-preamble.md"), "the partial itself is not touched");
        assertFalse(Files.list(copy.resolve("prompts/partials")).anyMatch(p -> !List.of("account-lookup-notes.md",
                "brand-voice.md", "escalation-policy.md", "safety-preamble.md").contains(p.getFileName().toString())),
                "no new partial: the existing one holds the text");
    }

    @Test
    void aSecondFixChangesNothing() throws IOException {
        assertEquals(1, Cli.run("fix", copy.toString(), "--include-review").exitCode());
        Map<String, byte[]> once = snapshot();
        Cli.Run again = Cli.run("fix", copy.toString(), "--include-review");
        assertEquals(1, again.exitCode(), "the preamble copies that differ in whitespace are reported again");
        assertTrue(again.out().contains("Nothing fixed in"), again.out());
        Map<String, byte[]> twice = snapshot();
        once.forEach((path, bytes) -> assertArrayEquals(bytes, twice.get(path), path));
    }

    private Map<String, byte[]> snapshot() throws IOException {
        Map<String, byte[]> files = new TreeMap<>();
        try (Stream<Path> walk = Files.walk(copy)) {
            for (Path file : walk.filter(Files::isRegularFile).toList()) {
                files.put(copy.relativize(file).toString().replace('\\', '/'), Files.readAllBytes(file));
            }
        }
        return files;
    }

    /** Lines outside fenced code (and outside front matter). */
    private static List<String> proseLines(String text) {
        List<String> lines = new ArrayList<>();
        boolean fence = false;
        for (String line : text.split("\n", -1)) {
            if (line.startsWith("```")) {
                fence = !fence;
            } else if (!fence) {
                lines.add(line);
            }
        }
        return lines;
    }

    private static List<String> jsonBlocks(String text) {
        List<String> blocks = new ArrayList<>();
        Matcher matcher = Pattern.compile("```json\\n(.*?)```", Pattern.DOTALL).matcher(text);
        while (matcher.find()) {
            blocks.add(matcher.group(1).strip());
        }
        return blocks;
    }

    private static Map<String, Integer> placeholders(String text) {
        Map<String, Integer> counts = new TreeMap<>();
        Matcher matcher = PLACEHOLDER.matcher(text);
        while (matcher.find()) {
            counts.merge(matcher.group(), 1, Integer::sum);
        }
        return counts;
    }

    private static int count(String text, String part) {
        int count = 0;
        for (int at = text.indexOf(part); at >= 0; at = text.indexOf(part, at + 1)) {
            count++;
        }
        return count;
    }

    /**
     * One computation per number: where a file has a single safe finding, what fix saves on the file
     * (on its first target's tokenizer) is the saving check gave that finding.
     */
    @Test
    void aLoneSafeFindingSavesInFixWhatCheckSays() throws IOException {
        ObjectMapper json = new ObjectMapper();
        JsonNode check = json.readTree(Cli.run("check", DEMO.toString(), "--format", "json").out());
        JsonNode fix = json.readTree(Cli.run("fix", DEMO.toString(), "--dry-run", "--format", "json").out());
        int compared = 0;
        for (JsonNode file : fix.get("files")) {
            List<JsonNode> safe = new ArrayList<>();
            for (JsonNode finding : check.get("findings")) {
                if (finding.get("path").equals(file.get("path")) && finding.get("rewrite_class").asText().equals("safe")
                        && finding.has("edits")) {
                    safe.add(finding);
                }
            }
            if (safe.size() == 1) {
                JsonNode first = file.get("tokens").elements().next();
                assertEquals(safe.get(0).get("saving_tokens").asInt(), first.get("saved").asInt(), file.get("path").asText());
                compared++;
            }
        }
        assertTrue(compared >= 2, "the demo has files with one safe finding, the tool file among them");
    }
}
