package dev.tare.template.code;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.File;
import java.io.IOException;
import java.net.URL;
import java.net.URLClassLoader;
import java.nio.charset.StandardCharsets;
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
 * The invented example sources (a city water utility's assistants) are real code: each parses or
 * compiles with its own language's tools where the machine has them, and the value Tare decodes for
 * every prompt without variables is the value the language itself gives it. Without a tool, its check
 * is skipped with a message that names what to install.
 */
class ExampleSourcesTest {
    private static final ObjectMapper JSON = new ObjectMapper();

    @TempDir
    Path folder;

    private static boolean onPath(String program) {
        String path = System.getenv("PATH");
        if (path == null) {
            return false;
        }
        for (String dir : path.split(File.pathSeparator)) {
            if (Files.isExecutable(Path.of(dir, program))) {
                return true;
            }
        }
        return false;
    }

    private Path write(String name) throws IOException {
        Path file = folder.resolve(name);
        Files.writeString(file, CodeSamples.resource(name));
        return file;
    }

    private static String run(List<String> command) throws IOException, InterruptedException {
        Process process = new ProcessBuilder(command).redirectErrorStream(true).start();
        byte[] output = process.getInputStream().readAllBytes();
        assertTrue(process.waitFor(120, TimeUnit.SECONDS), "the tool ended");
        String text = new String(output, StandardCharsets.UTF_8);
        assertEquals(0, process.exitValue(), () -> String.join(" ", command) + " failed:\n" + text);
        return text;
    }

    private static List<CodePrompt> withoutVariables(String name, Language language) {
        CodePrompts found = CodePrompts.find(name, CodeSamples.resource(name), language, List.of("client.chat"));
        assertEquals(java.util.Optional.empty(), found.stopped());
        assertEquals(List.of(), found.problems());
        return found.prompts().stream().filter(p -> p.variableNames().isEmpty()).toList();
    }

    @Test
    void thePythonExampleRunsAndItsConstantsAreWhatTareReads() throws Exception {
        assumeTrue(onPath("python3"), "skipped: python3 is not installed (apt-get install python3)");
        Path file = write("billing_assistant.py");
        List<CodePrompt> prompts = withoutVariables("billing_assistant.py", Language.PYTHON).stream()
                .filter(p -> p.name().matches("[A-Z_]+")).toList();
        List<String> command = new ArrayList<>(List.of("python3", "-c",
                "import json, runpy, sys\nvalues = runpy.run_path(sys.argv[1])\n"
                        + "print(json.dumps({n: values[n] for n in sys.argv[2:]}))", file.toString()));
        prompts.stream().map(CodePrompt::name).distinct().forEach(command::add);
        JsonNode values = JSON.readTree(run(command));
        assertEquals(List.of("SYSTEM_PROMPT", "GREETING_TEMPLATE", "PERSONA", "ESCALATION_INSTRUCTIONS",
                "FEW_SHOT_EXAMPLES", "FEW_SHOT_EXAMPLES", "ESCAPES_PROMPT"), prompts.stream().map(CodePrompt::name).toList());
        int element = 0;
        for (CodePrompt prompt : prompts) {
            JsonNode value = values.get(prompt.name());
            assertEquals((value.isArray() ? value.get(element++) : value).asText(), prompt.value(), prompt.name());
        }
    }

    @Test
    void theScriptExampleParsesAndItsLiteralsAreWhatTareReads() throws Exception {
        assumeTrue(onPath("node"), "skipped: node is not installed (apt-get install nodejs)");
        Path file = write("outage-assistant.js");
        run(List.of("node", "--check", file.toString()));
        String source = CodeSamples.resource("outage-assistant.js");
        List<CodePrompt> prompts = withoutVariables("outage-assistant.js", Language.JAVASCRIPT);
        List<String> command = new ArrayList<>(List.of("node", "-e",
                "const dedent = (strings) => strings.join('');\n"
                        + "console.log(JSON.stringify(process.argv.slice(1).map((s) => eval(s))));"));
        prompts.forEach(p -> command.add(source.substring(p.start(), p.end())));
        JsonNode values = JSON.readTree(run(command));
        assertEquals(List.of("request.system", "SMS_TEMPLATE", "RAW_PROMPT_NOTE", "notesPrompt"),
                prompts.stream().map(CodePrompt::name).toList());
        for (int k = 0; k < prompts.size(); k++) {
            assertEquals(values.get(k).asText(), prompts.get(k).value(), prompts.get(k).name());
        }
    }

    @Test
    void theJavaExampleCompilesAndItsConstantsAreWhatTareReads() throws Exception {
        JavaCompiler javac = ToolProvider.getSystemJavaCompiler();
        assumeTrue(javac != null, "skipped: the tests run on a Java runtime without a compiler; run them on a JDK");
        Path file = write("MeterAssistant.java");
        Path classes = Files.createDirectories(folder.resolve("classes"));
        int result = javac.run(null, null, null, "-d", classes.toString(), file.toString());
        assertEquals(0, result, "javac compiles the example");
        List<CodePrompt> prompts = withoutVariables("MeterAssistant.java", Language.JAVA);
        assertEquals(List.of("SYSTEM_PROMPT", "ESCAPED_INSTRUCTIONS", "PERSONA_PROMPT", "USER_PROMPT_HEADER"),
                prompts.stream().map(CodePrompt::name).toList());
        try (URLClassLoader loader = new URLClassLoader(new URL[] {classes.toUri().toURL()})) {
            Class<?> type = loader.loadClass("example.MeterAssistant");
            for (CodePrompt prompt : prompts) {
                var field = type.getDeclaredField(prompt.name());
                field.setAccessible(true);
                assertEquals(field.get(null), prompt.value(), prompt.name());
            }
        }
    }

    @Test
    void theGoExampleIsFormattedGo() throws Exception {
        assumeTrue(onPath("gofmt"), "skipped: gofmt is not installed (apt-get install golang-go)");
        Path file = write("readings.go");
        run(List.of("gofmt", "-e", "-l", file.toString()));
    }
}
