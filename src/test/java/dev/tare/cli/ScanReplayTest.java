package dev.tare.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.scan.StampedFiles;
import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.OptionalInt;
import java.util.stream.Stream;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * A warm scan printed from what its command line asked for the last time ({@link ScanReplay}): the
 * same bytes as a parsed run, and never when anything that decides them differs.
 */
class ScanReplayTest {
    private static final Path DEMO = Cli.projectDir().resolve("corpora/demo");

    @TempDir
    Path repo;

    @BeforeEach
    void copyTheDemoAged() throws IOException {
        try (Stream<Path> paths = Files.walk(DEMO)) {
            for (Path path : paths.filter(p -> !DEMO.relativize(p).startsWith(".tare")).toList()) {
                Path target = repo.resolve(DEMO.relativize(path).toString());
                if (Files.isDirectory(path)) {
                    Files.createDirectories(target);
                } else {
                    Files.copy(path, target, StandardCopyOption.REPLACE_EXISTING);
                }
            }
        }
        ageEverything();
    }

    @Test
    void aRepeatedScanIsPrintedFromWhatItsCommandLineAskedAndMatchesAParsedRun() {
        for (String format : List.of("json", "text")) {
            String[] args = {"scan", repo.toString(), "--format", format, "--sort", "tokens"};
            String parsed = scan(args);
            assertEquals(1, remembered(), "what the command line asked for is kept in the repository's cache");
            Replay replay = replay(args);
            assertEquals(OptionalInt.of(ExitCodes.OK), replay.code(), format);
            assertEquals(parsed, replay.out(), format);
            assertEquals(scan("scan", repo.toString(), "--format", format, "--sort", "tokens", "--no-cache"), replay.out());
            deleteRemembered();
        }
    }

    @Test
    void anotherCommandLineIsNotServedByWhatOneAsked() {
        scan("scan", repo.toString(), "--format", "json");
        for (String[] other : List.of(
                new String[] {"scan", repo.toString(), "--format", "json", "--sort", "tokens"},
                new String[] {"scan", repo.toString(), "--format=json"},
                new String[] {"scan", repo.toString(), "--format", "json", "--target", "hosted-small"},
                new String[] {"scan", repo.toString(), "--format", "json", "--timings"},
                new String[] {"check", repo.toString(), "--format", "json"},
                new String[] {"scan", repo.resolve("prompts").toString(), "--format", "json"})) {
            assertEquals(OptionalInt.empty(), replay(other).code(), String.join(" ", other));
        }
        assertTrue(replay("scan", repo.toString(), "--format", "json").code().isPresent());
    }

    @Test
    void aChangedRepositoryIsScannedAgain() throws IOException {
        String[] args = {"scan", repo.toString(), "--format", "json"};
        String before = scan(args);
        Files.writeString(repo.resolve("prompts/closing-notice.md"), "Tell the customer the office is closed today.");
        assertEquals(OptionalInt.empty(), replay(args).code(), "a new template: the stored report no longer holds");
        String after = scan(args);
        assertFalse(before.contains("prompts/closing-notice.md"));
        assertTrue(after.contains("prompts/closing-notice.md"));
        ageEverything();
        scan(args);
        Path config = repo.resolve("tare.yaml");
        Files.writeString(config, Files.readString(config) + "\n# a comment changes nothing that is loaded\n");
        assertEquals(OptionalInt.of(ExitCodes.OK), replay(args).code());
        Files.writeString(config, Files.readString(config).replace("calls_per_day: 40000", "calls_per_day: 50000"));
        assertEquals(OptionalInt.empty(), replay(args).code(), "an edited configuration: another cache key");
        Files.delete(repo.resolve("tare.yaml"));
        assertEquals(OptionalInt.empty(), replay(args).code(), "no configuration at all");
    }

