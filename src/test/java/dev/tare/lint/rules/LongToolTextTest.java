package dev.tare.lint.rules;

import static dev.tare.lint.RuleHarness.findings;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.config.ConfigLoader;
import dev.tare.config.TareConfig;
import dev.tare.lint.Finding;
import dev.tare.lint.RewriteClass;
import dev.tare.tokenize.Tokenizer;
import dev.tare.tokenize.TokenizerRegistry;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Tool and parameter descriptions and enum lists over their limits; token counts come from the tokenizer. */
class LongToolTextTest {
    private static final String LONG = "Record a customer's report of a problem with the water supply at their address,"
            + " whenever they say there is no water, low pressure, discoloured water, air in the pipes, an odd taste"
            + " or smell, or water pooling in the street outside the property. Ask when it started, whether the"
            + " neighbours have noticed it too, and whether anyone in the household depends on a medical device.";

    private final LongToolText rule = new LongToolText();
    private final Tokenizer o200k = new TokenizerRegistry().get("o200k_base", Path.of("."));

    @Test
    void aLongToolDescriptionIsReportedOnTheToolsLine() {
        String text = "[\n  {\"name\": \"lookup\", \"description\": \"Find an account.\"},\n"
                + "  {\"name\": \"report_outage\", \"description\": \"" + LONG + "\"}\n]\n";
        int tokens = o200k.count(LONG);
        assertTrue(tokens > LongToolText.DESCRIPTION_TOKENS, "precondition on o200k_base");
        List<Finding> found = findings(rule, "tools/outage.json", text, Map.of());
        assertEquals(1, found.size());
        assertEquals(3, found.get(0).line());
        assertEquals("tool 'report_outage' has a " + tokens + "-token description, over the limit of 60",
                found.get(0).message());
        assertEquals(RewriteClass.NONE, found.get(0).rewriteClass());
    }

    @Test
    void parameterDescriptionsAndEnumListsHaveLimitsOfTheirOwn(@TempDir Path dir) throws IOException {
        Files.writeString(dir.resolve("tare.yaml"), "rules: {limits: {tool_description_tokens: 5, tool_enum_tokens: 3}}\n");
        TareConfig config = ConfigLoader.load(dir.resolve("tare.yaml"));
        String text = "tools:\n  - name: report_outage\n    description: Record a supply problem.\n    parameters:\n"
                + "      type: object\n      properties:\n"
                + "        kind: {type: string, enum: [none, low, brown, air, taste, pooling]}\n"
                + "        notes: {type: string, description: 'What the customer said, in their words.'}\n";
        List<Finding> found = findings(rule, "tools/outage.yaml", text, config);
        assertEquals(List.of(7, 8), found.stream().map(Finding::line).toList());
        assertEquals("parameter 'kind' of tool 'report_outage' lists 6 values costing "
                + o200k.count("none,low,brown,air,taste,pooling") + " tokens, over the limit of 3", found.get(0).message());
        assertTrue(found.get(1).message().startsWith("parameter 'notes' of tool 'report_outage' has a "),
                found.get(1).message());
    }

    @Test
    void textWithinTheLimitsAndOtherFilesAreFine() {
        assertTrue(findings(rule, "tools/lookup.json", "[{\"name\":\"lookup\",\"description\":\"Find an account.\"}]\n",
                Map.of()).isEmpty());
        assertTrue(findings(rule, LONG + "\n").isEmpty(), "a prompt is not a tool file");
    }
}
