package dev.tare.app;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import dev.tare.footprint.Footprint;
import dev.tare.overlap.CachePrefixes;
import dev.tare.tokenize.Tokenizer;
import dev.tare.tokenize.TokenizerRegistry;
import dev.tare.workspace.Workspace;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.stream.Collectors;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Prefix caching in a scan (design.md, "Prefix caching — hosted"): each template's static prefix P,
 * the cacheable part C, the hit rate h = 1 − e^(−λ × ttl) from the calls of every template whose
 * calls begin with the same C tokens, and the cost per call with reads and writes. Expected token
 * counts come from Tare's o200k_base, which TiktokenReferenceTest checks against the reference encoder.
 */
class SharedPrefixScanTest {
    private static final String PREAMBLE = "You are the support assistant of a water utility. Answer in plain words,"
            + " cite the account notes you were given, never guess a meter reading, and hand the customer to a"
            + " person when they ask for one or when a leak may be dangerous.\n\n";
    private static final String OTHER = "You write the monthly newsletter of a water utility: short paragraphs, one"
            + " tip about saving water, and the dates of planned works, in a friendly voice.\n\n";
    /** 288 calls a day with a 300-second entry: λ × ttl = 1 for one template alone. */
    private static final int CALLS = 288;

    @TempDir
    Path root;
    private final Tokenizer o200k = new TokenizerRegistry().get("o200k_base", Path.of("."));

    @BeforeEach
    void workspace() throws IOException {
        write("tare.yaml", """
                templates: {include: ["prompts/**/*.md"], partials: prompts/partials}
                targets:
                  - name: hosted
                    tokenizer: o200k_base
                    price: {input: 2.0, cached_input: 0.5, cache_write: 2.5, output: 8.0, currency: USD}
                    prefix_cache: {min_tokens: 20, ttl_seconds: 300}
                    calls_per_day: 288
                    output_tokens: 10
                  - name: plain
                    tokenizer: o200k_base
                """);
        write("prompts/partials/preamble.md", PREAMBLE);
        write("prompts/answer.md", PREAMBLE + "{{question}}\nAnswer briefly.");
        write("prompts/summary.md", "{{> preamble}}{{ticket}}\nSummarize the ticket.");
        write("prompts/newsletter.md", OTHER + "{{month}}");
        write("prompts/variable-first.md", "{{greeting}}" + PREAMBLE + "Say hello.");
        write("prompts/short.md", "Short.");
    }

    @Test
    void templatesSharingAStaticPrefixPoolTheirTraffic() {
        Map<String, ScannedTemplate> byPath = scan();
        int preamble = o200k.count(PREAMBLE);
        // answer.md and summary.md (through its include) both begin with the preamble and then a
        // variable: P = C = the preamble's tokens (the minimum is 20, in steps of 1), and their calls
        // keep one entry alive: λ × ttl = 2 × 288 / 86,400 × 300 = 2.
        Footprint answer = byPath.get("prompts/answer.md").targets().get("hosted");
        Footprint.Caching caching = answer.caching().orElseThrow();
        assertEquals(preamble, caching.staticPrefixTokens());
        assertEquals(preamble, caching.cacheablePrefixTokens());
        double hit = 1 - Math.exp(-2);
        assertEquals(hit, caching.hitRate(), 1e-12);
        assertEquals(2.0 * CALLS, caching.sharedCallsPerDay().getAsDouble(), 1e-9);
        assertEquals(hit, byPath.get("prompts/summary.md").targets().get("hosted").caching().orElseThrow().hitRate(), 1e-12);
        // ((I − C) × 2.0 + C × (h × 0.5 + (1 − h) × 2.5) + 10 × 8.0) / 1e6, and a month of 288 calls a day.
        int input = answer.inputTokens();
        double perCall = ((input - preamble) * 2.0 + preamble * (hit * 0.5 + (1 - hit) * 2.5) + 10 * 8.0) / 1e6;
        assertEquals(perCall, answer.costPerCall().getAsDouble(), 1e-12);
        assertEquals(perCall * CALLS * 30, answer.costPerMonth().getAsDouble(), 1e-9);
        assertEquals((input * 2.0 + 10 * 8.0) / 1e6 * CALLS * 30, answer.costPerMonthUncached().getAsDouble(), 1e-9);
        // A template whose prefix no other shares keeps its entry alive alone: λ × ttl = 1.
        assertEquals(1 - Math.exp(-1),
                byPath.get("prompts/newsletter.md").targets().get("hosted").caching().orElseThrow().hitRate(), 1e-12);
    }

