package dev.tare.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import dev.tare.tokenize.Tokenizer;
import dev.tare.tokenize.TokenizerRegistry;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;
import javax.tools.JavaCompiler;
import javax.tools.ToolProvider;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Prompts written in source code as the commands see them: one scan row per prompt (kind code, its
 * file, name and line), counts equal to counting the decoded text, findings at the literal's line and
 * column, directives in the language's comments, and fixes that edit only characters the file holds
 * as themselves and leave the file compiling. The examples are invented.
 */
class CodePromptsCommandsTest {
    private static final ObjectMapper JSON = new ObjectMapper();
    private final Tokenizer o200k = new TokenizerRegistry().get("o200k_base", Path.of("."));

    @TempDir
    Path root;

    private void write(String path, String text) throws IOException {
        Path file = root.resolve(path);
        Files.createDirectories(file.getParent());
        Files.writeString(file, text);
    }

    private JsonNode json(String... args) throws IOException {
        List<String> all = new ArrayList<>(List.of(args));
        all.add(1, root.toString());
        all.addAll(List.of("--format", "json"));
        Cli.Run run = Cli.run(all.toArray(String[]::new));
        assertTrue(run.exitCode() <= 1, run.err());
        return JSON.readTree(run.out());
    }

    private static final String PYTHON = """
            import logging

            log = logging.getLogger(__name__)

            SYSTEM_PROMPT = \"\"\"You plan ferry crossings for passengers.\\t
            Answer in two sentences.\"\"\"

            def ask(client, question, name):
                log.info("asking %s", question)
                messages = [
                    {"role": "system", "content": SYSTEM_PROMPT},
                    {"role": "user", "content": f"Passenger {name} asks: {question}"},
                ]
                return client.chat(messages=messages)
            """;

    @Test
    void theScanHasARowPerPromptWithItsNameLineAndTheCountOfItsDecodedText() throws IOException {
        write("app/agent.py", PYTHON);
        write("app/util.py", "import os\nPATH = os.path.join('a', 'b')\nlog_format = '%(asctime)s %(message)s'\n");
        JsonNode templates = json("scan").get("templates");
        assertEquals(2, templates.size(), templates.toString());
        JsonNode system = templates.get(0);
        assertEquals("app/agent.py", system.get("path").asText());
        assertEquals("code", system.get("kind").asText());
        assertEquals("SYSTEM_PROMPT", system.get("name").asText());
        assertEquals(5, system.get("line").asInt());
        assertEquals(o200k.count("You plan ferry crossings for passengers.\t\nAnswer in two sentences."),
                system.get("static_tokens").asInt());
        JsonNode user = templates.get(1);
        assertEquals("messages.content", user.get("name").asText());
        assertEquals(12, user.get("line").asInt());
        assertEquals(o200k.count("Passenger  asks: "), user.get("static_tokens").asInt());
        assertEquals("[\"name\",\"question\"]", user.get("variables").toString());
        assertEquals(countCommand("You plan ferry crossings for passengers.\t\nAnswer in two sentences."),
                system.get("static_tokens").asInt(), "tare count of the decoded text");
    }

    /** What {@code tare count} says of {@code text} written to a file of its own. */
    private int countCommand(String text) throws IOException {
        Path file = Files.createTempFile("decoded", ".txt");
        try {
            Files.writeString(file, text);
            Cli.Run run = Cli.run("count", file.toString(), "--format", "json");
            assertEquals(0, run.exitCode(), run.err());
            return JSON.readTree(run.out()).at("/files/0/tokens").asInt();
        } finally {
            Files.delete(file);
        }
    }

    @Test
    void eachLanguageIsReadAndNonPromptsAreLeftAlone() throws IOException {
        write("web/summary.ts", """
                const url = "https://example.com/api/bookings";
                export const summaryPrompt = `Summarise the booking for ${passenger} in one line.`;
                throw new Error("booking not found");
                """);
        write("src/main/java/app/Prompts.java", """
                package app;

                class Prompts {
                    static final String SQL = "SELECT * FROM bookings WHERE id = ?";
                    static final String SYSTEM_PROMPT = \"\"\"
                        You check ferry bookings.
                        Reply with the booking status only.
                        \"\"\";
                }
                """);
        write("cmd/ask.go", """
                package main

                const instructions = `List the sailings that leave after noon.`
                var logLine = "started %d workers"
                """);
        JsonNode templates = json("scan").get("templates");
        List<String> keys = new ArrayList<>();
        templates.forEach(t -> keys.add(t.get("path").asText() + "#" + t.get("name").asText() + "@" + t.get("line").asInt()));
        assertEquals(List.of("cmd/ask.go#instructions@3", "src/main/java/app/Prompts.java#SYSTEM_PROMPT@5",
                "web/summary.ts#summaryPrompt@2"), keys);
        assertEquals(o200k.count("You check ferry bookings.\nReply with the booking status only.\n"),
                templates.get(1).get("static_tokens").asInt(), "the text block's incidental indentation is removed");
    }

