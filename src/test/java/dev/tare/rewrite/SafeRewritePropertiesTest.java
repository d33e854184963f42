package dev.tare.rewrite;

import dev.tare.app.Fix;
import dev.tare.app.FixResult;
import dev.tare.workspace.FileSystemOps;
import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.core.util.DefaultIndenter;
import com.fasterxml.jackson.core.util.DefaultPrettyPrinter;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import dev.tare.tokenize.Tokenizer;
import dev.tare.tokenize.TokenizerRegistry;
import dev.tare.workspace.Workspace;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.TreeMap;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;

/**
 * Property tests over generated templates (prose with variables, includes and code spans; fenced
 * code; pretty-printed JSON blocks; lists and headings; repeated sentences; invisible characters;
 * LF, CRLF and mixed line endings; a byte-order mark; unicode words), written to files and fixed
 * through {@link Fix} as {@code tare fix} would. The invariants are those of design.md "Rewrites that
 * are safe"; they are checked here with this test's own simple readers, not the engine's: placeholders
 * by a regular expression, fences by their marker lines (CommonMark 0.31.2 §4.5, from memory), JSON by
 * a plain Jackson tree comparison (RFC 8259: member order is not significant), paragraphs as runs of
 * non-blank lines (CommonMark §4.8).
 */
class SafeRewritePropertiesTest {
    private static final TokenizerRegistry TOKENIZERS = new TokenizerRegistry();
    private static final ObjectMapper JSON = new ObjectMapper();
    private static final Pattern PLACEHOLDER = Pattern.compile("\\{\\{.*?\\}\\}|\\{%.*?%\\}");
    private static final Pattern CODE_SPAN = Pattern.compile("`[^`\\n]*`");
    private static final String REPEATED = "Always confirm the account number before you continue.";
    private static final Set<String> WHITESPACE_RULES = Set.of("blank-lines", "space-run", "trailing-whitespace", "prose-tab");

    /** A generated template file: its text with {@code \n} breaks, how breaks are written, and its byte-order mark. */
    record Document(String text, LineEnding lineEnding, boolean bom) {
        String written() {
            return lineEnding.apply(text);
        }

        /** Shown with escapes, so that a failing sample can be pasted into a test as it is. */
        @Override
        public String toString() {
            StringBuilder out = new StringBuilder("\"");
            text.codePoints().forEach(c -> out.append(c == '\n' ? "\\n" : c == '\t' ? "\\t" : c == '"' ? "\\\""
                    : c < 0x20 || (c >= 0x7F && c < 0xA0) || c == 0xA0 || c == 0xAD || c == 0x200B
                    ? String.format("\\u%04X", c) : new String(Character.toChars(c))));
            return out.append("\" ").append(lineEnding).append(bom ? " with BOM" : "").toString();
        }

        byte[] bytes() {
            byte[] body = written().getBytes(StandardCharsets.UTF_8);
            if (!bom) {
                return body;
            }
            byte[] bytes = new byte[body.length + 3];
            bytes[0] = (byte) 0xEF;
            bytes[1] = (byte) 0xBB;
            bytes[2] = (byte) 0xBF;
            System.arraycopy(body, 0, bytes, 3, body.length);
            return bytes;
        }
    }

    /** How the line breaks of a generated file are written. */
    enum LineEnding {
        LF, CRLF, MIXED;

        String apply(String text) {
            if (this == LF) {
                return text;
            }
            StringBuilder out = new StringBuilder();
            int breaks = 0;
            for (int i = 0; i < text.length(); i++) {
                char c = text.charAt(i);
                if (c == '\n' && (this == CRLF || breaks++ % 2 == 0)) {
                    out.append("\r\n");
                } else {
                    out.append(c);
                }
            }
            return out.toString();
        }
    }

    /** What a fix of one generated file did: the text before, the text after, and the engine's report. */
    record Outcome(String before, String after, byte[] bytesBefore, byte[] bytesAfter, FixResult result,
                   FixResult second, byte[] bytesAfterSecond) {
    }