    @Test
    void frontMatterAndTrafficGlobsSetEachTemplatesCalls() throws IOException {
        write("tare.yaml", Files.readString(root.resolve("tare.yaml"))
                + "traffic: {\"prompts/sum*.md\": 576, \"prompts/**\": 1}\n");
        write("prompts/answer.md", "---\ncalls_per_day: 864\n---\n" + PREAMBLE + "{{question}}\nAnswer briefly.");
        write("prompts/broken.md", "---\ncalls_per_day: lots\n---\nHello.");
        ScanResult result = new TemplateScan(Workspace.open(List.of(root), Optional.empty()), new TokenizerRegistry())
                .run(ScanOptions.defaults());
        Map<String, ScannedTemplate> byPath = result.templates().stream()
                .collect(Collectors.toMap(ScannedTemplate::path, t -> t));
        // answer's front matter says 864, the first glob gives summary 576: λ × ttl = 1,440 / 86,400 × 300 = 5.
        Footprint answer = byPath.get("prompts/answer.md").targets().get("hosted");
        assertEquals(1440, answer.caching().orElseThrow().sharedCallsPerDay().getAsDouble(), 1e-9);
        assertEquals(1 - Math.exp(-5), answer.caching().orElseThrow().hitRate(), 1e-12);
        assertEquals(answer.costPerCall().getAsDouble() * 864 * 30, answer.costPerMonth().getAsDouble(), 1e-9);
        Footprint summary = byPath.get("prompts/summary.md").targets().get("hosted");
        assertEquals(summary.costPerCall().getAsDouble() * 576 * 30, summary.costPerMonth().getAsDouble(), 1e-9);
        // The second glob matches the rest; the target's 288 is left for templates no glob matches.
        Footprint newsletter = byPath.get("prompts/newsletter.md").targets().get("hosted");
        assertEquals(newsletter.costPerCall().getAsDouble() * 30, newsletter.costPerMonth().getAsDouble(), 1e-9);
        assertTrue(result.skipped().stream().anyMatch(s -> s.path().equals("prompts/broken.md")
                && s.reason().contains("calls_per_day must be a number of calls a day")), result.skipped().toString());
    }

    @Test
    void writesAtAPremiumMakeCachingPayOnlyFromABreakEvenTraffic() throws IOException {
        ScanResult result = new TemplateScan(Workspace.open(List.of(root), Optional.empty()), new TokenizerRegistry())
                .run(ScanOptions.defaults());
        // h* = (2.5 − 2.0) / (2.5 − 0.5) = 0.25, reached at −ln(0.75) / 300 s × 86,400 s = 82.85 calls a day.
        double breakEven = -Math.log(0.75) / 300 * 86_400;
        assertEquals(82.85, breakEven, 0.01);
        JsonNode totals = new ObjectMapper().readTree(dev.tare.report.ScanReport.json(result, ScanResult.Order.PATH))
                .get("totals").get("targets").get("hosted");
        assertEquals(breakEven, totals.get("cache_break_even_calls_per_day").asDouble(), 1e-9);
        assertTrue(dev.tare.report.ScanReport.text(result, ScanResult.Order.PATH).contains("caching pays from 82.9 calls a day"));
    }

    @Test
    void aVariableFirstOrAShortTemplateHasNothingToCache() {
        Map<String, ScannedTemplate> byPath = scan();
        Footprint.Caching first = byPath.get("prompts/variable-first.md").targets().get("hosted").caching().orElseThrow();
        assertEquals(0, first.staticPrefixTokens());
        assertEquals(0, first.cacheablePrefixTokens());
        // Without a variable the whole call is static, but shorter than the minimum.
        Footprint shortOne = byPath.get("prompts/short.md").targets().get("hosted");
        assertEquals(shortOne.inputTokens(), shortOne.caching().orElseThrow().staticPrefixTokens());
        assertEquals(0, shortOne.caching().orElseThrow().cacheablePrefixTokens());
        assertEquals(0, shortOne.cachedInputTokens().getAsDouble(), 1e-12);
        // A target without a prefix cache has no caching figure at all.
        assertTrue(byPath.get("prompts/answer.md").targets().get("plain").caching().isEmpty());
    }

    @Test
    void aMinimumAboveTheStaticPrefixCachesNothing() throws IOException {
        int preamble = o200k.count(PREAMBLE);
        write("tare.yaml", Files.readString(root.resolve("tare.yaml"))
                .replace("min_tokens: 20", "min_tokens: " + (preamble + 1)));
        Footprint answer = scan().get("prompts/answer.md").targets().get("hosted");
        assertEquals(0, answer.caching().orElseThrow().cacheablePrefixTokens());
        assertEquals(answer.costPerMonthUncached().getAsDouble(), answer.costPerMonth().getAsDouble(), 1e-9);
    }

    @Test
    void staticPrefixIsBoundedToTheKeptIds() throws IOException {
        // "word", 19,999 × " word" and the newline are one o200k token each: 20,001, over the kept 16,384.
        String big = "word" + " word".repeat(19_999) + "\n";
        write("prompts/big-a.md", big + "{{a}}");
        assertEquals(20_001, o200k.count(big));
        assertEquals(CachePrefixes.MAX_LEADING_IDS,
                scan().get("prompts/big-a.md").targets().get("hosted").caching().orElseThrow().staticPrefixTokens());
    }

    private Map<String, ScannedTemplate> scan() {
        Workspace workspace = Workspace.open(List.of(root), Optional.empty());
        ScanResult result = new TemplateScan(workspace, new TokenizerRegistry()).run(ScanOptions.defaults());
        return result.templates().stream().collect(Collectors.toMap(ScannedTemplate::path, t -> t));
    }

    private void write(String relative, String text) throws IOException {
        Path file = root.resolve(relative);
        Files.createDirectories(file.getParent());
        Files.writeString(file, text, StandardCharsets.UTF_8);
    }
}
