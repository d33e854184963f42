package dev.tare.source;

import com.fasterxml.jackson.core.JsonLocation;
import com.fasterxml.jackson.core.io.ContentReference;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.math.BigInteger;
import java.util.HashMap;
import java.util.Locale;
import java.util.Map;
import java.util.Set;

/**
 * A reader for the plain subset of YAML that chat files and front matter are nearly always written
 * in: block mappings with plain keys, block sequences, literal block scalars ({@code |} and
 * {@code |-}), one-line flow mappings (their keys plain or quoted) and sequences of scalars, quoted strings on one line (double
 * quotes with the escapes {@code \" \\ \n \t \r \\uXXXX}), plain strings, whole numbers, empty
 * values and comments. Anything else (an anchor, a tag, a folded or multi-line scalar, a tab, a word
 * YAML might read as a boolean or null, a duplicate key, an unusual character) makes it give up, and
 * the document goes to Jackson's YAML parser instead; so it never decides an error message, and what
 * it accepts it reads as that parser does: the tree, the value types and the locations (lines, and
 * columns in code points). {@code SimpleYamlTest} holds it to the parser on the repository's YAML
 * and on random documents. On the benchmark corpus it reads 99 % of the documents (chat files and
 * front matter) in about a quarter of the parser's time, under the first JIT tier the scan runs with.
 */
final class SimpleYaml {
    /** Deeper documents go to the general parser, which enforces the real limit. */
    private static final int MAX_DEPTH = 16;
    /** Longer documents go to the general parser, which enforces its own size limit. */
    private static final int MAX_CHARS = 1 << 20;
    /** Plain words some YAML schema reads as something other than a string. */
    private static final Set<String> SPECIAL_WORDS = Set.of("true", "false", "yes", "no", "y", "n", "on", "off", "null", "~");
    /** Characters a plain scalar may not start with (indicators, quotes, and what could start a number). */
    private static final String NOT_FIRST = "-?:,[]{}#&*!|>'\"%@`+.=<0123456789";

    /** Thrown (without a stack trace) when the document is outside the subset. */
    private static final class Unsupported extends RuntimeException {
        private static final Unsupported INSTANCE = new Unsupported();

        private Unsupported() {
            super(null, null, false, false);
        }
    }

    /** A document read: its root and the location of each value, by path. */
    record Read(JsonNode root, Map<String, JsonLocation> locations) {
    }

    private final String text;
    /** The text's chars, scanned here rather than through {@code charAt}, which checks the string's coder each time. */
    private final char[] chars;
    private final int[] starts;
    private final int[] ends;
    private final int lineCount;
    private final Map<String, JsonLocation> locations = new HashMap<>();
    private final JsonNodeFactory nodes = JsonNodeFactory.instance;
    /** The next line not yet read. */
    private int line;

    private SimpleYaml(String text, char[] chars, int[] starts, int[] ends, int lineCount) {
        this.text = text;
        this.chars = chars;
        this.starts = starts;
        this.ends = ends;
        this.lineCount = lineCount;
    }

    /** The document read, or null when it is outside the subset (or not valid YAML at all). */
    static Read read(String text) {
        if (text.length() > MAX_CHARS) {
            return null;
        }
        char[] chars = text.toCharArray();
        if (!plainCharacters(chars)) {
            return null;
        }
        int lines = 1;
        for (int at = text.indexOf('\n'); at >= 0; at = text.indexOf('\n', at + 1)) {
            lines++;
        }
        int[] starts = new int[lines];
        int[] ends = new int[lines];
        int start = 0;
        for (int i = 0; i < lines; i++) {
            int newline = text.indexOf('\n', start);
            int end = newline < 0 ? text.length() : newline;
            starts[i] = start;
            ends[i] = end;
            start = end + 1;
        }
        SimpleYaml reader = new SimpleYaml(text, chars, starts, ends, lines);
        try {
            return reader.document();
        } catch (Unsupported e) {
            return null;
        }
    }

