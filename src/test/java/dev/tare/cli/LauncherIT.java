package dev.tare.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import dev.tare.testing.Git;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.concurrent.TimeUnit;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The real {@code ./tare} launcher and packaged jar, as a newcomer runs them (after {@code mvn package}). */
class LauncherIT {
    private record Result(int exitCode, String out, String err) {
    }

    private static Result launch(String... args) throws IOException, InterruptedException {
        return launch(Map.of(), args);
    }

    private static Result launch(Map<String, String> env, String... args) throws IOException, InterruptedException {
        List<String> command = new ArrayList<>(List.of("bash", "./tare"));
        command.addAll(List.of(args));
        Path dir = Cli.projectDir();
        ProcessBuilder builder = new ProcessBuilder(command).directory(dir.toFile());
        builder.environment().putAll(env);
        Process process = builder.start();
        process.getOutputStream().close();
        byte[] out = process.getInputStream().readAllBytes();
        byte[] err = process.getErrorStream().readAllBytes();
        assertTrue(process.waitFor(5, TimeUnit.MINUTES), "the launcher finished");
        return new Result(process.exitValue(), new String(out, StandardCharsets.UTF_8), new String(err, StandardCharsets.UTF_8));
    }

    @Test
    void scansTheDemoLikeTheInProcessCommand() throws Exception {
        Result launched = launch("scan", "corpora/demo", "--format", "json");
        assertEquals(0, launched.exitCode(), launched.err());
        assertFalse(launched.err().contains("building"), "a fresh jar is not rebuilt: " + launched.err());
        JsonNode viaLauncher = new ObjectMapper().readTree(launched.out());
        JsonNode inProcess = new ObjectMapper().readTree(
                Cli.run("scan", Cli.projectDir().resolve("corpora/demo").toString(), "--format", "json").out());
        assertEquals(inProcess.get("templates"), viaLauncher.get("templates"));
        assertEquals(inProcess.get("totals"), viaLauncher.get("totals"));
    }

    @Test
    void aWarmScanThroughTheRealStandardOutputPrintsTheUncachedScansBytes() throws Exception {
        for (String format : List.of("json", "text")) {
            Result uncached = launch("scan", "corpora/demo", "--format", format, "--no-cache");
            Result first = launch("scan", "corpora/demo", "--format", format);
            Result second = launch("scan", "corpora/demo", "--format", format);
            assertEquals(0, second.exitCode(), second.err());
            assertEquals(uncached.out(), first.out(), format);
            assertEquals(uncached.out(), second.out(), format + ": measurements read back from the cache print the same text");
        }
    }

    @Test
    void theJvmIsGivenTheMainClassSoThatAWarmScanNeedNotOpenTheJar() throws Exception {
        // The JDK that runs the tests has a release file, so the launcher knows its version.
        String settings = launch(Map.of("TARE_JAVA_OPTS", "-XshowSettings:properties"), "scan", "--help").err();
        assertTrue(settings.contains("sun.java.command = dev.tare.cli.Main scan --help"), settings);
        assertTrue(settings.matches("(?s).*java\\.class\\.path = \\S*tare\\.jar\\s.*"), settings);
    }

