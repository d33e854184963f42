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
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import org.junit.jupiter.api.Test;

/**
 * Java's string literals and text blocks as the Java Language Specification (Java SE 17) defines
 * them: Unicode escapes first (§3.3), escape sequences (§3.10.7), string literals (§3.10.5) and text
 * blocks (§3.10.6), whose content has its line terminators normalized, then its incidental white space
 * removed as String.stripIndent does, then its escapes interpreted as String.translateEscapes does.
 */
class JavaLiteralsTest {
    /** A class holding one constant written as {@code literal}, marked a prompt so that any value counts. */
    private static String constant(String literal) {
        return "class Assistant {\n    // tare: prompt\n    static final String SYSTEM_PROMPT = " + literal + ";\n}\n";
    }

    private static String valueOf(String literal) {
        return only(find(Language.JAVA, constant(literal))).value();
    }

    /** The value the JDK gives the text block {@code literal}: its content, stripped and then translated. */
    private static String jdkValue(String literal) {
        String afterOpening = literal.substring(literal.indexOf('\n') + 1);
        String content = afterOpening.substring(0, closingQuotes(afterOpening)).replace("\r\n", "\n").replace('\r', '\n');
        return content.stripIndent().translateEscapes();
    }

    private static int closingQuotes(String text) {
        for (int k = 0; k < text.length(); k++) {
            if (text.charAt(k) == '\\') {
                k++;
            } else if (text.startsWith("\"\"\"", k)) {
                return k;
            }
        }
        throw new IllegalArgumentException("no closing delimiter");
    }

    private static void assertTextBlock(String expected, String literal) {
        assertEquals(expected, jdkValue(literal), "the JDK's own reading of the example");
        assertEquals(expected, valueOf(literal));
    }

    @Test
    void jlsTextBlockExamplesOfIncidentalWhiteSpace() {
        // JLS 17 §3.10.6: the empty text block, and the HTML example with the closing delimiter under the
        // content (its 14 leading spaces are incidental), at the left margin (none is), and on the last
        // content line (no final line terminator).
        assertTextBlock("", "\"\"\"\n\"\"\"");
        String html = "<html>\n    <body>\n        <p>Hello, world</p>\n    </body>\n</html>\n";
        assertTextBlock(html, "\"\"\"\n"
                + "              <html>\n"
                + "                  <body>\n"
                + "                      <p>Hello, world</p>\n"
                + "                  </body>\n"
                + "              </html>\n"
                + "              \"\"\"");
        assertTextBlock(html.indent(14), "\"\"\"\n"
                + "              <html>\n"
                + "                  <body>\n"
                + "                      <p>Hello, world</p>\n"
                + "                  </body>\n"
                + "              </html>\n"
                + "\"\"\"");
        assertTextBlock(html.strip(), "\"\"\"\n"
                + "              <html>\n"
                + "                  <body>\n"
                + "                      <p>Hello, world</p>\n"
                + "                  </body>\n"
                + "              </html>\"\"\"");
    }

    @Test
    void jlsTextBlockExamplesOfQuotesAndEscapes() {
        // JLS 17 §3.10.6: a text block inside a text block, quotes before the closing delimiter, and the
        // numbered lines of quote runs that show which quotes close the block.
        assertTextBlock("String text = \"\"\"\n    A text block inside a text block\n\"\"\";\n", "\"\"\"\n"
                + "    String text = \\\"\"\"\n"
                + "        A text block inside a text block\n"
                + "    \\\"\"\";\n"
                + "    \"\"\"");
        assertTextBlock("A common character\nin Java programs\nis \"", "\"\"\"\n"
                + "    A common character\n"
                + "    in Java programs\n"
                + "    is \\\"\"\"\"");
        assertTextBlock("The empty string literal\nis formed from \" characters\nas follows: \"\"", "\"\"\"\n"
                + "    The empty string literal\n"
                + "    is formed from \" characters\n"
                + "    as follows: \\\"\\\"\"\"\"");
        assertTextBlock(" 1 \"\n 2 \"\"\n 3 \"\"\"\n 4 \"\"\"\"\n 5 \"\"\"\"\"\n", "\"\"\"\n"
                + "     1 \"\n"
                + "     2 \"\"\n"
                + "     3 \"\"\\\"\n"
                + "     4 \"\"\\\"\"\n"
                + "     5 \"\"\\\"\"\"\n"
                + "    \"\"\"");
    }

    @Test
    void trailingSpaceGoesUnlessEscapedAndABackslashJoinsLines() {
        // JLS 17 §3.10.6 and §3.10.7: trailing white space is incidental, \s is a space that stays, and a
        // backslash before a line terminator joins the lines; escapes are read after the stripping.
        String literal = "\"\"\"\n"
                + "        Readings are in cubic metres.   \n"
                + "          Say \"sorry\" once.  \\s\n"
                + "        Ask for the meter number, \\\n"
                + "        then for the reading.\\n\\tThanks.\n"
                + "        \"\"\"";
        assertTextBlock("Readings are in cubic metres.\n  Say \"sorry\" once.   \nAsk for the meter number, "
                + "then for the reading.\n\tThanks.\n", literal);
    }

