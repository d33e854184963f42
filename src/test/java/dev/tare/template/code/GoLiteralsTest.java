package dev.tare.template.code;

import static dev.tare.template.code.CodeSamples.assertStartsAt;
import static dev.tare.template.code.CodeSamples.find;
import static dev.tare.template.code.CodeSamples.named;
import static dev.tare.template.code.CodeSamples.only;
import static dev.tare.template.code.CodeSamples.variablesAsWritten;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.Test;

/**
 * Go's string literals as the Go specification defines them ("String literals", "Rune literals"):
 * raw strings with their carriage returns removed, interpreted strings whose byte escapes spell UTF-8,
 * and fmt's verbs ("Printing" in package fmt's documentation) as variables.
 */
class GoLiteralsTest {
    private static CodePrompts go(String source) {
        return find(Language.GO, source);
    }

    @Test
    void aRawStringIsReadAsWrittenWithoutCarriageReturns() {
        String source = "package readings\n\nconst systemPrompt = `You are the water-quality assistant.\r\n"
                + "Explain \\n results in plain words.`\n";
        CodePrompt prompt = only(go(source));
        assertEquals("systemPrompt", prompt.name());
        assertEquals("You are the water-quality assistant.\nExplain \\n results in plain words.", prompt.value());
        assertStartsAt(source, "`You", prompt);
        assertEquals(2, prompt.oneToOne().size(), "the removed carriage return cuts the run");
    }

    @Test
    void byteEscapesSpellUtf8AndOtherEscapesAreDecoded() {
        String source = "package readings\n\nvar escapesPrompt = \"Tabs\\there, caf\\xc3\\xa9 \\u00e9 \\303\\251"
                + " \\U0001F6B0 \\\"quoted\\\" and a backslash \\\\ in the guide.\"\n";
        CodePrompt prompt = only(go(source));
        assertEquals("Tabs\there, caf\u00e9 \u00e9 \u00e9 \uD83D\uDEB0 \"quoted\" and a backslash \\ in the guide.",
                prompt.value());
        int first = prompt.value().indexOf('\u00e9');
        assertEquals(source.indexOf("\\xc3"), prompt.map().sourceOffset(first), "the run of byte escapes is one source");
        assertEquals(source.indexOf("\\xc3") + 8, prompt.map().sourceEnd(first));
        assertFalse(prompt.map().isOneToOne(first));
    }

    @Test
    void sprintfVerbsAreVariablesNamedByTheirArguments() {
        String source = """
                package readings

                func ask(area string, chlorine float64) string {
                	userPrompt := fmt.Sprintf("Sample from %s shows %.2f mg/L; is %[1]q safe at %v? (100%% sure, %-8s)",
                		area, chlorine, limit)
                	return userPrompt
                }
                """;
        CodePrompt prompt = only(go(source));
        assertEquals("Sample from %s shows %.2f mg/L; is %[1]q safe at %v? (100% sure, %-8s)", prompt.value());
        assertEquals(List.of("%s", "%.2f", "%[1]q", "%v", "%-8s"), variablesAsWritten(source, prompt));
        assertEquals(List.of("area", "chlorine", "limit"), List.copyOf(prompt.variableNames()),
                "after %[1]q the next verb takes the second argument, as fmt does");
    }

    @Test
    void constGroupsVarsWithTypesAndStructKeysNameTheirPrompts() {
        String source = """
                package readings

                const (
                	hardnessInstructions = "Hardness is given in mg/L; below 60 is soft, above 180 is very hard."
                	qualityPersona string = "You are a careful chemist who never alarms a customer without reason."
                )

                var fewShotExamples []string = []string{
                	"Q: Is 0.3 mg/L chlorine safe?\\nA: Yes, it is well within the limit for tap water.",
                }

                func messages(userPrompt string) []Message {
                	return []Message{
                		{Role: chat.RoleSystem, Content: "Answer only about water quality results, briefly."},
                		{Role: "user", Content: userPrompt + " Please answer in two sentences."},
                	}
                }
                """;
        CodePrompts found = go(source);
        assertEquals(List.of("hardnessInstructions", "qualityPersona", "fewShotExamples", "Content", "Content"),
                CodeSamples.names(found));
        assertEquals(Optional.of("system"), found.prompts().get(3).role());
        assertEquals(Optional.of("user"), found.prompts().get(4).role());
        assertEquals("userPrompt Please answer in two sentences.", found.prompts().get(4).value());
        assertEquals("Q: Is 0.3 mg/L chlorine safe?\nA: Yes, it is well within the limit for tap water.",
                named(found, "fewShotExamples").value());
    }

    @Test
    void aQuoteInARuneAndCommentsOpenNoString() {
        String source = """
                package readings

                // const systemPrompt = "commented out, never read"
                /* "neither" is `this` */
                var quote = '"'
                var escaped = '\\''
                const systemPrompt = "You are the water-quality assistant of Riverton Water, answer briefly."
                """;
        assertEquals("systemPrompt", only(go(source)).name());
    }

    @Test
    void anUnterminatedStringEndsTheFileAtItsLine() {
        CodePrompts found = go("package readings\n\nvar x = \"open\nconst systemPrompt = `You are the assistant.`\n");
        assertTrue(found.prompts().isEmpty());
        assertTrue(found.stopped().orElseThrow().startsWith("line 3, column 9: the string opened here is not closed"),
                found.stopped().orElseThrow());
        assertTrue(go("package readings\nvar prompt = `never closed\n").stopped().orElseThrow()
                .startsWith("line 2, column 14: the raw string opened here is never closed"));
        assertEquals(Optional.empty(), go("package readings\nvar p = `never closed\n").stopped(),
                "a file without a word that names prompts is not read literal by literal");
    }
}
