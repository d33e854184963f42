package dev.tare.app;

import dev.tare.workspace.Workspace;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.template.Rendering;
import dev.tare.tokenize.Tokenizer;
import dev.tare.tokenize.TokenizerRegistry;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Static and estimated tokens as the design defines them, and chat framing per target. */
class TemplateScanTest {
    @TempDir
    Path root;
    private final Tokenizer o200k = new TokenizerRegistry().get("o200k_base", Path.of("."));

    private void write(String path, String text) throws IOException {
        Path file = root.resolve(path);
        Files.createDirectories(file.getParent());
        Files.writeString(file, text);
    }

    private ScannedTemplate scanOne(String path) {
        ScanResult result = new TemplateScan(Workspace.open(List.of(root), Optional.empty()), new TokenizerRegistry())
                .run(ScanOptions.defaults());
        return result.templates().stream().filter(t -> t.path().equals(path)).findFirst().orElseThrow(
                () -> new AssertionError(path + " not scanned; skipped: " + result.skipped()));
    }

    @Test
    void staticIsEveryVariableEmptyAndEstimatedAddsSamplesAndSizes() throws IOException {
        write("tare.yaml", "templates: {include: [\"prompts/**/*.md\"]}\n");
        write("prompts/partials/sign-off.md", "Thanks, {{ agent }}.");
        write("prompts/reply.md", "---\nvariables:\n  customer: {sample: \"Ada Lovelace\"}\n  history: {tokens: 250}\n---\n"
                + "Dear {{ customer }}, about {{ history }} and {{ history }}: {{ unsized }} {{> sign-off }}");
        ScannedTemplate template = scanOne("prompts/reply.md");
        String emptied = "Dear , about  and :  Thanks, .";
        assertEquals(o200k.count(emptied), template.staticTokens());
        String withSamples = "Dear Ada Lovelace, about  and :  Thanks, .";
        assertEquals(o200k.count(withSamples) + 2 * 250, template.estimatedTokens(), "a declared size counts per occurrence");
        assertEquals(List.of("customer", "history", "unsized", "agent"), template.variables());
        assertEquals(List.of("unsized", "agent"), template.unsizedVariables());
        assertEquals(List.of("prompts/partials/sign-off.md"), template.includes());
    }

    @Test
    void loopsCountTheirItemsAndBranchesTheLongestPathWithTheShortestBeside() throws IOException {
        write("tare.yaml", "templates: {include: [\"prompts/**/*.md\"]}\n");
        write("prompts/history.md", "---\nvariables:\n  history: {items: 4, tokens: 10}\n---\n"
                + "Conversation so far:\n{% for turn in history %}\n{{ turn.role }}: {{ turn.text }}\n{% endfor %}"
                + "{% for q in questions %}Ask: {{ q }}\n{% endfor %}"
                + "{% if overdue %}The account is overdue; offer a payment plan.{% else %}The account is paid.{% endif %}");
        ScannedTemplate template = scanOne("prompts/history.md");
        String turns = "Conversation so far:\n" + "\n: \n".repeat(4) + "Ask: \n";
        assertEquals(o200k.count(turns + "The account is overdue; offer a payment plan."), template.staticTokens());
        assertEquals(o200k.count(turns + "The account is overdue; offer a payment plan.") + 4 * 2 * 10,
                template.estimatedTokens());
        assertEquals(o200k.count(turns + "The account is paid.") + 4 * 2 * 10, template.shortestEstimatedTokens());
        assertEquals(List.of("history.role", "history.text", "questions"), template.variables());
        assertEquals(List.of("questions"), template.unsizedVariables());
        assertEquals(List.of(new Rendering.Loop("turn", "history", 4, true, "prompts/history.md", 6),
                new Rendering.Loop("q", "questions", 1, false, "prompts/history.md", 8)), template.loops());
    }

    @Test
    void theJsonSaysWhichLoopsWereAssumedAndGivesTheShortestPath() throws IOException {
        write("tare.yaml", "templates: {include: [\"prompts/**/*.md\"], partials: prompts/partials}\n");
        write("prompts/partials/readings.md", "{{#each readings}}\n- {{value}}\n{{/each}}\n");
        write("prompts/dispute.md", "Readings:\n{{> readings }}{{#if estimated}}Say which are estimated.{{/if}}");
        ScanResult result = new TemplateScan(Workspace.open(List.of(root), Optional.empty()), new TokenizerRegistry())
                .run(ScanOptions.defaults());
        com.fasterxml.jackson.databind.JsonNode json = new com.fasterxml.jackson.databind.ObjectMapper()
                .readTree(dev.tare.report.ScanReport.json(result, ScanResult.Order.PATH));
        com.fasterxml.jackson.databind.JsonNode dispute = json.get("templates").get(0);
        assertEquals("prompts/dispute.md", dispute.get("path").asText());
        assertEquals(o200k.count("Readings:\n- \nSay which are estimated."), dispute.get("estimated_tokens").asInt());
        assertEquals(o200k.count("Readings:\n- \n"), dispute.get("estimated_tokens_shortest").asInt());
        assertEquals("{\"variable\":\"this\",\"iterable\":\"readings\",\"items\":1,\"declared\":false,"
                + "\"in\":\"prompts/partials/readings.md\",\"line\":1}", dispute.get("loops").get(0).toString());
        assertEquals(dispute.get("estimated_tokens_shortest").asInt(), json.get("totals").get("estimated_tokens_shortest").asInt());
        assertTrue(dev.tare.report.ScanReport.text(result, ScanResult.Order.PATH)
                .contains("1 template has loops without declared items, counted once"));
    }

