package dev.tare.source;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.core.JsonLocation;
import dev.tare.TareException;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.Random;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;

/**
 * The subset reader against Jackson's YAML parser, which stays the definition: whatever the subset
 * reader accepts must be read by the parser to the same tree (node types and field order included)
 * with the same line and column for every value, and nothing the parser refuses may be accepted.
 */
class SimpleYamlTest {
    /** Compares the two readings; true when the subset reader accepted the document. */
    private static boolean sameReading(String text) {
        SimpleYaml.Read fast = SimpleYaml.read(text);
        YamlDocument full;
        try {
            full = YamlDocument.parseYamlInFull(text);
        } catch (TareException e) {
            assertNull(fast, () -> "accepted what the parser refuses (" + e.getMessage() + "):\n" + text);
            return false;
        }
        if (fast == null) {
            return false;
        }
        assertEquals(full.root(), fast.root(), text);
        assertEquals(full.root().toString(), fast.root().toString(), text);
        assertEquals(full.locatedPaths(), fast.locations().keySet(), text);
        for (Map.Entry<String, JsonLocation> entry : fast.locations().entrySet()) {
            String path = entry.getKey();
            assertEquals(full.line(path).getAsInt(), entry.getValue().getLineNr(), () -> "line of '" + path + "' in\n" + text);
            assertEquals(full.column(path).getAsInt(), entry.getValue().getColumnNr(), () -> "column of '" + path + "' in\n" + text);
        }
        return true;
    }

    @Test
    void readsTheCommonShapesAsTheParserDoes() {
        List<String> accepted = List.of(
                "# A chat file.\nvariables:\n  sailing.departs_at: {tokens: 459}\n  tier: {sample: \"gold tier \u2728\", tokens: 3}\n"
                        + "messages:\n  - role: system\n    content: |\n      Hello {{ name }}: \u26f4\ufe0f\n\n      # not a comment\n"
                        + "        indented more\n    \n  - role: user\n    content: |-\n      Hi\n\n\nbudget: 500\n",
                "messages:\n- role: user  # who\n  content: 'its'\n- role: assistant\n  content: \"\ud83d\ude42 ok\"\ntools: [a.md, \"b c\", 7]\n",
                "\nvariables:\n  a: {sample: \"\ud83d\ude42\ud83d\ude42\", tokens: 5}\n  b: []\n  c: {}\ntarget: hosted-main\n",
                "a:\n  b:\n    c: -12\n  d: x y z\n",
                "budgets: {default: 4000, \"prompts/planning/**\": 12000, 'drafts/*': 10}\n");
        for (String text : accepted) {
            assertTrue(sameReading(text), () -> "not accepted:\n" + text);
        }
    }

    @Test
    void leavesEverythingElseToTheParser() {
        List<String> refused = List.of(
                "", "# only a comment\n", "a: yes\n", "a: 1.5\n", "a: 0x1F\n", "a: 012\n", "a: ~\n", "a: \"\"\n", "a: \"\\x41\"\n",
                "a: &x 1\nb: *x\n", "a: !tag x\n", "a: >\n  folded\n", "a: |+\n  kept\n\n", "a: |2\n  x\n",
                "a: \"esc\\a\"\n", "a: x\n  continued\n", "a: 1\na: 2\n", "a:\tb\n", "a: b\r\n", "---\na: 1\n",
                "a: [x, [y]]\n", "a: {b: {c: 1}}\n", "? a\n: b\n", "a: |\n  x", "'a': 1\n", "true: 1\n",
                "a: b: c\n", "a: \"x\"y\n", "a: x\u2028y\n");
        for (String text : refused) {
            assertNull(SimpleYaml.read(text), () -> "accepted:\n" + text);
            sameReading(text);
        }
    }

