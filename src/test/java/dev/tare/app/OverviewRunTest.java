package dev.tare.app;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.lint.RewriteClass;
import dev.tare.tokenize.Tokenizer;
import dev.tare.tokenize.TokenizerRegistry;
import dev.tare.workspace.Workspace;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The overview behind the Markdown and HTML reports: tokens line by line, rule tallies, target totals
 * and the baseline comparison. Token counts come from o200k_base, whose counts
 * {@code TiktokenReferenceTest} checks against the reference tokenizer (npm package tiktoken).
 */
class OverviewRunTest {
    @TempDir
    Path root;
    private final Tokenizer o200k = new TokenizerRegistry().get("o200k_base", Path.of("."));

    private void write(String path, String text) throws IOException {
        Path file = root.resolve(path);
        Files.createDirectories(file.getParent());
        Files.writeString(file, text);
    }

    private Overview run(boolean withLines) {
        return new OverviewRun(Workspace.open(List.of(root), Optional.empty()), new TokenizerRegistry())
                .run(ScanOptions.defaults(), withLines);
    }

    private static TemplateLines lines(Overview overview, String path) {
        return overview.linesOf(path).orElseThrow(() -> new AssertionError(path + " has no lines"));
    }

    @Test
    void eachBodyLineCountsItsOwnTextAndFrontMatterIsNotSent() throws IOException {
        write("tare.yaml", "templates: {include: [\"prompts/**/*.md\"], partials: prompts/partials}\n");
        write("prompts/partials/sign-off.md", "Thanks for writing to the water utility.\n");
        write("prompts/reply.md", "---\nbudget: 500\n---\nAnswer {{ name }} in plain words.\n{# a note #}\n"
                + "{{> sign-off }}\nKeep it short.");
        Overview overview = run(true);
        TemplateLines lines = lines(overview, "prompts/reply.md");
        assertEquals(7, lines.lines().size(), "no empty line after the last one");
        for (int i = 0; i < 3; i++) {
            assertFalse(lines.lines().get(i).prompt(), "front matter line " + (i + 1));
            assertEquals(0, lines.lines().get(i).tokens());
        }
        // Line 4: the literal text around the variable, each piece counted on its own.
        assertEquals(o200k.count("Answer ") + o200k.count(" in plain words.\n"), lines.lines().get(3).tokens());
        assertEquals(o200k.count("\n"), lines.lines().get(4).tokens(), "a comment renders to nothing but its line end");
        ScannedTemplate partial = overview.scan().templates().stream()
                .filter(t -> t.path().equals("prompts/partials/sign-off.md")).findFirst().orElseThrow();
        TemplateLines.Line include = lines.lines().get(5);
        assertEquals(partial.staticTokens() + o200k.count("\n"), include.tokens(), "the include's line carries the partial");
        assertEquals(List.of("prompts/partials/sign-off.md"), include.includes());
        assertEquals(o200k.count("Keep it short."), lines.lines().get(6).tokens());
        assertEquals("Keep it short.", lines.lines().get(6).text());
    }

    @Test
    void chatContentIsPlacedOnTheFileLinesItWasReadFrom() throws IOException {
        write("tare.yaml", "templates: {include: [\"**/*.chat.yaml\"]}\n");
        write("a.chat.yaml", "messages:\n  - role: system\n    content: |\n      You are brief.\n      Answer in one line.\n"
                + "  - {role: user, content: \"Where is my bill?\"}\n");
        TemplateLines lines = lines(run(true), "a.chat.yaml");
        assertFalse(lines.lines().get(0).prompt(), "messages:");
        assertFalse(lines.lines().get(1).prompt(), "- role: system");
        assertEquals(o200k.count("You are brief.\n"), lines.lines().get(3).tokens());
        assertEquals(o200k.count("Answer in one line.\n"), lines.lines().get(4).tokens());
        assertEquals(o200k.count("Where is my bill?"), lines.lines().get(5).tokens());
        assertTrue(lines.lines().get(5).prompt());
    }

