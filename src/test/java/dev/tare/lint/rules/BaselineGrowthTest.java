package dev.tare.lint.rules;

import static dev.tare.lint.RuleHarness.findings;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.lint.Example;
import dev.tare.lint.Finding;
import dev.tare.lint.RewriteClass;
import dev.tare.tokenize.TokenizerRegistry;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.junit.jupiter.api.Test;

/**
 * Growth over the committed baseline, with the recorded count given as an example setting and the
 * default tolerance of 5 %; current counts come from the tokenizer itself.
 */
class BaselineGrowthTest {
    private static final String TEXT = "You answer billing questions for the city water utility, politely and briefly,"
            + " in plain words, and you never promise a refund or a repair time.\n";

    private final BaselineGrowth rule = new BaselineGrowth();
    private final int now = new TokenizerRegistry().get("o200k_base", Path.of(".")).count(TEXT);

    @Test
    void growthBeyondTheToleranceIsAnErrorAtTheTop() {
        int recorded = now / 2;
        List<Finding> found = findings(rule, "prompts/a.md", TEXT, recordedAt(recorded));
        assertEquals(1, found.size());
        assertEquals(1, found.get(0).line());
        assertEquals(1, found.get(0).column());
        assertEquals(String.format(Locale.ROOT, "grew from %d to %d tokens on o200k_base (%+.1f%%, over the 5%% tolerance"
                + " of the baseline); token counts are planning estimates", recorded, now,
                (now - recorded) * 100.0 / recorded), found.get(0).message());
        assertEquals(RewriteClass.NONE, found.get(0).rewriteClass());
    }

    @Test
    void growthWithinTheToleranceOrNoneIsFine() {
        assertTrue(now >= 25, "precondition: one token is less than 5 %");
        assertTrue(findings(rule, "prompts/a.md", TEXT, recordedAt(now - 1)).isEmpty());
        assertTrue(findings(rule, "prompts/a.md", TEXT, recordedAt(now)).isEmpty());
    }

    @Test
    void aShrinkIsBaselineShrinksToReport() {
        assertTrue(findings(rule, "prompts/a.md", TEXT, recordedAt(now * 2)).isEmpty());
    }

    @Test
    void withoutABaselineOrForAPartialThereIsNothingToCompare() {
        assertTrue(findings(rule, "prompts/a.md", TEXT, Map.of()).isEmpty());
        assertTrue(findings(rule, "prompts/partials/a.md", TEXT, recordedAt(1)).isEmpty());
    }

    private static Map<String, Integer> recordedAt(int tokens) {
        return Map.of(Example.BASELINE_TOKENS, tokens);
    }
}
