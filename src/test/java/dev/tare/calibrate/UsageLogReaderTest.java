package dev.tare.calibrate;

import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.tare.tokenize.Tokenizer;
import dev.tare.tokenize.TokenizerRegistry;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class UsageLogReaderTest {
    @TempDir
    Path dir;
    private final Tokenizer o200k = new TokenizerRegistry().get("o200k_base", Path.of("."));

    @Test
    void countsMessagesAndMinifiedToolsAndReportsBadLinesByNumber() throws Exception {
        Path log = Files.writeString(dir.resolve("usage.jsonl"), String.join("\n",
                "{\"messages\": [{\"role\": \"system\", \"content\": \"Be brief.\"}, {\"role\": \"user\", \"content\": \"Hi\"}],"
                        + " \"tools\": [{\"name\": \"lookup\", \"description\": \"Find an account.\", \"parameters\": {\"type\": \"object\"}}],"
                        + " \"reported_input_tokens\": 61}",
                "",
                "{not json",
                "{\"messages\": [{\"role\": \"user\", \"content\": \"x\"}], \"reported_input_tokens\": -4}",
                "{\"messages\": [{\"role\": \"user\", \"content\": \"x\"}]}",
                "{\"messages\": [{\"role\": \"user\", \"content\": 5}], \"reported_input_tokens\": 3}") + "\n");
        UsageLog read;
        try (java.io.BufferedReader in = Files.newBufferedReader(log)) {
            read = new UsageLogReader(o200k).read(in, log.toString());
        }
        int expectedText = o200k.count("Be brief.") + o200k.count("Hi")
                + o200k.count("{\"name\":\"lookup\",\"description\":\"Find an account.\",\"parameters\":{\"type\":\"object\"}}");
        assertEquals(List.of(new UsageSample(1, expectedText, 2, 1, 61)), read.samples());
        assertEquals(4, read.problems().size());
        assertEquals("line 3: not valid JSON", read.problems().get(0).substring(0, "line 3: not valid JSON".length()));
        assertEquals("line 4: reported_input_tokens must be a whole number above zero (got -4)", read.problems().get(1));
        assertEquals("line 5: no reported_input_tokens", read.problems().get(2));
        assertEquals("line 6: messages[0] has no usable content", read.problems().get(3));
    }
}
