package dev.tare.template;

import static dev.tare.template.PlaceholderSyntax.DOUBLE_BRACE;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.TareException;
import dev.tare.source.SourceText;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.OptionalInt;
import org.junit.jupiter.api.Test;

/**
 * Text templates whose lines name roles ({@code system:}, {@code # user:}) are chat templates: one
 * message per marker, the marker lines themselves in no message, every segment where the file has it.
 * Fenced code blocks follow CommonMark 0.31.2 §4.5 (from memory): three or more backticks or tildes,
 * closed by a run of the same character at least as long.
 */
class RoleMarkedTextTest {
    private static final String OUTAGE = """
            ---
            budget: 400
            ---
            system:
            You answer questions for the Riverside water utility.
            Be brief.

            user:
            My meter reads {{ reading }}.

            assistant:
            Thanks, I will check it.
            """;

    private static List<String> roles(Template template) {
        return template.messages().stream().map(Message::role).toList();
    }

    private static List<String> contents(Template template) {
        return template.messages().stream().map(Message::content).toList();
    }

    private static Template parse(RoleMarkers roles, String path, String text, boolean partial) {
        return new TemplateParser(DOUBLE_BRACE, roles).parse(new SourceText(path, Path.of(path), text, false, text.length()), partial);
    }

    @Test
    void markersSplitTheBodyIntoMessagesThatKeepTheirPlaces() {
        Template template = Templates.text(DOUBLE_BRACE, OUTAGE);
        assertEquals(TemplateKind.TEXT, template.kind());
        assertTrue(template.isChat(), "framed per message like a chat file");
        assertEquals(OptionalInt.of(400), template.meta().budget());
        assertEquals(List.of("system", "user", "assistant"), roles(template));
        assertEquals(List.of("You answer questions for the Riverside water utility.\nBe brief.",
                "My meter reads {{ reading }}.", "Thanks, I will check it."), contents(template));
        for (Message message : template.messages()) {
            int at = ((ContentOrigin.FileText) message.origin()).offset();
            assertEquals(message.content(), OUTAGE.substring(at, at + message.content().length()),
                    "each message is the file's own text where its origin says");
        }
        Segment.Variable reading = (Segment.Variable) template.messages().get(1).segments().get(1);
        assertEquals("reading", reading.name());
        assertEquals(new Span(15, 28, 9, 16), reading.span(), "offsets in the message, line and column in the file");
        assertEquals(List.of("You answer questions for the Riverside water utility.\nBe brief.", "My meter reads .",
                "Thanks, I will check it."), Templates.renderer(DOUBLE_BRACE, Map.of()).renderStatic(template).messages());
    }

    @Test
    void headingMarksAndSurroundingSpacesAreAllowedButNotCapitalsIndentsOrText() {
        Template headings = Templates.text(DOUBLE_BRACE, "# system:\nHelp with bills.\n  ## user:  \t\nWhy is it high?\n");
        assertEquals(List.of("system", "user"), roles(headings));
        assertEquals(List.of("Help with bills.", "Why is it high?"), contents(headings));
        for (String notAMarker : List.of("User:", "USER:", "    user:", "\tuser:", "user: hello", "user :", "####### user:",
                "users:", "customer:")) {
            Template template = Templates.text(DOUBLE_BRACE, "Example call:\n" + notAMarker + "\nMy bill is high.\n");
            assertFalse(template.isChat(), notAMarker);
            assertEquals(List.of(Message.TEXT_ROLE), roles(template), notAMarker);
        }
    }

    @Test
    void textBeforeTheFirstMarkerIsASystemMessageAndBlankLinesAreNone() {
        Template preamble = Templates.text(DOUBLE_BRACE, "Riverside water utility assistant.\n\nuser:\n{{ question }}\n");
        assertEquals(List.of("system", "user"), roles(preamble));
        assertEquals(List.of("Riverside water utility assistant.", "{{ question }}"), contents(preamble));
        Template blank = Templates.text(DOUBLE_BRACE, "---\ntarget: hosted\n---\n\n  \nuser:\n\n\nHi\n\n");
        assertEquals(List.of("user"), roles(blank));
        assertEquals(List.of("Hi"), contents(blank));
        assertEquals(9, blank.messages().get(0).segments().get(0).span().line());
    }

    @Test
    void markersInsideFencedCodeAreText() {
        String text = """
                system:
                Reply in this shape:
                ```
                user:
                ~~~
                assistant:
                ```
                ~~~~ text
                user:
                ~~~
                assistant:
                ~~~~
                user:
                Where is my bill?
                """;
        Template template = Templates.text(DOUBLE_BRACE, text);
        assertEquals(List.of("system", "user"), roles(template));
        assertTrue(template.messages().get(0).content().endsWith("assistant:\n~~~~"), template.messages().get(0).content());
        assertEquals("Where is my bill?", template.messages().get(1).content());
        Template unclosed = Templates.text(DOUBLE_BRACE, "system:\nA\n```\nuser:\nB\n");
        assertEquals(List.of("system"), roles(unclosed), "an unclosed fence runs to the end of the file");
    }

    @Test
    void rolesOffAndPartialsReadTheFileAsOneText() {
        String text = "system:\nHi\nuser:\nBye\n";
        Template off = parse(RoleMarkers.OFF, "a.md", text, false);
        assertFalse(off.isChat());
        assertEquals(List.of(text), contents(off));
        Template partial = parse(RoleMarkers.AUTO, "partials/p.md", text, true);
        assertEquals(TemplateKind.PARTIAL, partial.kind());
        assertEquals(List.of(text), contents(partial));
    }

    @Test
    void crlfLineEndingsAndEmptyMessages() {
        Template crlf = Templates.text(DOUBLE_BRACE, "system:\r\nBe brief.\r\n\r\nuser:\r\n{{ q }}\r\nassistant:\r\n");
        assertEquals(List.of("system", "user", "assistant"), roles(crlf));
        assertEquals(List.of("Be brief.", "{{ q }}", ""), contents(crlf));
        assertEquals(5, crlf.messages().get(1).segments().get(0).span().line());
        assertTrue(crlf.messages().get(2).segments().isEmpty());
    }

    @Test
    void aBrokenPlaceholderNamesTheFileLineAndColumn() {
        TareException e = assertThrows(TareException.class,
                () -> Templates.text(DOUBLE_BRACE, "---\nbudget: 5\n---\nsystem:\nHi\nuser:\nSay {{ open\n"));
        assertTrue(e.getMessage().startsWith("line 7, column 5: "), e.getMessage());
    }

    @Test
    void aTextWithoutMarkersIsOnePlainMessage() {
        Template template = Templates.text(DOUBLE_BRACE, "---\nbudget: 5\n---\nAnswer billing questions.\n");
        assertFalse(template.isChat());
        assertEquals(List.of(Message.TEXT_ROLE), roles(template));
        assertEquals(new ContentOrigin.FileText(template.bodyStart()), template.messages().get(0).origin());
    }
}
