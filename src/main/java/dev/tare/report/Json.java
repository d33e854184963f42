package dev.tare.report;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.core.util.DefaultIndenter;
import com.fasterxml.jackson.core.util.DefaultPrettyPrinter;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.tare.Tare;

/** The JSON conventions every machine-readable report shares: snake_case keys, tool and version first. */
final class Json {
    static final ObjectMapper MAPPER = new ObjectMapper();

    private Json() {
    }

    /** A new report object that already carries {@code "tool": "tare"} and {@code "version"}. */
    static ObjectNode report() {
        ObjectNode root = MAPPER.createObjectNode();
        root.put("tool", "tare");
        root.put("version", Tare.version());
        return root;
    }

    /** The report as indented JSON with a final newline. */
    static String write(ObjectNode root) {
        DefaultPrettyPrinter printer = new DefaultPrettyPrinter()
                .withObjectIndenter(new DefaultIndenter("  ", "\n"));
        try {
            return MAPPER.writer(printer).writeValueAsString(root) + "\n";
        } catch (JsonProcessingException e) {
            throw new IllegalStateException("a report could not be written as JSON", e);
        }
    }
}