    @Test
    void aLinkToTheLauncherRunsFromAnyFolderAndTheHookItInstallsCallsTheLink(@TempDir Path dir) throws Exception {
        Path bin = Files.createDirectories(dir.resolve("bin"));
        // A chain of two links, the second relative, as a person's ~/bin might hold.
        Files.createSymbolicLink(dir.resolve("tare-real"), Cli.projectDir().resolve("tare"));
        Path link = Files.createSymbolicLink(bin.resolve("tare"), Path.of("../tare-real"));
        Path elsewhere = Files.createDirectories(dir.resolve("work"));
        Process version = new ProcessBuilder(link.toString(), "--version").directory(elsewhere.toFile()).start();
        version.getOutputStream().close();
        String out = new String(version.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
        String err = new String(version.getErrorStream().readAllBytes(), StandardCharsets.UTF_8);
        assertTrue(version.waitFor(5, TimeUnit.MINUTES));
        assertEquals(0, version.exitValue(), err);
        assertTrue(out.startsWith("tare "), out);
        Path repo = repositoryWithAStagedTemplate(Files.createDirectories(dir.resolve("repo")));
        Process install = new ProcessBuilder(link.toString(), "hook", "install").directory(repo.toFile())
                .redirectErrorStream(true).start();
        install.getOutputStream().close();
        String said = new String(install.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
        assertTrue(install.waitFor(5, TimeUnit.MINUTES));
        assertEquals(0, install.exitValue(), said);
        String hook = Files.readString(repo.resolve(".git/hooks/pre-commit"));
        assertTrue(hook.endsWith("\nexec '" + link + "' hook run\n"), hook);
        Result commit = commit(repo, Map.of());
        assertEquals(0, commit.exitCode(), commit.err());
        // The links go before JUnit cleans the folder, which would warn about a link leading out of it.
        Files.delete(link);
        Files.delete(dir.resolve("tare-real"));
    }

    @Test
    void thePackageLeavesOneRunnableJarInTarget() throws Exception {
        try (var jars = Files.list(Cli.projectDir().resolve("target"))) {
            assertEquals(List.of("tare.jar"), jars.map(p -> p.getFileName().toString()).filter(n -> n.endsWith(".jar"))
                    .toList());
        }
    }

    @Test
    void usageErrorsExitTwoThroughTheRealProcess() throws Exception {
        Result launched = launch("scan", "--no-such-flag");
        assertEquals(2, launched.exitCode());
        assertTrue(launched.err().startsWith("tare: unknown option '--no-such-flag'"), launched.err());
        assertEquals("", launched.out());
    }

    @Test
    void printsUnicodeAsUtf8WhateverTheLocale() throws Exception {
        Result launched = launch("scan", "corpora/hostile/weird-names");
        assertEquals(0, launched.exitCode(), launched.err());
        assertTrue(launched.out().contains("café prompt.md"), launched.out());
    }

    @Test
    void shortRunsUseTheFirstJitTierOnlyAndPromoteAtOnceAFullCheckOrFixTrimsNativeMemoryAndEveryRunTheSerialCollector() throws Exception {
        Pattern firstTierOnly = Pattern.compile("TieredStopAtLevel\\s+= 1\\s");
        Pattern serial = Pattern.compile("UseSerialGC\\s+= true\\s");
        Pattern promotedAtOnce = Pattern.compile("MaxTenuringThreshold\\s+= 0\\s");
        Pattern trimmed = Pattern.compile("TrimNativeHeapInterval\\s+= 5000\\s");
        Map<String, String> flags = Map.of("TARE_JAVA_OPTS", "-XX:+PrintFlagsFinal");
        for (String[] command : new String[][] {{"hook", "run"}, {"check", "--staged"}, {"scan"}, {"count"}}) {
            String out = launch(flags, append(command, "--help")).out();
            assertTrue(firstTierOnly.matcher(out).find(), String.join(" ", command));
            assertTrue(serial.matcher(out).find(), String.join(" ", command));
            assertTrue(promotedAtOnce.matcher(out).find(), String.join(" ", command));
            assertFalse(trimmed.matcher(out).find(), String.join(" ", command));
        }
        for (String[] command : new String[][] {{"check"}, {"fix"}}) {
            String out = launch(flags, append(command, "--help")).out();
            assertTrue(out.contains("TieredStopAtLevel"), out);
            assertFalse(firstTierOnly.matcher(out).find(), String.join(" ", command) + " keeps the optimizing compiler");
            assertFalse(promotedAtOnce.matcher(out).find(), String.join(" ", command) + " keeps the default tenuring");
            assertTrue(serial.matcher(out).find(), String.join(" ", command));
            // The JVM lists the option when it has it (JDK 17.0.9, 21.0.1, 22 and later); an older one
            // would not have started with it.
            if (out.contains("TrimNativeHeapInterval")) {
                assertTrue(trimmed.matcher(out).find(), String.join(" ", command) + " gives freed native memory back");
            }
        }
    }

    /** A git repository with one small template staged, for the pre-commit hook. */
    private static Path repositoryWithAStagedTemplate(Path repo) throws Exception {
        Git.run(repo, "init", "-q");
        Files.createDirectories(repo.resolve("prompts"));
        Files.writeString(repo.resolve("tare.yaml"), "templates: {include: [\"prompts/*.md\"]}\n");
        Files.writeString(repo.resolve("prompts/a.md"), "Answer billing questions briefly.\n");
        Git.run(repo, "add", ".");
        return repo;
    }

    private static Result commit(Path repo, Map<String, String> env) throws Exception {
        ProcessBuilder builder = new ProcessBuilder("git", "-c", "user.name=Test", "-c", "user.email=test@example.invalid",
                "-c", "commit.gpgsign=false", "commit", "-q", "-m", "a template").directory(repo.toFile());
        builder.environment().remove("TARE_JAVA_OPTS");
        builder.environment().putAll(env);
        Process process = builder.start();
        process.getOutputStream().close();
        byte[] out = process.getInputStream().readAllBytes();
        byte[] err = process.getErrorStream().readAllBytes();
        assertTrue(process.waitFor(5, TimeUnit.MINUTES), "the commit finished");
        return new Result(process.exitValue(), new String(out, StandardCharsets.UTF_8), new String(err, StandardCharsets.UTF_8));
    }

    @Test
    void theHookInstalledThroughTheLauncherRunsTheLauncherWithItsOptions(@TempDir Path repo) throws Exception {
        repositoryWithAStagedTemplate(repo);
        Result install = launch("hook", "install", repo.toString());
        assertEquals(0, install.exitCode(), install.err());
        String hook = Files.readString(repo.resolve(".git/hooks/pre-commit"));
        assertTrue(hook.endsWith("\nexec '" + Cli.projectDir().resolve("tare") + "' hook run\n"), hook);
        Result commit = commit(repo, Map.of("TARE_JAVA_OPTS", "-XX:+PrintFlagsFinal"));
        assertEquals(0, commit.exitCode(), commit.err());
        // Git passes on a pre-commit hook's standard output as its own standard error.
        String flags = commit.out() + commit.err();
        assertTrue(Pattern.compile("TieredStopAtLevel\\s+= 1\\s").matcher(flags).find(),
                "the hook runs with the launcher's options for hook run: " + flags);
        assertTrue(Pattern.compile("UseSerialGC\\s+= true\\s").matcher(flags).find(), flags);
    }

    @Test
    void theHookInstalledByPlainJavaRunsTheJarWithNoJvmOptions(@TempDir Path repo) throws Exception {
        repositoryWithAStagedTemplate(repo);
        String java = Path.of(System.getProperty("java.home"), "bin", "java").toString();
        Path jar = Cli.projectDir().resolve("target/tare.jar");
        Process install = new ProcessBuilder(java, "-jar", jar.toString(), "hook", "install").directory(repo.toFile())
                .redirectErrorStream(true).start();
        install.getOutputStream().close();
        String said = new String(install.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
        assertTrue(install.waitFor(5, TimeUnit.MINUTES));
        assertEquals(0, install.exitValue(), said);
        String hook = Files.readString(repo.resolve(".git/hooks/pre-commit"));
        assertTrue(hook.endsWith("\nexec '" + java + "' -jar '" + jar + "' hook run\n"), hook);
        Result commit = commit(repo, Map.of());
        assertEquals(0, commit.exitCode(), commit.err());
        assertEquals("", commit.out() + commit.err(), "a clean commit prints nothing");
    }

    private static String[] append(String[] command, String last) {
        String[] all = java.util.Arrays.copyOf(command, command.length + 1);
        all[command.length] = last;
        return all;
    }
}
