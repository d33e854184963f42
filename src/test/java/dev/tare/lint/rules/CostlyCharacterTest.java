package dev.tare.lint.rules;

import static dev.tare.lint.RuleHarness.findings;
import static dev.tare.lint.RuleHarness.fixed;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.config.ConfigLoader;
import dev.tare.config.TareConfig;
import dev.tare.lint.Finding;
import dev.tare.lint.LintContext;
import dev.tare.lint.RewriteClass;
import dev.tare.lint.RuleHarness;
import dev.tare.template.IncludeResolver;
import dev.tare.template.Renderer;
import dev.tare.tokenize.Tokenizer;
import dev.tare.tokenize.TokenizerRegistry;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Costly characters are decided by measurement. Every expectation here is first checked against
 * the tokenizer itself (o200k_base, the default encoding), so the test follows the
 * encoding rather than a list.
 */
class CostlyCharacterTest {
    private final CostlyCharacter rule = new CostlyCharacter();
    private final Tokenizer o200k = new TokenizerRegistry().get("o200k_base", Path.of("."));

    @Test
    void anEmojiThatCostsTokensIsFlaggedAndDroppedForReview() {
        String text = "Report the leak \uD83D\uDCA7 and call back.\n";
        assertTrue(o200k.count(text) > o200k.count("Report the leak and call back.\n"), "precondition on o200k_base");
        List<Finding> found = findings(rule, text);
        assertEquals(1, found.size());
        assertEquals(17, found.get(0).column());
        assertTrue(found.get(0).message().startsWith("'\uD83D\uDCA7' (U+1F4A7) costs "), found.get(0).message());
        assertTrue(found.get(0).message().endsWith(" more here than leaving it out on o200k_base"), found.get(0).message());
        assertEquals(RewriteClass.REVIEW, found.get(0).rewriteClass());
        assertEquals("Report the leak and call back.\n", fixed(rule, text));
        // The message, the rewrite's saving and what fix saves are one figure on the tokenizer named.
        int saved = o200k.count(text) - o200k.count("Report the leak and call back.\n");
        assertEquals(saved, found.get(0).savingTokens());
        assertTrue(found.get(0).message().contains("costs " + saved + (saved == 1 ? " token" : " tokens") + " more here"),
                found.get(0).message());
    }

    @Test
    void aCharacterThatCostsNoMoreThanItsPlainFormIsNotFlagged() {
        String text = "Press A \u2192 then B.\n";
        assertEquals(o200k.count(text), o200k.count("Press A -> then B.\n"), "precondition on o200k_base");
        assertTrue(findings(rule, text).isEmpty());
    }

    @Test
    void aCurlyApostropheIsFlaggedOnlyWhereItCostsMore() {
        String costly = "I haven\u2019t done anything.\n";
        String plain = "I haven't done anything.\n";
        boolean costs = o200k.count(costly) > o200k.count(plain);
        assertEquals(costs, !findings(rule, costly).isEmpty());
        if (costs) {
            assertEquals(plain, fixed(rule, costly));
        }
    }

    @Test
    void asciiTextAndCodeAreNeverFlagged() {
        assertTrue(findings(rule, "Plain ASCII only -> fine.\n").isEmpty());
        assertTrue(findings(rule, "`\uD83D\uDCA7`\n").isEmpty());
    }

    @Test
    void plainAsciiLoadsNoTargetTokenizer(@TempDir Path dir) throws Exception {
        Files.writeString(dir.resolve("tare.yaml"), "targets: [{name: a, tokenizer: o200k_base}, {name: b, tokenizer: cl100k_base}]\n");
        TareConfig config = ConfigLoader.load(dir.resolve("tare.yaml"));
        LintContext context = new LintContext(config, new TokenizerRegistry(), new Renderer(IncludeResolver.NONE), List.of(),
                Set.of(), Map.of());
        double before = TokenizerRegistry.loadMillis();
        assertTrue(rule.check(RuleHarness.template("a.md", "Plain ASCII only -> fine.\n"), context).isEmpty());
        assertEquals(before, TokenizerRegistry.loadMillis(), "no tokenizer was loaded");
        rule.check(RuleHarness.template("b.md", "I haven\u2019t done anything.\n"), context);
        assertTrue(TokenizerRegistry.loadMillis() > before, "a candidate character loads the targets' tokenizers");
    }
}
