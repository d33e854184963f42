package dev.tare.lint;

import dev.tare.app.BaselineFile;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.TareException;
import dev.tare.cli.Cli;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class BaselineTest {
    @TempDir
    Path dir;

    @Test
    void theFileIsSortedOneTemplateALineAndReadsBack() throws Exception {
        Baseline baseline = new Baseline(Map.of("b.md", Map.of("z", 2, "a", 1), "a.md", Map.of("t", 10)));
        String text = BaselineFile.text(baseline);
        assertEquals("{\n  \"tool\": \"tare\",\n  \"format\": 1,\n  \"templates\": {\n"
                + "    \"a.md\": {\"t\":10},\n    \"b.md\": {\"a\":1,\"z\":2}\n  }\n}\n", text);
        Path file = dir.resolve("tare-baseline.json");
        BaselineFile.write(file, baseline);
        assertEquals(baseline, BaselineFile.read(file).orElseThrow());
        assertEquals(dev.tare.workspace.SafeFileWriter.Outcome.UNCHANGED, BaselineFile.write(file, baseline));
        assertEquals("{\n  \"tool\": \"tare\",\n  \"format\": 1,\n  \"templates\": {}\n}\n", BaselineFile.text(new Baseline(Map.of())));
    }

    @Test
    void growthBeyondTheToleranceIsABreachAndShrinkingIsReported() {
        Baseline recorded = new Baseline(Map.of("a.md", Map.of("t", 100), "b.md", Map.of("t", 100), "c.md", Map.of("t", 100)));
        Baseline current = new Baseline(Map.of("a.md", Map.of("t", 105), "b.md", Map.of("t", 106), "c.md", Map.of("t", 80),
                "new.md", Map.of("t", 5000)));
        List<BaselineChange> changes = BaselineComparison.compare(recorded, current, 5.0);
        assertEquals(List.of(
                new BaselineChange("a.md", "t", 100, 105, false),
                new BaselineChange("b.md", "t", 100, 106, true),
                new BaselineChange("c.md", "t", 100, 80, false)), changes);
        assertEquals(-20.0, changes.get(2).percent());
    }

    @Test
    void aBrokenBaselineSaysHowToMendIt() throws Exception {
        Path file = Files.writeString(dir.resolve("tare-baseline.json"), "{\"tool\": \"other\"}");
        TareException e = assertThrows(TareException.class, () -> BaselineFile.read(file));
        assertTrue(e.getMessage().endsWith("rewrite it with 'tare baseline'"), e.getMessage());
        assertEquals(java.util.Optional.empty(), BaselineFile.read(dir.resolve("none.json")));
    }

    @Test
    void checkFailsOnGrowthBeyondTheToleranceAndReportsShrinking() throws Exception {
        Files.createDirectories(dir.resolve("prompts"));
        Files.writeString(dir.resolve("tare.yaml"), "templates: {include: [\"prompts/*.md\"]}\n"
                + "targets:\n  - {name: hosted, tokenizer: o200k_base}\nbaseline: {tolerance_percent: 10}\n");
        Files.writeString(dir.resolve("prompts/grows.md"), "Answer billing questions politely and briefly.\n");
        Files.writeString(dir.resolve("prompts/shrinks.md"), "Answer billing questions politely, briefly and in plain words.\n");
        assertEquals(0, Cli.run("baseline", dir.toString()).exitCode());
        assertEquals(0, Cli.run("check", dir.toString()).exitCode(), "nothing moved yet");

        Files.writeString(dir.resolve("prompts/grows.md"),
                "You answer billing questions for the city water utility, politely and briefly, in plain words.\n");
        Files.writeString(dir.resolve("prompts/shrinks.md"), "Answer billing questions.\n");
        Cli.Run check = Cli.run("check", dir.toString());
        assertEquals(1, check.exitCode(), check.out());
        dev.tare.tokenize.Tokenizer o200k = new dev.tare.tokenize.TokenizerRegistry().get("o200k_base", dir);
        int before = o200k.count("Answer billing questions politely and briefly.\n");
        int after = o200k.count("You answer billing questions for the city water utility, politely and briefly, in plain words.\n");
        assertTrue(check.out().contains("prompts/grows.md:1:1: error baseline-growth: grew from " + before + " to " + after
                + " tokens on hosted"), check.out());
        assertTrue(check.out().contains("prompts/shrinks.md:1:1: info baseline-shrink: shrank from"), check.out());
    }

    @Test
    void theCommandRecordsTheDemosEstimatedTokensPerTarget() throws Exception {
        Path demo = Cli.projectDir().resolve("corpora/demo");
        Path copy = dir.resolve("demo");
        try (var files = Files.walk(demo)) {
            for (Path file : (Iterable<Path>) files::iterator) {
                Path target = copy.resolve(demo.relativize(file).toString());
                if (Files.isDirectory(file)) {
                    Files.createDirectories(target);
                } else {
                    Files.copy(file, target);
                }
            }
        }
        Cli.Run run = Cli.run("baseline", copy.toString());
        assertEquals(0, run.exitCode(), run.err());
        Baseline written = BaselineFile.read(copy.resolve("tare-baseline.json")).orElseThrow();
        Cli.Run scan = Cli.run("scan", copy.toString(), "--format", "json");
        var templates = new com.fasterxml.jackson.databind.ObjectMapper().readTree(scan.out()).get("templates");
        int checked = 0;
        for (var template : templates) {
            String path = template.get("path").asText();
            boolean sentWithTools = Files.readString(copy.resolve(path)).contains("\ntools:");
            if (!template.get("kind").asText().matches("text|chat") || sentWithTools) {
                continue;
            }
            var targets = template.get("targets");
            for (var name : (Iterable<String>) targets::fieldNames) {
                var footprint = targets.get(name);
                int estimated = footprint.get("input_tokens").asInt() - footprint.get("framing_tokens").asInt();
                assertEquals(estimated, written.tokens().get(template.get("path").asText()).get(name));
                checked++;
            }
        }
        assertTrue(checked > 20, "most demo templates run on a target");
    }
}
