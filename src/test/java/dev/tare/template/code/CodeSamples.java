package dev.tare.template.code;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

import dev.tare.template.LineIndex;
import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.util.List;
import java.util.stream.Collectors;

/** What the code tests share: finding prompts in a snippet, picking one out, and checking it maps back to its source. */
final class CodeSamples {
    private CodeSamples() {
    }

    static CodePrompts find(Language language, String source, String... calls) {
        String path = switch (language) {
            case PYTHON -> "assistant.py";
            case JAVASCRIPT -> "assistant.js";
            case TYPESCRIPT -> "assistant.ts";
            case JAVA -> "Assistant.java";
            case GO -> "assistant.go";
        };
        CodePrompts found = CodePrompts.find(path, source, language, List.of(calls));
        for (CodePrompt prompt : found.prompts()) {
            assertMapsBack(source, prompt);
        }
        return found;
    }

    /** The one prompt found, failing when there are none or several. */
    static CodePrompt only(CodePrompts found) {
        assertEquals(1, found.prompts().size(), () -> "prompts: " + names(found));
        return found.prompts().get(0);
    }

    static CodePrompt named(CodePrompts found, String name) {
        List<CodePrompt> matching = found.prompts().stream().filter(p -> p.name().equals(name)).toList();
        if (matching.size() != 1) {
            fail("expected one prompt named " + name + " among " + names(found));
        }
        return matching.get(0);
    }

    static List<String> names(CodePrompts found) {
        return found.prompts().stream().map(CodePrompt::name).collect(Collectors.toList());
    }

    /** The 1-based line and column of the first occurrence of {@code marker} in {@code source}. */
    static int[] position(String source, String marker) {
        int at = source.indexOf(marker);
        assertTrue(at >= 0, () -> "no " + marker + " in the sample");
        LineIndex lines = LineIndex.of(source);
        return new int[] {lines.line(at), lines.column(at)};
    }

    static void assertStartsAt(String source, String marker, CodePrompt prompt) {
        int[] expected = position(source, marker);
        assertEquals(expected[0], prompt.line(), "line of " + prompt.name());
        assertEquals(expected[1], prompt.column(), "column of " + prompt.name());
        assertEquals(source.indexOf(marker), prompt.start(), "start of " + prompt.name());
    }

    /**
     * Every one-to-one run is the source's own text, the parts cover the value in order, each part's
     * text is the value there, and what the map says agrees with the runs.
     */
    static void assertMapsBack(String source, CodePrompt prompt) {
        String value = prompt.value();
        ValueMap map = prompt.map();
        assertEquals(value.length(), map.length(), "map length");
        boolean[] inRun = new boolean[value.length()];
        int previousEnd = 0;
        for (ValueMap.Run run : prompt.oneToOne()) {
            assertTrue(run.valueStart() >= previousEnd && run.valueEnd() > run.valueStart(), "runs in order: " + run);
            assertEquals(value.substring(run.valueStart(), run.valueEnd()),
                    source.substring(run.sourceStart(), run.sourceEnd()), "run " + run + " of " + prompt.name());
            for (int i = run.valueStart(); i < run.valueEnd(); i++) {
                inRun[i] = true;
                assertEquals(run.sourceStart() + i - run.valueStart(), map.sourceOffset(i));
            }
            previousEnd = run.valueEnd();
        }
        for (int i = 0; i < value.length(); i++) {
            assertEquals(inRun[i], map.isOneToOne(i), "one to one at " + i + " of " + prompt.name());
            assertTrue(map.sourceOffset(i) >= 0 && map.sourceOffset(i) <= map.sourceEnd(i)
                    && map.sourceEnd(i) <= source.length(), "offsets of " + i);
            assertTrue(map.sourceOffset(i) >= prompt.start() && map.sourceEnd(i) <= prompt.end(),
                    "character " + i + " of " + prompt.name() + " comes from inside its expression");
        }
        int at = 0;
        LineIndex lines = LineIndex.of(source);
        for (CodePart part : prompt.parts()) {
            assertEquals(at, part.valueStart(), "parts cover the value of " + prompt.name());
            assertEquals(value.substring(part.valueStart(), part.valueEnd()), part.text());
            assertEquals(lines.line(part.sourceStart()), part.line());
            assertEquals(lines.column(part.sourceStart()), part.column());
            if (part.isVariable()) {
                for (int i = part.valueStart(); i < part.valueEnd(); i++) {
                    assertFalse(map.isOneToOne(i), "a variable is never one to one");
                }
            }
            at = part.valueEnd();
        }
        assertEquals(value.length(), at, "parts cover the value of " + prompt.name());
    }

    /** The variable parts of a prompt as written in the file. */
    static List<String> variablesAsWritten(String source, CodePrompt prompt) {
        return prompt.parts().stream().filter(CodePart::isVariable)
                .map(part -> source.substring(part.sourceStart(), part.sourceEnd())).toList();
    }

    static String resource(String name) {
        try (InputStream in = CodeSamples.class.getResourceAsStream(name)) {
            if (in == null) {
                throw new IllegalStateException("no test resource " + name);
            }
            return new String(in.readAllBytes(), StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }
}
