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
 * Python's string literals as the language reference's lexical analysis defines them ("String and
 * Bytes literals", "f-strings"): quotes, prefixes, escapes, fields, adjacent literals, and the calls
 * that shape a prompt's text (str.format, %, textwrap.dedent, inspect.cleandoc, strip).
 */
class PythonLiteralsTest {
    private static CodePrompts python(String source, String... calls) {
        return find(Language.PYTHON, source, calls);
    }

    @Test
    void aTripleQuotedSystemPromptIsFoundWhereItStarts() {
        String source = """
                import os

                SYSTEM_PROMPT = \"""You are the billing assistant of Riverton Water.
                Answer questions about bills only.
                \"""
                """;
        CodePrompt prompt = only(python(source));
        assertEquals("SYSTEM_PROMPT", prompt.name());
        assertEquals(Optional.of("system"), prompt.role());
        assertStartsAt(source, "\"\"\"You", prompt);
        assertEquals("You are the billing assistant of Riverton Water.\nAnswer questions about bills only.\n",
                prompt.value());
        assertEquals(1, prompt.oneToOne().size(), "one literal without escapes is one run");
    }

    @Test
    void escapesAreDecodedAndMapToTheirBackslash() {
        String source = "INSTRUCTIONS = 'Say \\'hi\\',\\ttab \\x41\\101\\u00e9\\U0001F6B0\\N{BLACK STAR} \\\\ \\d end'\n";
        CodePrompt prompt = only(python(source));
        assertEquals("Say 'hi',\ttab AA\u00e9\uD83D\uDEB0\u2605 \\ \\d end", prompt.value());
        int tab = prompt.value().indexOf('\t');
        assertFalse(prompt.map().isOneToOne(tab));
        assertEquals(source.indexOf("\\t"), prompt.map().sourceOffset(tab), "an escaped character maps to its backslash");
        int star = prompt.value().indexOf('\u2605');
        assertEquals(source.indexOf("\\N{"), prompt.map().sourceOffset(star));
        assertEquals(source.indexOf(" end'") + 1, prompt.map().sourceOffset(prompt.value().length() - 3));
        int unknown = prompt.value().indexOf("\\d");
        assertFalse(prompt.map().isOneToOne(unknown), "an unknown escape keeps its backslash but is not one to one");
    }

    @Test
    void aBackslashAtTheEndOfALineContinuesTheString() {
        String source = "PERSONA = \"You are patient \\\nand exact with every meter reading.\"\n";
        assertEquals("You are patient and exact with every meter reading.", only(python(source)).value());
    }

    @Test
    void rawStringsKeepTheirBackslashesOneToOne() {
        String source = "TEMPLATE = r\"Bills are kept in C:\\new\\table and a \\\" quote stays escaped.\"\n";
        CodePrompt prompt = only(python(source));
        assertEquals("Bills are kept in C:\\new\\table and a \\\" quote stays escaped.", prompt.value());
        assertEquals(1, prompt.oneToOne().size());
    }

    @Test
    void prefixesAreReadInAnyCaseAndByteStringsAreSkipped() {
        String source = """
                SYSTEM_PROMPT_BYTES = b"You are the billing assistant, written as bytes."
                PROMPT_ONE = Rb'You are the billing assistant, written as raw bytes.'
                PROMPT_TWO = U"You are the billing assistant, written with a u prefix."
                PROMPT_THREE = Fr"You are the {role} assistant with a raw \\d in it."
                PROMPT_FOUR = rF'You are the {role} assistant, the other way round.'
                """;
        CodePrompts found = python(source);
        assertEquals(List.of("PROMPT_TWO", "PROMPT_THREE", "PROMPT_FOUR"), CodeSamples.names(found));
        assertEquals("You are the {role} assistant with a raw \\d in it.", named(found, "PROMPT_THREE").value());
        assertEquals(List.of("role"), List.copyOf(named(found, "PROMPT_FOUR").variableNames()));
    }

    @Test
    void fStringFieldsAreVariablesNamedByTheirExpressions() {
        String source = "USER_PROMPT = f\"Customer {customer.name!r:>{width}} owes {total = } on {len(bills)} bills"
                + " {{not a field}} {plan['name']} {d[\"k\"]}.\"\n";
        CodePrompt prompt = only(python(source));
        assertEquals(List.of("customer.name", "total", "len(bills)", "plan['name']", "d[\"k\"]"),
                List.copyOf(prompt.variableNames()));
        assertEquals("Customer {customer.name!r:>{width}} owes {total = } on {len(bills)} bills {not a field}"
                + " {plan['name']} {d[\"k\"]}.", prompt.value());
        assertEquals(List.of("{customer.name!r:>{width}}", "{total = }", "{len(bills)}", "{plan['name']}", "{d[\"k\"]}"),
                variablesAsWritten(source, prompt));
        int brace = prompt.value().indexOf("{not");
        assertFalse(prompt.map().isOneToOne(brace), "{{ is an escape");
        assertEquals(source.indexOf("{{"), prompt.map().sourceOffset(brace));
    }

    @Test
    void fieldsHoldStringsWithBracesAndQuotesOfTheirOwn() {
        String source = "PROMPT = f'''Reply {'}' if closed else \"{\"} and {f\"{inner!s}\"} ''' + f\"{a:{'>'}10}"
                + " is the reading for this customer.\"\n";
        CodePrompt prompt = only(python(source));
        assertEquals(List.of("'}' if closed else \"{\"", "f\"{inner!s}\"", "a"), List.copyOf(prompt.variableNames()));
    }

    @Test
    void adjacentLiteralsInParenthesesJoinAcrossLinesAndComments() {
        String source = """
                GREETING_TEMPLATE = (
                    "Hello, thanks for contacting "  # the opening
                    # a comment between the parts
                    'Riverton Water about your '
                    f"account {account}."
                )
                """;
        CodePrompt prompt = only(python(source));
        assertEquals("Hello, thanks for contacting Riverton Water about your account {account}.", prompt.value());
        assertStartsAt(source, "\"Hello", prompt);
        assertEquals(List.of("account"), List.copyOf(prompt.variableNames()));
        assertEquals(4, prompt.oneToOne().size(), "one run per literal, and the last cut in two by the variable");
    }

    @Test
    void formatCallsMakeTheirFieldsVariables() {
        String source = "REMINDER_PROMPT = \"Plan {} for {customer} renews on {date:%d %b}; {{braces}} stay, {}.\""
                + ".format(plan.name, today, customer=name, date=renewal)\n";
        CodePrompt prompt = only(python(source));
        assertEquals(List.of("plan.name", "customer", "date", "today"), List.copyOf(prompt.variableNames()));
        assertEquals("Plan {} for {customer} renews on {date:%d %b}; {braces} stay, {}.", prompt.value());
    }

    @Test
    void textPartsStayInsideOneLiteralAfterFormatting() {
        String source = """
                REMINDER_PROMPT = ("Plan {} renews "
                                   "for {customer} on {{day one}}.").format(plan, customer=name).strip()
                """;
        CodePrompt prompt = only(python(source));
        assertEquals(List.of("Plan ", "{}", " renews ", "for ", "{customer}", " on {day one}."),
                prompt.parts().stream().map(CodePart::text).toList());
        for (CodePart part : prompt.parts()) {
            String written = source.substring(part.sourceStart(), part.sourceEnd());
            assertFalse(written.contains("\n"), () -> "part " + part.text() + " is written as " + written);
        }
    }

    @Test
    void percentFormattingMakesItsSpecifiersVariables() {
        String source = "SUMMARY_PROMPT = \"Summarize the call about %s in %d lines for %(team)s, 100%% sure.\" % (account, 3)\n";
        CodePrompt prompt = only(python(source));
        assertEquals(List.of("account", "3", "team"), List.copyOf(prompt.variableNames()));
        assertEquals("Summarize the call about %s in %d lines for %(team)s, 100% sure.", prompt.value());
    }

    @Test
    void dedentAndStripShapeTheValueAsPythonDoes() {
        String source = """
                import textwrap
                PERSONA = textwrap.dedent(\"""
                    You speak like a patient clerk.
                      You never guess a reading.
                \t
                    You say when a question is outside billing.
                    \""").strip()
                """;
        CodePrompt prompt = only(python(source));
        assertEquals("You speak like a patient clerk.\n  You never guess a reading.\n\n"
                + "You say when a question is outside billing.", prompt.value());
        assertStartsAt(source, "\"\"\"\n", prompt);
        int lineBreak = prompt.value().indexOf('\n');
        assertFalse(prompt.map().isOneToOne(lineBreak), "where indentation was removed, line breaks are not one to one");
    }

    @Test
    void cleandocRemovesTheMarginOfTheLinesAfterTheFirst() {
        String source = """
                import inspect
                ESCALATION_INSTRUCTIONS = inspect.cleandoc(\"""   Escalate to a person when
                        the customer mentions a leak.
                            Give them the hotline number.

                    \""")
                """;
        assertEquals("Escalate to a person when\nthe customer mentions a leak.\n    Give them the hotline number.",
                only(python(source)).value());
    }

    @Test
    void windowsLineBreaksInATripleQuotedStringBecomeNewlines() {
        String source = "SYSTEM_PROMPT = \"\"\"You are the billing assistant.\r\nAnswer in one line.\"\"\"\r\n";
        CodePrompt prompt = only(python(source));
        assertEquals("You are the billing assistant.\nAnswer in one line.", prompt.value());
        assertFalse(prompt.map().isOneToOne(prompt.value().indexOf('\n')));
    }

    @Test
    void commentsNeverHoldLiteralsAndAHashInAStringIsNoComment() {
        String source = """
                # SYSTEM_PROMPT = "a commented-out prompt is never read by anyone"
                SYSTEM_PROMPT = "Reply with # and the ticket number, then stop the conversation."  # "not this"
                """;
        CodePrompt prompt = only(python(source));
        assertEquals("Reply with # and the ticket number, then stop the conversation.", prompt.value());
    }

    @Test
    void anUnterminatedStringEndsTheFileWithItsLineAndKeepsWhatCameBefore() {
        String source = """
                SYSTEM_PROMPT = "You are the billing assistant of Riverton Water, answer briefly."
                broken = "this string never ends
                LATER_PROMPT = "This prompt comes after the broken line and is not read."
                """;
        CodePrompts found = python(source);
        assertEquals(List.of("SYSTEM_PROMPT"), CodeSamples.names(found));
        assertTrue(found.stopped().orElseThrow().startsWith("line 2, column 10: the string opened here is not closed"),
                found.stopped().orElseThrow());
    }

    @Test
    void anUnterminatedTripleQuotedStringOrFieldSaysWhatToClose() {
        assertTrue(python("PROMPT = '''never closed\n\nat all\n").stopped().orElseThrow()
                .contains("line 1, column 10: the triple-quoted string opened here is never closed; close it with '''"));
        assertTrue(python("PROMPT = f\"open {field\n").stopped().orElseThrow().contains("line 1, column 17: the f-string"
                + " field opened here is not closed before the end of its line; close it with }"));
    }
}
