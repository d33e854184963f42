package dev.tare.source;

import com.fasterxml.jackson.core.JsonFactory;
import com.fasterxml.jackson.core.JsonLocation;
import com.fasterxml.jackson.core.JsonParseException;
import com.fasterxml.jackson.core.JsonParser;
import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.core.JsonToken;
import com.fasterxml.jackson.core.StreamReadFeature;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;
import com.fasterxml.jackson.dataformat.yaml.YAMLFactory;
import com.fasterxml.jackson.dataformat.yaml.YAMLParser;
import dev.tare.TareException;
import java.io.IOException;
import java.util.HashMap;
import java.util.Map;
import java.util.Optional;
import java.util.regex.Pattern;
import java.util.OptionalInt;
import org.yaml.snakeyaml.LoaderOptions;

/**
 * A parsed YAML or JSON document that remembers where each value stood, so that a validation
 * message can name the line. Reading is bounded: duplicate keys, YAML aliases (so no "billion laughs"
 * expansion can happen) and nesting deeper than {@value #MAX_DEPTH} levels are refused.
 *
 * <p>Paths are written {@code key.sub[2].name}; the root is {@code ""}.
 */
public final class YamlDocument {
    /** The deepest nesting accepted; real prompt and config files stay far below it. */
    public static final int MAX_DEPTH = 64;

    private static final JsonFactory YAML = yamlFactory();

    private static final JsonFactory JSON = JsonFactory.builder()
            .enable(StreamReadFeature.STRICT_DUPLICATE_DETECTION)
            .build();

    /** Where the parser says an unclosed list or object began, naming its input by a placeholder. */
    private static final Pattern JSON_OPENED = Pattern.compile(
            "\\(for (Array|Object) starting at \\[Source: [^\\]]*; line: (\\d+), column: \\d+]\\)");

    private final JsonNode root;
    private final Map<String, JsonLocation> locations;

    private YamlDocument(JsonNode root, Map<String, JsonLocation> locations) {
        this.root = root;
        this.locations = locations;
    }

    /** Parses YAML text (JSON is YAML too, but use {@link #parseJson} for JSON files' exact messages). */
    public static YamlDocument parseYaml(String text) {
        return parse(YAML, text);
    }

    /** Parses JSON text. */
    public static YamlDocument parseJson(String text) {
        return parse(JSON, text);
    }

    /** The document's root value; a missing node for an empty document. */
    public JsonNode root() {
        return root;
    }

    /** The value at {@code path} ({@code key.sub[2].name}); a missing node when there is none. */
    public JsonNode at(String path) {
        JsonNode node = root;
        int i = 0;
        while (i < path.length() && !node.isMissingNode()) {
            char c = path.charAt(i);
            if (c == '[') {
                int close = path.indexOf(']', i);
                if (close < 0) {
                    return JsonNodeFactory.instance.missingNode();
                }
                node = node.path(Integer.parseInt(path.substring(i + 1, close)));
                i = close + 1;
            } else {
                int from = c == '.' ? i + 1 : i;
                int end = from;
                while (end < path.length() && path.charAt(end) != '.' && path.charAt(end) != '[') {
                    end++;
                }
                node = node.path(path.substring(from, end));
                i = end;
            }
        }
        return node;
    }

    /** The 1-based line of the value at {@code path} in the parsed text, when known. */
    public OptionalInt line(String path) {
        JsonLocation location = locations.get(path);
        return location == null ? OptionalInt.empty() : OptionalInt.of(location.getLineNr());
    }

    /** The 1-based column of the value at {@code path} in the parsed text, when known. */
    public OptionalInt column(String path) {
        JsonLocation location = locations.get(path);
        return location == null ? OptionalInt.empty() : OptionalInt.of(location.getColumnNr());
    }

    private static YamlDocument parse(JsonFactory factory, String text) {
        Map<String, JsonLocation> locations = new HashMap<>();
        try (JsonParser parser = factory.createParser(text)) {
            JsonToken first = parser.nextToken();
            if (first == null) {
                return new YamlDocument(JsonNodeFactory.instance.missingNode(), locations);
            }
            JsonNode root = read(parser, "", 0, locations);
            return new YamlDocument(root, locations);
        } catch (JsonParseException e) {
            throw new TareException(describe(e));
        } catch (JsonProcessingException e) {
            throw new TareException(describe(e));
        } catch (IOException e) {
            throw new TareException(e.getMessage(), e);
        } catch (RuntimeException e) {
            // SnakeYAML reports limits (alias expansion, document size) as its own runtime exceptions.
            throw new TareException(firstLine(e.getMessage()), e);
        }
    }

