package dev.tare.template;

import static dev.tare.template.PlaceholderSyntax.DOUBLE_BRACE;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.TareException;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalInt;
import org.junit.jupiter.api.Test;

/**
 * Single-file prompt formats with settings in front matter: model settings and descriptions are
 * metadata, {@code inputs} and {@code sample} give samples, and {@code tools} may define tools in
 * place beside the paths of tool files.
 */
class PromptFormatMetaTest {
    private static final String NOTICE = """
            ---
            name: Outage notice
            description: Tells a customer about planned work on the water mains.
            authors: [Riverside water utility]
            model:
              api: chat
              configuration: {type: hosted, deployment: notices}
              parameters: {max_tokens: 300, temperature: 0.2}
            inputs:
              customer:
                type: string
                description: The customer's first name.
                sample: Dana
              district: North Hill
              hours: {type: number, default: 4}
              streets: {type: array, example: [Elm Street, Oak Lane]}
              reference: {type: string, description: no value given}
            sample:
              district: Mill Creek
            variables:
              customer: {tokens: 3}
            ---
            system:
            Write a short notice for {{ customer }} in {{ district }}: the water is off for {{ hours }} hours
            on {{ streets }} ({{ reference }}).
            """;

    @Test
    void inputsAndSampleBecomeSamplesAndVariablesWin() {
        Template template = Templates.text(DOUBLE_BRACE, NOTICE);
        Map<String, VariableSpec> declared = template.meta().variables();
        assertEquals(OptionalInt.of(3), declared.get("customer").tokens(), "variables wins where both speak");
        assertEquals(Optional.empty(), declared.get("customer").sample());
        assertEquals(Optional.of("Mill Creek"), declared.get("district").sample(), "sample wins over inputs");
        assertEquals(Optional.of("4"), declared.get("hours").sample(), "an input's default");
        assertEquals(Optional.of("[\"Elm Street\",\"Oak Lane\"]"), declared.get("streets").sample(), "a list as its JSON");
        assertTrue(!declared.containsKey("reference"), "an input with no value declares nothing");
        assertEquals(List.of("Write a short notice for  in Mill Creek: the water is off for 4 hours\non [\"Elm Street\","
                        + "\"Oak Lane\"] ()."),
                Templates.renderer(DOUBLE_BRACE, Map.of()).renderWithSamples(template).messages());
    }

    @Test
    void inputsAndSampleInOtherShapesAreMetadata() {
        Template template = Templates.text(DOUBLE_BRACE, "---\ninputs: [customer]\nsample: samples/notice.json\n---\nHi {{ customer }}\n");
        assertEquals(Map.of(), template.meta().variables());
    }

    @Test
    void toolsMayMixPathsAndDefinitionsInPlace() {
        String text = """
                ---
                tools:
                  - tools/accounts.tools.json
                  - name: lookup_outage
                    description: Find planned work in a district.
                    parameters:
                      type: object
                      properties:
                        district: {type: string, description: The district's name.}
                  - type: function
                    function: {name: report_leak, parameters: {type: object}}
                ---
                user:
                Is there work in {{ district }}?
                """;
        Template template = Templates.text(DOUBLE_BRACE, text);
        assertEquals(List.of("tools/accounts.tools.json"), template.meta().tools());
        List<ToolDefinition> inline = template.meta().inlineTools();
        assertEquals(List.of("lookup_outage", "report_leak"), inline.stream().map(ToolDefinition::name).toList());
        assertEquals(4, inline.get(0).line(), "the file line of the definition");
        assertEquals(List.of("district"), inline.get(0).parameters().stream().map(ToolDefinition.Parameter::path).toList());
        assertEquals("{\"type\":\"function\",\"function\":{\"name\":\"report_leak\",\"parameters\":{\"type\":\"object\"}}}",
                inline.get(1).json(), "minified JSON, as a tool file's definition is counted");

        Template tools = template.inlineToolFile().orElseThrow();
        assertEquals(TemplateKind.TOOLS, tools.kind());
        assertEquals(template.path(), tools.path());
        assertEquals(inline.stream().map(ToolDefinition::json).toList(),
                Templates.renderer(DOUBLE_BRACE, Map.of()).renderStatic(tools).messages());
        assertEquals(Optional.empty(), Templates.text(DOUBLE_BRACE, "---\ntools: [a.json]\n---\nx").inlineToolFile());
    }

    @Test
    void chatFilesMayDefineToolsBesideTheirMessages() {
        String yaml = "messages:\n  - {role: user, content: hi}\ntools:\n  - {name: lookup_account, description: Find an account.}\n";
        Template template = Templates.parse(DOUBLE_BRACE, "a.chat.yaml", yaml);
        assertEquals(TemplateKind.CHAT, template.kind());
        assertEquals(List.of("lookup_account"), template.meta().inlineTools().stream().map(ToolDefinition::name).toList());
    }

    @Test
    void aBrokenToolEntryNamesTheLine() {
        TareException nameless = assertThrows(TareException.class,
                () -> Templates.text(DOUBLE_BRACE, "---\ntools:\n  - tools/a.json\n  - description: no name\n---\nx"));
        assertEquals("front matter, line 4: tool 2 has no name", nameless.getMessage());
        TareException number = assertThrows(TareException.class,
                () -> Templates.text(DOUBLE_BRACE, "---\ntools:\n  - 7\n---\nx"));
        assertEquals("front matter, line 3: tools[0] must be the path of a tool file or a tool definition"
                + " {name, description, parameters}", number.getMessage());
    }
}
