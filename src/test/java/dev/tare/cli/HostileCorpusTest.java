package dev.tare.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.HashMap;
import java.util.Map;
import java.util.TreeSet;
import java.util.stream.Stream;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Every file of {@code corpora/hostile}, plus a symlink loop and a link out of the root made here,
 * is either counted or skipped with a reason; the scan exits 0 and prints no stack trace.
 */
class HostileCorpusTest {
    @TempDir
    static Path copy;
    @TempDir
    static Path outside;
    private static Cli.Run run;
    private static JsonNode report;

    @BeforeAll
    static void scanACopyWithLinksAdded() throws IOException {
        Path source = Cli.projectDir().resolve("corpora/hostile");
        try (Stream<Path> files = Files.walk(source)) {
            for (Path file : (Iterable<Path>) files::iterator) {
                Path target = copy.resolve(source.relativize(file).toString());
                if (Files.isDirectory(file)) {
                    Files.createDirectories(target);
                } else {
                    Files.copy(file, target);
                }
            }
        }
        Files.writeString(outside.resolve("secret.md"), "outside the root");
        Files.createSymbolicLink(copy.resolve("loop"), copy);
        Files.createSymbolicLink(copy.resolve("escape"), outside);
        run = Cli.run("scan", copy.toString(), "--format", "json");
        report = new ObjectMapper().readTree(run.out());
    }

    @org.junit.jupiter.api.AfterAll
    static void removeLinks() throws IOException {
        Files.deleteIfExists(copy.resolve("loop"));
        Files.deleteIfExists(copy.resolve("escape"));
    }

    private static Map<String, String> outcomes() {
        Map<String, String> outcomes = new HashMap<>();
        report.get("templates").forEach(t -> outcomes.put(t.get("path").asText(), "counted"));
        report.get("skipped").forEach(s -> outcomes.put(s.get("path").asText(), "skipped: " + s.get("reason").asText()));
        return outcomes;
    }

    @Test
    void exitsZeroWithoutAStackTrace() {
        assertEquals(0, run.exitCode(), run.err());
        assertFalse(run.err().contains("Exception") || run.err().contains("\tat "), run.err());
    }

    @Test
    void everyFileIsCountedOrSkippedExactlyOnce() throws IOException {
        Map<String, String> outcomes = outcomes();
        TreeSet<String> expected = new TreeSet<>();
        try (Stream<Path> files = Files.walk(Cli.projectDir().resolve("corpora/hostile"))) {
            files.filter(Files::isRegularFile)
                    .map(f -> Cli.projectDir().resolve("corpora/hostile").relativize(f).toString().replace('\\', '/'))
                    .filter(p -> !p.equals("tare.yaml"))
                    .filter(p -> !p.startsWith(".tare/")) // the scan cache that scanning this folder leaves
                    .forEach(expected::add);
        }
        for (String path : expected) {
            assertTrue(outcomes.containsKey(path), path + " is neither counted nor skipped");
        }
        assertEquals(report.get("templates").size() + report.get("skipped").size(), outcomes.size(), "no path twice");
    }

    @Test
    void theGoodFilesBesideTheBadAreCounted() {
        Map<String, String> outcomes = outcomes();
        for (String good : new String[] {"utf8-bom.md", "crlf.md", "mixed-endings.md", "special-tokens.md", "one-mib-line.md",
                "empty.md", "only-front-matter.md", "weird-names/café prompt.md", "weird-names/-dash-start.md"}) {
            assertEquals("counted", outcomes.get(good), good);
        }
    }

    @Test
    void theBadFilesAreSkippedWithTheirReasons() {
        Map<String, String> outcomes = outcomes();
        Map<String, String> expected = Map.ofEntries(
                Map.entry("binary.md", "binary file"),
                Map.entry("invalid-utf8.md", "not valid UTF-8 (bad byte sequence at offset 90, line 4)"),
                Map.entry("utf16-bom.md", "UTF-16 encoded"),
                Map.entry("huge-line.md", "larger than the size limit"),
                Map.entry("unterminated-placeholder.md", "line 7, column 29: '{{' is never closed"),
                Map.entry("unterminated-tag.md", "line 4, column 1: '{%' is never closed"),
                Map.entry("malformed-front-matter.md",
                        "front matter: line 4, column 1: a mapping in { } is not closed (opened on line 3)"),
                Map.entry("unclosed-front-matter.md", "never closed"),
                Map.entry("include-cycle.md", "include cycle"),
                Map.entry("include-escape.md", "leads outside the scanned root"),
                Map.entry("include-missing.md", "names no file"),
                Map.entry("alias-bomb.chat.yaml", "YAML aliases"),
                Map.entry("malformed.chat.json", "line 5"),
                Map.entry("malformed.chat.yaml", "line "),
                Map.entry("no-messages.chat.yaml", "neither a chat file"),
                Map.entry("bad-message.chat.json", "messages[1].content must be text"),
                Map.entry("deep-nesting.chat.json", "nested deeper than"),
                Map.entry("loop", "symbolic link loop"),
                Map.entry("escape", "outside the scanned root"));
        expected.forEach((path, reason) -> {
            String outcome = outcomes.get(path);
            assertTrue(outcome != null && outcome.startsWith("skipped: ") && outcome.contains(reason),
                    path + " should be skipped for '" + reason + "', was: " + outcome);
        });
    }
}