    /**
     * Whether every character is one the subset takes as it is: printable, no tab or carriage return,
     * no character YAML 1.1 counts as a line break, no byte-order mark, surrogates only in pairs.
     */
    private static boolean plainCharacters(char[] chars) {
        for (int i = 0; i < chars.length; i++) {
            char c = chars[i];
            if (c >= 0x20 && c <= 0x7E || c == '\n') {
                continue;
            }
            if (Character.isHighSurrogate(c) && i + 1 < chars.length && Character.isLowSurrogate(chars[i + 1])) {
                i++;
                continue;
            }
            boolean printable = c >= 0xA0 && c <= 0xD7FF || c >= 0xE000 && c <= 0xFFFD;
            if (!printable || c == 0xFEFF || c == 0x2028 || c == 0x2029) {
                return false;
            }
        }
        return true;
    }

    private Read document() {
        skipIgnorable();
        if (line >= lineCount || indent(line) != 0) {
            throw Unsupported.INSTANCE;
        }
        JsonNode root = collection(line, 0, "", 0, false);
        skipIgnorable();
        if (line < lineCount) {
            throw Unsupported.INSTANCE;
        }
        return new Read(root, locations);
    }

    /** The mapping or sequence whose first key or dash stands at {@code column} of line {@code ln}. */
    private JsonNode collection(int ln, int column, String path, int depth, boolean indentless) {
        if (depth > MAX_DEPTH) {
            throw Unsupported.INSTANCE;
        }
        if (dashAt(ln, column)) {
            return sequence(ln, column, path, depth, indentless);
        }
        if (keyEnd(ln, column) > 0) {
            return mapping(ln, column, path, depth);
        }
        throw Unsupported.INSTANCE;
    }

    private ObjectNode mapping(int ln, int column, String path, int depth) {
        ObjectNode object = nodes.objectNode();
        locate(path, ln, column);
        int current = ln;
        while (true) {
            int keyEnd = keyEnd(current, column);
            if (keyEnd < 0) {
                throw Unsupported.INSTANCE;
            }
            String key = text.substring(starts[current] + column, keyEnd);
            if (object.has(key)) {
                throw Unsupported.INSTANCE;
            }
            String child = path.isEmpty() ? key : path + "." + key;
            JsonNode value = value(current, skipSpaces(keyEnd + 1, ends[current]), column, child, depth + 1);
            if (value == null) {
                // Nothing after the colon: a null, which the general parser places just after the colon.
                locate(child, current, keyEnd + 1 - starts[current]);
                value = nodes.nullNode();
            }
            object.set(key, value);
            skipIgnorable();
            if (line >= lineCount || indent(line) < column) {
                return object;
            }
            if (indent(line) > column || keyEnd(line, column) < 0) {
                throw Unsupported.INSTANCE;
            }
            current = line;
        }
    }

    private ArrayNode sequence(int ln, int column, String path, int depth, boolean indentless) {
        ArrayNode array = nodes.arrayNode();
        locate(path, ln, column);
        int current = ln;
        while (true) {
            int item = starts[current] + column + 1;
            int at = skipSpaces(item, ends[current]);
            if (at == item || at == ends[current]) {
                throw Unsupported.INSTANCE;
            }
            if (chars[at] == '#') {
                throw Unsupported.INSTANCE;
            }
            String child = path + "[" + array.size() + "]";
            int itemColumn = at - starts[current];
            if (keyEnd(current, itemColumn) > 0) {
                array.add(mapping(current, itemColumn, child, depth + 1));
            } else {
                char first = chars[at];
                if (first == '-' || first == '|') {
                    throw Unsupported.INSTANCE;
                }
                array.add(value(current, at, column, child, depth + 1));
            }
            skipIgnorable();
            if (line >= lineCount || indent(line) < column) {
                return array;
            }
            if (indent(line) == column && dashAt(line, column)) {
                current = line;
            } else if (indent(line) == column && indentless) {
                return array;
            } else {
                throw Unsupported.INSTANCE;
            }
        }
    }

