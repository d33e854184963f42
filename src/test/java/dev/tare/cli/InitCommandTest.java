package dev.tare.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.config.ConfigLoader;
import dev.tare.config.TareConfig;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class InitCommandTest {
    @TempDir
    Path dir;

    @Test
    void writesAStarterThatLoadsAndNeverOverwrites() throws Exception {
        Cli.Run first = Cli.run("init", dir.toString());
        assertEquals(0, first.exitCode(), first.err());
        TareConfig config = ConfigLoader.load(dir.resolve("tare.yaml"));
        assertEquals("o200k_base", config.target("hosted").tokenizer());
        Files.writeString(dir.resolve("tare.yaml"), "# mine\n");
        Cli.Run second = Cli.run("init", dir.toString());
        assertEquals(2, second.exitCode());
        assertTrue(second.err().contains("already exists"), second.err());
        assertEquals("# mine\n", Files.readString(dir.resolve("tare.yaml")));
    }
}
