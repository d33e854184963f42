package dev.tare.lint;

import dev.tare.source.YamlDocument;
import dev.tare.template.Template;
import java.util.Arrays;
import java.util.Locale;
import java.util.OptionalInt;

/**
 * Builds the {@link ContentMap} of each message read from a string value of a YAML or JSON file (a
 * chat file's {@code content}, a serialized prompt object's {@code template}) by reading the file's
 * string values again: JSON strings and YAML double-quoted, single-quoted, plain one-line and literal
 * block scalars are followed character by character; any other form (folded blocks, multi-line plain
 * or quoted scalars, content given as a list of parts) is placed at the value's start and left
 * read-only. A map is only used when the characters it follows spell the parsed content exactly.
 */
final class ChatContentMaps {
    private final String source;
    private final SourceLines lines;
    /** The file read as YAML or JSON; null when it cannot be read again. */
    private final YamlDocument document;

    private ChatContentMaps(String source, SourceLines lines, YamlDocument document) {
        this.source = source;
        this.lines = lines;
        this.document = document;
    }

    /** The maps of {@code template}'s file, read as YAML or JSON once. */
    static ChatContentMaps of(Template template, SourceLines lines) {
        boolean json = template.path().toLowerCase(Locale.ROOT).endsWith(".json");
        YamlDocument document;
        try {
            document = json ? YamlDocument.parseJson(template.source()) : YamlDocument.parseYaml(template.source());
        } catch (RuntimeException e) {
            document = null;
        }
        return new ChatContentMaps(template.source(), lines, document);
    }

    /** The map of {@code content}, read from the value at {@code key} ({@code messages[0].content}). */
    ContentMap map(String key, String content) {
        if (document == null) {
            return ContentMap.approximate(0, content.length());
        }
        OptionalInt line = document.line(key);
        OptionalInt column = document.column(key);
        if (line.isEmpty() || column.isEmpty()) {
            int dot = key.lastIndexOf('.');
            OptionalInt ownerLine = document.line(dot < 0 ? "" : key.substring(0, dot));
            int at = ownerLine.isPresent() ? lines.lineStart(ownerLine.getAsInt()) : 0;
            return ContentMap.approximate(at, content.length());
        }
        int at = lines.offset(line.getAsInt(), column.getAsInt());
        if (document.at(key).isTextual()) {
            ContentMap exact = exact(at, content);
            if (exact != null) {
                return exact;
            }
        }
        return ContentMap.approximate(at, content.length());
    }

    /** The exact map when the value at {@code at} (or just before it) is a form this class follows. */
    private ContentMap exact(int at, String content) {
        for (int start : new int[] {at, at - 1}) {
            if (start < 0 || start >= source.length()) {
                continue;
            }
            char first = source.charAt(start);
            Built built = switch (first) {
                case '"' -> doubleQuoted(start + 1);
                case '\'' -> singleQuoted(start + 1);
                case '|' -> literalBlock(start);
                case '>' -> null;
                default -> plain(start);
            };
            if (built != null && built.text().startsWith(content)) {
                return built.truncated(content.length());
            }
        }
        return null;
    }

    /** Characters collected from the file with the offset each came from. */
    private static final class Built {
        private final StringBuilder text = new StringBuilder();
        private int[] offsets = new int[64];
        private boolean[] verbatim = new boolean[64];
        private final ContentMap.Style style;
        private int end;

        Built(ContentMap.Style style) {
            this.style = style;
        }

        void add(char c, int offset, boolean exact) {
            int n = text.length();
            if (n == offsets.length) {
                offsets = Arrays.copyOf(offsets, n * 2);
                verbatim = Arrays.copyOf(verbatim, n * 2);
            }
            text.append(c);
            offsets[n] = offset;
            verbatim[n] = exact;
            end = offset + 1;
        }

        String text() {
            return text.toString();
        }

        ContentMap truncated(int length) {
            int[] mapped = Arrays.copyOf(offsets, length + 1);
            mapped[length] = length < text.length() ? offsets[length] : end;
            return new ContentMap(mapped, Arrays.copyOf(verbatim, length), style);
        }
    }

