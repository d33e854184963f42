package dev.tare.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import dev.tare.tokenize.Tokenizer;
import dev.tare.tokenize.TokenizerRegistry;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class CalibrateCommandTest {
    @TempDir
    Path dir;

    /** A log whose reported counts are 2 × counted text + 4 per message + 3 per call + 9 per tool. */
    private Path log(Tokenizer tokenizer) throws Exception {
        ObjectMapper json = new ObjectMapper();
        List<String> lines = new ArrayList<>();
        String[] words = {"meter", "leak", "bill", "outage", "crew", "valve", "pressure", "reading"};
        for (int i = 0; i < 12; i++) {
            var sample = json.createObjectNode();
            var messages = sample.putArray("messages");
            int text = 0;
            for (int m = 0; m <= i % 4; m++) {
                String content = (words[(i + m) % words.length] + " ").repeat(1 + 3 * i + m);
                messages.addObject().put("role", m == 0 ? "system" : "user").put("content", content);
                text += tokenizer.count(content);
            }
            var tools = sample.putArray("tools");
            for (int t = 0; t < i % 3; t++) {
                var tool = tools.addObject().put("name", "tool_" + t).put("description", "Does " + words[t] + " work.");
                tool.putObject("parameters").put("type", "object");
                text += tokenizer.count(tool.toString());
            }
            sample.put("reported_input_tokens", 2 * text + 4 * messages.size() + 3 + 9 * tools.size());
            lines.add(sample.toString());
        }
        lines.add("this line is broken");
        return Files.writeString(dir.resolve("usage.jsonl"), String.join("\n", lines) + "\n");
    }

    @Test
    void fitsTheConstantsThatMadeTheLogAndReportsBadLines() throws Exception {
        Files.writeString(dir.resolve("tare.yaml"), "targets:\n  - {name: hosted, tokenizer: cl100k_base}\n");
        Path usage = log(new TokenizerRegistry().get("cl100k_base", Path.of(".")));
        Cli.Run run = Cli.run("calibrate", "--config", dir.resolve("tare.yaml").toString(), "--target", "hosted",
                "--format", "json", usage.toString());
        assertEquals(0, run.exitCode(), run.err());
        assertTrue(run.err().contains("line 13: not valid JSON"), run.err());
        JsonNode result = new ObjectMapper().readTree(run.out());
        assertEquals("hosted", result.get("target").asText());
        assertEquals(12, result.get("samples").asInt());
        assertEquals(2.0, result.get("fit").get("scale").asDouble(), 1e-9);
        assertEquals(4, result.get("fit").get("message_overhead_tokens").asInt());
        assertEquals(3, result.get("fit").get("reply_overhead_tokens").asInt());
        assertEquals(9, result.get("fit").get("tool_overhead_tokens").asInt());
        assertEquals(0.0, result.get("error_after").get("max_abs_percent").asDouble(), 1e-9);
        assertTrue(result.get("error_before").get("mean_abs_percent").asDouble() > 40);

        Cli.Run text = Cli.run("calibrate", "--config", dir.resolve("tare.yaml").toString(), "--target", "hosted", usage.toString());
        assertTrue(text.out().contains("    scale: 2.0000\n    message_overhead_tokens: 4\n"), text.out());
        assertTrue(text.out().contains("estimates"), "the output says the figures are estimates");
    }

    @Test
    void aLogWithNoUsableLineExitsTwo() throws Exception {
        Files.writeString(dir.resolve("tare.yaml"), "targets:\n  - {name: hosted, tokenizer: o200k_base}\n");
        Path usage = Files.writeString(dir.resolve("usage.jsonl"), "{}\n[1]\n");
        Cli.Run run = Cli.run("calibrate", "--config", dir.resolve("tare.yaml").toString(), "--target", "hosted", usage.toString());
        assertEquals(2, run.exitCode());
        assertTrue(run.err().contains("no usable line"), run.err());
        Cli.Run unknown = Cli.run("calibrate", "--config", dir.resolve("tare.yaml").toString(), "--target", "elsewhere", usage.toString());
        assertEquals(2, unknown.exitCode());
    }
}
