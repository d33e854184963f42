package dev.tare.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import dev.tare.Tare;
import dev.tare.tokenize.TokenizerRegistry;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.FileTime;
import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** {@code tare scan} end to end on the demo repository, read back through its JSON contract. */
class ScanCommandTest {
    private static final Path DEMO = Cli.projectDir().resolve("corpora/demo");

    private static JsonNode scanJson(String... extra) throws Exception {
        List<String> args = new ArrayList<>(List.of("scan", DEMO.toString(), "--format", "json"));
        args.addAll(List.of(extra));
        Cli.Run run = Cli.run(args.toArray(String[]::new));
        assertEquals(0, run.exitCode(), run.err());
        return new ObjectMapper().readTree(run.out());
    }

    @Test
    void jsonCarriesTheContractKeys() throws Exception {
        JsonNode root = scanJson();
        assertEquals("tare", root.get("tool").asText());
        assertEquals(Tare.version(), root.get("version").asText());
        assertTrue(root.get("templates").size() >= 20, "the demo has 20 or more templates");
        assertEquals(0, root.get("skipped").size(), root.get("skipped").toString());
        for (JsonNode template : root.get("templates")) {
            String path = template.get("path").asText();
            assertFalse(path.startsWith("/") || path.contains("\\"), path);
            assertTrue(Files.isRegularFile(DEMO.resolve(path)), path);
            assertFalse(path.contains("/drafts/"), "drafts are excluded by the demo's tare.yaml");
            String expectedKind = path.contains("/partials/") ? "partial" : path.contains(".tools.") ? "tools"
                    : path.matches(".*\\.(yaml|json)$") ? "chat" : "text";
            assertEquals(expectedKind, template.get("kind").asText(), path);
            assertTrue(template.get("static_tokens").asInt() <= template.get("estimated_tokens").asInt(), path);
            assertTrue(template.get("variables").isArray() && template.get("targets").isObject(), path);
        }
    }

    @Test
    void aWarmScanPrintsByteForByteWhatAColdOneAndAnUncachedOnePrint(@TempDir Path copy) throws IOException {
        copyAged(DEMO, copy);
        for (String format : List.of("json", "text")) {
            for (String sort : List.of("path", "tokens")) {
                String uncached = scanOut(copy, format, sort, "--no-cache");
                String cold = scanOut(copy, format, sort);
                String warm = scanOut(copy, format, sort);
                assertEquals(uncached, cold, format + " " + sort);
                assertEquals(uncached, warm, format + " " + sort);
            }
        }
        try (Stream<Path> files = Files.list(copy.resolve(".tare/cache"))) {
            assertEquals(1, files.filter(f -> f.getFileName().toString().startsWith("scan-")).count(),
                    "one cache of measurements, whatever the format and order, so the warm runs read it");
        }
        Files.writeString(copy.resolve("prompts/new-notice.md"), "Tell the customer the office is closed today.");
        String afterEdit = scanOut(copy, "json", "path");
        assertEquals(scanOut(copy, "json", "path", "--no-cache"), afterEdit);
        assertTrue(afterEdit.contains("prompts/new-notice.md"));
    }

    private static String scanOut(Path root, String format, String sort, String... extra) {
        List<String> args = new ArrayList<>(List.of("scan", root.toString(), "--format", format, "--sort", sort));
        args.addAll(List.of(extra));
        Cli.Run run = Cli.run(args.toArray(String[]::new));
        assertEquals(0, run.exitCode(), run.err());
        return run.out();
    }

    /** Copies a folder with every time an hour back, out of the window in which a stamp cannot vouch for a file. */
    private static void copyAged(Path from, Path to) throws IOException {
        FileTime old = FileTime.from(Instant.now().minus(1, ChronoUnit.HOURS));
        List<Path> folders = new ArrayList<>();
        try (Stream<Path> paths = Files.walk(from)) {
            for (Path path : paths.filter(p -> !from.relativize(p).startsWith(".tare")).toList()) {
                Path target = to.resolve(from.relativize(path).toString());
                if (Files.isDirectory(path)) {
                    Files.createDirectories(target);
                    folders.add(target);
                } else {
                    Files.copy(path, target);
                    Files.setLastModifiedTime(target, old);
                }
            }
        }
        for (Path folder : folders) {
            Files.setLastModifiedTime(folder, old);
        }
    }

