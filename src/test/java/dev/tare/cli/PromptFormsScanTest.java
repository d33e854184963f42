package dev.tare.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import dev.tare.tokenize.Tokenizer;
import dev.tare.tokenize.TokenizerRegistry;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Role-marked text, single-file prompt formats and serialized prompt objects as the scan measures
 * them: framing per message, samples from {@code inputs}, tools defined in place counted exactly as a
 * tool file holding the same definitions (first in the static prefix, as providers read tools before
 * messages), and {@code fix} editing the file's own bytes. Expected counts come from the o200k_base
 * tokenizer, which TiktokenReferenceTest holds to the reference encoder.
 */
class PromptFormsScanTest {
    private static final String SYSTEM = "You answer questions for the Riverside water utility.";
    /** The minified JSON of the tool both forms below define. */
    private static final String TOOL = "{\"name\":\"lookup_outage\",\"description\":\"Find planned work in a district.\","
            + "\"parameters\":{\"type\":\"object\",\"properties\":{\"district\":{\"type\":\"string\"}}}}";
    private static final String INLINE_TOOL = """
              - name: lookup_outage
                description: Find planned work in a district.
                parameters:
                  type: object
                  properties:
                    district: {type: string}
            """;
    private static final String BODY = "{{ question }}\nAnswer briefly.\n";
    private static final String TARGETS = """
            targets:
              - name: t
                tokenizer: o200k_base
                message_overhead_tokens: 4
                reply_overhead_tokens: 3
                tool_overhead_tokens: 7
                price: {input: 1.0, output: 1.0}
                prefix_cache: {min_tokens: 1024}
            """;

    @TempDir
    Path root;
    private final Tokenizer o200k = new TokenizerRegistry().get("o200k_base", Path.of("."));

    @BeforeEach
    void repository() throws Exception {
        Files.createDirectories(root.resolve("prompts"));
        Files.createDirectories(root.resolve("tools"));
        Files.writeString(root.resolve("tools/outage.tools.json"), "[\n  " + TOOL + "\n]\n");
        Files.writeString(root.resolve("prompts/outage.md"), "---\ninputs:\n  district: {type: string, sample: North Hill}\n"
                + "model: {api: chat, parameters: {max_tokens: 200}}\n---\nsystem:\n" + SYSTEM + "\n\nuser:\nIs the water off in {{ district }}?\n");
        Files.writeString(root.resolve("prompts/filed.md"), "---\ntools: [tools/outage.tools.json]\n---\n" + BODY);
        Files.writeString(root.resolve("prompts/inline.md"), "---\ntools:\n" + INLINE_TOOL + "---\n" + BODY);
        Files.writeString(root.resolve("prompts/both.md"), "---\ntools:\n  - tools/outage.tools.json\n"
                + "  - {type: function, function: {name: report_leak, description: Report a leak.}}\n---\n" + BODY);
        Files.writeString(root.resolve("prompts/notice.yaml"), """
                _type: prompt
                input_variables: [customer, district]
                template: "Dear {customer}, the water in {district} is off today."
                """);
        Files.writeString(root.resolve("prompts/support.json"), "{\"input_variables\": [\"question\"], \"messages\": ["
                + "{\"role\": \"system\", \"prompt\": {\"template\": \"" + SYSTEM + "\"}},"
                + "{\"role\": \"user\", \"prompt\": {\"template\": \"{question}\"}}]}");
    }

    private JsonNode scan(String templates) throws Exception {
        Files.writeString(root.resolve("tare.yaml"), "templates: {include: [\"prompts/*\", \"tools/*.tools.json\"]"
                + templates + "}\n" + TARGETS);
        Cli.Run run = Cli.run("scan", root.toString(), "--format", "json");
        assertEquals(0, run.exitCode(), run.err());
        JsonNode scan = new ObjectMapper().readTree(run.out());
        assertEquals(0, scan.get("skipped").size(), scan.get("skipped").toString());
        return scan;
    }

    private static JsonNode template(JsonNode scan, String path) {
        for (JsonNode template : scan.get("templates")) {
            if (template.get("path").asText().equals(path)) {
                return template;
            }
        }
        throw new AssertionError(path + " not in " + scan);
    }

