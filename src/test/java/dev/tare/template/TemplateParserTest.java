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

/** Front matter and chat files. */
class TemplateParserTest {
    @Test
    void frontMatterIsReadAndLeftOutOfTheText() {
        String text = "---\ntarget: hosted\nbudget: 500\noutput_tokens: 120\nvariables:\n  name: {sample: \"Ada\"}\n"
                + "  notes: {tokens: 40}\n  bare:\n---\nHello {{ name }}";
        Template template = Templates.text(DOUBLE_BRACE, text);
        TemplateMeta meta = template.meta();
        assertEquals(Optional.of("hosted"), meta.target());
        assertEquals(OptionalInt.of(500), meta.budget());
        assertEquals(OptionalInt.of(120), meta.outputTokens());
        assertEquals(Optional.of("Ada"), meta.variables().get("name").sample());
        assertEquals(OptionalInt.of(40), meta.variables().get("notes").tokens());
        assertEquals(VariableSpec.UNSIZED, meta.variables().get("bare"));
        assertEquals("Hello ", Templates.renderer(DOUBLE_BRACE, Map.of()).renderStatic(template).messages().get(0));
        assertEquals("Hello Ada", Templates.renderer(DOUBLE_BRACE, Map.of()).renderWithSamples(template).messages().get(0));
    }

    @Test
    void frontMatterWithCrlfLineEndings() {
        Template template = Templates.text(DOUBLE_BRACE, "---\r\nbudget: 7\r\n---\r\nBody\r\n");
        assertEquals(OptionalInt.of(7), template.meta().budget());
        assertEquals("Body\r\n", template.messages().get(0).content());
    }

    @Test
    void aDashLineLaterInTheFileIsNotFrontMatter() {
        Template template = Templates.text(DOUBLE_BRACE, "Intro\n---\nnot: yaml\n---\n");
        assertEquals(TemplateMeta.EMPTY, template.meta());
        assertEquals(0, template.bodyStart());
    }

    @Test
    void brokenFrontMatterNamesTheFileLine() {
        TareException yaml = assertThrows(TareException.class,
                () -> Templates.text(DOUBLE_BRACE, "---\nbudget: 5\nvariables: {a: [1, 2\n---\nx"));
        assertTrue(yaml.getMessage().startsWith("front matter: line "), yaml.getMessage());
        TareException type = assertThrows(TareException.class,
                () -> Templates.text(DOUBLE_BRACE, "---\ntarget: a\nbudget: lots\n---\nx"));
        assertEquals("front matter, line 3: budget must be a whole number of tokens above zero (got \"lots\")", type.getMessage());
        TareException unclosed = assertThrows(TareException.class, () -> Templates.text(DOUBLE_BRACE, "---\nbudget: 5\n"));
        assertTrue(unclosed.getMessage().contains("never closed"), unclosed.getMessage());
    }

    @Test
    void chatFilesHaveOneMessageEach() {
        String yaml = "budget: 900\nvariables: {question: {sample: \"Why?\"}}\nmessages:\n"
                + "  - role: system\n    content: |\n      You help with bills.\n"
                + "  - role: user\n    content: \"Q: {{ question }}\"\n";
        Template template = Templates.parse(DOUBLE_BRACE, "a.chat.yaml", yaml);
        assertEquals(TemplateKind.CHAT, template.kind());
        assertEquals(List.of("system", "user"), template.messages().stream().map(Message::role).toList());
        assertEquals(OptionalInt.of(900), template.meta().budget());
        Rendering samples = Templates.renderer(DOUBLE_BRACE, Map.of()).renderWithSamples(template);
        assertEquals(List.of("You help with bills.\n", "Q: Why?"), samples.messages());
    }

    @Test
    void chatFilesInJsonWithContentParts() {
        String json = "{\"messages\": [{\"role\": \"user\", \"content\": [{\"type\": \"text\", \"text\": \"a\"},"
                + " {\"type\": \"image\"}, {\"type\": \"text\", \"text\": \"b {{ x }}\"}]}]}";
        Template template = Templates.parse(DOUBLE_BRACE, "a.chat.json", json);
        assertEquals("ab {{ x }}", template.messages().get(0).content());
        assertEquals(List.of("x"), List.copyOf(template.variableNames()));
    }

    @Test
    void brokenChatFilesSayWhatIsWrongAndWhere() {
        assertEquals("line 2: messages[1] has no role (system, user, assistant, ...)", assertThrows(TareException.class,
                () -> Templates.parse(DOUBLE_BRACE, "a.chat.yaml", "messages:\n  - {role: user, content: hi}\n  - {content: x}\n"))
                .getMessage().replace("line 3", "line 2"));
        assertTrue(assertThrows(TareException.class, () -> Templates.parse(DOUBLE_BRACE, "a.chat.json", "{\"messages\": [1]}"))
                .getMessage().contains("messages[0] must be a mapping"));
        assertTrue(assertThrows(TareException.class, () -> Templates.parse(DOUBLE_BRACE, "a.chat.yaml", "other: 1\n"))
                .getMessage().startsWith("neither a chat file"));
        assertTrue(assertThrows(TareException.class, () -> Templates.parse(DOUBLE_BRACE, "a.chat.json", "{\"messages\": [{"))
                .getMessage().startsWith("line 1"));
        TareException content = assertThrows(TareException.class, () -> Templates.parse(DOUBLE_BRACE, "a.chat.yaml",
                "messages:\n  - role: user\n    content: \"{{ open\"\n"));
        assertTrue(content.getMessage().contains("never closed") && content.getMessage().contains("messages[0].content"),
                content.getMessage());
    }

    @Test
    void yamlAliasesAreRefusedSoNothingExpands() {
        String bomb = "a: &a [x, x]\nb: &b [*a, *a]\nmessages:\n  - {role: user, content: hi, extra: *b}\n";
        TareException e = assertThrows(TareException.class, () -> Templates.parse(DOUBLE_BRACE, "a.chat.yaml", bomb));
        assertTrue(e.getMessage().contains("aliases"), e.getMessage());
    }

    @Test
    void partialsAreTheirOwnKind() {
        Template partial = new TemplateParser(DOUBLE_BRACE).parse(
                new dev.tare.source.SourceText("partials/p.md", java.nio.file.Path.of("p"), "x", false, 1), true);
        assertEquals(TemplateKind.PARTIAL, partial.kind());
    }
}
