package dev.tare.lint.rules;

import static dev.tare.lint.RuleHarness.findings;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.config.ConfigLoader;
import dev.tare.config.TareConfig;
import dev.tare.lint.Finding;
import dev.tare.lint.LintContext;
import dev.tare.lint.RuleHarness;
import dev.tare.template.IncludeResolver;
import dev.tare.template.Renderer;
import dev.tare.template.Template;
import dev.tare.tokenize.Tokenizer;
import dev.tare.tokenize.TokenizerRegistry;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** A call longer than the model's context: from a target's model, or from front matter. */
class ContextLimitTest {
    private final Tokenizer o200k = new TokenizerRegistry().get("o200k_base", Path.of("."));

    @TempDir
    Path root;

    @Test
    void frontMatterLimitOnThePrimaryTokenizer() {
        String body = "Never promise a refund or a repair time. ".repeat(4) + "\n";
        String text = "---\ncontext_limit: 20\noutput_tokens: 5\n---\n" + body;
        List<Finding> found = findings(new ContextLimit(), text);
        assertEquals(1, found.size());
        assertEquals(2, found.get(0).line(), "at the context_limit key");
        int input = o200k.count(body);
        int total = input + 5;
        assertTrue(found.get(0).message().startsWith("estimated " + input + " input + 5 output = " + total
                + " tokens exceed the context of 20 tokens (front matter, on o200k_base) by " + (total - 20)),
                found.get(0).message());
        assertTrue(found.get(0).message().contains("planning estimates"), found.get(0).message());
    }

    @Test
    void withinTheLimitOrWithoutOneThereIsNoFinding() {
        assertTrue(findings(new ContextLimit(), "---\ncontext_limit: 50\noutput_tokens: 5\n---\nShort text.\n").isEmpty());
        assertTrue(findings(new ContextLimit(), "No limit anywhere, context_limit only in prose.\n").isEmpty());
    }

    @Test
    void aTargetModelsContextLimitCountsFramingAndOutput() throws IOException {
        // An 8,192-token model (its config.json's max_position_embeddings, here inline) and 300 output tokens:
        // a template of more than 7,892 input tokens does not fit.
        Path yaml = root.resolve("tare.yaml");
        Files.writeString(yaml, """
                targets:
                  - name: small
                    tokenizer: o200k_base
                    output_tokens: 300
                    model: {params: 8e9, layers: 32, heads: 32, kv_heads: 8, head_dim: 128, context_limit: 8192}
                """, StandardCharsets.UTF_8);
        TareConfig config = ConfigLoader.load(yaml);
        String longBody = "Never promise a refund or a repair time. ".repeat(1000) + "\n";
        int input = o200k.count(longBody);
        assertTrue(input + 300 > 8192, "the fixture must overflow: " + input);
        Template template = RuleHarness.template("prompts/long.md", longBody);
        LintContext context = new LintContext(config, new TokenizerRegistry(), new Renderer(IncludeResolver.NONE),
                List.of(template), Set.of(), Map.of());
        List<Finding> found = new ContextLimit().check(template, context);
        assertEquals(1, found.size());
        assertTrue(found.get(0).message().startsWith(String.format(java.util.Locale.ROOT, "estimated %,d input + 300"
                + " output = %,d tokens exceed the context of 8,192 tokens (target small) by %,d", input, input + 300,
                input + 300 - 8192)), found.get(0).message());
        Template fits = RuleHarness.template("prompts/short.md", "Answer billing questions.\n");
        assertTrue(new ContextLimit().check(fits, new LintContext(config, new TokenizerRegistry(),
                new Renderer(IncludeResolver.NONE), List.of(fits), Set.of(), Map.of())).isEmpty());
    }
}