    @Property(tries = 120)
    void safeRewritesKeepEveryInvariantNeverCostMoreAndAreIdempotent(@ForAll("documents") Document document) {
        Outcome outcome = fix(document, Set.of());
        assertTrue(outcome.result().notFixed().isEmpty(), () -> "no rewrite may be dropped: " + outcome.result().notFixed());
        String before = outcome.before();
        String after = outcome.after();

        assertEquals(placeholders(before), placeholders(after), "every variable, include and tag survives");
        assertEquals(codeSpans(before), codeSpans(after), "code spans are kept");
        assertFences(fences(before), fences(after));
        assertEquals(endsWithBreak(before), endsWithBreak(after), "the final-newline state is kept");
        assertTrue(styles(before).containsAll(styles(after)), "no new line-ending style: " + styles(before) + " -> " + styles(after));
        assertEquals(document.bom(), hasBom(outcome.bytesAfter()), "the byte-order mark is kept");

        Tokenizer tokenizer = TOKENIZERS.defaultTokenizer();
        assertTrue(tokenizer.count(after) <= tokenizer.count(before),
                () -> "a safe fix never costs tokens: " + tokenizer.count(before) + " -> " + tokenizer.count(after));
        for (FileFix file : outcome.result().files()) {
            file.tokens().forEach(t -> assertTrue(t.after() <= t.before(), "reported " + t));
        }

        assertTrue(outcome.second().files().isEmpty(), () -> "a second fix finds nothing: " + outcome.second().files());
        assertArrayEquals(outcome.bytesAfter(), outcome.bytesAfterSecond(), "fixing twice gives the bytes of fixing once");
    }

    @Property(tries = 80)
    void whitespaceRulesKeepTheNonWhitespaceCharactersAndTheParagraphs(@ForAll("documents") Document document) {
        Outcome outcome = fix(document, WHITESPACE_RULES);
        assertTrue(outcome.result().notFixed().isEmpty(), () -> "no rewrite may be dropped: " + outcome.result().notFixed());
        assertEquals(nonWhitespace(outcome.before()), nonWhitespace(outcome.after()));
        assertEquals(paragraphs(outcome.before()), paragraphs(outcome.after()),
                "the same paragraphs, in order, each with the same non-whitespace characters");
    }

    private static Outcome fix(Document document, Set<String> only) {
        Path dir = null;
        try {
            dir = Files.createTempDirectory("tare-property");
            Files.writeString(dir.resolve("tare.yaml"), "templates:\n  include: [\"prompts/**/*.md\"]\n  partials: prompts/partials\n");
            Path file = Files.createDirectories(dir.resolve("prompts")).resolve("generated.md");
            Files.write(file, document.bytes());
            Workspace workspace = Workspace.open(List.of(), Optional.of(dir.resolve("tare.yaml")));
            FixOptions options = new FixOptions(false, only, false);
            FixResult result = new Fix(workspace, TOKENIZERS, FileSystemOps.DEFAULT).run(options);
            byte[] once = Files.readAllBytes(file);
            FixResult second = new Fix(workspace, TOKENIZERS, FileSystemOps.DEFAULT).run(options);
            byte[] twice = Files.readAllBytes(file);
            return new Outcome(document.written(), text(once), document.bytes(), once, result, second, twice);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        } finally {
            delete(dir);
        }
    }

    private static String text(byte[] bytes) {
        String text = new String(bytes, StandardCharsets.UTF_8);
        return hasBom(bytes) ? text.substring(1) : text;
    }

    private static boolean hasBom(byte[] bytes) {
        return bytes.length >= 3 && (bytes[0] & 0xFF) == 0xEF && (bytes[1] & 0xFF) == 0xBB && (bytes[2] & 0xFF) == 0xBF;
    }