    @Test
    void textBlockCharactersMapBackAndItsLineBreaksAreNotOneToOne() {
        String source = constant("\"\"\"\n        You are the meter assistant.\n          Be exact.\n        \"\"\"");
        CodePrompt prompt = only(find(Language.JAVA, source));
        assertEquals("You are the meter assistant.\n  Be exact.\n", prompt.value());
        assertStartsAt(source, "\"\"\"", prompt);
        assertFalse(prompt.map().isOneToOne(prompt.value().indexOf('\n')), "removed indentation depends on the lines");
        assertTrue(prompt.map().isOneToOne(prompt.value().indexOf("Be")));
        assertEquals(List.of("You are the meter assistant.", "  Be exact."),
                prompt.oneToOne().stream().map(run -> prompt.value().substring(run.valueStart(), run.valueEnd())).toList());
    }

    @Property(tries = 300)
    void textBlocksReadAsTheJdkReadsThem(@ForAll("contents") String content, @ForAll("closings") String closing) {
        String literal = "\"\"\"\n" + content + closing + "\"\"\"";
        assertEquals(jdkValue(literal), valueOf(literal));
    }

    @Provide
    Arbitrary<String> contents() {
        Arbitrary<String> piece = Arbitraries.of("    ", "  ", "\t", " ", "\n", "\r\n", "word", "\\s", "\\n", "\\t",
                "\\\"", "\\\\", "\\\n", "\\101", "\\0", "\"", "\"\"", "\f", "\u2003");
        return piece.list().ofMaxSize(30).map(list -> String.join("", list));
    }

    @Provide
    Arbitrary<String> closings() {
        return Arbitraries.of("", "\n", "\n    ", "\n  ", "\n\t");
    }

    @Test
    void stringEscapesIncludingSpaceAndOctalAreDecoded() {
        assertEquals("Say \"thanks\",\tthen stop.\nOctal A0\0\u00ff\n and a space: .\\u0041 stays.",
                valueOf("\"Say \\\"thanks\\\",\\tthen stop.\\nOctal \\101\\60\\0\\377\\12 and a space:\\s.\\\\u0041 stays.\""));
    }

    @Test
    void unicodeEscapesAreTranslatedFirstEvenOutsideStrings() {
        String source = constant("\\u0022You are calm and exact, caf\\u00e9 and \\uuu0041 included.\\u0022");
        CodePrompt prompt = only(find(Language.JAVA, source));
        assertEquals("You are calm and exact, caf\u00e9 and A included.", prompt.value());
        int accent = prompt.value().indexOf('\u00e9');
        assertFalse(prompt.map().isOneToOne(accent));
        assertEquals(source.indexOf("\\u00e9"), prompt.map().sourceOffset(accent));
        assertEquals(source.indexOf("\\u00e9") + 6, prompt.map().sourceEnd(accent));
        assertStartsAt(source, "\\u0022You", prompt);
    }

    @Test
    void plusJoinsLiteralsAndNamesTheExpressionsBetween() {
        String source = """
                class Assistant {
                    String userPrompt(String customer, Meter meter) {
                        String userPrompt = "Customer " + customer + " asks about meter "
                                + meter.number() + " read " + (days + 1) + " days ago.";
                        return userPrompt;
                    }
                }
                """;
        CodePrompt prompt = only(find(Language.JAVA, source));
        assertEquals("userPrompt", prompt.name());
        assertEquals(List.of("customer", "meter.number()", "(days + 1)"), List.copyOf(prompt.variableNames()));
        assertEquals("Customer customer asks about meter meter.number() read (days + 1) days ago.", prompt.value());
        assertStartsAt(source, "\"Customer", prompt);
    }

    @Test
    void formatSpecifiersAreVariablesNamedByTheirArguments() {
        String source = """
                class Assistant {
                    String reminderPrompt = String.format(Locale.ROOT,
                            "Remind %s that meter %2$s is read every %3$d days; %<d is usual, 100%% sure.%n",
                            customer, meter, days);
                    String followUpPrompt = "Ask %s whether the reading of %-10s looks right (%.1f).".formatted(who, meter);
                }
                """;
        CodePrompts found = find(Language.JAVA, source);
        CodePrompt reminder = named(found, "reminderPrompt");
        assertEquals("Remind %s that meter %2$s is read every %3$d days; %<d is usual, 100% sure.\n", reminder.value());
        assertEquals(List.of("customer", "meter", "days"), List.copyOf(reminder.variableNames()));
        assertEquals(List.of("%s", "%2$s", "%3$d", "%<d"), variablesAsWritten(source, reminder));
        CodePrompt followUp = named(found, "followUpPrompt");
        assertEquals(List.of("who", "meter", "%.1f"), List.copyOf(followUp.variableNames()));
    }

    @Test
    void aQuoteInACharacterLiteralOpensNoString() {
        String source = """
                class Assistant {
                    static final char QUOTE = '"', ESCAPED = '\\'';
                    static final String SYSTEM_PROMPT = "You are the meter-reading assistant, and you never round.";
                }
                """;
        assertEquals(Optional.of("system"), only(find(Language.JAVA, source)).role());
    }

    @Test
    void aTextBlockWithTextOnItsOpeningLineStopsTheFile() {
        CodePrompts found = find(Language.JAVA, constant("\"\"\"You are the meter assistant.\n\"\"\""));
        assertTrue(found.stopped().orElseThrow().startsWith("line 3, column 41: a text block's opening \"\"\" must end its line"),
                found.stopped().orElseThrow());
    }
}
