package dev.tare.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.testing.Git;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The command the installed pre-commit hook runs: the launcher that installed it, which alone
 * chooses the JVM options, or else plain {@code java -jar} with no options at all.
 */
class HookCommandTest {
    private static final Path JAVA = Path.of("/opt/jdk/bin/java");

    @TempDir
    Path dir;

    @Test
    void theLauncherThatInstalledTheHookRunsIt() throws Exception {
        Path launcher = Files.writeString(dir.resolve("tare"), "#!/usr/bin/env bash\n");
        assertEquals("'" + launcher + "'", HookCommand.command(Optional.of(launcher), JAVA, "/x/target/tare.jar", "unused"));
        Path quoted = Files.writeString(Files.createDirectories(dir.resolve("it's here")).resolve("tare"), "#!/usr/bin/env bash\n");
        assertEquals("'" + dir + "/it'\\''s here/tare'",
                HookCommand.command(Optional.of(quoted), JAVA, "/x/target/tare.jar", "unused"));
    }

    @Test
    void withoutALauncherTheHookRunsTheJarWithNoJvmOptions() {
        assertEquals("'/opt/jdk/bin/java' -jar '/x/target/tare.jar'",
                HookCommand.command(Optional.empty(), JAVA, "/x/target/tare.jar", "unused"));
        assertEquals("'/opt/jdk/bin/java' -jar '/x/target/tare.jar'",
                HookCommand.command(Optional.of(dir.resolve("gone/tare")), JAVA, "/x/target/tare.jar", "unused"),
                "a launcher that is not there is not named");
    }

    @Test
    void fromAClassFolderTheHookRunsTheMainClassOnThatClassPath() {
        assertEquals("'/opt/jdk/bin/java' -cp '/x/classes:/y/lib.jar' dev.tare.cli.Main",
                HookCommand.command(Optional.empty(), JAVA, "/x/classes", "/x/classes:/y/lib.jar"));
    }

    @Test
    void installWritesAHookThatExecsTheLauncherNamedByTheProperty() throws Exception {
        Path repo = Files.createDirectories(dir.resolve("repo"));
        Git.run(repo, "init", "-q");
        Path launcher = Files.writeString(dir.resolve("tare"), "#!/usr/bin/env bash\n");
        String before = System.getProperty(HookCommand.LAUNCHER);
        System.setProperty(HookCommand.LAUNCHER, launcher.toString());
        try {
            Cli.Run install = Cli.run("hook", "install", repo.toString());
            assertEquals(0, install.exitCode(), install.err());
        } finally {
            if (before == null) {
                System.clearProperty(HookCommand.LAUNCHER);
            } else {
                System.setProperty(HookCommand.LAUNCHER, before);
            }
        }
        String hook = Files.readString(repo.resolve(".git/hooks/pre-commit"));
        assertTrue(hook.endsWith("\nexec '" + launcher + "' hook run\n"), hook);
    }
}
