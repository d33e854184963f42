package dev.tare.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assumptions.assumeFalse;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import dev.tare.testing.Git;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.attribute.FileTime;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The class-data archive the build makes (scripts/class-archive.sh), through the real launcher, jar and
 * pre-commit hook: used on the JDK that made it, and never a warning or a failure when it does not fit.
 */
class ClassArchiveIT {
    private static final Path PROJECT = Cli.projectDir();
    private static final Path JAVA_HOME = Path.of(System.getProperty("java.home"));
    private static final String FILE = "corpora/demo/prompts/meters/reading-dispute.md";
    private static Path archive;

    @TempDir
    Path dir;

    private record Result(int exitCode, String out, String err) {
    }

    @BeforeAll
    static void theBuildMadeAnArchive() {
        assumeFalse("off".equals(System.getenv("TARE_CLASS_ARCHIVE")), "TARE_CLASS_ARCHIVE=off: the build made no archive");
        Path target = PROJECT.resolve("target");
        archive = Files.exists(target.resolve("tare.aot")) ? target.resolve("tare.aot") : target.resolve("tare.jsa");
    }

    private static Result run(Path workDir, Map<String, String> env, List<String> command) throws IOException, InterruptedException {
        ProcessBuilder builder = new ProcessBuilder(command).directory(workDir.toFile());
        builder.environment().remove("TARE_JAVA_OPTS");
        builder.environment().putAll(env);
        Process process = builder.start();
        process.getOutputStream().close();
        byte[] out = process.getInputStream().readAllBytes();
        byte[] err = process.getErrorStream().readAllBytes();
        assertTrue(process.waitFor(5, TimeUnit.MINUTES), "finished");
        return new Result(process.exitValue(), new String(out, StandardCharsets.UTF_8), new String(err, StandardCharsets.UTF_8));
    }

    /** Runs {@code LAUNCHER count --timings FILE} with {@code jdk}'s java first on the PATH. */
    private static Result count(Path launcher, Path jdk) throws IOException, InterruptedException {
        String path = jdk.resolve("bin") + java.io.File.pathSeparator + System.getenv("PATH");
        return run(PROJECT, Map.of("PATH", path), List.of("bash", launcher.toString(), "count", "--timings", FILE));
    }

    /** The count report, and nothing on standard error but the timings line; returns that line's archive status. */
    private static String cleanCount(Result result) {
        assertEquals(0, result.exitCode(), result.err());
        assertTrue(result.out().startsWith("Tokens on o200k_base\n"), result.out());
        assertTrue(result.out().contains("  " + FILE + "\n"), result.out());
        assertEquals(1, result.err().lines().count(), "only the timings line on standard error: " + result.err());
        assertFalse(result.out().contains("[") || result.out().contains("warning"), "no JVM message in the report: " + result.out());
        return TimingsTest.checkedLine(result.err());
    }

    /** A copy of the launcher, the jar and the archive, with the jar's time kept (an archive names it). */
    private Path copyOfTheBuild() throws IOException {
        Path copy = Files.createDirectories(dir.resolve("tare/target"));
        Files.copy(PROJECT.resolve("tare"), copy.resolveSibling("tare"), StandardCopyOption.COPY_ATTRIBUTES);
        for (Path file : List.of(PROJECT.resolve("target/tare.jar"), archive, stamp(archive))) {
            Files.copy(file, copy.resolve(file.getFileName()), StandardCopyOption.COPY_ATTRIBUTES);
        }
        return copy;
    }

    private static Path stamp(Path archive) {
        return archive.resolveSibling(archive.getFileName() + ".jdk");
    }

    @Test
    void theBuildMadeItForItsOwnJdk() throws IOException {
        assertTrue(Files.isRegularFile(archive), "target/tare.jsa or target/tare.aot after packaging");
        assertEquals(jdkIdentity(JAVA_HOME) + "\n", Files.readString(stamp(archive)));
        assertTrue(jdkIdentity(JAVA_HOME).endsWith(" " + System.getProperty("java.runtime.version")));
    }

    /** The JDK as the stamp names it, the way the launcher reads it: its real path and its release file's runtime version. */
    private static String jdkIdentity(Path javaHome) throws IOException {
        Path home = javaHome.toRealPath();
        for (String line : Files.readAllLines(home.resolve("release"), StandardCharsets.UTF_8)) {
            if (line.startsWith("JAVA_RUNTIME_VERSION=")) {
                return home + " " + line.substring(line.indexOf('=') + 1).replace("\"", "");
            }
        }
        throw new AssertionError(home.resolve("release") + " names no JAVA_RUNTIME_VERSION");
    }

    @Test
    void theLauncherUsesItOnThatJdk() throws Exception {
        assertEquals("in use", cleanCount(count(PROJECT.resolve("tare"), JAVA_HOME)));
    }