    @Test
    void aDamagedRecordIsIgnoredAndWrittenAgain() throws IOException {
        String[] args = {"scan", repo.toString(), "--format", "json"};
        String parsed = scan(args);
        Path record = rememberedFiles().get(0);
        byte[] bytes = Files.readAllBytes(record);
        bytes[bytes.length / 2] ^= 0x01;
        Files.write(record, bytes);
        assertEquals(OptionalInt.empty(), replay(args).code());
        assertEquals(parsed, scan(args));
        assertEquals(parsed, replay(args).out());
    }

    @Test
    void nothingIsRememberedForRunsThatPrintMoreThanTheStoredReportOrStoreNone() {
        scan("scan", repo.toString(), "--format", "json", "--no-cache");
        scan("scan", repo.toString(), "--format", "md");
        Cli.Run timed = Cli.run("scan", repo.toString(), "--format", "json", "--timings");
        assertTrue(timed.err().contains("timings:"), timed.err());
        scan("scan", repo.toString(), "--format", "json", "--debug");
        assertEquals(0, remembered());
        // The root is the repository, above the folder named: the next run would not look there.
        scan("scan", repo.resolve("prompts").toString(), "--format", "json");
        assertEquals(0, remembered());
    }

    @Test
    void requestsRoundTripThroughLinesAndOtherLinesAreRefused() {
        ScanRequest request = new ScanRequest(List.of(Path.of("prompts"), Path.of("/abs/other path")),
                Optional.of(Path.of("conf/tare.yaml")), List.of("a", "b"), Optional.of("o200k_base"),
                ScanCommand.Format.json, ScanCommand.Sort.cost, true);
        assertEquals(Optional.of(request), ScanRequest.of(request.lines()));
        ScanRequest bare = new ScanRequest(List.of(), Optional.empty(), List.of(), Optional.empty(),
                ScanCommand.Format.text, ScanCommand.Sort.path, false);
        assertEquals(Optional.of(bare), ScanRequest.of(bare.lines()));
        List<String> wrongCount = new ArrayList<>(request.lines());
        wrongCount.set(5, "9");
        assertEquals(Optional.empty(), ScanRequest.of(wrongCount));
        List<String> unknownFormat = new ArrayList<>(request.lines());
        unknownFormat.set(0, "pdf");
        assertEquals(Optional.empty(), ScanRequest.of(unknownFormat));
        assertEquals(Optional.empty(), ScanRequest.of(List.of("json")));
    }

    private record Replay(OptionalInt code, String out) {
    }

    private static Replay replay(String... args) {
        StringWriter out = new StringWriter();
        OptionalInt code = ScanReplay.run(args, new PrintWriter(out, true));
        if (code.isEmpty()) {
            assertEquals("", out.toString(), "nothing printed when the scan must run");
        }
        return new Replay(code, out.toString());
    }

    private static String scan(String... args) {
        Cli.Run run = Cli.run(args);
        assertEquals(0, run.exitCode(), run.err());
        return run.out();
    }

    private long remembered() {
        return rememberedFiles().size();
    }

    private List<Path> rememberedFiles() {
        Path cache = repo.resolve(".tare/cache");
        if (!Files.isDirectory(cache)) {
            return List.of();
        }
        try (Stream<Path> files = Files.list(cache)) {
            return files.filter(f -> f.getFileName().toString().startsWith(ScanReplay.KIND + "-")).toList();
        } catch (IOException e) {
            throw new java.io.UncheckedIOException(e);
        }
    }

    private void deleteRemembered() {
        for (Path file : rememberedFiles()) {
            try {
                Files.delete(file);
            } catch (IOException e) {
                throw new java.io.UncheckedIOException(e);
            }
        }
    }

    /** Every file and folder an hour back, out of the window in which a stamp cannot vouch for it. */
    private void ageEverything() throws IOException {
        new StampedFiles(repo).ageEveryFile();
        try (Stream<Path> folders = Files.walk(repo)) {
            for (Path folder : folders.filter(Files::isDirectory).toList()) {
                Files.setLastModifiedTime(folder, StampedFiles.LONG_AGO);
            }
        }
    }
}
