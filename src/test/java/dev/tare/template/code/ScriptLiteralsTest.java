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
 * JavaScript's and TypeScript's string literals as ECMA-262 defines them (§12.9.4 string literals,
 * §12.9.6 template literals, §12.9.5 regular expression literals): escapes, line continuations,
 * template fields, and the slashes and quotes that are not strings.
 */
class ScriptLiteralsTest {
    private static CodePrompts script(String source, String... calls) {
        return find(Language.JAVASCRIPT, source, calls);
    }

    @Test
    void templateLiteralFieldsAreVariablesEvenWithBracesAndTemplatesInside() {
        String source = """
                const OUTAGE_PROMPT = `The outage in ${area} has lasted ${hours} hours.
                Zones: ${zones.map((z) => `zone ${z}`).join(", ")}; crews: ${ {a: 1}.a } and ${"}"}.`;
                """;
        CodePrompt prompt = only(script(source));
        assertEquals(List.of("area", "hours", "zones.map((z) => `zone ${z}`).join(\", \")", "{a: 1}.a", "\"}\""),
                List.copyOf(prompt.variableNames()));
        assertEquals(List.of("${area}", "${hours}", "${zones.map((z) => `zone ${z}`).join(\", \")}", "${ {a: 1}.a }",
                "${\"}\"}"), variablesAsWritten(source, prompt));
        assertStartsAt(source, "`The outage", prompt);
        assertTrue(prompt.value().startsWith("The outage in ${area} has lasted ${hours} hours.\nZones: "));
    }

    @Test
    void escapesAreDecodedInStringsAndTemplates() {
        String source = "const PERSONA_PROMPT = 'Don\\'t guess: caf\\u00e9 \\u{1F6B0} \\x41\\101\\0 \\q "
                + "and a \\\ncontinued line.' + `\\`tick\\` \\${not a field} \\u00e9`;\n";
        CodePrompt prompt = only(script(source));
        assertEquals("Don't guess: caf\u00e9 \uD83D\uDEB0 AA\0 q and a continued line.`tick` ${not a field} \u00e9",
                prompt.value());
        assertEquals(List.of(), List.copyOf(prompt.variableNames()));
        int accent = prompt.value().indexOf('\u00e9');
        assertEquals(source.indexOf("\\u00e9"), prompt.map().sourceOffset(accent));
        assertFalse(prompt.map().isOneToOne(accent));
    }

    @Test
    void regularExpressionsAreNotStringsAndDivisionsAreNotRegularExpressions() {
        String source = """
                const METER = /^"[A-Z]{2}'\\/`$/g, ratio = usage / 2 / days;
                if (/["']/.test(x)) { total = (a) / b; }
                const SYSTEM_PROMPT = "You are the outage desk of Riverton Water; answer briefly.";
                """;
        CodePrompts found = script(source);
        assertEquals(List.of("SYSTEM_PROMPT"), CodeSamples.names(found));
        assertEquals(Optional.empty(), found.stopped());
    }

    @Test
    void commentsHideTheirQuotes() {
        String source = """
                // const SYSTEM_PROMPT = "not this one, it is commented out";
                /* and "not" this `one` either
                   const PROMPT = 'nor this'; */
                const SYSTEM_PROMPT = "You are the outage desk // with slashes /* inside */ the text.";
                """;
        assertEquals("You are the outage desk // with slashes /* inside */ the text.", only(script(source)).value());
    }

    @Test
    void objectKeysTypeAnnotationsAndArrowFunctionsNameTheirPrompts() {
        String source = """
                const request = {
                  model: "riverton-small",
                  system: 'Answer only questions about outages and water quality, never about bills.',
                  messages: [{ role: "user", content: `Is there an outage on ${street} right now?` }],
                };
                const NOTICE_TEMPLATE: string = "Crews are working on your street and will report back soon.";
                const buildPrompt = async (street: string): Promise<string> => `Write a notice for ${street} residents.`;
                """;
        CodePrompts found = find(Language.TYPESCRIPT, source);
        assertEquals(List.of("request.system", "request.messages.content", "NOTICE_TEMPLATE", "buildPrompt"),
                CodeSamples.names(found));
        assertEquals(Optional.of("system"), named(found, "request.system").role());
        assertEquals(Optional.of("user"), named(found, "request.messages.content").role());
    }

    @Test
    void rawAndTaggedTemplatesAreReadAsWrittenAndNamedPastTheTag() {
        String source = """
                const RAW_PROMPT = String.raw`Logs live in C:\\new\\table for ${days} days, kept as written.`;
                const SMS_TEMPLATE = dedent`Riverton Water: the supply on your street is back, thank you.`;
                """;
        CodePrompts found = script(source);
        assertEquals("Logs live in C:\\new\\table for ${days} days, kept as written.", named(found, "RAW_PROMPT").value());
        assertEquals(1, named(found, "SMS_TEMPLATE").oneToOne().size());
    }

    @Test
    void plusJoinsLiteralsAcrossLinesWithTheExpressionsBetweenAsVariables() {
        String source = """
                const noticePrompt = "Crews are working on " + street.name +
                    '. Water should return within ' + estimate(hours, 2) + " hours, we expect.";
                """;
        CodePrompt prompt = only(script(source));
        assertEquals("Crews are working on street.name. Water should return within estimate(hours, 2) hours, we expect.",
                prompt.value());
        assertEquals(List.of("street.name", "estimate(hours, 2)"), List.copyOf(prompt.variableNames()));
        assertEquals(List.of("street.name", "estimate(hours, 2)"), variablesAsWritten(source, prompt));
    }

    @Test
    void anApostropheInJsxTextIsNotAStringButInPlainScriptItStopsTheFile() {
        String source = """
                const Banner = () => <p>Don't drink tap water in Zone 4 today</p>;
                const SYSTEM_PROMPT = "You are the outage desk of Riverton Water; answer briefly.";
                """;
        CodePrompts jsx = CodePrompts.find("banner.tsx", source, Language.TYPESCRIPT, List.of());
        assertEquals(List.of("SYSTEM_PROMPT"), CodeSamples.names(jsx));
        assertEquals(Optional.empty(), jsx.stopped());
        CodePrompts plain = CodePrompts.find("banner.ts", source, Language.TYPESCRIPT, List.of());
        assertTrue(plain.stopped().orElseThrow().startsWith("line 1, column 28: the string opened here is not closed"),
                plain.stopped().orElseThrow());
    }

    @Test
    void unterminatedTemplatesAndFieldsSayWhereTheyOpened() {
        assertTrue(script("const prompt = `never\nclosed").stopped().orElseThrow()
                .startsWith("line 1, column 16: the template literal opened here is never closed; close it with `"));
        assertTrue(script("const prompt = `a ${b + `c` \n").stopped().orElseThrow()
                .startsWith("line 1, column 19: the template literal field opened here is never closed; close it with }"));
        assertTrue(script("/* the prompt\n").stopped().orElseThrow().startsWith("line 1, column 1: the comment opened here"));
    }

    @Test
    void aShebangLineIsSkipped() {
        String source = "#!/usr/bin/env node\nconst SYSTEM_PROMPT = 'You are the outage desk of Riverton Water, be brief.';\n";
        assertEquals(2, only(script(source)).line());
    }
}
