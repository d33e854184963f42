package dev.tare.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.networknt.schema.JsonSchema;
import com.networknt.schema.JsonSchemaFactory;
import com.networknt.schema.SchemaValidatorsConfig;
import com.networknt.schema.SpecVersion;
import com.networknt.schema.ValidationMessage;
import dev.tare.app.Check;
import dev.tare.app.CheckOptions;
import dev.tare.app.CheckResult;
import dev.tare.tokenize.TokenizerRegistry;
import dev.tare.workspace.Workspace;
import java.io.InputStream;
import java.nio.file.Path;
import java.util.List;
import java.util.Optional;
import java.util.Set;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * The check outputs. SARIF is validated against the SARIF 2.1.0 JSON schema (OASIS standard, copy
 * from the npm package @microsoft/sarif-multitool-linux 5.7.0, see src/test/resources/sarif/README.md)
 * with com.networknt:json-schema-validator 1.5.9; the JSON keys are those of design.md's check contract.
 */
class CheckReportTest {
    private static final Path ROOT = Path.of(System.getProperty("tare.project.dir", "."));
    private static final ObjectMapper MAPPER = new ObjectMapper();
    private static CheckResult demo;
    private static JsonSchema sarifSchema;

    @BeforeAll
    static void setUp() throws Exception {
        demo = run(ROOT.resolve("corpora/demo"));
        try (InputStream in = CheckReportTest.class.getResourceAsStream("/sarif/sarif-schema-2.1.0.json")) {
            SchemaValidatorsConfig config = SchemaValidatorsConfig.builder().formatAssertionsEnabled(true).build();
            sarifSchema = JsonSchemaFactory.getInstance(SpecVersion.VersionFlag.V202012).getSchema(in, config);
        }
    }

    private static CheckResult run(Path folder) {
        return new Check(Workspace.open(List.of(folder), Optional.empty()), new TokenizerRegistry()).run(CheckOptions.defaults());
    }

    @Test
    void sarifOfTheDemoIsValidAgainstTheSchema() throws Exception {
        JsonNode log = MAPPER.readTree(CheckReport.sarif(demo));
        Set<ValidationMessage> errors = sarifSchema.validate(log);
        assertEquals(Set.of(), errors);
        JsonNode run = log.get("runs").get(0);
        assertEquals("tare", run.at("/tool/driver/name").asText());
        assertEquals(demo.findings().size(), run.get("results").size());
        assertTrue(run.at("/tool/driver/rules").size() >= 17);
        assertTrue(findResult(run, "repeated-instruction").has("relatedLocations"));
        assertTrue(findResult(run, "trailing-whitespace").at("/fixes/0/artifactChanges/0/replacements").size() >= 1);
    }

    @Test
    void sarifOfTheHostileCorpusIsValidToo() throws Exception {
        assertEquals(Set.of(), sarifSchema.validate(MAPPER.readTree(CheckReport.sarif(run(ROOT.resolve("corpora/hostile"))))));
    }

    @Test
    void theSchemaRejectsABrokenLog() throws Exception {
        JsonNode broken = MAPPER.readTree("{\"version\": \"2.1.0\", \"runs\": [{\"tool\": {}}]}");
        assertFalse(sarifSchema.validate(broken).isEmpty());
    }

    @Test
    void aSarifFixReplacesExactlyWhatTheRewriteEdits() throws Exception {
        JsonNode run = MAPPER.readTree(CheckReport.sarif(demo)).get("runs").get(0);
        JsonNode result = findResult(run, "trailing-whitespace");
        String path = result.at("/locations/0/physicalLocation/artifactLocation/uri").asText();
        String text = java.nio.file.Files.readString(ROOT.resolve("corpora/demo").resolve(path));
        JsonNode replacement = result.at("/fixes/0/artifactChanges/0/replacements/0");
        int offset = replacement.at("/deletedRegion/charOffset").asInt();
        int length = replacement.at("/deletedRegion/charLength").asInt();
        assertTrue(text.substring(offset, offset + length).isBlank());
        assertEquals("", replacement.at("/insertedContent/text").asText());
    }

    @Test
    void jsonCarriesTheContractKeys() throws Exception {
        JsonNode root = MAPPER.readTree(CheckReport.json(demo));
        assertEquals("tare", root.get("tool").asText());
        assertTrue(root.has("version"));
        for (JsonNode finding : root.get("findings")) {
            for (String key : List.of("path", "line", "column", "end_line", "end_column", "rule", "severity", "message",
                    "rewrite_class", "saving_tokens", "related")) {
                assertTrue(finding.has(key), key + " in " + finding);
            }
        }
        assertEquals(demo.findings().size(), root.at("/summary/findings").asInt());
        assertTrue(root.at("/summary/note").asText().contains("planning estimates"));
    }

    @Test
    void everyFormatIsByteIdenticalForTheSameInput() {
        CheckResult again = run(ROOT.resolve("corpora/demo"));
        assertEquals(CheckReport.text(demo), CheckReport.text(again));
        assertEquals(CheckReport.json(demo), CheckReport.json(again));
        assertEquals(CheckReport.sarif(demo), CheckReport.sarif(again));
    }

    @Test
    void textLinesNameThePlaceRuleAndSaving() {
        String text = CheckReport.text(demo);
        assertTrue(text.contains("prompts/leaks/leak-triage.md:39:1: warning repeated-instruction: "), text);
        assertTrue(text.contains("[safe rewrite, saves "), text);
        assertTrue(text.contains("planning estimates"), text);
    }

    @Test
    void pathsBecomeRelativeUriReferences() {
        assertEquals("weird-names/caf%C3%A9%20prompt.md", CheckReport.uri("weird-names/café prompt.md"));
    }

    private static JsonNode findResult(JsonNode run, String rule) {
        for (JsonNode result : run.get("results")) {
            if (result.get("ruleId").asText().equals(rule)) {
                return result;
            }
        }
        throw new AssertionError("no result for " + rule);
    }
}