    /**
     * The value that starts at offset {@code at} of line {@code ln}, after a key or a dash at
     * {@code parentIndent}; leaves {@link #line} at the first line after it.
     */
    private JsonNode value(int ln, int at, int parentIndent, String path, int depth) {
        int end = ends[ln];
        if (at == end || chars[at] == '#') {
            line = ln + 1;
            skipIgnorable();
            if (line < lineCount && indent(line) > parentIndent) {
                return collection(line, indent(line), path, depth, false);
            }
            if (line < lineCount && indent(line) == parentIndent && dashAt(line, parentIndent)) {
                return collection(line, parentIndent, path, depth, true);
            }
            return null;
        }
        locate(path, ln, at - starts[ln]);
        char first = chars[at];
        JsonNode node;
        int after;
        if (first == '|') {
            return literal(ln, at, parentIndent);
        } else if (first == '{') {
            ObjectNode object = nodes.objectNode();
            after = flowMapping(ln, at, object, path);
            node = object;
        } else if (first == '[') {
            ArrayNode array = nodes.arrayNode();
            after = flowSequence(ln, at, array, path);
            node = array;
        } else if (first == '"' || first == '\'') {
            int close = closingQuote(at, end);
            node = nodes.textNode(unquote(at, close));
            after = close + 1;
        } else {
            int stop = plainEnd(at, end);
            node = plain(text.substring(at, trimSpaces(at, stop)), false);
            after = stop;
        }
        after = skipSpaces(after, end);
        if (after < end && !(chars[after] == '#' && chars[after - 1] == ' ')) {
            throw Unsupported.INSTANCE;
        }
        line = ln + 1;
        // A more indented line after a one-line value would continue it (or be an error).
        int next = line;
        while (next < lineCount && blank(next)) {
            next++;
        }
        if (next < lineCount && indent(next) > parentIndent) {
            throw Unsupported.INSTANCE;
        }
        return node;
    }

    /** A literal block scalar whose indicator is at {@code at}: {@code |} (clip) or {@code |-} (strip). */
    private JsonNode literal(int ln, int at, int parentIndent) {
        int header = at + 1;
        boolean strip = header < ends[ln] && chars[header] == '-';
        if (strip) {
            header++;
        }
        if (skipSpaces(header, ends[ln]) != ends[ln]) {
            throw Unsupported.INSTANCE;
        }
        int first = ln + 1;
        if (first >= lineCount || blank(first)) {
            throw Unsupported.INSTANCE;
        }
        int indent = indent(first);
        if (indent <= parentIndent) {
            throw Unsupported.INSTANCE;
        }
        // The lines are copied without their indentation into one array, which holds at most the
        // block's own chars.
        char[] content = new char[chars.length - starts[first]];
        int length = 0;
        int contentEnd = 0;
        int i = first;
        for (; i < lineCount; i++) {
            int spaces = indent(i);
            if (spaces == ends[i] - starts[i]) {
                if (spaces > indent) {
                    throw Unsupported.INSTANCE;
                }
                content[length++] = '\n';
                continue;
            }
            if (spaces < indent) {
                break;
            }
            int from = starts[i] + indent;
            System.arraycopy(chars, from, content, length, ends[i] - from);
            length += ends[i] - from;
            content[length++] = '\n';
            contentEnd = length;
        }
        if (i == lineCount && !text.endsWith("\n")) {
            throw Unsupported.INSTANCE;
        }
        line = i;
        return nodes.textNode(new String(content, 0, strip ? contentEnd - 1 : contentEnd));
    }

    /** Reads {@code {key: value, ...}} on one line into {@code object}; the offset after its brace. */
    private int flowMapping(int ln, int open, ObjectNode object, String path) {
        int end = ends[ln];
        int at = skipSpaces(open + 1, end);
        if (at < end && chars[at] == '}') {
            return at + 1;
        }
        while (true) {
            int keyEnd;
            String key;
            if (at < end && (chars[at] == '"' || chars[at] == '\'')) {
                // A quoted key, as configuration files write a glob: {"prompts/**": 7000}.
                int close = closingQuote(at, end);
                key = unquote(at, close);
                keyEnd = close + 1;
                if (keyEnd + 1 >= end || chars[keyEnd] != ':' || chars[keyEnd + 1] != ' ') {
                    throw Unsupported.INSTANCE;
                }
            } else {
                keyEnd = flowKeyEnd(at, end);
                key = text.substring(at, keyEnd);
            }
            if (object.has(key)) {
                throw Unsupported.INSTANCE;
            }
            at = keyEnd + 2;
            at = skipSpaces(at, end);
            if (at >= end) {
                throw Unsupported.INSTANCE;
            }
            String child = path.isEmpty() ? key : path + "." + key;
            locate(child, ln, at - starts[ln]);
            at = flowScalar(at, end, '}', value -> object.set(key, value));
            at = skipSpaces(at, end);
            if (at >= end) {
                throw Unsupported.INSTANCE;
            }
            char c = chars[at];
            if (c == '}') {
                return at + 1;
            }
            if (c != ',') {
                throw Unsupported.INSTANCE;
            }
            at = skipSpaces(at + 1, end);
        }
    }

