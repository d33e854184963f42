package dev.tare.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.file.Files;
import java.util.Iterator;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;

/**
 * The README's examples of the demo's output are the demo's real output: every field its JSON
 * example shows, and the prefix-cache line it quotes, so that neither can drift from the tool.
 */
class ReadmeExamplesTest {
    private static final Pattern JSON_BLOCK = Pattern.compile("(?s)```json\\n(\\{\"tool\": \"tare\".*?)```");
    private static final Pattern ENDS_WITH = Pattern.compile("(?s)`tare scan corpora/demo` ends with:\\n\\n```\\n(.*?)```");

    private static String readme() throws IOException {
        return Files.readString(Cli.projectDir().resolve("README.md"));
    }

    @Test
    void theScanJsonExampleIsTheDemosOutput() throws IOException {
        Matcher block = JSON_BLOCK.matcher(readme());
        assertTrue(block.find(), "the README shows the scan's JSON");
        JsonNode shown = new ObjectMapper().readTree(block.group(1));
        Cli.Run scan = Cli.run("scan", "corpora/demo", "--format", "json");
        assertEquals(0, scan.exitCode(), scan.err());
        JsonNode real = new ObjectMapper().readTree(scan.out());
        for (Iterator<Map.Entry<String, JsonNode>> it = shown.fields(); it.hasNext(); ) {
            Map.Entry<String, JsonNode> field = it.next();
            if (!field.getKey().equals("version")) {
                assertShown(field.getValue(), real.get(field.getKey()), field.getKey());
            }
        }
    }

    @Test
    void theQuotedPrefixCacheLineIsTheDemosOutput() throws IOException {
        Matcher quoted = ENDS_WITH.matcher(readme());
        assertTrue(quoted.find(), "the README quotes the scan's prefix-cache line");
        Cli.Run scan = Cli.run("scan", "corpora/demo");
        assertEquals(0, scan.exitCode(), scan.err());
        String line = quoted.group(1).strip().replace("\n", " ");
        assertTrue(scan.out().contains(line + "\n"), line + "\nis not in\n" + scan.out());
    }

    /** Every field the README shows is in the real output with the same value; arrays of templates match by path. */
    private static void assertShown(JsonNode shown, JsonNode real, String where) {
        assertTrue(real != null && !real.isMissingNode(), where + " is not in the real output");
        if (shown.isObject()) {
            for (Iterator<Map.Entry<String, JsonNode>> it = shown.fields(); it.hasNext(); ) {
                Map.Entry<String, JsonNode> field = it.next();
                assertShown(field.getValue(), real.get(field.getKey()), where + "." + field.getKey());
            }
        } else if (shown.isArray() && shown.size() > 0 && shown.get(0).has("path")) {
            for (JsonNode item : shown) {
                JsonNode match = null;
                for (JsonNode candidate : real) {
                    if (candidate.path("path").equals(item.get("path"))) {
                        match = candidate;
                    }
                }
                assertShown(item, match, where + "[" + item.get("path").asText() + "]");
            }
        } else {
            assertEquals(shown, real, where);
        }
    }
}
