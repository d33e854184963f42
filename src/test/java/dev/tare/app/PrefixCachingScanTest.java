package dev.tare.app;

import dev.tare.workspace.Workspace;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import dev.tare.footprint.Footprint;
import dev.tare.overlap.PrefixShare;
import dev.tare.tokenize.Tokenizer;
import dev.tare.tokenize.TokenizerRegistry;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.stream.Collectors;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Prefix caching in a scan, against numbers worked out by hand from design.md ("Prefix caching —
 * hosted"): each template's static prefix P, the cacheable part C (from 20 tokens on, in steps of
 * one), the hit rate h = 1 − e^(−λ × ttl) with λ the calls of every template whose first C tokens are
 * the same, and what caching saves a month: C × (p_in − h × p_cached − (1 − h) × p_write) / 1e6 ×
 * calls_per_day × 30, here with no write premium C × 1.5 × h / 1e6 × 30,000. Token counts are Tare's
 * o200k_base, checked against the reference encoder in TiktokenReferenceTest.
 */
class PrefixCachingScanTest {
    /** 42 tokens on o200k_base, checked below; its last token ("\n\n") stays whole whatever follows here. */
    private static final String PREAMBLE = "You are the support assistant of a water utility. Answer in plain words,"
            + " cite the account notes you were given, never guess a meter reading, and hand the customer to a"
            + " person when they ask for one.\n\n";
    /** λ × ttl of 1,000 calls a day with a 300-second entry. */
    private static final double ONE = 1000.0 / 86_400 * 300;

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
                    price: {input: 2.0, cached_input: 0.5, output: 8.0, currency: USD}
                    prefix_cache: {min_tokens: 20, ttl_seconds: 300}
                    calls_per_day: 1000
                    output_tokens: 10
                """);
        write("prompts/answer.md", PREAMBLE + "{{question}} Answer briefly.");
        write("prompts/summary.md", PREAMBLE + "{{ticket}} Summarize the ticket.");
        write("prompts/greeting.md", "{{greeting}}" + PREAMBLE + "Say hello.");
        write("prompts/short.md", "Short text {{x}}.");
    }

    @Test
    void thePremisesHold() {
        assertEquals(42, o200k.count(PREAMBLE));
        for (String reordered : List.of(PREAMBLE + " Answer briefly.", PREAMBLE + " Summarize the ticket.",
                PREAMBLE + "Say hello.")) {
            int[] ids = o200k.encode(reordered);
            int[] preamble = o200k.encode(PREAMBLE);
            assertTrue(java.util.Arrays.equals(ids, 0, preamble.length, preamble, 0, preamble.length), reordered);
        }
        assertTrue(o200k.count("Short text ") < 20);
    }

    @Test
    void templatesWithTheSameCacheablePrefixShareOneWarmEntry() {
        Map<String, Footprint.Caching> caching = caching(scan());
        // answer and summary send the same 42 tokens first: two templates' calls keep the entry warm.
        double two = 1 - Math.exp(-2 * ONE);
        assertEquals(new Footprint.Caching(42, 42, two, OptionalDouble.of(2000)), caching.get("prompts/answer.md"));
        assertEquals(new Footprint.Caching(42, 42, two, OptionalDouble.of(2000)), caching.get("prompts/summary.md"));
        // greeting starts with its variable: nothing is the same on every call.
        assertEquals(0, caching.get("prompts/greeting.md").cacheablePrefixTokens());
        // short's static start is under the minimum.
        assertEquals(0, caching.get("prompts/short.md").cacheablePrefixTokens());
    }

    @Test
    void theMonthlySavingIsWorkedOutByHand() {
        ScanResult result = scan();
        double two = 1 - Math.exp(-2 * ONE);
        double one = 1 - Math.exp(-ONE);
        // Now: 42 × 1.5 × h / 1e6 × 30,000 = 1.89 × h for answer and summary, nothing for the others.
        Map<String, PrefixShare> shares = shares(result);
        assertEquals(1.89 * two, shares.get("prompts/answer.md").savingPerMonth().getAsDouble(), 1e-9);
        assertEquals(0.0, shares.get("prompts/greeting.md").savingPerMonth().getAsDouble(), 1e-9);
        // Reordered, each template's whole static text comes first, so no two begin with the same
        // cacheable tokens any more (step 1 takes all of it) and each keeps its own entry warm.
        int greeting = o200k.count(PREAMBLE + "Say hello.");
        assertEquals(greeting, shares.get("prompts/greeting.md").reorderedStaticPrefixTokens());
        assertEquals(greeting * 1.5 * one / 1e6 * 30_000,
                shares.get("prompts/greeting.md").reorderedSavingPerMonth().getAsDouble(), 1e-9);
        int answer = o200k.count(PREAMBLE + " Answer briefly.");
        int summary = o200k.count(PREAMBLE + " Summarize the ticket.");
        ScanResult.CacheTotals totals = result.cacheTotals().get("hosted");
        assertEquals(4, totals.templates());
        assertEquals(84, totals.cachedTokens());
        assertEquals(answer + summary + greeting, totals.reorderedCachedTokens());
        assertEquals(2 * 1.89 * two, totals.savingPerMonth().getAsDouble(), 1e-9);
        assertEquals((answer + summary + greeting) * 1.5 * one / 1e6 * 30_000,
                totals.reorderedSavingPerMonth().getAsDouble(), 1e-9);
        assertEquals(Optional.of("USD"), totals.currency());
    }

    @Test
    void theSavingIsTheDifferenceOfTheMonthlyCosts() {
        ScannedTemplate answer = scan().templates().stream().filter(t -> t.path().equals("prompts/answer.md"))
                .findFirst().orElseThrow();
        Footprint footprint = answer.targets().get("hosted");
        int input = footprint.inputTokens();
        double uncached = (input * 2.0 + 10 * 8.0) / 1e6 * 1000 * 30;
        assertEquals(uncached, footprint.costPerMonthUncached().getAsDouble(), 1e-9);
        assertEquals(uncached - footprint.costPerMonth().getAsDouble(),
                answer.prefixes().get("hosted").savingPerMonth().getAsDouble(), 1e-9);
    }

    @Test
    void theJsonCarriesTheStaticPrefixAndTheTotals() throws IOException {
        String json = dev.tare.report.ScanReport.json(scan(), ScanResult.Order.PATH);
        JsonNode root = new ObjectMapper().readTree(json);
        JsonNode answer = null;
        for (JsonNode template : root.get("templates")) {
            if (template.get("path").asText().equals("prompts/answer.md")) {
                answer = template.get("targets").get("hosted");
            }
        }
        double two = 1 - Math.exp(-2 * ONE);
        assertEquals(42, answer.get("static_prefix_tokens").asInt());
        assertEquals(42, answer.get("cacheable_prefix_tokens").asInt());
        assertEquals(Math.round(two * 10_000) / 10_000.0, answer.get("cache_hit_rate").asDouble(), 1e-12);
        assertEquals(Math.round(42 * two * 10) / 10.0, answer.get("cached_input_tokens").asDouble(), 1e-12);
        assertEquals(o200k.count(PREAMBLE + " Answer briefly."), answer.get("reordered_static_prefix_tokens").asInt());
        JsonNode totals = root.get("totals").get("targets").get("hosted");
        assertEquals(84, totals.get("cached_input_tokens").asInt());
        assertEquals(2 * 1.89 * two, totals.get("cache_saving_per_month").asDouble(), 1e-9);
        assertEquals("USD", totals.get("currency").asText());
    }

    @Test
    void theTextReportSaysItIsAnEstimate() {
        String text = dev.tare.report.ScanReport.text(scan(), ScanResult.Order.PATH);
        assertTrue(text.contains("Prefix cache on hosted: 84 tokens per call cacheable now, saving USD "), text);
        assertTrue(text.contains("if each template's per-call parts came after its static parts"), text);
        assertTrue(text.contains("(estimates)."), text);
    }

    private static Map<String, Footprint.Caching> caching(ScanResult result) {
        return result.templates().stream().collect(Collectors.toMap(ScannedTemplate::path,
                t -> t.targets().get("hosted").caching().orElseThrow()));
    }

    private static Map<String, PrefixShare> shares(ScanResult result) {
        return result.templates().stream().collect(Collectors.toMap(ScannedTemplate::path, t -> t.prefixes().get("hosted")));
    }

    private ScanResult scan() {
        return new TemplateScan(Workspace.open(List.of(root), Optional.empty()), new TokenizerRegistry())
                .run(ScanOptions.defaults());
    }

    private void write(String relative, String text) throws IOException {
        Path file = root.resolve(relative);
        Files.createDirectories(file.getParent());
        Files.writeString(file, text, StandardCharsets.UTF_8);
    }
}
