package dev.tare.app;

import dev.tare.workspace.Workspace;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.footprint.Footprint;
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
 * cached_input_tokens in a scan: the leading static token ids a template shares with another on the
 * same target, counted from prefix_cache_min_tokens (design.md, "Formulas"). Expected token counts
 * come from Tare's o200k_base, which TiktokenReferenceTest checks against the reference encoder.
 */
class SharedPrefixScanTest {
    private static final String PREAMBLE = "You are the support assistant of a water utility. Answer in plain words,"
            + " cite the account notes you were given, never guess a meter reading, and hand the customer to a"
            + " person when they ask for one or when a leak may be dangerous.\n\n";

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
                    output_tokens: 10
                  - name: plain
                    tokenizer: o200k_base
                """);
        write("prompts/partials/preamble.md", PREAMBLE);
        write("prompts/answer.md", PREAMBLE + "{{question}}\nAnswer briefly.");
        write("prompts/summary.md", "{{> preamble}}{{ticket}}\nSummarize the ticket.");
        write("prompts/variable-first.md", "{{greeting}}" + PREAMBLE + "Say hello.");
        write("prompts/short.md", "Short.");
    }

    @Test
    void templatesSharingAStaticPrefixGetItCached() {
        Map<String, ScannedTemplate> byPath = scan();
        int shared = o200k.count(PREAMBLE);
        // The preamble is the same text before the first variable in answer.md and (through the include)
        // in summary.md, so both share all its tokens.
        Footprint answer = byPath.get("prompts/answer.md").targets().get("hosted");
        assertEquals(shared, answer.cachedInputTokens().getAsInt());
        assertEquals(shared, byPath.get("prompts/summary.md").targets().get("hosted").cachedInputTokens().getAsInt());
        // A variable before the preamble makes every call's prefix differ; a short template has too few tokens.
        assertEquals(0, byPath.get("prompts/variable-first.md").targets().get("hosted").cachedInputTokens().getAsInt());
        assertEquals(0, byPath.get("prompts/short.md").targets().get("hosted").cachedInputTokens().getAsInt());
        // The cost formula with the cached share: ((I − cached) × 2.0 + cached × 0.5 + 10 × 8.0) / 1e6.
        int input = answer.inputTokens();
        assertEquals(((input - shared) * 2.0 + shared * 0.5 + 10 * 8.0) / 1e6, answer.costPerCall().getAsDouble(), 1e-12);
        // A target without a prefix cache has no cached figure at all.
        assertTrue(byPath.get("prompts/answer.md").targets().get("plain").cachedInputTokens().isEmpty());
    }

    @Test
    void thresholdAboveTheSharedPrefixCachesNothing() throws IOException {
        int shared = o200k.count(PREAMBLE);
        write("tare.yaml", Files.readString(root.resolve("tare.yaml"))
                .replace("prefix_cache_min_tokens: 20", "prefix_cache_min_tokens: " + (shared + 1)));
        assertEquals(0, scan().get("prompts/answer.md").targets().get("hosted").cachedInputTokens().getAsInt());
    }

    @Test
    void sharedPrefixIsBoundedToTheKeptIds() throws IOException {
        // "word", 19,999 × " word" and the newline are one o200k token each: 20,001, over the kept 16,384.
        String big = "word" + " word".repeat(19_999) + "\n";
        write("prompts/big-a.md", big + "{{a}}");
        write("prompts/big-b.md", big + "{{b}}");
        assertEquals(20_001, o200k.count(big));
        assertEquals(dev.tare.overlap.CachePrefixes.MAX_LEADING_IDS,
                scan().get("prompts/big-a.md").targets().get("hosted").cachedInputTokens().getAsInt());
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
