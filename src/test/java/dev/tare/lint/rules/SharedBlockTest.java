package dev.tare.lint.rules;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.app.Check;
import dev.tare.app.CheckOptions;
import dev.tare.lint.Finding;
import dev.tare.lint.Related;
import dev.tare.tokenize.Tokenizer;
import dev.tare.tokenize.TokenizerRegistry;
import dev.tare.workspace.Workspace;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The shared-block rule through the check engine, on small repositories: one finding per block at
 * its first copy, every other copy related, what each copy costs per call, the threshold from
 * {@code rules.limits}, directives, and what the rewrite would do. Token counts are Tare's
 * o200k_base, checked against the reference encoder in TiktokenReferenceTest; the cost is design.md's
 * formula with no output and nothing cached: tokens × input price / 1e6.
 */
class SharedBlockTest {
    /** 41 tokens on o200k_base (checked below). */
    private static final String BLOCK = "Never promise a refund, a repair time or a bill credit that the account notes do"
            + " not show, and never read out a full account number, a bank detail or a password to anyone on the call.";
    private static final String CONFIG = """
            templates: {include: ["prompts/**/*.md", "prompts/**/*.chat.yaml"], partials: prompts/partials, placeholder: %s}
            targets:
              - name: hosted
                tokenizer: o200k_base
                price: {input: 2.00, cached_input: 0.50, output: 8.00, currency: USD}
            rules: {limits: {shared_block_tokens: %d}}
            """;

    @TempDir
    Path root;
    private final Tokenizer o200k = new TokenizerRegistry().get("o200k_base", Path.of("."));

    @Test
    void oneFindingPerBlockAtItsFirstCopyWithEveryOtherCopyRelated() throws IOException {
        assertEquals(41, o200k.count(BLOCK));
        config("double-brace", 30);
        write("prompts/billing.md", "You answer billing questions.\n\n" + BLOCK + "\n\nKeep it short.\n");
        write("prompts/outages.md", "You answer questions about outages.\n\n" + BLOCK + "\n");
        write("prompts/leaks.md", "You triage leak reports.\n\n" + BLOCK + "\n\nAsk about the colour of the water.\n");
        List<Finding> found = findings();
        assertEquals(1, found.size());
        Finding finding = found.get(0);
        assertEquals("prompts/billing.md", finding.path());
        assertEquals(3, finding.line());
        // 41 tokens × USD 2.00 per million = USD 0.000082 a call.
        assertTrue(finding.message().startsWith("3 templates hold this 41-token block (copies that differ only in"
                + " whitespace count as the same); this copy (line 3) costs hosted 41 tokens (USD 0.000082) per call"),
                finding.message());
        assertTrue(finding.message().contains("'tare fix --include-review' replaces 3 copies with {{> never-promise-a-refund-a }},"
                + " a new partial prompts/partials/never-promise-a-refund-a.md"), finding.message());
        assertEquals(List.of("prompts/leaks.md", "prompts/outages.md"), finding.related().stream().map(Related::path).toList());
        assertTrue(finding.related().get(0).message().startsWith("copy in prompts/leaks.md (line 3): hosted 41 tokens"),
                finding.related().get(0).message());
    }

    @Test
    void theMinimumComesFromRulesLimits() throws IOException {
        config("double-brace", 42);
        write("prompts/billing.md", "Billing.\n\n" + BLOCK + "\n");
        write("prompts/outages.md", "Outages.\n\n" + BLOCK + "\n");
        assertEquals(List.of(), findings());
        config("double-brace", 41);
        assertEquals(1, findings().size());
    }

    @Test
    void aDirectiveTakesACopyOutOfTheBlock() throws IOException {
        config("double-brace", 30);
        write("prompts/billing.md", "Billing.\n\n" + BLOCK + "\n");
        write("prompts/outages.md", "Outages.\n\n{# tare-ignore-next-line shared-block #}\n" + BLOCK + "\n");
        assertEquals(List.of(), findings(), "one template left is no shared block");
        write("prompts/leaks.md", "Leaks.\n\n" + BLOCK + "\n");
        List<Finding> found = findings();
        assertEquals(1, found.size());
        assertEquals(List.of("prompts/leaks.md"), found.get(0).related().stream().map(Related::path).toList());
    }

    @Test
    void aPartialHoldingTheBlockIsOfferedInsteadOfANewOne() throws IOException {
        config("double-brace", 30);
        write("prompts/partials/promises.md", BLOCK + "\n");
        write("prompts/billing.md", "Billing.\n\n" + BLOCK + "\n\nKeep it short.\n");
        write("prompts/outages.md", "Outages.\n\n" + BLOCK + "\n\nGive the area.\n");
        List<Finding> found = findings();
        assertEquals(1, found.size());
        assertEquals("prompts/billing.md", found.get(0).path());
        assertTrue(found.get(0).message().endsWith("'tare fix --include-review' replaces 2 copies with {{> promises }},"
                + " as prompts/partials/promises.md holds the same text"), found.get(0).message());
        assertTrue(found.get(0).related().stream().anyMatch(r -> r.message().startsWith("copy in partial prompts/partials/promises.md")));
    }

    @Test
    void copiesDifferingInWhitespaceAreOneFindingAndOnlyIdenticalOnesAreMoved() throws IOException {
        config("double-brace", 30);
        write("prompts/billing.md", "Billing.\n\n" + BLOCK + "\n\nKeep it short.\n");
        write("prompts/outages.md", "Outages.\n\n" + BLOCK + "\n\nGive the area.\n");
        write("prompts/leaks.md", "Leaks.\n\n" + BLOCK.replace(", and never", ",\nand  never") + "\n\nAsk.\n");
        List<Finding> found = findings();
        assertEquals(1, found.size());
        assertTrue(found.get(0).message().contains("replaces 2 copies") && found.get(0).message().contains("1 copy stays"),
                found.get(0).message());
    }

    @Test
    void templatesWithoutIncludesGetTheFindingButNoExtraction() throws IOException {
        config("single-brace", 30);
        write("prompts/billing.md", "Billing for {name}.\n\n" + BLOCK + "\n");
        write("prompts/outages.md", "Outages near {area}.\n\n" + BLOCK + "\n");
        List<Finding> found = findings();
        assertEquals(1, found.size());
        assertTrue(found.get(0).message().endsWith("it is not moved into a partial, as single-brace templates have no includes"),
                found.get(0).message());
    }

    private List<Finding> findings() {
        return new Check(Workspace.open(List.of(root), Optional.empty()), new TokenizerRegistry())
                .run(CheckOptions.defaults()).findings().stream().filter(f -> f.rule().equals("shared-block")).toList();
    }

    private void config(String placeholder, int minimum) throws IOException {
        write("tare.yaml", String.format(CONFIG, placeholder, minimum));
    }

    private void write(String relative, String text) throws IOException {
        Path file = root.resolve(relative);
        Files.createDirectories(file.getParent());
        Files.writeString(file, text, StandardCharsets.UTF_8);
    }
}
