package dev.tare.template.code;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import org.junit.jupiter.api.Test;

/**
 * Whatever a file holds, finding its prompts never throws, every one-to-one run of a prompt is the
 * file's own text, and the parts cover each value; hostile files (huge, deeply nested, unterminated,
 * binary) end with prompts or a reason, not an exception. A quadratic walk would make the large cases
 * here run for hours, so they also guard the linear bound without timing anything.
 */
class CodePromptsPropertiesTest {
    /** A first line that names prompts, so that the text after it is read literal by literal. */
    private static final String READ_WHOLLY = "prompt = 0\n";
    private static final String[] COMMON = {
        "SYSTEM_PROMPT = ", "system_prompt = ", "messages = [", "{\"role\": \"system\", \"content\": ", "]", ")", "(",
        "{", "}", "[", ",", " + ", " ", "  ", "\t", "\n", "\r\n", "\r", "\"", "'", "`", "\\", "\\n", "\\t", "\\\"",
        "\\'", "\\\\", "\\x41", "\\u00e9", "\\u{1F6B0}", "\\101", "\\0", "%s", "%d", "%1$s", "%(name)s", "%%",
        "{name}", "{{", "}}", "${", "You are the Riverton Water assistant. ", "Answer briefly, please. ", "name",
        "x.y", "(a, b)", ".format(a, b)", ".strip()", "\u00e9", "\uD83D\uDEB0", "\uD83D", "\u0000", "\u2028",
        ":", "=", "==", "=>", "/", "*", "client.chat(", "system=", "content: ",
    };
    private static final String[] PYTHON = {
        "\"\"\"", "'''", "f\"", "f'", "rb\"", "r\"", "b'", "Rf'", "# tare: prompt\n", "# tare: ignore\n",
        "# tare: prompt budget=800 var x=3\n", "# comment\n", "{x!r:>{w}}", "{x=}", "textwrap.dedent(", "\\N{BLACK STAR}",
        "\\U0001F6B0", "\\\n", " % (a, b)", "inspect.cleandoc(",
    };
    private static final String[] SCRIPT = {
        "const SYSTEM_PROMPT = ", "// tare: prompt\n", "/* tare: ignore */\n", "// comment\n", "/*", "*/", "/re/g",
        "a / b", "String.raw`", "dedent`", "${a}", "`${`", "}`", "=> `", ".trim()",
    };
    private static final String[] JAVA = {
        "static final String SYSTEM_PROMPT = ", "\"\"\"\n", "\"\"\"", "\\s", "\\u0022", "\\uuu0041", "\\\\u0041",
        "// tare: prompt\n", "/* tare: var a=1 */\n", "'\"'", "String.format(", ".formatted(", "%n", "%<s", ".stripIndent()",
    };
    private static final String[] GO = {
        "const systemPrompt = ", "var systemPrompt string = ", "userPrompt := ", "fmt.Sprintf(", "%[1]q", "%v", "'\"'",
        "// tare: prompt\n", "\\xc3\\xa9", "\\303\\251", "strings.TrimSpace(", "Content: ",
    };

    @Property(tries = 400)
    void randomSourceNeverThrowsAndMapsBack(@ForAll("sources") Sample sample) {
        CodePrompts found = CodePrompts.find(sample.path(), sample.text(), sample.language(), List.of("client.chat"));
        for (CodePrompt prompt : found.prompts()) {
            CodeSamples.assertMapsBack(sample.text(), prompt);
        }
        found.stopped().ifPresent(reason -> assertTrue(reason.startsWith("line "), reason));
    }

    @Property(tries = 200)
    void anyCharactersAtAllNeverThrow(@ForAll("anything") String anything, @ForAll Language language) {
        String text = READ_WHOLLY + anything;
        CodePrompts found = CodePrompts.find("any." + extension(language), text, language, List.of());
        for (CodePrompt prompt : found.prompts()) {
            CodeSamples.assertMapsBack(text, prompt);
        }
    }

    /** A generated source file in one language. */
    record Sample(Language language, String path, String text) {
        @Override
        public String toString() {
            return language + ": " + text.replace("\n", "\\n");
        }
    }