    @Test
    void roleMarkedTextIsFramedPerMessageAndSampledFromItsInputs() throws Exception {
        JsonNode outage = template(scan(""), "prompts/outage.md");
        assertEquals("text", outage.get("kind").asText());
        int system = o200k.count(SYSTEM);
        assertEquals(system + o200k.count("Is the water off in ?"), outage.get("static_tokens").asInt(),
                "the marker lines and the white space between messages are not counted");
        int estimated = system + o200k.count("Is the water off in North Hill?");
        assertEquals(estimated, outage.get("estimated_tokens").asInt());
        assertEquals(0, outage.get("unsized_variables").size(), "the input's sample sizes it");
        JsonNode t = outage.get("targets").get("t");
        assertEquals(2 * 4 + 3, t.get("framing_tokens").asInt(), "two messages and the reply");
        assertEquals(estimated + 2 * 4 + 3, t.get("input_tokens").asInt());
    }

    @Test
    void withRolesOffTheFileIsOnePlainText() throws Exception {
        JsonNode outage = template(scan(", roles: off"), "prompts/outage.md");
        assertEquals(o200k.count("system:\n" + SYSTEM + "\n\nuser:\nIs the water off in ?\n"), outage.get("static_tokens").asInt());
        assertEquals(0, outage.get("targets").get("t").get("framing_tokens").asInt());
    }

    @Test
    void toolsDefinedInPlaceCountAsTheSameToolFileDoes() throws Exception {
        JsonNode scan = scan("");
        int body = o200k.count("\nAnswer briefly.\n");
        int tool = o200k.count(TOOL) + 7;
        for (String path : List.of("prompts/filed.md", "prompts/inline.md")) {
            JsonNode t = template(scan, path).get("targets").get("t");
            assertEquals(body + tool, t.get("input_tokens").asInt(), path);
            assertEquals(7, t.get("framing_tokens").asInt(), path);
            assertEquals(tool, t.get("static_prefix_tokens").asInt(), path + ": the tools open the prefix, the question ends it");
            assertEquals(body, template(scan, path).get("estimated_tokens").asInt(), path + ": the template's own text");
        }
        String leak = "{\"type\":\"function\",\"function\":{\"name\":\"report_leak\",\"description\":\"Report a leak.\"}}";
        JsonNode both = template(scan, "prompts/both.md").get("targets").get("t");
        assertEquals(body + tool + o200k.count(leak) + 7, both.get("input_tokens").asInt(), "a file and a definition in one list");
        assertEquals(6, scan.get("totals").get("templates").asInt(), "the six prompts; the tool file is no call of its own");
    }

    @Test
    void serializedPromptObjectsAreCountedInTheirOwnFormat() throws Exception {
        JsonNode scan = scan("");
        JsonNode notice = template(scan, "prompts/notice.yaml");
        assertEquals("text", notice.get("kind").asText());
        assertEquals(o200k.count("Dear , the water in  is off today."), notice.get("static_tokens").asInt());
        assertEquals(List.of("customer", "district"), List.of(notice.get("variables").get(0).asText(),
                notice.get("variables").get(1).asText()));
        assertEquals(0, notice.get("targets").get("t").get("framing_tokens").asInt());
        JsonNode support = template(scan, "prompts/support.json");
        assertEquals("chat", support.get("kind").asText());
        assertEquals(o200k.count(SYSTEM), support.get("static_tokens").asInt());
        assertEquals(2 * 4 + 3, support.get("targets").get("t").get("framing_tokens").asInt());
    }

    @Test
    void fixEditsTheMessagesOfRoleMarkedTextInPlace() throws Exception {
        Files.writeString(root.resolve("tare.yaml"), "templates: {include: [\"prompts/bill.md\"]}\n");
        String text = "---\nbudget: 400\n---\nsystem:  \nYou help with  water bills.   \n\n\n\nuser:\n{{ question }}\n";
        Files.writeString(root.resolve("prompts/bill.md"), text);
        Cli.Run run = Cli.run("fix", root.toString());
        assertEquals(0, run.exitCode(), run.out() + run.err());
        String fixed = Files.readString(root.resolve("prompts/bill.md"));
        assertEquals("---\nbudget: 400\n---\nsystem:  \nYou help with water bills.\n\n\n\nuser:\n{{ question }}\n", fixed,
                "the message is fixed; the marker line and the white space between messages are no message's to edit");
        assertEquals(0, Cli.run("fix", root.toString()).exitCode());
        assertTrue(Files.readString(root.resolve("prompts/bill.md")).equals(fixed), "a second fix changes nothing");
    }
}