    private static JsonNode read(JsonParser parser, String path, int depth, Map<String, JsonLocation> locations)
            throws IOException {
        if (depth > MAX_DEPTH) {
            throw new TareException("line " + parser.currentTokenLocation().getLineNr()
                    + ": nested deeper than " + MAX_DEPTH + " levels");
        }
        locations.put(path, parser.currentTokenLocation());
        if (parser instanceof YAMLParser yaml && yaml.isCurrentAlias()) {
            // Jackson reports an alias as its anchor's name, which would be counted as text.
            throw new TareException("line " + parser.currentTokenLocation().getLineNr()
                    + ": YAML aliases (*" + parser.getText() + ") are not supported; write the value out in full");
        }
        JsonNodeFactory nodes = JsonNodeFactory.instance;
        JsonToken token = parser.currentToken();
        switch (token) {
            case START_OBJECT: {
                ObjectNode object = nodes.objectNode();
                while (parser.nextToken() == JsonToken.FIELD_NAME) {
                    String name = parser.currentName();
                    String child = path.isEmpty() ? name : path + "." + name;
                    parser.nextToken();
                    object.set(name, read(parser, child, depth + 1, locations));
                }
                return object;
            }
            case START_ARRAY: {
                ArrayNode array = nodes.arrayNode();
                int index = 0;
                while (parser.nextToken() != JsonToken.END_ARRAY) {
                    array.add(read(parser, path + "[" + index + "]", depth + 1, locations));
                    index++;
                }
                return array;
            }
            case VALUE_STRING:
                return nodes.textNode(parser.getText());
            case VALUE_NUMBER_INT:
                return nodes.numberNode(parser.getBigIntegerValue());
            case VALUE_NUMBER_FLOAT:
                return nodes.numberNode(parser.getDecimalValue());
            case VALUE_TRUE:
                return nodes.booleanNode(true);
            case VALUE_FALSE:
                return nodes.booleanNode(false);
            case VALUE_NULL:
                return nodes.nullNode();
            default:
                throw new TareException("line " + parser.currentTokenLocation().getLineNr()
                        + ": unexpected " + token);
        }
    }

    private static String describe(JsonProcessingException e) {
        Optional<String> yaml = YamlProblems.describe(e);
        if (yaml.isPresent()) {
            return yaml.get();
        }
        if (e.getOriginalMessage() != null && e.getOriginalMessage().startsWith("Duplicate field '")) {
            String name = e.getOriginalMessage().substring("Duplicate field '".length());
            name = name.substring(0, Math.max(0, name.indexOf('\'')));
            return where(e.getLocation()) + "the key '" + name + "' appears twice in one mapping; keep one";
        }
        return where(e.getLocation()) + JSON_OPENED.matcher(firstLine(e.getOriginalMessage())).replaceAll("(opened on line $2)")
                + "; fix the syntax there";
    }

    /** "line L, column C: " for a parser's location, or nothing when it has none. */
    private static String where(JsonLocation location) {
        return location == null || location.getLineNr() < 1 ? ""
                : "line " + location.getLineNr() + ", column " + location.getColumnNr() + ": ";
    }

    private static String firstLine(String message) {
        if (message == null) {
            return "unreadable";
        }
        int newline = message.indexOf('\n');
        return (newline < 0 ? message : message.substring(0, newline)).trim();
    }

    private static JsonFactory yamlFactory() {
        LoaderOptions options = new LoaderOptions();
        options.setMaxAliasesForCollections(20);
        options.setAllowDuplicateKeys(false);
        options.setNestingDepthLimit(MAX_DEPTH + 2);
        options.setCodePointLimit(8 * 1024 * 1024);
        return YAMLFactory.builder()
                .loaderOptions(options)
                .enable(YAMLParser.Feature.EMPTY_STRING_AS_NULL)
                .enable(StreamReadFeature.STRICT_DUPLICATE_DETECTION)
                .build();
    }
}
