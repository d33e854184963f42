package dev.tare.lint.rules;

import static dev.tare.lint.RuleHarness.findings;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.lint.Example;
import dev.tare.lint.Finding;
import dev.tare.lint.RewriteClass;
import dev.tare.lint.Severity;
import dev.tare.tokenize.TokenizerRegistry;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.junit.jupiter.api.Test;

/** A template smaller than its baseline, with the recorded count given as an example setting. */
class BaselineShrinkTest {
    private static final String TEXT = "Answer billing questions politely, briefly and in plain words.\n";

    private final BaselineShrink rule = new BaselineShrink();
    private final int now = new TokenizerRegistry().get("o200k_base", Path.of(".")).count(TEXT);

    @Test
    void anyShrinkIsWorthRecording() {
        int recorded = now + 1;
        List<Finding> found = findings(rule, "prompts/a.md", TEXT, Map.of(Example.BASELINE_TOKENS, recorded));
        assertEquals(1, found.size());
        assertEquals(1, found.get(0).line());
        assertEquals(String.format(Locale.ROOT, "shrank from %d to %d tokens on o200k_base (%.1f%%); run 'tare baseline'"
                + " to record it", recorded, now, (now - recorded) * 100.0 / recorded), found.get(0).message());
        assertEquals(Severity.INFO, found.get(0).severity());
        assertEquals(RewriteClass.NONE, found.get(0).rewriteClass());
    }

    @Test
    void anUnchangedOrGrownTemplateIsNotAShrink() {
        assertTrue(findings(rule, "prompts/a.md", TEXT, Map.of(Example.BASELINE_TOKENS, now)).isEmpty());
        assertTrue(findings(rule, "prompts/a.md", TEXT, Map.of(Example.BASELINE_TOKENS, now - 1)).isEmpty());
        assertTrue(findings(rule, "prompts/a.md", TEXT, Map.of()).isEmpty());
    }
}
