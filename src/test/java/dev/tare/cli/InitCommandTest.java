package dev.tare.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import dev.tare.config.ConfigLoader;
import dev.tare.config.TareConfig;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** {@code tare init} looks before it writes: a scan right after measures what it printed. */
class InitCommandTest {
    @TempDir
    Path dir;

    private void write(String path, String text) throws IOException {
        Path file = dir.resolve(path);
        Files.createDirectories(file.getParent());
        Files.writeString(file, text);
    }

    private List<String> scanned() throws IOException {
        Cli.Run scan = Cli.run("scan", dir.toString(), "--format", "json");
        assertEquals(0, scan.exitCode(), scan.err());
        List<String> paths = new ArrayList<>();
        for (JsonNode template : new ObjectMapper().readTree(scan.out()).get("templates")) {
            paths.add(template.get("path").asText());
        }
        return paths;
    }

    @Test
    void writesAStarterThatLoadsAndNeverOverwrites() throws Exception {
        Cli.Run first = Cli.run("init", dir.toString());
        assertEquals(0, first.exitCode(), first.err());
        assertTrue(first.out().contains("Found no template file that looks like a prompt"), first.out());
        TareConfig config = ConfigLoader.load(dir.resolve("tare.yaml"));
        assertEquals("o200k_base", config.target("hosted").tokenizer());
        Files.writeString(dir.resolve("tare.yaml"), "# mine\n");
        Cli.Run second = Cli.run("init", dir.toString());
        assertEquals(2, second.exitCode());
        assertTrue(second.err().contains("already exists"), second.err());
        assertEquals("# mine\n", Files.readString(dir.resolve("tare.yaml")));
    }

    @Test
    void initNamesTheSourceFilesThatHoldPromptsAndReadsTheirFolders() throws Exception {
        write("prompts/triage.md", "Sort the ticket {{ ticket }} into one of the crew's queues.\n");
        write("app/agent.py", "SYSTEM_PROMPT = \"You route ferry tickets to the right crew, briefly.\"\n");
        write("app/util.py", "import os\nDATA = os.path.join('var', 'data')\n");
        write("tools/build.go", "package main\nconst usage = \"build the release\"\n");
        Cli.Run init = Cli.run("init", dir.toString());
        assertEquals(0, init.exitCode(), init.err());
        assertTrue(init.out().contains("Found prompts written in 1 source file, read through app/**/*.py:\n  app/agent.py"),
                init.out());
        TareConfig config = ConfigLoader.load(dir.resolve("tare.yaml"));
        assertEquals(List.of("app/**/*.py"), config.templates().code().include());
        assertEquals(List.of("app/agent.py", "prompts/triage.md"), scanned());
    }

    @Test
    void aPromptFoundBeforeInitIsStillFoundAfterIt() throws Exception {
        write("src/app/prompts/x.md", "Summarize the ticket {{ ticket }} for the crew.\n");
        write("docs/guide.md", "# Guide\n\nRun the service.\n");
        assertEquals(List.of("src/app/prompts/x.md"), scanned());
        Cli.Run init = Cli.run("init", dir.toString());
        assertEquals(0, init.exitCode(), init.err());
        assertEquals(List.of("src/app/prompts/x.md"), scanned());
    }

    @Test
    void theGlobsSelectWhatLooksLikeAPromptAndNothingElseAndTheSyntaxIsTheOneInUse() throws Exception {
        write("templates/billing.md", "You answer water bill questions, {name}.\n");
        write("templates/outage.md", "Explain the outage in {area}.\n");
        write("templates/partials/footer.md", "Thanks for calling.\n");
        write("config/chat.yaml", "messages:\n  - role: system\n    content: Be brief with {name}.\n");
        write("config/app.yaml", "server: {port: 8080}\n");
        write("docs/guide.md", "# Guide\n\nRun the service.\n");
        Cli.Run init = Cli.run("init", dir.toString());
        assertEquals(0, init.exitCode(), init.err());
        List<String> expected = List.of("config/chat.yaml", "templates/billing.md", "templates/outage.md",
                "templates/partials/footer.md");
        for (String path : expected) {
            assertTrue(init.out().contains("\n  " + path + "\n"), init.out());
        }
        assertTrue(init.out().contains("placeholder syntax single-brace (seen in 3 of 4)"), init.out());
        TareConfig config = ConfigLoader.load(dir.resolve("tare.yaml"));
        assertEquals("single-brace", config.templates().placeholder().label());
        assertEquals("templates/partials", config.templates().partials());
        assertEquals(List.of("config/chat.yaml", "templates/**/*.md"), config.templates().include());
        assertEquals(expected, scanned());
    }
}
