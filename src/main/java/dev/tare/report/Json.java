package dev.tare.report;

import com.fasterxml.jackson.core.JsonFactory;
import com.fasterxml.jackson.core.JsonGenerator;
import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.core.util.DefaultIndenter;
import com.fasterxml.jackson.core.util.DefaultPrettyPrinter;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.tare.Tare;
import java.io.IOException;
import java.io.StringWriter;
import java.io.UncheckedIOException;
import java.io.Writer;
import java.util.Map;

/** The JSON conventions every machine-readable report shares: snake_case keys, tool and version first. */
final class Json {
    /**
     * Makes the generators of streamed reports. A plain factory rather than the mapper's, so that a
     * report written only through a generator (count's) never starts the mapper: that loads a few
     * hundred classes, about a tenth of a second of CPU at the end of a count.
     */
    private static final JsonFactory GENERATORS = new JsonFactory();

    private Json() {
    }

    /** The object mapper of every report, made on first use. */
    static ObjectMapper mapper() {
        return Mapper.INSTANCE;
    }

    private static final class Mapper {
        static final ObjectMapper INSTANCE = new ObjectMapper();
    }

    /** A new report object that already carries {@code "tool": "tare"} and {@code "version"}. */
    static ObjectNode report() {
        ObjectNode root = mapper().createObjectNode();
        root.put("tool", "tare");
        root.put("version", Tare.version());
        return root;
    }

    /** The report as indented JSON with a final newline. */
    static String write(ObjectNode root) {
        try {
            return mapper().writer(printer()).writeValueAsString(root) + "\n";
        } catch (JsonProcessingException e) {
            throw new IllegalStateException("a report could not be written as JSON", e);
        }
    }

    /** What writes a report's fields after {@code "tool"} and {@code "version"}, one at a time. */
    interface Fields {
        void write(JsonGenerator out) throws IOException;
    }

    /**
     * A report written field by field, laid out exactly as {@link #write} lays out the same tree, with
     * a final newline: for reports of many thousand entries, which a tree would first hold whole.
     */
    static String stream(Fields fields) {
        StringWriter out = new StringWriter(1 << 16);
        stream(fields, out);
        return out.toString();
    }

    /** {@link #stream(Fields)} written to {@code out}, which is flushed and left open. */
    static void stream(Fields fields, Writer out) {
        try (JsonGenerator generator = GENERATORS.createGenerator(out)) {
            generator.disable(JsonGenerator.Feature.AUTO_CLOSE_TARGET);
            generator.setPrettyPrinter(printer());
            generator.writeStartObject();
            generator.writeStringField("tool", "tare");
            generator.writeStringField("version", Tare.version());
            fields.write(generator);
            generator.writeEndObject();
            generator.flush();
            out.write('\n');
            out.flush();
        } catch (IOException e) {
            throw new UncheckedIOException("a report could not be written as JSON", e);
        }
    }

    /** An object of plain values (numbers, strings, booleans) as a tree, in the map's order. */
    static ObjectNode object(Map<String, ?> fields) {
        ObjectNode node = mapper().createObjectNode();
        fields.forEach((key, value) -> node.set(key, mapper().valueToTree(value)));
        return node;
    }

    /** Writes an object of plain values (numbers, strings, booleans) in the map's order. */
    static void object(JsonGenerator out, Map<String, ?> fields) throws IOException {
        out.writeStartObject();
        for (Map.Entry<String, ?> field : fields.entrySet()) {
            out.writeFieldName(field.getKey());
            Object value = field.getValue();
            if (value instanceof Integer v) {
                out.writeNumber(v);
            } else if (value instanceof Long v) {
                out.writeNumber(v);
            } else if (value instanceof Double v) {
                out.writeNumber(v);
            } else if (value instanceof java.math.BigInteger v) {
                out.writeNumber(v);
            } else if (value instanceof Boolean v) {
                out.writeBoolean(v);
            } else if (value instanceof String v) {
                out.writeString(v);
            } else {
                throw new IllegalArgumentException("not a plain JSON value: " + value);
            }
        }
        out.writeEndObject();
    }

    /** Writes one part of a streamed report as {@link #write} would write it in place. */
    static void tree(JsonGenerator generator, JsonNode node) throws IOException {
        mapper().writeTree(generator, node);
    }

    private static DefaultPrettyPrinter printer() {
        return new DefaultPrettyPrinter().withObjectIndenter(new DefaultIndenter("  ", "\n"));
    }
}
