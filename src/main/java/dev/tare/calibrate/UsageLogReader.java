package dev.tare.calibrate;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import dev.tare.TareException;
import dev.tare.template.ChatContent;
import dev.tare.tokenize.Tokenizer;
import java.io.BufferedReader;
import java.io.IOException;
import java.nio.charset.CharacterCodingException;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

/**
 * Reads a usage log: one JSON object per line, {@code {"messages": [{role, content}], "tools": [...],
 * "reported_input_tokens": N}}, copied from real responses. Lines are read one at a time, so a long
 * log never sits in memory whole; a line that cannot be used is reported by number and skipped.
 */
public final class UsageLogReader {
    private static final ObjectMapper JSON = new ObjectMapper();

    private final Tokenizer tokenizer;

    public UsageLogReader(Tokenizer tokenizer) {
        this.tokenizer = tokenizer;
    }

    /**
     * Reads the log {@code name} from {@code in}, line by line.
     *
     * @throws TareException when the text cannot be read at all
     */
    public UsageLog read(BufferedReader in, String name) {
        List<String> problems = new ArrayList<>();
        List<UsageSample> samples = new ArrayList<>();
        try {
            int number = 0;
            for (String line = in.readLine(); line != null; line = in.readLine()) {
                number++;
                if (line.isBlank()) {
                    continue;
                }
                try {
                    samples.add(sample(number, line));
                } catch (TareException e) {
                    problems.add("line " + number + ": " + e.getMessage());
                }
            }
        } catch (CharacterCodingException e) {
            throw new TareException(name + ": not valid UTF-8; save the log as UTF-8", e);
        } catch (IOException e) {
            throw new TareException(name + ": cannot be read (" + e.getMessage() + ")", e);
        }
        return new UsageLog(name, samples, problems);
    }

    private UsageSample sample(int number, String line) {
        JsonNode node;
        try {
            node = JSON.readTree(line);
        } catch (JsonProcessingException e) {
            throw new TareException("not valid JSON (" + e.getOriginalMessage() + ")");
        }
        if (node == null || !node.isObject()) {
            throw new TareException("not a JSON object");
        }
        JsonNode reported = node.get("reported_input_tokens");
        if (reported == null || reported.isNull()) {
            throw new TareException("no reported_input_tokens");
        }
        if (!reported.isIntegralNumber() || !reported.canConvertToInt() || reported.asInt() <= 0) {
            throw new TareException("reported_input_tokens must be a whole number above zero (got " + reported + ")");
        }
        JsonNode messages = node.get("messages");
        if (messages == null || !messages.isArray() || messages.isEmpty()) {
            throw new TareException("no messages list");
        }
        int text = 0;
        for (int i = 0; i < messages.size(); i++) {
            JsonNode message = messages.get(i);
            Optional<String> content = message.isObject() ? ChatContent.text(message.get("content")) : Optional.empty();
            if (content.isEmpty()) {
                throw new TareException("messages[" + i + "] has no usable content");
            }
            text += tokenizer.count(content.get());
        }
        JsonNode tools = node.get("tools");
        int toolCount = 0;
        if (tools != null && !tools.isNull()) {
            if (!tools.isArray()) {
                throw new TareException("tools must be a list of tool definitions");
            }
            for (JsonNode tool : tools) {
                text += tokenizer.count(tool.toString());
                toolCount++;
            }
        }
        return new UsageSample(number, text, messages.size(), toolCount, reported.asInt());
    }
}
