package dev.tare.lint;

import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.tare.config.ConfigLoader;
import dev.tare.config.TareConfig;
import dev.tare.footprint.Target;
import dev.tare.template.IncludeResolver;
import dev.tare.template.Renderer;
import dev.tare.template.Template;
import dev.tare.tokenize.Tokenizer;
import dev.tare.tokenize.TokenizerRegistry;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The tools a template sends, as the rules price them: the tool files it names and the definitions
 * it writes in place, each counted as its minified JSON plus the target's framing per tool, as the
 * scan counts them (PromptFormsScanTest).
 */
class SentToolsTest {
    @Test
    void toolFilesAndToolsDefinedInPlaceAreCountedAlike(@TempDir Path dir) throws IOException {
        Files.writeString(dir.resolve("tare.yaml"), "targets:\n  - {name: hosted, tokenizer: o200k_base, tool_overhead_tokens: 7}\n");
        TareConfig config = ConfigLoader.load(dir.resolve("tare.yaml"));
        String lookup = "{\"name\":\"lookup_account\",\"description\":\"Find an account.\"}";
        Template tools = RuleHarness.template("tools/accounts.json", "[" + lookup + "]\n");
        Template template = RuleHarness.template("prompts/a.md", "---\ntools:\n  - tools/accounts.json\n"
                + "  - {name: report_leak, description: Report a leak.}\n---\nsystem:\nHi {{ name }}\n");
        LintContext context = new LintContext(config, new TokenizerRegistry(), new Renderer(IncludeResolver.NONE),
                List.of(template, tools), Set.of(), Map.of());
        Target hosted = config.targets().get(0);
        Tokenizer o200k = new TokenizerRegistry().get("o200k_base", Path.of("."));
        String leak = "{\"name\":\"report_leak\",\"description\":\"Report a leak.\"}";
        assertEquals(o200k.count(lookup) + 7 + o200k.count(leak) + 7, context.sentToolTokens(template, hosted));
    }
}