    /** Reads {@code [value, ...]} on one line into {@code array}; the offset after its bracket. */
    private int flowSequence(int ln, int open, ArrayNode array, String path) {
        int end = ends[ln];
        int at = skipSpaces(open + 1, end);
        if (at < end && chars[at] == ']') {
            return at + 1;
        }
        while (true) {
            if (at >= end) {
                throw Unsupported.INSTANCE;
            }
            locate(path + "[" + array.size() + "]", ln, at - starts[ln]);
            at = flowScalar(at, end, ']', array::add);
            at = skipSpaces(at, end);
            if (at >= end) {
                throw Unsupported.INSTANCE;
            }
            char c = chars[at];
            if (c == ']') {
                return at + 1;
            }
            if (c != ',') {
                throw Unsupported.INSTANCE;
            }
            at = skipSpaces(at + 1, end);
        }
    }

    /** A quoted or plain scalar inside a flow collection closed by {@code closer}, given to {@code sink}; the offset after it. */
    private int flowScalar(int at, int end, char closer, java.util.function.Consumer<JsonNode> sink) {
        char first = chars[at];
        if (first == '"' || first == '\'') {
            int close = closingQuote(at, end);
            sink.accept(nodes.textNode(unquote(at, close)));
            return close + 1;
        }
        int stop = at;
        while (stop < end && ",[]{}".indexOf(chars[stop]) < 0) {
            stop++;
        }
        if (stop < end && chars[stop] != ',' && chars[stop] != closer) {
            throw Unsupported.INSTANCE;
        }
        sink.accept(plain(text.substring(at, trimSpaces(at, stop)), true));
        return stop;
    }

    /** A plain scalar's node: a whole number or a string, refusing anything another reading could differ on. */
    private JsonNode plain(String value, boolean flow) {
        if (value.isEmpty()) {
            throw Unsupported.INSTANCE;
        }
        if (wholeNumber(value)) {
            return nodes.numberNode(new BigInteger(value));
        }
        if (NOT_FIRST.indexOf(value.charAt(0)) >= 0 || Character.isWhitespace(value.charAt(0))
                || Character.isSpaceChar(value.charAt(0)) || value.endsWith(":") || value.contains(": ")
                || value.contains(" #") || SPECIAL_WORDS.contains(value.toLowerCase(Locale.ROOT))
                || (flow && value.indexOf(':') >= 0)) {
            throw Unsupported.INSTANCE;
        }
        return nodes.textNode(value);
    }

    /** {@code 0} or an optional minus and up to 18 digits without a leading zero. */
    private static boolean wholeNumber(String value) {
        int digits = value.charAt(0) == '-' ? 1 : 0;
        int count = value.length() - digits;
        if (count < 1 || count > 18 || (value.charAt(digits) == '0' && (count > 1 || digits == 1))) {
            return false;
        }
        for (int i = digits; i < value.length(); i++) {
            if (value.charAt(i) < '0' || value.charAt(i) > '9') {
                return false;
            }
        }
        return true;
    }

    /** The end of a plain scalar in block context: the line's end or a comment. */
    private int plainEnd(int at, int end) {
        for (int i = at; i + 1 < end; i++) {
            if (chars[i] == ' ' && chars[i + 1] == '#') {
                return i;
            }
        }
        return end;
    }

    /**
     * The offset of the quote closing the one at {@code open}, on the same line, past any escaped
     * double quote; an empty string or a doubled single quote is left to the general parser.
     */
    private int closingQuote(int open, int end) {
        char quote = chars[open];
        int close = open + 1;
        while (close < end && chars[close] != quote) {
            close += quote == '"' && chars[close] == '\\' ? 2 : 1;
        }
        if (close >= end || close == open + 1 || (quote == '\'' && close + 1 < end && chars[close + 1] == '\'')) {
            throw Unsupported.INSTANCE;
        }
        return close;
    }