    @Test
    void aBrokenArchiveIsPassedOverQuietly() throws Exception {
        Path copy = copyOfTheBuild();
        Path broken = copy.resolve(archive.getFileName());
        broken.toFile().setWritable(true);
        Files.writeString(broken, "not an archive at all", StandardCharsets.UTF_8);
        assertTrue(cleanCount(count(copy.resolveSibling("tare"), JAVA_HOME)).startsWith("not used"));
    }

    @Test
    void anArchiveForAnotherJarIsPassedOverQuietly() throws Exception {
        Path copy = copyOfTheBuild();
        Path jar = copy.resolve("tare.jar");
        Files.setLastModifiedTime(jar, FileTime.fromMillis(Files.getLastModifiedTime(jar).toMillis() + 60_000));
        assertTrue(cleanCount(count(copy.resolveSibling("tare"), JAVA_HOME)).startsWith("not used"));
    }

    @Test
    void anArchiveStampedForAnotherJdkIsNotPassed() throws Exception {
        Path copy = copyOfTheBuild();
        Files.writeString(copy.resolve(stamp(archive).getFileName()), "/usr/lib/jvm/some-other-jdk 17.0.0+1\n");
        assertEquals("none", cleanCount(count(copy.resolveSibling("tare"), JAVA_HOME)));
    }

    @Test
    void otherJdksOnThisMachineRunWithoutIt() throws Exception {
        List<Path> others = new ArrayList<>();
        Path jvms = Path.of("/usr/lib/jvm");
        if (Files.isDirectory(jvms)) {
            try (Stream<Path> homes = Files.list(jvms)) {
                for (Path home : homes.toList()) {
                    if (Files.isExecutable(home.resolve("bin/java")) && !Files.isSymbolicLink(home)
                            && !home.toRealPath().equals(JAVA_HOME.toRealPath())) {
                        others.add(home);
                    }
                }
            }
        }
        assumeTrue(!others.isEmpty(), "no other JDK under /usr/lib/jvm");
        for (Path other : others) {
            assertEquals("none", cleanCount(count(PROJECT.resolve("tare"), other)), other.toString());
        }
    }

    /** A repository with Tare's hook, installed through {@code launcher hook install}, and one template staged. */
    private Path repositoryWithTheHook(Path launcher) throws Exception {
        Path repo = Files.createDirectories(dir.resolve("repo"));
        Git.run(repo, "init", "-q");
        Files.createDirectories(repo.resolve("prompts"));
        Files.writeString(repo.resolve("tare.yaml"), "templates: {include: [\"prompts/*.md\"]}\n");
        Files.writeString(repo.resolve("prompts/a.md"), "Answer billing questions briefly.\n");
        Git.run(repo, "add", ".");
        Result install = run(repo, Map.of(), List.of("bash", launcher.toString(), "hook", "install"));
        assertEquals(0, install.exitCode(), install.err());
        assertTrue(Files.readString(repo.resolve(".git/hooks/pre-commit")).endsWith("\nexec '" + launcher + "' hook run\n"),
                "the hook runs Tare through the launcher that installed it");
        return repo;
    }

    private static String commit(Path repo) throws Exception {
        return commit(repo, Map.of());
    }

    /** Commits the staged template and returns what git and the hook printed (a hook's standard output comes on git's standard error). */
    private static String commit(Path repo, Map<String, String> env) throws Exception {
        Result commit = run(repo, env, List.of("git", "-c", "user.name=Test", "-c", "user.email=test@example.invalid",
                "-c", "commit.gpgsign=false", "commit", "-q", "-m", "a template"));
        assertEquals(0, commit.exitCode(), commit.out() + commit.err());
        return commit.out() + commit.err();
    }

    @Test
    void theInstalledHookStartsWithIt() throws Exception {
        Path repo = repositoryWithTheHook(PROJECT.resolve("tare"));
        String flags = commit(repo, Map.of("TARE_JAVA_OPTS", "-XX:+PrintFlagsFinal"));
        String option = archive.getFileName().toString().endsWith(".aot") ? "AOTCache" : "SharedArchiveFile";
        assertTrue(java.util.regex.Pattern.compile(option + "\\s+= " + java.util.regex.Pattern.quote(archive.toString()) + "\\s")
                .matcher(flags).find(), "the launcher gives the hook's run the archive: " + flags);

        Files.writeString(repo.resolve("prompts/b.md"), "Answer outage questions briefly.\n");
        Git.run(repo, "add", ".");
        assertEquals("", commit(repo), "a clean commit prints nothing");
    }

    @Test
    void theInstalledHookRunsQuietlyWhenTheArchiveIsGoneOrBroken() throws Exception {
        Path copy = copyOfTheBuild();
        Path repo = repositoryWithTheHook(copy.resolveSibling("tare"));
        Path copied = copy.resolve(archive.getFileName());
        copied.toFile().setWritable(true);
        Files.writeString(copied, "not an archive at all", StandardCharsets.UTF_8);
        assertEquals("", commit(repo));

        Files.delete(copied);
        Files.writeString(repo.resolve("prompts/b.md"), "Answer outage questions briefly.\n");
        Git.run(repo, "add", ".");
        assertEquals("", commit(repo));
    }
}
