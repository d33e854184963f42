package dev.tare.report;

import com.fasterxml.jackson.core.JsonGenerator;
import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.core.util.DefaultIndenter;
import com.fasterxml.jackson.core.util.DefaultPrettyPrinter;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.tare.Tare;
import java.io.IOException;
import java.io.Writer;

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

    /**
     * A generator writing indented JSON to {@code out} exactly as {@link #write} lays it out, for a
     * report too large to build as one tree first: it writes the document's frame itself and each
     * part as a tree ({@link #tree}). Closing it flushes {@code out} but leaves it open.
     */
    static JsonGenerator generator(Writer out) throws IOException {
        JsonGenerator generator = MAPPER.getFactory().createGenerator(out);
        generator.disable(JsonGenerator.Feature.AUTO_CLOSE_TARGET);
        generator.setPrettyPrinter(printer());
        return generator;
    }

    /** Writes one part of a document as {@link #write} would write it in place. */
    static void tree(JsonGenerator generator, JsonNode node) throws IOException {
        MAPPER.writeTree(generator, node);
    }

    private static DefaultPrettyPrinter printer() {
        return new DefaultPrettyPrinter().withObjectIndenter(new DefaultIndenter("  ", "\n"));
    }
}
