package dev.tare.lint;

import com.fasterxml.jackson.core.JsonFactory;
import com.fasterxml.jackson.core.JsonGenerator;
import com.fasterxml.jackson.core.JsonParser;
import com.fasterxml.jackson.core.JsonToken;
import com.fasterxml.jackson.core.StreamReadFeature;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.IOException;
import java.io.StringWriter;
import java.io.UncheckedIOException;
import java.util.Map;
import java.util.Optional;

/**
 * The one strict reading of JSON in prompt text, shared by the JSON rule and the rewrite engine's
 * check of it: duplicate keys and trailing text are refused and numbers are kept exact, so two texts
 * read to equal trees only when they hold the same JSON value.
 *
 * <p>Read and written with Jackson's streaming parser and generator rather than its object mapper:
 * the mapper's first use sets up date formats, locales and time zones, which costs a short run such
 * as the pre-commit hook more than the JSON itself. {@code StrictJsonTest} holds the trees and the
 * written text to what the mapper, configured the same way, makes of the same input.
 */
public final class StrictJson {
    private static final JsonFactory FACTORY = JsonFactory.builder().enable(StreamReadFeature.STRICT_DUPLICATE_DETECTION).build();
    private static final JsonNodeFactory NODES = JsonNodeFactory.withExactBigDecimals(true);

    private StrictJson() {
    }

    /** The object or array {@code text} holds, or empty when it is anything else or not strict JSON. */
    public static Optional<JsonNode> tree(String text) {
        try (JsonParser parser = FACTORY.createParser(text)) {
            JsonToken first = parser.nextToken();
            if (first != JsonToken.START_OBJECT && first != JsonToken.START_ARRAY) {
                return Optional.empty();
            }
            JsonNode tree = read(parser, first);
            return parser.nextToken() == null ? Optional.of(tree) : Optional.empty();
        } catch (IOException e) {
            return Optional.empty();
        }
    }

    /** {@code tree} written on one line without spaces between members. */
    public static String minified(JsonNode tree) {
        StringWriter out = new StringWriter();
        try (JsonGenerator generator = FACTORY.createGenerator(out)) {
            write(generator, tree);
        } catch (IOException e) {
            throw new UncheckedIOException("a parsed JSON tree could not be written back", e);
        }
        return out.toString();
    }

    /** The value that starts with {@code token}; the parser's nesting limit bounds the recursion. */
    private static JsonNode read(JsonParser parser, JsonToken token) throws IOException {
        switch (token) {
            case START_OBJECT -> {
                ObjectNode object = NODES.objectNode();
                while (parser.nextToken() == JsonToken.FIELD_NAME) {
                    String name = parser.currentName();
                    object.set(name, read(parser, parser.nextToken()));
                }
                return object;
            }
            case START_ARRAY -> {
                ArrayNode array = NODES.arrayNode();
                for (JsonToken next = parser.nextToken(); next != JsonToken.END_ARRAY; next = parser.nextToken()) {
                    array.add(read(parser, next));
                }
                return array;
            }
            case VALUE_STRING -> {
                return NODES.textNode(parser.getText());
            }
            case VALUE_NUMBER_INT -> {
                return switch (parser.getNumberType()) {
                    case INT -> NODES.numberNode(parser.getIntValue());
                    case LONG -> NODES.numberNode(parser.getLongValue());
                    default -> NODES.numberNode(parser.getBigIntegerValue());
                };
            }
            case VALUE_NUMBER_FLOAT -> {
                return NODES.numberNode(parser.getDecimalValue());
            }
            case VALUE_TRUE, VALUE_FALSE -> {
                return NODES.booleanNode(token == JsonToken.VALUE_TRUE);
            }
            case VALUE_NULL -> {
                return NODES.nullNode();
            }
            default -> throw new IOException("unexpected " + token);
        }
    }

    private static void write(JsonGenerator out, JsonNode node) throws IOException {
        switch (node.getNodeType()) {
            case OBJECT -> {
                out.writeStartObject();
                for (Map.Entry<String, JsonNode> field : node.properties()) {
                    out.writeFieldName(field.getKey());
                    write(out, field.getValue());
                }
                out.writeEndObject();
            }
            case ARRAY -> {
                out.writeStartArray();
                for (JsonNode element : node) {
                    write(out, element);
                }
                out.writeEndArray();
            }
            case STRING -> out.writeString(node.textValue());
            case NUMBER -> {
                if (node.isInt()) {
                    out.writeNumber(node.intValue());
                } else if (node.isLong()) {
                    out.writeNumber(node.longValue());
                } else if (node.isBigInteger()) {
                    out.writeNumber(node.bigIntegerValue());
                } else {
                    out.writeNumber(node.decimalValue());
                }
            }
            case BOOLEAN -> out.writeBoolean(node.booleanValue());
            case NULL -> out.writeNull();
            default -> throw new IllegalStateException("a " + node.getNodeType() + " node is not JSON text");
        }
    }
}
