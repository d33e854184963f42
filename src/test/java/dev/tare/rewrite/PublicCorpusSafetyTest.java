package dev.tare.rewrite;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.cli.Cli;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import java.util.stream.Stream;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * {@code tare fix} with its default safe rewrites on prompts nobody on this project wrote: the 221
 * system prompts of the public repository danielmiessler/fabric (folder data/patterns, commit
 * 272f04dd3278f99bee49e94a7747b54708745a5d, MIT License), kept unchanged under
 * {@code src/test/resources/public-prompts} with their LICENSE and SOURCE.md. Every file the fix changes
 * is held to what a safe rewrite promises (design.md, "Rewrites that are safe") by this test's own
 * {@link SafeRewriteProperties}, not by the engine's verifier. The fix runs once for the whole class,
 * because the corpus is the slow part and every test here reads the same outcome.
 */
class PublicCorpusSafetyTest {
    private static final Path CORPUS = Cli.projectDir().resolve("src/test/resources/public-prompts");
    /** Issue 19: safe fixes must still earn their keep on this corpus, not be made safe by doing nothing. */
    private static final int MIN_CHANGED_FILES = 20;

    @TempDir
    static Path dir;

    private static Cli.Run firstFix;
    private static Cli.Run secondFix;
    private static final Map<String, byte[]> BEFORE = new TreeMap<>();
    private static final Map<String, byte[]> AFTER_ONCE = new TreeMap<>();
    private static final Map<String, byte[]> AFTER_TWICE = new TreeMap<>();

    @BeforeAll
    static void fixTheCorpusTwice() throws IOException {
        copyWritable(CORPUS, dir);
        BEFORE.putAll(read(dir));
        firstFix = Cli.run("fix", dir.toString());
        AFTER_ONCE.putAll(read(dir));
        // Safe rewrites look at one file at a time, so a file the first fix left alone has nothing new
        // to offer; fixing again only what changed keeps the test quick.
        List<String> again = new ArrayList<>(List.of("fix"));
        changed(BEFORE, AFTER_ONCE).forEach(path -> again.add(dir.resolve(path).toString()));
        secondFix = again.size() > 1 ? Cli.run(again.toArray(String[]::new)) : firstFix;
        AFTER_TWICE.putAll(read(dir));
    }

    /**
     * A plain copy, each file made writable: a fix refuses read-only files, and a checkout or a build
     * may hand the resources over read-only.
     */
    private static void copyWritable(Path from, Path to) throws IOException {
        try (Stream<Path> walk = Files.walk(from)) {
            for (Path source : walk.toList()) {
                Path target = to.resolve(from.relativize(source).toString());
                if (Files.isDirectory(source)) {
                    Files.createDirectories(target);
                } else {
                    Files.copy(source, target);
                    assertTrue(target.toFile().setWritable(true, true), () -> "cannot make " + target + " writable");
                }
            }
        }
    }

    /** The corpus's prompt files by their path under {@code patterns/}; the fix's own cache is not the corpus. */
    private static Map<String, byte[]> read(Path root) throws IOException {
        Map<String, byte[]> files = new TreeMap<>();
        try (Stream<Path> walk = Files.walk(root.resolve("patterns"))) {
            for (Path file : walk.filter(Files::isRegularFile).toList()) {
                files.put(root.relativize(file).toString().replace('\\', '/'), Files.readAllBytes(file));
            }
        }
        return files;
    }

    private static List<String> changed(Map<String, byte[]> from, Map<String, byte[]> to) {
        return from.keySet().stream().filter(path -> !Arrays.equals(from.get(path), to.get(path))).toList();
    }

    @Test
    void theCorpusIsThere() {
        assertTrue(BEFORE.size() >= 200, "expected the ~220 public prompts, found " + BEFORE.size());
        assertEquals(BEFORE.keySet(), AFTER_ONCE.keySet(), "a fix neither adds nor removes files");
    }

    @Test
    void theFixEndsWithOkOrAFileLeftUnfixedNeverAnError() {
        assertTrue(firstFix.exitCode() == 0 || firstFix.exitCode() == 1,
                () -> "exit " + firstFix.exitCode() + "\n" + firstFix.err() + firstFix.out());
    }

    @Test
    void everyChangedFileKeepsWhatASafeRewritePromises() {
        List<String> violations = new ArrayList<>();
        for (String path : changed(BEFORE, AFTER_ONCE)) {
            String before = new String(BEFORE.get(path), StandardCharsets.UTF_8);
            String after = new String(AFTER_ONCE.get(path), StandardCharsets.UTF_8);
            SafeRewriteProperties.check(before, after).forEach(v -> violations.add(path + ":" + v));
        }
        assertTrue(violations.isEmpty(), () -> violations.size() + " broken promises in "
                + violations.stream().map(v -> v.substring(0, v.indexOf(':'))).distinct().count() + " files:\n"
                + String.join("\n", violations));
    }

    @Test
    void safeFixesStillChangeAtLeastTwentyFiles() {
        List<String> changed = changed(BEFORE, AFTER_ONCE);
        assertTrue(changed.size() >= MIN_CHANGED_FILES, () -> "only " + changed.size() + " files changed: " + changed
                + "\n" + firstFix.out() + firstFix.err());
    }

    @Test
    void aSecondFixChangesNothing() {
        List<String> changedAgain = changed(AFTER_ONCE, AFTER_TWICE);
        assertTrue(changedAgain.isEmpty(), () -> "fixing twice did not give the bytes of fixing once: " + changedAgain
                + "\n" + secondFix.out());
    }
}