    private Built doubleQuoted(int from) {
        Built out = new Built(ContentMap.Style.DOUBLE_QUOTED);
        for (int i = from; i < source.length(); i++) {
            char c = source.charAt(i);
            if (c == '"') {
                out.end = i;
                return out;
            }
            if (c == '\n' || c == '\r') {
                return null;
            }
            if (c != '\\') {
                out.add(c, i, true);
                continue;
            }
            if (i + 1 >= source.length()) {
                return null;
            }
            char e = source.charAt(i + 1);
            int width = 2;
            char decoded;
            switch (e) {
                case 'n' -> decoded = '\n';
                case 't' -> decoded = '\t';
                case 'r' -> decoded = '\r';
                case 'b' -> decoded = '\b';
                case 'f' -> decoded = '\f';
                case '"', '\\', '/' -> decoded = e;
                case 'u' -> {
                    if (i + 6 > source.length()) {
                        return null;
                    }
                    try {
                        decoded = (char) Integer.parseInt(source.substring(i + 2, i + 6), 16);
                    } catch (NumberFormatException ex) {
                        return null;
                    }
                    width = 6;
                }
                default -> {
                    return null;
                }
            }
            out.add(decoded, i, false);
            i += width - 1;
        }
        return null;
    }

    private Built singleQuoted(int from) {
        Built out = new Built(ContentMap.Style.SINGLE_QUOTED);
        for (int i = from; i < source.length(); i++) {
            char c = source.charAt(i);
            if (c == '\'') {
                if (i + 1 < source.length() && source.charAt(i + 1) == '\'') {
                    out.add('\'', i, false);
                    i++;
                    continue;
                }
                out.end = i;
                return out;
            }
            if (c == '\n' || c == '\r') {
                return null;
            }
            out.add(c, i, true);
        }
        return null;
    }

    /** A one-line plain scalar: read-only, since a replacement could change how YAML reads it. */
    private Built plain(int from) {
        Built out = new Built(ContentMap.Style.READ_ONLY);
        int end = from;
        while (end < source.length() && source.charAt(end) != '\n' && source.charAt(end) != '\r'
                && !(source.charAt(end) == '#' && end > from && source.charAt(end - 1) == ' ')) {
            end++;
        }
        String value = source.substring(from, end).stripTrailing();
        for (int i = 0; i < value.length(); i++) {
            out.add(value.charAt(i), from + i, true);
        }
        return out;
    }

    /** A literal block scalar ({@code |}, {@code |-}, {@code |+}) with automatic indentation. */
    private Built literalBlock(int header) {
        int lineEnd = source.indexOf('\n', header);
        if (lineEnd < 0) {
            return null;
        }
        String indicators = source.substring(header + 1, lineEnd).strip();
        if (indicators.matches(".*\\d.*")) {
            return null;
        }
        Built out = new Built(ContentMap.Style.LITERAL_BLOCK);
        int indent = -1;
        int at = lineEnd + 1;
        while (at < source.length()) {
            int end = source.indexOf('\n', at);
            int next = end < 0 ? source.length() : end + 1;
            int contentEnd = end < 0 ? source.length() : end;
            boolean crlf = contentEnd > at && source.charAt(contentEnd - 1) == '\r';
            if (crlf) {
                contentEnd--;
            }
            int spaces = 0;
            while (at + spaces < contentEnd && source.charAt(at + spaces) == ' ') {
                spaces++;
            }
            boolean blank = at + spaces == contentEnd;
            if (!blank) {
                if (indent < 0) {
                    indent = spaces;
                    if (indent == 0) {
                        return null;
                    }
                } else if (spaces < indent) {
                    break;
                }
                for (int i = at + indent; i < contentEnd; i++) {
                    out.add(source.charAt(i), i, true);
                }
            } else if (indent >= 0 && spaces > indent) {
                for (int i = at + indent; i < contentEnd; i++) {
                    out.add(source.charAt(i), i, true);
                }
            }
            if (end >= 0) {
                out.add('\n', crlf ? contentEnd : end, !crlf);
            }
            at = next;
        }
        return out;
    }
}
