package dev.tare.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import dev.tare.cli.Cli;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;

/**
 * {@code tare scan --format md}, pinned by golden files under {@code src/test/resources/reports/golden}.
 * After an intended change of the Markdown, rewrite them with
 * {@code mvn test -Dtest=MarkdownReportTest -Dtare.golden.update=true} and review the diff.
 */
class MarkdownReportTest {
    private static final Path GOLDEN = Path.of("src/test/resources/reports/golden");
    private static final Path BASELINE_REPO = Path.of("src/test/resources/reports/baseline-repo");
    /** Each corpus is rendered once per run; the tests only read the text. */
    private static final java.util.Map<Path, String> MARKDOWN = new java.util.concurrent.ConcurrentHashMap<>();

    @Test
    void demoSummaryMatchesItsGoldenFile() throws IOException {
        String markdown = markdown(Path.of("corpora/demo"));
        assertGolden("demo.md", markdown);
    }

    @Test
    void baselineSummaryMatchesItsGoldenFile() throws IOException {
        String markdown = markdown(BASELINE_REPO);
        assertGolden("baseline-repo.md", markdown);
    }

    @Test
    void demoTotalsEqualTheJsonReportAndEveryFigureSaysItIsAnEstimate() throws IOException {
        Path demo = Cli.projectDir().resolve("corpora/demo");
        String markdown = markdown(Path.of("corpora/demo"));
        JsonNode json = json(demo);
        for (var target : (Iterable<java.util.Map.Entry<String, JsonNode>>) json.get("totals").get("targets")::fields) {
            String tokens = TextTable.number(target.getValue().get("input_tokens").asLong());
            assertTrue(markdown.lines().anyMatch(l -> l.startsWith("| " + target.getKey() + " |") && l.contains(" " + tokens + " ")),
                    target.getKey() + " total " + tokens + " missing:\n" + markdown);
        }
        assertTrue(markdown.contains("> " + Figures.ESTIMATE_NOTE), markdown);
        for (String header : new String[] {"Cost per month (estimate)", "KV cache, largest request (estimate)",
                "hosted-large: cost per month (estimate)", "laptop: KV cache (estimate)"}) {
            assertTrue(markdown.contains(header), header);
        }
        assertTrue(markdown.contains(CheckReport.ESTIMATE_NOTE), "savings say they are estimates");
    }

    @Test
    void costliestTemplatesAreTheTenWithTheHighestSummedMonthlyCost() throws IOException {
        Path demo = Cli.projectDir().resolve("corpora/demo");
        JsonNode json = json(demo);
        java.util.List<JsonNode> templates = new java.util.ArrayList<>();
        json.get("templates").forEach(t -> {
            // Partials and tool files are never sent alone.
            if (!t.get("kind").asText().equals("partial") && !t.get("kind").asText().equals("tools")) {
                templates.add(t);
            }
        });
        // The ranking the Markdown promises, recomputed from the JSON contract's per-target cost_per_month.
        templates.sort(java.util.Comparator.comparingDouble(MarkdownReportTest::monthly).reversed());
        String markdown = markdown(Path.of("corpora/demo"));
        for (int rank = 1; rank <= 10; rank++) {
            String row = "| " + rank + " | `" + templates.get(rank - 1).get("path").asText() + "` |";
            assertTrue(markdown.contains(row), row + "\n" + markdown);
        }
        assertTrue(!markdown.contains("| 11 | `"), "only ten rows");
    }

    @Test
    void baselineChangesFollowTheRecordedCountsAndTheTolerance() throws IOException {
        String markdown = markdown(BASELINE_REPO);
        JsonNode json = json(Cli.projectDir().resolve(BASELINE_REPO));
        int greet = hosted(json, "prompts/greet.md");
        int outage = hosted(json, "prompts/outage.md");
        // Recorded counts are in the fixture's tare-baseline.json (see its README); tolerance 5%.
        assertTrue(greet > 30 * 1.05, "fixture: greet.md must have grown beyond the tolerance, now " + greet);
        assertTrue(markdown.contains("| `prompts/greet.md` | hosted | 30 | " + greet + " | +" + (greet - 30)),
                markdown);
        assertTrue(markdown.contains("| `prompts/outage.md` | hosted | 35 | " + outage + " | −" + (35 - outage)),
                markdown);
        assertTrue(markdown.contains("**1 count grew beyond the tolerance**"), markdown);
        assertTrue(markdown.contains("New since the baseline: `prompts/meter.md`."), markdown);
        assertTrue(markdown.contains("Recorded but gone: `prompts/retired.md`."), markdown);
    }

    @Test
    void withoutABaselineFileTheSummarySaysHowToRecordOne() throws IOException {
        assertTrue(markdown(Path.of("corpora/demo")).contains("No baseline: `tare-baseline.json` does not exist."));
    }

    @Test
    void aBrokenBaselineFileIsAOneLineErrorNamingIt(@org.junit.jupiter.api.io.TempDir Path root) throws IOException {
        Files.writeString(root.resolve("tare.yaml"), "templates: {include: [\"*.md\"]}\n");
        Files.writeString(root.resolve("a.md"), "Say hello.\n");
        Files.writeString(root.resolve("tare-baseline.json"), "{not json");
        Cli.Run run = Cli.run("scan", root.toString(), "--format", "md");
        assertEquals(2, run.exitCode());
        assertTrue(run.err().startsWith("tare: " + root.resolve("tare-baseline.json") + ", line 1"), run.err());
        assertTrue(run.err().contains("rewrite it with 'tare baseline'"), run.err());
        assertEquals(1, run.err().strip().lines().count(), "one line, no stack trace");
    }

    private static double monthly(JsonNode template) {
        double sum = 0;
        for (JsonNode footprint : template.get("targets")) {
            sum += footprint.path("cost_per_month").asDouble(0);
        }
        return sum;
    }

    private static int hosted(JsonNode json, String path) {
        for (JsonNode template : json.get("templates")) {
            if (template.get("path").asText().equals(path)) {
                JsonNode hosted = template.get("targets").get("hosted");
                return hosted.get("input_tokens").asInt() - hosted.get("framing_tokens").asInt();
            }
        }
        throw new AssertionError(path + " not scanned");
    }

    private static JsonNode json(Path root) throws IOException {
        Cli.Run run = Cli.run("scan", root.toString(), "--format", "json");
        assertEquals(0, run.exitCode(), run.err());
        return new ObjectMapper().readTree(run.out());
    }

    /** The Markdown for a folder of the checkout, with its root written as that relative path wherever the run was started. */
    private static String markdown(Path relative) {
        return MARKDOWN.computeIfAbsent(relative, MarkdownReportTest::render);
    }

    private static String render(Path relative) {
        Path absolute = Cli.projectDir().resolve(relative);
        Cli.Run run = Cli.run("scan", absolute.toString(), "--format", "md");
        assertEquals(0, run.exitCode(), run.err());
        return run.out().replace("`" + absolute + "`", "`" + relative.toString().replace('\\', '/') + "`");
    }

    private static void assertGolden(String name, String actual) throws IOException {
        Path file = Cli.projectDir().resolve(GOLDEN).resolve(name);
        if (Boolean.getBoolean("tare.golden.update")) {
            Files.createDirectories(file.getParent());
            Files.writeString(file, actual, StandardCharsets.UTF_8);
        }
        assertTrue(Files.exists(file), file + " is missing; write it with -Dtare.golden.update=true");
        assertEquals(Files.readString(file, StandardCharsets.UTF_8), actual,
                name + " differs from its golden file; if the change is intended, rerun with -Dtare.golden.update=true");
    }
}