    @Test
    void findingsStandAtTheLiteralsLineAndColumnAndCommentsSilenceThem() throws IOException {
        write("app/agent.py", """
                PROMPT = "Answer  briefly and name the sailing."
                # tare-ignore-next-line space-run
                GREETING_PROMPT = "Say  hello to the passenger by name."
                """);
        write("web/note.js", "const notePrompt = 'Take  notes on the booking request.'; // tare-ignore space-run\n");
        JsonNode findings = json("check").get("findings");
        List<String> places = new ArrayList<>();
        findings.forEach(f -> places.add(f.get("rule").asText() + " " + f.get("path").asText() + ":"
                + f.get("line").asInt() + ":" + f.get("column").asInt()));
        assertEquals(List.of("space-run app/agent.py:1:17"), places);
        JsonNode sarif = JSON.readTree(Cli.run("check", root.toString(), "--format", "sarif").out());
        JsonNode region = sarif.at("/runs/0/results/0/locations/0/physicalLocation/region");
        assertEquals(1, region.get("startLine").asInt());
        assertEquals(17, region.get("startColumn").asInt());
    }

    @Test
    void aFixEditsOnlyCharactersWrittenAsThemselvesAndThePythonStillCompiles() throws IOException, InterruptedException {
        write("app/agent.py", """
                SYSTEM_PROMPT = \"\"\"Answer  briefly.   
                Keep to the facts of the booking.\"\"\"
                ESCAPED_PROMPT = "Reply to the passenger\\t\\t  now."
                user_prompt = f"Ask {name}  about {topic}."
                """);
        Cli.Run run = Cli.run("fix", root.toString());
        assertEquals(0, run.exitCode(), run.out() + run.err());
        String fixed = Files.readString(root.resolve("app/agent.py"));
        assertEquals("""
                SYSTEM_PROMPT = \"\"\"Answer briefly.
                Keep to the facts of the booking.\"\"\"
                ESCAPED_PROMPT = "Reply to the passenger\\t\\t  now."
                user_prompt = f"Ask {name} about {topic}."
                """, fixed, "the run of white space written partly as escapes is left as it is");
        assumeTrue(hasPython(), "python3 is not installed; the fixed file's syntax is not checked");
        Process compile = new ProcessBuilder("python3", "-m", "py_compile", root.resolve("app/agent.py").toString())
                .redirectErrorStream(true).start();
        String output = new String(compile.getInputStream().readAllBytes());
        assertTrue(compile.waitFor(60, TimeUnit.SECONDS));
        assertEquals(0, compile.exitValue(), output);
    }

    @Test
    void aFixedJavaFileStillCompiles() throws IOException {
        String source = """
                package app;

                class Prompts {
                    static final String SYSTEM_PROMPT = "Check  the booking and its sailing.  ";
                    static final String REVIEW_PROMPT = \"\"\"
                        Review the booking.   
                        Reply with one word.
                        \"\"\";
                }
                """;
        write("src/app/Prompts.java", source);
        assertEquals(0, Cli.run("fix", root.toString()).exitCode());
        String fixed = Files.readString(root.resolve("src/app/Prompts.java"));
        assertFalse(fixed.equals(source), "the fix changed nothing");
        assertTrue(fixed.contains("\"Check the booking and its sailing.\""), fixed);
        JavaCompiler javac = ToolProvider.getSystemJavaCompiler();
        assumeTrue(javac != null, "no Java compiler in this runtime; the fixed file is not compiled");
        ByteArrayOutputStream errors = new ByteArrayOutputStream();
        int status = javac.run(null, null, errors, "-d", root.resolve("classes").toString(),
                root.resolve("src/app/Prompts.java").toString());
        assertEquals(0, status, errors.toString());
    }

    @Test
    void aRepositoryWhoseSourceFilesHoldNoPromptHasNothingToScan() throws IOException {
        write("app/main.py", "print('hello')\n");
        Cli.Run run = Cli.run("scan", root.toString());
        assertEquals(2, run.exitCode(), run.out());
        assertTrue(run.err().contains("no template"), run.err());
    }

    @Test
    void codeIncludeAndCallsComeFromTheConfiguration() throws IOException {
        write("tare.yaml", "templates:\n  code:\n    include: [\"app/**/*.py\"]\n    calls: [assistant.ask]\n");
        write("app/run.py", "self.assistant.ask(\"Plan the crossing for the group.\")\n");
        write("tools/other.py", "PROMPT = 'Never read: outside the include globs.'\n");
        JsonNode templates = json("scan").get("templates");
        assertEquals(1, templates.size(), templates.toString());
        assertEquals("app/run.py", templates.get(0).get("path").asText());
        write("tare.yaml", "templates:\n  code:\n    calls: [\"ask(\"]\n");
        Cli.Run refused = Cli.run("scan", root.toString());
        assertEquals(2, refused.exitCode());
        assertTrue(refused.err().contains("templates.code.calls[0]") && refused.err().contains("line 3"), refused.err());
    }

    private static boolean hasPython() {
        try {
            return new ProcessBuilder("python3", "--version").start().waitFor(30, TimeUnit.SECONDS);
        } catch (IOException | InterruptedException e) {
            return false;
        }
    }
}