    private static void delete(Path dir) {
        if (dir == null) {
            return;
        }
        try (Stream<Path> walk = Files.walk(dir)) {
            walk.sorted(Comparator.reverseOrder()).forEach(p -> p.toFile().delete());
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    // --- this test's own readers of the invariants -------------------------------------------

    private static Map<String, Integer> placeholders(String text) {
        Map<String, Integer> counts = new TreeMap<>();
        Matcher matcher = PLACEHOLDER.matcher(text);
        while (matcher.find()) {
            counts.merge(matcher.group(), 1, Integer::sum);
        }
        return counts;
    }

    /** Fenced blocks as {info, body} pairs, found by their marker lines. */
    private static List<String[]> fences(String text) {
        List<String[]> fences = new ArrayList<>();
        String[] lines = text.split("\r?\n", -1);
        for (int i = 0; i < lines.length; i++) {
            if (lines[i].startsWith("```")) {
                StringBuilder body = new StringBuilder();
                int j = i + 1;
                while (j < lines.length && !lines[j].startsWith("```")) {
                    body.append(lines[j]).append('\n');
                    j++;
                }
                fences.add(new String[] {lines[i].substring(3), body.toString()});
                i = j;
            }
        }
        return fences;
    }

    private static void assertFences(List<String[]> before, List<String[]> after) {
        assertEquals(before.size(), after.size(), "the same number of fenced blocks");
        for (int i = 0; i < before.size(); i++) {
            assertEquals(before.get(i)[0], after.get(i)[0], "the same info string");
            if (before.get(i)[0].equals("json")) {
                assertEquals(tree(before.get(i)[1]), tree(after.get(i)[1]), "a JSON block holds the same JSON value");
            } else {
                assertEquals(before.get(i)[1], after.get(i)[1], "other fenced code is kept as written");
            }
        }
    }

    private static JsonNode tree(String json) {
        try {
            return JSON.readTree(json);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    private static List<String> codeSpans(String text) {
        List<String> spans = new ArrayList<>();
        boolean inFence = false;
        for (String line : text.split("\r?\n", -1)) {
            if (line.startsWith("```")) {
                inFence = !inFence;
                continue;
            }
            Matcher matcher = CODE_SPAN.matcher(line);
            while (!inFence && matcher.find()) {
                spans.add(matcher.group());
            }
        }
        return spans;
    }

    private static String nonWhitespace(String text) {
        return text.codePoints().filter(c -> !Character.isWhitespace(c))
                .collect(StringBuilder::new, StringBuilder::appendCodePoint, StringBuilder::append).toString();
    }

    /**
     * The non-whitespace characters of each paragraph (a run of non-blank lines) of the prompt text
     * after any front matter, in order; a fence counts as one.
     */
    private static List<String> paragraphs(String file) {
        String text = file.startsWith("---\n") || file.startsWith("---\r\n") ? file.substring(file.indexOf("\n---", 3) + 4) : file;
        List<String> paragraphs = new ArrayList<>();
        StringBuilder current = new StringBuilder();
        boolean inFence = false;
        for (String line : text.split("\r\n|\r|\n", -1)) {
            if (line.startsWith("```")) {
                inFence = !inFence;
            }
            if (!inFence && line.isBlank()) {
                if (current.length() > 0) {
                    paragraphs.add(current.toString());
                    current.setLength(0);
                }
            } else {
                current.append(nonWhitespace(line));
            }
        }
        if (current.length() > 0) {
            paragraphs.add(current.toString());
        }
        return paragraphs;
    }

    private static boolean endsWithBreak(String text) {
        return text.endsWith("\n") || text.endsWith("\r");
    }

    private static Set<String> styles(String text) {
        Set<String> styles = new java.util.TreeSet<>();
        for (int i = 0; i < text.length(); i++) {
            if (text.charAt(i) == '\r') {
                boolean crlf = i + 1 < text.length() && text.charAt(i + 1) == '\n';
                styles.add(crlf ? "CRLF" : "CR");
                i += crlf ? 1 : 0;
            } else if (text.charAt(i) == '\n') {
                styles.add("LF");
            }
        }
        return styles;
    }

    // --- generators ----------------------------------------------------------------------------

    @Provide
    Arbitrary<Document> documents() {
        Arbitrary<String> body = block().list().ofMinSize(1).ofMaxSize(7)
                .flatMap(blocks -> gap().list().ofSize(blocks.size()).map(gaps -> join(blocks, gaps)));
        Arbitrary<String> frontMatter = Arbitraries.of("", "", "---\nbudget: 900\nvariables:\n  name: {tokens: 3}\n---\n");
        Arbitrary<String> leading = Arbitraries.of("", "", "\n\n", " \n\n\n");
        Arbitrary<String> ending = Arbitraries.of("\n", "\n", "", "\n\n\n", "  \n", "\n \n\n");
        return Combinators.combine(frontMatter, leading, body, ending, Arbitraries.of(LineEnding.class), Arbitraries.of(true, false))
                .as((front, lead, text, end, lineEnding, bom) -> new Document(front + lead + text + end, lineEnding, bom));
    }

    private static String join(List<String> blocks, List<String> gaps) {
        StringBuilder out = new StringBuilder(blocks.get(0));
        for (int i = 1; i < blocks.size(); i++) {
            out.append('\n').append(gaps.get(i)).append(blocks.get(i));
        }
        return out.toString();
    }

    /** What stands between two blocks after the first one's line break: nothing, or blank lines (some with spaces). */
    private Arbitrary<String> gap() {
        return Arbitraries.of("", "\n", "\n", "\n", " \n", "\n\n", "\t\n\n", "\n\n\n");
    }

    private Arbitrary<String> block() {
        return Arbitraries.frequencyOf(
                net.jqwik.api.Tuple.of(5, paragraph()),
                net.jqwik.api.Tuple.of(2, fencedCode()),
                net.jqwik.api.Tuple.of(2, jsonBlock()),
                net.jqwik.api.Tuple.of(1, line().list().ofMinSize(1).ofMaxSize(3).map(items -> "- " + String.join("\n- ", items))),
                net.jqwik.api.Tuple.of(1, line().map(title -> "# " + title)),
                net.jqwik.api.Tuple.of(1, Arbitraries.just(REPEATED)));
    }

    private Arbitrary<String> paragraph() {
        return line().list().ofMinSize(1).ofMaxSize(3).map(lines -> String.join("\n", lines));
    }

    /** One line of prose: words and placeholders with assorted spacing, and sometimes trailing whitespace. */
    private Arbitrary<String> line() {
        Arbitrary<String> word = Arbitraries.of("water", "meter", "account", "bill.", "now!", "why?", "café", "naïve",
                "Grüße", "日本語", "данные", "señal", "(see", "notes)", "{{ name }}", "{{ account.id }}",
                "{{ amount | currency }}", "{{> safety }}", "{% if late %}", "{% endif %}", "`a  b`", "`x`",
                "ad\u200Bjust", "co\u00ADop");
        Arbitrary<String> space = Arbitraries.of(" ", " ", " ", " ", "  ", "   ", "\t", " \t", "\u00A0");
        Arbitrary<String> trailing = Arbitraries.of("", "", "", " ", "  ", "\t");
        return Combinators.combine(word.list().ofMinSize(1).ofMaxSize(8), space.list().ofSize(8), trailing)
                .as((words, spaces, end) -> {
                    StringBuilder out = new StringBuilder(words.get(0));
                    for (int i = 1; i < words.size(); i++) {
                        out.append(spaces.get(i)).append(words.get(i));
                    }
                    return out.append(end).toString();
                });
    }

    private Arbitrary<String> fencedCode() {
        Arbitrary<String> codeLine = Arbitraries.of("echo  hi  ", "x = 1   ", "\tindented", "", "a\t\tb", "{{ name }}  ", "   ");
        return Combinators.combine(Arbitraries.of("", "sh", "python"), codeLine.list().ofMinSize(1).ofMaxSize(4))
                .as((language, lines) -> "```" + language + "\n" + String.join("\n", lines) + "\n```");
    }

    private Arbitrary<String> jsonBlock() {
        Arbitrary<Object> scalar = Arbitraries.oneOf(Arbitraries.integers().between(-1000, 1000).map(i -> (Object) i),
                Arbitraries.of("billing", "a  b", "café", "{{ name }}", "", "line\nbreak").map(s -> (Object) s),
                Arbitraries.of(true, false).map(b -> (Object) b),
                Arbitraries.of(1.5, 0.25, -3.0E-5).map(d -> (Object) d));
        Arbitrary<Object> value = Arbitraries.oneOf(scalar, scalar.list().ofMaxSize(3).map(l -> (Object) l),
                Combinators.combine(Arbitraries.of("id", "kind", "urgent"), scalar)
                        .as((k, v) -> (Object) Map.of(k, v)));
        Arbitrary<String> key = Arbitraries.of("intent", "urgent", "account", "notes", "score", "tags", "reply");
        return Combinators.combine(key.list().uniqueElements().ofMinSize(1).ofMaxSize(4), value.list().ofSize(4))
                .as((keys, values) -> {
                    Map<String, Object> object = new LinkedHashMap<>();
                    for (int i = 0; i < keys.size(); i++) {
                        object.put(keys.get(i), values.get(i));
                    }
                    return "```json\n" + pretty(object) + "\n```";
                });
    }

    private static String pretty(Object value) {
        DefaultPrettyPrinter printer = new DefaultPrettyPrinter().withObjectIndenter(new DefaultIndenter("  ", "\n"));
        try {
            return JSON.writer(printer).writeValueAsString(value);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }
}
