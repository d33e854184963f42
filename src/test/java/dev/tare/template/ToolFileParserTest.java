package dev.tare.template;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import dev.tare.TareException;
import dev.tare.cli.Cli;
import dev.tare.source.YamlDocument;
import dev.tare.tokenize.TokenizerRegistry;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.junit.jupiter.api.Test;

class ToolFileParserTest {
    private static final Path TOOLS = Cli.projectDir().resolve("corpora/demo/tools");

    private static Template parse(String name) throws Exception {
        return Templates.parse(PlaceholderSyntax.DOUBLE_BRACE, "tools/" + name, Files.readString(TOOLS.resolve(name)));
    }

    /**
     * Source: the npm package {@code tiktoken} (version in the vectors' header) counted each tool of
     * the demo's JSON tool file as minified by {@code JSON.stringify}; see scripts/reference-counts.
     */
    @Test
    void eachToolIsItsMinifiedJsonCountedAsTheReferenceCountsIt() throws Exception {
        Map<String, JsonNode> vectors = new HashMap<>();
        try (InputStream in = getClass().getResourceAsStream("/reference-counts/tiktoken-vectors.json")) {
            for (JsonNode vector : new ObjectMapper().readTree(in).get("vectors")) {
                vectors.put(vector.get("id").asText(), vector);
            }
        }
        Template tools = parse("customer-service.tools.json");
        assertEquals(TemplateKind.TOOLS, tools.kind());
        assertEquals(4, tools.messages().size());
        for (int i = 0; i < tools.messages().size(); i++) {
            JsonNode vector = vectors.get(String.format("tools-%03d", i + 1));
            String minified = tools.messages().get(i).content();
            assertEquals(vector.get("text").asText(), minified, "the same minified JSON as JSON.stringify");
            for (String encoding : List.of("o200k_base", "cl100k_base")) {
                assertEquals(vector.get(encoding).asInt(), new TokenizerRegistry().get(encoding, Path.of(".")).count(minified));
            }
        }
    }

    @Test
    void readsWrappedDefinitionsUnderAToolsKeyWithTheirParameters() throws Exception {
        YamlDocument document = YamlDocument.parseYaml(Files.readString(TOOLS.resolve("field-crew.tools.yaml")));
        List<ToolDefinition> tools = ToolFileParser.definitions(document);
        assertEquals(List.of("create_work_order", "list_crews", "notify_customers"), tools.stream().map(ToolDefinition::name).toList());
        ToolDefinition first = tools.get(0);
        assertEquals(3, first.line(), "the line of \"- type: function\"");
        assertEquals(List.of("asset_id", "fault", "priority"), first.parameters().stream().map(ToolDefinition.Parameter::path).toList());
        assertEquals(List.of("emergency", "same_day", "next_day", "planned"), first.parameters().get(2).enumValues());
        ToolDefinition.Parameter streets = tools.get(2).parameters().get(0);
        assertEquals(Optional.empty(), streets.description());
        assertTrue(first.json().startsWith("{\"type\":\"function\",\"function\":{\"name\":\"create_work_order\""), first.json());
        assertEquals(TemplateKind.TOOLS, parse("field-crew.tools.yaml").kind());
    }

    @Test
    void brokenToolFilesNameTheTool() {
        TareException nameless = assertThrows(TareException.class,
                () -> Templates.parse(PlaceholderSyntax.DOUBLE_BRACE, "t.tools.yaml", "- description: x\n"));
        assertEquals("line 1: tool 1 has no name", nameless.getMessage());
        TareException notList = assertThrows(TareException.class,
                () -> Templates.parse(PlaceholderSyntax.DOUBLE_BRACE, "t.tools.yaml", "tools: 3\n"));
        assertTrue(notList.getMessage().contains("'tools' must be a list"), notList.getMessage());
    }

    @Test
    void frontMatterNamesToolFiles() {
        Template template = Templates.text(PlaceholderSyntax.DOUBLE_BRACE, "---\ntools: [tools/a.tools.yaml]\n---\nx");
        assertEquals(List.of("tools/a.tools.yaml"), template.meta().tools());
    }
}