    @Provide
    Arbitrary<Sample> sources() {
        return Arbitraries.of(Language.values()).flatMap(language -> {
            String[] own = switch (language) {
                case PYTHON -> PYTHON;
                case JAVASCRIPT, TYPESCRIPT -> SCRIPT;
                case JAVA -> JAVA;
                case GO -> GO;
            };
            String[] all = new String[COMMON.length + own.length * 2];
            System.arraycopy(COMMON, 0, all, 0, COMMON.length);
            System.arraycopy(own, 0, all, COMMON.length, own.length);
            System.arraycopy(own, 0, all, COMMON.length + own.length, own.length);
            String path = language == Language.TYPESCRIPT ? "sample.tsx" : "sample." + extension(language);
            return Arbitraries.of(all).list().ofMaxSize(60)
                    .map(parts -> new Sample(language, path, String.join("", parts)));
        });
    }

    @Provide
    Arbitrary<String> anything() {
        return Arbitraries.strings().all().ofMaxLength(200);
    }

    private static String extension(Language language) {
        return switch (language) {
            case PYTHON -> "py";
            case JAVASCRIPT -> "js";
            case TYPESCRIPT -> "ts";
            case JAVA -> "java";
            case GO -> "go";
        };
    }

    private static CodePrompts everyLanguage(String hostile) {
        String text = READ_WHOLLY + hostile;
        CodePrompts last = null;
        for (Language language : Language.values()) {
            last = CodePrompts.find("hostile." + extension(language), text, language, List.of("client.chat"));
            for (CodePrompt prompt : last.prompts()) {
                CodeSamples.assertMapsBack(text, prompt);
            }
        }
        return last;
    }

    @Test
    void deeplyNestedBracketsAndFieldsEndCleanly() {
        everyLanguage("x = " + "(".repeat(200_000) + "\"deep\"" + ")".repeat(200_000) + "\n");
        everyLanguage("x = " + "{[(".repeat(100_000) + "\n");
        everyLanguage("x = " + ")]}".repeat(100_000) + "\n");
        CodePrompts python = CodePrompts.find("deep.py", "PROMPT = f\"" + "{f\"".repeat(5_000) + "\n", Language.PYTHON, List.of());
        assertTrue(python.stopped().orElseThrow().contains("nest too deeply"), python.stopped().orElseThrow());
        CodePrompts script = CodePrompts.find("deep.js", "PROMPT = `" + "${`".repeat(5_000), Language.JAVASCRIPT, List.of());
        assertTrue(script.stopped().orElseThrow().contains("nest too deeply"), script.stopped().orElseThrow());
    }

    @Test
    void hugeFilesOfQuotesSlashesAndJoinsEndCleanly() {
        everyLanguage("\"".repeat(1_000_000));
        everyLanguage("'\"`".repeat(300_000));
        everyLanguage("a = / / / [ / ".repeat(200_000));
        everyLanguage("x = 1\n".repeat(200_000) + "SYSTEM_PROMPT = \"You are the Riverton Water assistant, be brief.\"\n");
        everyLanguage("# // tare: prompt\n".repeat(100_000) + "\"You are the Riverton Water assistant, be brief.\" \"a\"\n");
        everyLanguage("SYSTEM_PROMPT = " + "\"You are the assistant, \" + name + ".repeat(50_000) + "\"end\"\n");
        everyLanguage("f(" + "\"a\", ".repeat(100_000) + ")\nMap.of(" + "\"content\", ".repeat(100_000) + ")\n");
        everyLanguage("\\N{".repeat(100_000) + "\n\"" + "\\N{".repeat(100_000) + "\"\n");
        CodePrompts longLine = CodePrompts.find("long.jsx", "<p>" + "Don't ".repeat(200_000) + "</p>\n",
                Language.JAVASCRIPT, List.of());
        assertEquals(List.of(), longLine.prompts());
    }

    @Test
    void unterminatedConstructsAtTheEndOfTheFileGiveReasons() {
        String[] endings = {"\"", "'", "`", "\"\"\"", "'''", "/*", "f\"{", "`${", "\"\"\"\n", "'\\", "\"\\"};
        for (String ending : endings) {
            for (Language language : Language.values()) {
                String text = "SYSTEM_PROMPT = \"You are the Riverton Water assistant, be brief.\"\nx = " + ending;
                CodePrompts found = CodePrompts.find("end." + extension(language), text, language, List.of());
                assertTrue(found.prompts().size() <= 1, ending);
                found.stopped().ifPresent(reason -> assertTrue(reason.startsWith("line 2, column "), reason));
            }
        }
    }

    @Test
    void binaryBytesReadAsTextEndCleanly() {
        StringBuilder binary = new StringBuilder();
        java.util.Random random = new java.util.Random(25);
        for (int k = 0; k < 500_000; k++) {
            binary.append((char) random.nextInt(0x10000));
        }
        everyLanguage(binary.toString());
    }
}
