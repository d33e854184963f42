package dev.tare.template;

import static dev.tare.template.PlaceholderSyntax.DOUBLE_BRACE;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.TareException;
import java.util.List;
import java.util.Map;
import java.util.OptionalInt;
import org.junit.jupiter.api.Test;

/**
 * Serialized prompt objects: a {@code template} string in its {@code template_format} (f-string as
 * Python's {@code str.format} reads it; Jinja and Mustache as double-brace), or a chat-shaped object
 * whose messages hold a {@code prompt} with a {@code template}. The configured syntax is
 * double-brace throughout, so every single-brace result comes from the file's own format.
 */
class PromptObjectTest {
    private static List<String> staticTexts(Template template) {
        return Templates.renderer(DOUBLE_BRACE, Map.of()).renderStatic(template).messages();
    }

    @Test
    void anFStringObjectIsASingleBraceTextTemplate() {
        String yaml = """
                _type: prompt
                budget: 60
                input_variables: [customer, district]
                template_format: f-string
                template: "Dear {customer}, the water in {district} is off today. {{braces}} stay."
                """;
        Template template = Templates.parse(DOUBLE_BRACE, "notice.yaml", yaml);
        assertEquals(TemplateKind.TEXT, template.kind());
        assertFalse(template.isChat());
        assertTrue(template.isDocument());
        assertEquals(PlaceholderSyntax.SINGLE_BRACE, template.syntax());
        assertEquals(OptionalInt.of(60), template.meta().budget(), "keys beside the template are its metadata");
        assertEquals(List.of("customer", "district"), List.copyOf(template.variableNames()));
        assertEquals(List.of("Dear , the water in  is off today. {braces} stay."), staticTexts(template));
        Message message = template.messages().get(0);
        assertEquals(new ContentOrigin.DocumentValue("template"), message.origin());
        Segment.Variable customer = (Segment.Variable) message.segments().get(1);
        assertEquals(5, customer.span().start(), "offsets count from the start of the template string");
        assertEquals(5, customer.span().line(), "the file line of the template string");
    }

    @Test
    void partialVariablesAreFilledInAsTheyAreWhenTheObjectIsBuilt() {
        String yaml = """
                input_variables: [customer]
                partial_variables: {utility: Alder Creek Water}
                template: "Dear {customer}, {utility} is working on the main."
                """;
        Template template = Templates.parse(DOUBLE_BRACE, "notice.yaml", yaml);
        assertEquals(List.of("Dear , Alder Creek Water is working on the main."),
                Templates.renderer(DOUBLE_BRACE, Map.of()).renderWithSamples(template).messages());
        assertTrue(template.meta().variables().get("utility").sample().isPresent());
    }

    @Test
    void theFormatIsFStringUnlessItSaysJinjaOrMustache() {
        String json = "{\"input_variables\": [\"question\"], \"template\": \"Answer {{ question }} in {lang}.\","
                + " \"template_format\": \"jinja2\"}";
        Template jinja = Templates.parse(PlaceholderSyntax.SINGLE_BRACE, "answer.json", json);
        assertEquals(DOUBLE_BRACE, jinja.syntax());
        assertEquals(List.of("question"), List.copyOf(jinja.variableNames()));
        Template mustache = Templates.parse(PlaceholderSyntax.SINGLE_BRACE, "greeting.yaml",
                "input_variables: [name]\ntemplate_format: mustache\ntemplate: |\n  Hello {{name}}.\n  {single} braces are text.\n");
        assertEquals(List.of("Hello .\n{single} braces are text.\n"), staticTexts(mustache));
        Template unstated = Templates.parse(DOUBLE_BRACE, "plain.yaml", "input_variables: [name]\ntemplate: Hi {name}\n");
        assertEquals(PlaceholderSyntax.SINGLE_BRACE, unstated.syntax());
        assertEquals(List.of("name"), List.copyOf(unstated.variableNames()));
    }

    @Test
    void aChatShapedObjectIsAChatTemplate() {
        String yaml = """
                _type: chat
                input_variables: [question]
                messages:
                  - role: system
                    prompt: {template: "You help Riverside water utility customers.", input_variables: []}
                  - role: user
                    prompt:
                      input_variables: [question]
                      template: "{question}"
                  - role: assistant
                    prompt: {template: "{{ answer }}", template_format: jinja2}
                """;
        Template template = Templates.parse(DOUBLE_BRACE, "support.yaml", yaml);
        assertEquals(TemplateKind.CHAT, template.kind());
        assertTrue(template.isChat());
        assertEquals(List.of("system", "user", "assistant"), template.messages().stream().map(Message::role).toList());
        assertEquals(PlaceholderSyntax.SINGLE_BRACE, template.syntax());
        assertEquals(List.of("question", "answer"), List.copyOf(template.variableNames()), "each message in its own format");
        assertEquals(new ContentOrigin.DocumentValue("messages[1].prompt.template"), template.messages().get(1).origin());
        assertEquals(9, template.messages().get(1).segments().get(0).span().line());
    }

    @Test
    void anUnknownFormatAndAnUnknownShapeSayWhatIsWrong() {
        TareException format = assertThrows(TareException.class, () -> Templates.parse(DOUBLE_BRACE, "a.yaml",
                "input_variables: []\ntemplate: Hi\ntemplate_format: erb\n"));
        assertEquals("line 3: template_format must be f-string, jinja2 or mustache (got \"erb\")", format.getMessage());
        TareException neither = assertThrows(TareException.class, () -> Templates.parse(DOUBLE_BRACE, "a.yaml",
                "template: Hi {name}\n"));
        assertTrue(neither.getMessage().startsWith("neither a chat file") && neither.getMessage().contains("serialized prompt object"),
                neither.getMessage());
        TareException unclosed = assertThrows(TareException.class, () -> Templates.parse(DOUBLE_BRACE, "a.yaml",
                "input_variables: [name]\ntemplate: \"Hi {name\"\n"));
        assertTrue(unclosed.getMessage().startsWith("line 2, column ") && unclosed.getMessage().endsWith("(in template)"),
                unclosed.getMessage());
    }
}