    @Test
    void dollarDoubleBraceCallsAreSizedUnderTheirFunctionAndReadTheVariablesTheyArePassed() throws IOException {
        write("tare.yaml", "templates: {include: [\"prompts/**/*.md\"], placeholder: dollar-double-brace}\n");
        write("prompts/outage.md", "---\nvariables:\n  city: {sample: Springfield}\n  outages.near: {tokens: 60}\n---\n"
                + "Outages near {{$city}}: {{outages.near $city radius='5 km'}}. Write {{ \"{{\" }}ticket{{ '}}' }} as is."
                + " {{time.now}}\n");
        ScannedTemplate template = scanOne("prompts/outage.md");
        String emptied = "Outages near : . Write {{ticket}} as is. \n";
        assertEquals(o200k.count(emptied), template.staticTokens());
        String withSamples = "Outages near Springfield: . Write {{ticket}} as is. \n";
        assertEquals(o200k.count(withSamples) + 60, template.estimatedTokens(),
                "the call's declared size counts, its argument's sample is not pasted in");
        assertEquals(List.of("city"), template.variables());
        assertEquals(List.of("time.now"), template.unsizedVariables());
    }

    @Test
    void chatFilesCountEachMessageAndAddFramingOnChatTargets() throws IOException {
        write("tare.yaml", "templates: {include: [\"**/*.chat.yaml\"]}\n"
                + "targets:\n  - {name: t, tokenizer: o200k_base, message_overhead_tokens: 4, reply_overhead_tokens: 3}\n");
        write("a.chat.yaml", "messages:\n  - {role: system, content: \"You are brief.\"}\n  - {role: user, content: \"Hi {{ q }}\"}\n");
        ScannedTemplate template = scanOne("a.chat.yaml");
        int text = o200k.count("You are brief.") + o200k.count("Hi ");
        assertEquals(text, template.staticTokens(), "messages are counted one by one and summed");
        assertEquals(2 * 4 + 3, template.targets().get("t").framingTokens());
        assertEquals(text + 11, template.targets().get("t").inputTokens());
    }

    @Test
    void withoutConfigurationTheGitWorkTreeIsTheRoot() throws IOException {
        Files.createDirectories(root.resolve(".git"));
        write("prompts/a/x.md", "x");
        write("prompts/b/y.md", "y");
        Workspace workspace = Workspace.open(List.of(root.resolve("prompts/b")), Optional.empty());
        assertEquals(root.toAbsolutePath().normalize(), workspace.root());
        ScanResult result = new TemplateScan(workspace, new TokenizerRegistry()).run(ScanOptions.defaults());
        assertEquals(List.of("prompts/b/y.md"), result.templates().stream().map(ScannedTemplate::path).toList());
    }

    @Test
    void aTemplateNamingATargetTareYamlLacksIsSkippedNotFatal() throws IOException {
        write("tare.yaml", "targets:\n  - {name: hosted, tokenizer: o200k_base}\n");
        write("prompts/a.md", "---\ntarget: elsewhere\n---\nx");
        write("prompts/b.md", "fine");
        ScanResult result = new TemplateScan(Workspace.open(List.of(root), Optional.empty()), new TokenizerRegistry())
                .run(ScanOptions.defaults());
        assertEquals(List.of("prompts/b.md"), result.templates().stream().map(ScannedTemplate::path).toList());
        assertTrue(result.skipped().get(0).reason().contains("names target 'elsewhere', which tare.yaml does not"
                + " define (defined: hosted)"), result.skipped().toString());
    }

    @Test
    void withoutATareYamlATemplateNamingATargetIsMeasuredOnTheDefaultAndSaysSo() throws IOException {
        write("prompts/a.md", "---\ntarget: hosted-small\n---\nAnswer water billing questions.\n");
        ScanResult result = new TemplateScan(Workspace.open(List.of(root), Optional.empty()), new TokenizerRegistry())
                .run(ScanOptions.defaults());
        assertTrue(result.skipped().isEmpty(), result.skipped().toString());
        ScannedTemplate a = result.templates().get(0);
        assertEquals(new TokenizerRegistry().get("o200k_base", root).count("Answer water billing questions.\n"),
                a.staticTokens());
        assertEquals(List.of("names target 'hosted-small', which is defined in no tare.yaml; measured on o200k_base"
                + " alone (tare init writes a tare.yaml to define targets in)"), a.notes());
    }

    @Test
    void pathsInsideTheRootNarrowTheScan() throws IOException {
        write("tare.yaml", "templates: {include: [\"prompts/**/*.md\"]}\n");
        write("prompts/a/x.md", "x");
        write("prompts/b/y.md", "y");
        ScanResult result = new TemplateScan(Workspace.open(List.of(root.resolve("prompts/b")), Optional.empty()),
                new TokenizerRegistry()).run(ScanOptions.defaults());
        assertEquals(List.of("prompts/b/y.md"), result.templates().stream().map(ScannedTemplate::path).toList());
    }
}