    /** A quoted string's value: single quotes as they are, double quotes with the common escapes read. */
    private String unquote(int open, int close) {
        if (chars[open] == '\'' || !contains(open + 1, close, '\\')) {
            return text.substring(open + 1, close);
        }
        StringBuilder value = new StringBuilder(close - open);
        for (int i = open + 1; i < close; i++) {
            char c = chars[i];
            if (c != '\\') {
                value.append(c);
                continue;
            }
            char escaped = chars[++i];
            switch (escaped) {
                case '"', '\\' -> value.append(escaped);
                case 'n' -> value.append('\n');
                case 't' -> value.append('\t');
                case 'r' -> value.append('\r');
                case 'u' -> value.append(hexChar(i + 1, close));
                default -> throw Unsupported.INSTANCE;
            }
            if (escaped == 'u') {
                i += 4;
            }
        }
        return value.toString();
    }

    private boolean contains(int from, int to, char wanted) {
        for (int i = from; i < to; i++) {
            if (chars[i] == wanted) {
                return true;
            }
        }
        return false;
    }

    /** The character of the four hex digits at {@code at}: a Basic Multilingual Plane character, not a surrogate. */
    private char hexChar(int at, int close) {
        if (at + 4 > close) {
            throw Unsupported.INSTANCE;
        }
        int code = 0;
        for (int i = at; i < at + 4; i++) {
            int digit = Character.digit(chars[i], 16);
            if (digit < 0) {
                throw Unsupported.INSTANCE;
            }
            code = code * 16 + digit;
        }
        if (Character.isSurrogate((char) code)) {
            throw Unsupported.INSTANCE;
        }
        return (char) code;
    }

    /** The end of a plain key at {@code column} of line {@code ln} followed by {@code ": "} or a colon ending the line, else -1. */
    private int keyEnd(int ln, int column) {
        int at = starts[ln] + column;
        int end = ends[ln];
        int keyEnd = identifierEnd(at, end);
        if (keyEnd < 0 || keyEnd >= end || chars[keyEnd] != ':'
                || (keyEnd + 1 < end && chars[keyEnd + 1] != ' ')) {
            return -1;
        }
        return keyEnd;
    }

    /** The end of a key inside a flow mapping, which must be followed by {@code ": "}. */
    private int flowKeyEnd(int at, int end) {
        int keyEnd = identifierEnd(at, end);
        if (keyEnd < 0 || keyEnd + 1 >= end || chars[keyEnd] != ':' || chars[keyEnd + 1] != ' ') {
            throw Unsupported.INSTANCE;
        }
        return keyEnd;
    }

    /** The end of {@code [A-Za-z_][A-Za-z0-9_.-]*} at {@code at}, refusing the special words; else -1. */
    private int identifierEnd(int at, int end) {
        if (at >= end || !keyStart(chars[at])) {
            return -1;
        }
        int i = at + 1;
        while (i < end && (keyStart(chars[i]) || chars[i] >= '0' && chars[i] <= '9'
                || chars[i] == '.' || chars[i] == '-')) {
            i++;
        }
        if (SPECIAL_WORDS.contains(text.substring(at, i).toLowerCase(Locale.ROOT))) {
            return -1;
        }
        return i;
    }

    private static boolean keyStart(char c) {
        return c >= 'a' && c <= 'z' || c >= 'A' && c <= 'Z' || c == '_';
    }

    private boolean dashAt(int ln, int column) {
        int at = starts[ln] + column;
        return at < ends[ln] && chars[at] == '-' && (at + 1 == ends[ln] || chars[at + 1] == ' ');
    }

    /** Moves {@link #line} past blank lines and comment lines. */
    private void skipIgnorable() {
        while (line < lineCount && (blank(line) || chars[starts[line] + indent(line)] == '#')) {
            line++;
        }
    }

    private boolean blank(int ln) {
        return indent(ln) == ends[ln] - starts[ln];
    }

    /** The number of spaces the line starts with. */
    private int indent(int ln) {
        return skipSpaces(starts[ln], ends[ln]) - starts[ln];
    }

    /** The end of {@code text[at, end)} without trailing spaces (only spaces: YAML keeps other blanks). */
    private int trimSpaces(int at, int end) {
        while (end > at && chars[end - 1] == ' ') {
            end--;
        }
        return end;
    }

    private int skipSpaces(int at, int end) {
        while (at < end && chars[at] == ' ') {
            at++;
        }
        return at;
    }

    /** Records a value's place as the general parser reports it: 1-based line, and column in code points. */
    private void locate(String path, int ln, int column) {
        int codePoints = text.codePointCount(starts[ln], starts[ln] + column);
        locations.put(path, new JsonLocation(ContentReference.unknown(), -1L, -1L, ln + 1, codePoints + 1));
    }
}