    /** Every YAML file of the repository, and the front matter of every template in the corpora. */
    @Test
    void theRepositorysYamlReadsTheSame() throws IOException {
        Pattern frontMatter = Pattern.compile("\\A---\\n(.*?\\n)(?:---|\\.\\.\\.)\\n", Pattern.DOTALL);
        int accepted = 0;
        for (String folder : List.of("corpora", "rules", "src/main/resources", "src/test/resources")) {
            List<Path> files;
            try (Stream<Path> walk = Files.walk(Path.of(folder))) {
                files = walk.filter(Files::isRegularFile).toList();
            }
            for (Path file : files) {
                String name = file.getFileName().toString();
                String text = new String(Files.readAllBytes(file), StandardCharsets.UTF_8);
                if (name.endsWith(".yaml") || name.endsWith(".yml")) {
                    accepted += sameReading(text) ? 1 : 0;
                } else if (name.endsWith(".md") || name.endsWith(".txt")) {
                    Matcher matcher = frontMatter.matcher(text);
                    if (matcher.find()) {
                        accepted += sameReading("\n" + matcher.group(1)) ? 1 : 0;
                    }
                }
            }
        }
        assertTrue(accepted >= 20, "only " + accepted + " documents read by the subset reader");
    }

    @Test
    void randomDocumentsReadTheSame() {
        Random random = new Random(2026);
        int accepted = 0;
        for (int round = 0; round < 10_000; round++) {
            StringBuilder text = new StringBuilder();
            mapping(random, text, 0, 0);
            accepted += sameReading(text.toString()) ? 1 : 0;
        }
        assertTrue(accepted >= 500, "only " + accepted + " random documents read by the subset reader");
    }

    private static final String[] KEYS = {"role", "content", "a.b", "x_y", "Key-2", "tools", "on", "n1", "role"};
    private static final String[] PLAIN = {"system", "gold tier \u2728", "x y", "Hello {{ name }}", "it's", "a,b",
        "50", "-7", "0", "007", "1.5", "yes", "No", "null", "~", "12:30", "a: b", "a #b", "a#b", "@x", "%x", "!x",
        "&x", "*x", "`x`", "x  ", "+1", ".5", "1e3", "true", "=", "<<", "\ud83d\ude42 smile", "caf\u00e9", "x\u2003",
        "[x]", "{y}", "- x", "|", ">", "\"q\"", "'s'", "x:", "-", "a\tb", "\u00a0lead"};

    private static void mapping(Random random, StringBuilder out, int indent, int depth) {
        int keys = 1 + random.nextInt(4);
        for (int k = 0; k < keys; k++) {
            if (random.nextInt(8) == 0) {
                out.append(" ".repeat(random.nextInt(indent + 3))).append("# note: {{ x }}\n");
            }
            if (random.nextInt(10) == 0) {
                out.append("\n");
            }
            out.append(" ".repeat(indent)).append(KEYS[random.nextInt(KEYS.length)]).append(':');
            value(random, out, indent, depth);
        }
    }

    private static void value(Random random, StringBuilder out, int indent, int depth) {
        int kind = random.nextInt(depth > 3 ? 6 : 10);
        switch (kind) {
            case 0, 1 -> out.append(' ').append(PLAIN[random.nextInt(PLAIN.length)]).append(comment(random)).append('\n');
            case 2 -> out.append(' ').append(quoted(random)).append(comment(random)).append('\n');
            case 3 -> out.append(' ').append(flowMapping(random)).append('\n');
            case 4 -> out.append(' ').append(flowSequence(random)).append('\n');
            case 5 -> literal(random, out, indent);
            case 8 -> out.append(random.nextBoolean() ? "" : "   # empty").append('\n');
            case 6 -> {
                out.append(random.nextInt(6) == 0 ? "  " : "").append(comment(random)).append('\n');
                mapping(random, out, indent + 1 + random.nextInt(3), depth + 1);
            }
            default -> {
                out.append('\n');
                int dash = random.nextBoolean() ? indent : indent + 2;
                int items = 1 + random.nextInt(3);
                for (int i = 0; i < items; i++) {
                    out.append(" ".repeat(dash)).append("- ");
                    if (random.nextBoolean()) {
                        out.append(KEYS[random.nextInt(KEYS.length)]).append(':');
                        int inner = dash + 2;
                        value(random, out, inner, depth + 1);
                        if (random.nextBoolean()) {
                            out.append(" ".repeat(inner)).append("content:");
                            value(random, out, inner, depth + 1);
                        }
                    } else {
                        out.append(random.nextBoolean() ? PLAIN[random.nextInt(PLAIN.length)] : quoted(random)).append('\n');
                    }
                }
            }
        }
    }