    @Test
    void totalsAreTheSumsOverTemplatesThatAreNotPartials() throws Exception {
        JsonNode root = scanJson();
        long staticSum = 0;
        long estimatedSum = 0;
        int templates = 0;
        int partials = 0;
        for (JsonNode template : root.get("templates")) {
            if (template.get("kind").asText().equals("partial")) {
                partials++;
                continue;
            }
            if (template.get("kind").asText().equals("tools")) {
                continue;
            }
            templates++;
            staticSum += template.get("static_tokens").asLong();
            estimatedSum += template.get("estimated_tokens").asLong();
        }
        JsonNode totals = root.get("totals");
        assertEquals(templates, totals.get("templates").asInt());
        assertEquals(partials, totals.get("partials").asInt());
        assertEquals(staticSum, totals.get("static_tokens").asLong());
        assertEquals(estimatedSum, totals.get("estimated_tokens").asLong());
    }

    @Test
    void aPlainPartialsStaticTokensAreItsWholeFilesCount() throws Exception {
        JsonNode root = scanJson("--tokenizer", "cl100k_base");
        Path partial = DEMO.resolve("prompts/partials/brand-voice.md");
        String text = Files.readString(partial);
        assertFalse(text.contains("{{") || text.contains("{%") || text.startsWith("---"), "the partial is plain text");
        int expected = new TokenizerRegistry().get("cl100k_base", Path.of(".")).count(text);
        for (JsonNode template : root.get("templates")) {
            if (template.get("path").asText().equals("prompts/partials/brand-voice.md")) {
                assertEquals(expected, template.get("static_tokens").asInt());
                return;
            }
        }
        throw new AssertionError("brand-voice.md not in the scan");
    }

    @Test
    void includesAddThePartialsTokens() throws Exception {
        JsonNode root = scanJson();
        JsonNode assistant = null;
        for (JsonNode template : root.get("templates")) {
            if (template.get("path").asText().equals("prompts/system/assistant.md")) {
                assistant = template;
            }
        }
        assertTrue(assistant != null && assistant.get("includes").toString().contains("prompts/partials/safety-preamble.md"),
                "the demo's system prompt includes the safety preamble");
    }

    @Test
    void targetSelectionAndTextOutput() throws Exception {
        JsonNode root = scanJson("--target", "hosted-small");
        assertEquals("cl100k_base", root.get("tokenizer").asText(), "the first selected target's tokenizer is primary");
        for (JsonNode template : root.get("templates")) {
            assertFalse(template.get("targets").has("hosted-large"), template.get("path").asText());
        }
        Cli.Run text = Cli.run("scan", DEMO.toString(), "--sort", "tokens");
        assertEquals(0, text.exitCode(), text.err());
        assertTrue(text.out().contains("prompts/agents/field-crew-work-order.md"));
        assertTrue(text.out().indexOf("field-crew-work-order.md") < text.out().indexOf("after-hours.md"),
                "sorted by tokens, largest first");
    }

    @Test
    void aScanOrCheckThatFindsNoTemplateExitsTwoNamingTheGlobsAndWhatLooksLikeAPrompt(@TempDir Path repo)
            throws IOException {
        Files.createDirectories(repo.resolve("templates"));
        Files.writeString(repo.resolve("templates/billing.md"), "You answer questions about water bills, {{ name }}.\n");
        Files.writeString(repo.resolve("tare.yaml"), "templates: {include: [\"prompts/**/*.md\"]}\n");
        for (String command : List.of("scan", "check")) {
            Cli.Run run = Cli.run(command, repo.toString());
            assertEquals(2, run.exitCode(), command);
            assertEquals("", run.out(), command);
            assertTrue(run.err().startsWith("tare: no template found in " + repo + ": no file matches the include"
                    + " globs of tare.yaml (prompts/**/*.md), but templates/billing.md looks like a prompt; run"
                    + " 'tare init'"), run.err());
            assertEquals(1, run.err().lines().count(), run.err());
        }
        // Named on the command line, the folder is measured although no glob selects it.
        Cli.Run named = Cli.run("scan", repo.resolve("templates").toString(), "--format", "json");
        assertEquals(0, named.exitCode(), named.err());
        assertTrue(named.out().contains("\"path\" : \"templates/billing.md\""), named.out());
    }

    @Test
    void usageAndConfigErrorsExitTwoWithOneLine() {
        Cli.Run unknownTarget = Cli.run("scan", DEMO.toString(), "--target", "nowhere");
        assertEquals(2, unknownTarget.exitCode());
        assertTrue(unknownTarget.err().startsWith("tare: unknown target 'nowhere'; configured targets: hosted-large, hosted-small"),
                unknownTarget.err());
        Cli.Run badFlag = Cli.run("scan", "--format", "xml");
        assertEquals(2, badFlag.exitCode());
        Cli.Run missing = Cli.run("scan", "no/such/folder");
        assertEquals(2, missing.exitCode());
        assertEquals("tare: no/such/folder: no such file or folder\n", missing.err());
    }
}
