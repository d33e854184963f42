package dev.tare.report;

import com.fasterxml.jackson.core.JsonEncoding;
import com.fasterxml.jackson.core.JsonGenerator;
import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.core.util.DefaultIndenter;
import com.fasterxml.jackson.core.util.DefaultPrettyPrinter;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.tare.Tare;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.nio.charset.StandardCharsets;

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
        try {
            return MAPPER.writer(printer()).writeValueAsString(root) + "\n";
        } catch (JsonProcessingException e) {
            throw new IllegalStateException("a report could not be written as JSON", e);
        }
    }

    /** What writes a report's fields after {@code "tool"} and {@code "version"}, one at a time. */
    interface Fields {
        void write(JsonGenerator out) throws IOException;
    }

    /**
     * A report written field by field as {@link #write} would write the same tree: for reports of
     * many thousand entries, which a tree would first hold whole in memory.
     */
    static String stream(Fields fields) {
        ByteArrayOutputStream bytes = new ByteArrayOutputStream(1 << 20);
        try (JsonGenerator out = MAPPER.writer(printer()).createGenerator(bytes, JsonEncoding.UTF8)) {
            out.writeStartObject();
            out.writeStringField("tool", "tare");
            out.writeStringField("version", Tare.version());
            fields.write(out);
            out.writeEndObject();
        } catch (IOException e) {
            throw new IllegalStateException("a report could not be written as JSON", e);
        }
        bytes.write('\n');
        return bytes.toString(StandardCharsets.UTF_8);
    }

    private static DefaultPrettyPrinter printer() {
        return new DefaultPrettyPrinter().withObjectIndenter(new DefaultIndenter("  ", "\n"));
    }
}