    private static void literal(Random random, StringBuilder out, int indent) {
        String[] headers = {"|", "|", "|-", "|+", ">", "|2", "| # c"};
        out.append(' ').append(headers[random.nextInt(headers.length)]).append('\n');
        int block = indent + 1 + random.nextInt(4);
        int lines = 1 + random.nextInt(5);
        String[] texts = {"Plain line.", "key: value", "# heading", "  deeper", "{{ name }} and {% if x %}", "trailing  ",
            "\ud83d\ude42 \u26f4\ufe0f", "- item", "tab\there", "'quoted'"};
        for (int i = 0; i < lines; i++) {
            int pick = random.nextInt(12);
            if (pick == 0) {
                out.append('\n');
            } else if (pick == 1) {
                out.append(" ".repeat(random.nextInt(block + 3))).append('\n');
            } else {
                out.append(" ".repeat(block + (pick == 2 ? 1 + random.nextInt(3) : 0)))
                        .append(texts[random.nextInt(texts.length)]).append('\n');
            }
        }
        if (random.nextInt(4) == 0) {
            out.append("\n".repeat(random.nextInt(3)));
        }
    }

    private static String quoted(Random random) {
        String[] values = {"\"21:50\"", "\"a # b\"", "'it''s'", "'x'", "\"\"", "\"esc\\\"aped\"", "\"\ud83d\ude42\"", "\"x\" y",
            "'a: b'", "\"two words\"", "\"back\\\\slash\"", "\"\\u00e9t\\u00E9\"", "\"\\ud83d\"", "\"\\/\"", "\"\\x41\"",
            "\"tab\\there\\n\\r\"", "\"end\\\"", "\"\\u00\"", "'back\\slash'"};
        return values[random.nextInt(values.length)];
    }

    private static String flowMapping(Random random) {
        String[] values = {"{tokens: 276}", "{sample: \"21:50\"}", "{sample: gold, tokens: 3}", "{}", "{a: 1,b: 2}",
            "{a: }", "{a: [1]}", "{a:1}", "{ a: x , b: 'y' }", "{sample: \"\ud83d\ude42\", tokens: 5} # c", "{a: yes}",
            "{a: 1, a: 2}", "{a: x: y}", "{default: 4000, \"prompts/planning/**\": 12000}", "{'k': v, \"a b\": 2}",
            "{\"a\": 1, a: 2}", "{\"\": 1}", "{\"x\":1}", "{\"e\\\"q\": 1}", "{\"on\": 1}", "{\"a.b\": [x]}", "{'it''s': 1}"};
        return values[random.nextInt(values.length)];
    }

    private static String flowSequence(Random random) {
        String[] values = {"[a.md, b.md]", "[]", "[1, \"two\", three]", "[ x ]", "[a, [b]]", "[a,]", "[\"\ud83d\ude42\", z]",
            "[on, off]", "[a b, c]"};
        return values[random.nextInt(values.length)];
    }

    private static String comment(Random random) {
        return random.nextInt(5) == 0 ? "  # trailing" : "";
    }

    @Test
    void literalBlocksKeepTheirLinesAndChompAsTheParserDoes() {
        SimpleYaml.Read read = SimpleYaml.read("a: |\n  one\n\n    two\n \n\nb: |-\n  x\n\n");
        assertNotNull(read);
        assertEquals("one\n\n  two\n", read.root().get("a").asText());
        assertEquals("x", read.root().get("b").asText());
        assertTrue(sameReading("a: |\n  one\n\n    two\n \n\nb: |-\n  x\n\n"));
    }
}
