package dev.tare.app;

import dev.tare.workspace.Workspace;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
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
import java.util.stream.Collectors;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Prefix caching in a scan, against numbers worked out by hand: the prefix each template shares
 * with the others on a caching target, as written and with every template's variables after its
 * static text, and what caching it saves per month. The cost formula is design.md's
 * ("Formulas": cost_per_call = ((I − cached) × input + cached × cached_input + O × output) / 1e6,
 * cost_per_month = cost_per_call × calls_per_day × 30), so caching C tokens saves
 * C × (input − cached_input) / 1e6 × calls_per_day × 30. Token counts are Tare's o200k_base,
 * checked against the reference encoder in TiktokenReferenceTest.
 */
class PrefixCachingScanTest {
    /** 42 tokens on o200k_base, checked below; its last token ("\n\n") stays whole whatever follows here. */
    private static final String PREAMBLE = "You are the support assistant of a water utility. Answer in plain words,"
            + " cite the account notes you were given, never guess a meter reading, and hand the customer to a"
            + " person when they ask for one.\n\n";

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
                    prefix_cache_min_tokens: 20
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
    }

    @Test
    void eachTemplateSharesItsStaticStartAsWrittenAndReordered() {
        Map<String, PrefixShare> shares = shares(scan());
        // answer and summary both start with the 42-token preamble before their first variable.
        assertEquals(new Share(42, 42, 42, 42), Share.of(shares.get("prompts/answer.md")));
        assertEquals(new Share(42, 42, 42, 42), Share.of(shares.get("prompts/summary.md")));
        // greeting starts with a variable, so nothing of it is the same on every call; with the variable
        // moved after the static text it starts with the preamble too.
        assertEquals(new Share(0, 0, 42, 42), Share.of(shares.get("prompts/greeting.md")));
        // short shares nothing either way ("Short text ." starts like no other template).
        assertEquals(new Share(0, 0, 0, 0), Share.of(shares.get("prompts/short.md")));
    }

    @Test
    void theMonthlySavingIsWorkedOutByHand() {
        ScanResult result = scan();
        // 42 tokens × (2.00 − 0.50) per million × 1,000 calls a day × 30 days = USD 1.89 a month.
        PrefixShare answer = shares(result).get("prompts/answer.md");
        assertEquals(1.89, answer.savingPerMonth().getAsDouble(), 1e-9);
        assertEquals(1.89, answer.reorderedSavingPerMonth().getAsDouble(), 1e-9);
        assertEquals(0.0, shares(result).get("prompts/greeting.md").savingPerMonth().getAsDouble(), 1e-9);
        assertEquals(1.89, shares(result).get("prompts/greeting.md").reorderedSavingPerMonth().getAsDouble(), 1e-9);
        // Repository: now answer + summary = 84 tokens, 2 × 1.89 = USD 3.78; reordered greeting joins
        // them: 126 tokens, 3 × 1.89 = USD 5.67.
        ScanResult.CacheTotals totals = result.cacheTotals().get("hosted");
        assertEquals(4, totals.templates());
        assertEquals(84, totals.cachedTokens());
        assertEquals(126, totals.reorderedCachedTokens());
        assertEquals(3.78, totals.savingPerMonth().getAsDouble(), 1e-9);
        assertEquals(5.67, totals.reorderedSavingPerMonth().getAsDouble(), 1e-9);
        assertEquals(Optional.of("USD"), totals.currency());
    }

    @Test
    void theSavingIsTheDifferenceOfTheMonthlyCosts() {
        ScanResult result = scan();
        ScannedTemplate answer = result.templates().stream().filter(t -> t.path().equals("prompts/answer.md")).findFirst()
                .orElseThrow();
        var footprint = answer.targets().get("hosted");
        int input = footprint.inputTokens();
        // Without the cache: (I × 2.0 + 10 × 8.0) / 1e6 a call; with it: ((I − 42) × 2.0 + 42 × 0.5 + 10 × 8.0) / 1e6.
        double uncached = (input * 2.0 + 10 * 8.0) / 1e6 * 1000 * 30;
        assertEquals(uncached - footprint.costPerMonth().getAsDouble(),
                answer.prefixes().get("hosted").savingPerMonth().getAsDouble(), 1e-9);
    }

    @Test
    void theJsonCarriesTheSharedPrefixAndTheTotals() throws IOException {
        String json = dev.tare.report.ScanReport.json(scan(), ScanResult.Order.PATH);
        JsonNode root = new ObjectMapper().readTree(json);
        JsonNode greeting = null;
        for (JsonNode template : root.get("templates")) {
            if (template.get("path").asText().equals("prompts/greeting.md")) {
                greeting = template.get("targets").get("hosted");
            }
        }
        assertEquals(0, greeting.get("shared_prefix_tokens").asInt());
        assertEquals(0, greeting.get("cached_input_tokens").asInt());
        assertEquals(42, greeting.get("reordered_shared_prefix_tokens").asInt());
        assertEquals(42, greeting.get("reordered_cached_input_tokens").asInt());
        assertEquals(1.89, greeting.get("reordered_cache_saving_per_month").asDouble(), 1e-9);
        JsonNode totals = root.get("totals").get("targets").get("hosted");
        assertEquals(84, totals.get("cached_input_tokens").asInt());
        assertEquals(126, totals.get("reordered_cached_input_tokens").asInt());
        assertEquals(3.78, totals.get("cache_saving_per_month").asDouble(), 1e-9);
        assertEquals(5.67, totals.get("reordered_cache_saving_per_month").asDouble(), 1e-9);
        assertEquals("USD", totals.get("currency").asText());
    }

    @Test
    void theTextReportSaysItIsAnEstimate() {
        String text = dev.tare.report.ScanReport.text(scan(), ScanResult.Order.PATH);
        assertTrue(text.contains("Prefix cache on hosted: 84 tokens per call cacheable now, saving USD 3.78 a month; 126 if"
                + " each template's per-call parts came after its static parts, saving USD 5.67 a month (estimates)."), text);
    }

    /** The four token figures of a share, for one comparison. */
    private record Share(int shared, int cached, int reorderedShared, int reorderedCached) {
        static Share of(PrefixShare share) {
            return new Share(share.sharedTokens(), share.cachedTokens(), share.reorderedSharedTokens(),
                    share.reorderedCachedTokens());
        }
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