    @Test
    void theSavingsAreWhatFixSavesApplyingTheRewrites() throws IOException {
        write("tare.yaml", "templates: {include: [\"prompts/**/*.md\"]}\n");
        String text = "One line with trailing spaces.   \nAnother one.  \n\n\n\nThe end.\n";
        write("prompts/a.md", text);
        Overview overview = run(false);
        assertTrue(overview.lines().isEmpty(), "lines only when asked for");
        RuleTally trailing = overview.rules().stream().filter(t -> t.rule().equals("trailing-whitespace")).findFirst()
                .orElseThrow();
        assertEquals(2, trailing.findings());
        assertEquals(1, trailing.files());
        // Not the findings' savings one by one: what the file loses when fix applies every safe rewrite.
        new Fix(Workspace.open(List.of(root), Optional.empty()), new TokenizerRegistry(),
                dev.tare.workspace.FileSystemOps.DEFAULT).run(dev.tare.rewrite.FixOptions.defaults());
        String fixed = Files.readString(root.resolve("prompts/a.md"));
        assertEquals(o200k.count(text) - o200k.count(fixed), overview.savingTokens(RewriteClass.SAFE));
        assertTrue(trailing.savingTokens() > 0 && trailing.savingTokens() <= overview.savingTokens(RewriteClass.SAFE));
    }

    @Test
    void targetTotalsSumCostsAndKeepTheLargestKvCache() throws IOException {
        write("tare.yaml", """
                templates: {include: ["prompts/**/*.md"]}
                targets:
                  - {name: hosted, tokenizer: o200k_base, price: {input: 2.0, output: 8.0, currency: USD}, calls_per_day: 100, output_tokens: 10}
                  - {name: box, tokenizer: o200k_base, model: opt-1.3b, weight_bits: int8, kv_bits: fp16, device: gpu-24gb, output_tokens: 10}
                """);
        write("prompts/short.md", "Say hello.\n");
        write("prompts/long.md", "Explain the bill line by line, in plain words, and say which reading it used.\n");
        Overview overview = run(false);
        TargetTotals hosted = overview.targets().get(0);
        double sum = overview.scan().templates().stream()
                .mapToDouble(t -> t.targets().get("hosted").costPerMonth().getAsDouble()).sum();
        assertEquals(sum, hosted.costPerMonth().getAsDouble(), 1e-9);
        assertTrue(hosted.largestKvCacheBytes().isEmpty(), "no model on the hosted target");
        TargetTotals box = overview.targets().get(1);
        assertEquals(Optional.of("prompts/long.md"), box.largestRequest());
        // opt-1.3b at fp16 KV: 2 x 24 layers x 32 heads x 64 x 2 bytes = 196,608 bytes per token (design formula).
        int input = overview.scan().templates().stream().filter(t -> t.path().equals("prompts/long.md")).findFirst()
                .orElseThrow().targets().get("box").inputTokens();
        assertEquals(196_608L * (input + 10), box.largestKvCacheBytes().getAsLong());
    }

    @Test
    void baselineComparisonNamesGrowthShrinkageNewAndGoneTemplates() throws IOException {
        write("tare.yaml", "templates: {include: [\"prompts/**/*.md\"]}\nbaseline: {file: base.json, tolerance_percent: 10}\n");
        write("prompts/a.md", "Explain the bill line by line, in plain words, and say which reading it used.\n");
        write("prompts/b.md", "Say hello.\n");
        int a = o200k.count("Explain the bill line by line, in plain words, and say which reading it used.\n");
        write("base.json", "{\"tool\": \"tare\", \"format\": 1, \"templates\": {\"prompts/a.md\": {\"o200k_base\": "
                + (a / 2) + "}, \"prompts/gone.md\": {\"o200k_base\": 5}}}");
        BaselineStatus status = run(false).baseline().orElseThrow();
        assertEquals(1, status.overTolerance().size());
        assertEquals(a / 2, status.overTolerance().get(0).recorded());
        assertEquals(a, status.overTolerance().get(0).current());
        assertEquals(List.of("prompts/b.md"), status.added());
        assertEquals(List.of("prompts/gone.md"), status.removed());
        assertEquals("base.json", status.file());
    }
}
