package dev.tare.rewrite;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import dev.tare.cli.Cli;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The five ways issue 19 saw a "safe" fix change what a prompt tells the model, each replayed through the
 * command line on a small invented repository (the support desk of a water utility): repeated-instruction
 * deleting examples, dialogue, code and per-section headings; prose-tab and space-run flattening
 * tab-separated and aligned text and indentation; a rule pack declaring a word-deleting rule safe;
 * repeated-instruction matching across a conditional block and across chat messages; and
 * invisible-character removing joiners a script or an emoji sequence needs. Each behaviour that must
 * be kept has a twin that must still be fixed or flagged, so that a fix that does nothing cannot pass.
 */
class SafeRewriteReproductionTest {
    private static final String CONFIG = "templates: {include: [\"prompts/**/*.md\", \"prompts/**/*.yaml\"]}\n";
    private static final ObjectMapper JSON = new ObjectMapper();

    @TempDir
    Path dir;

    private Path write(String path, String text) throws IOException {
        Path file = dir.resolve(path);
        Files.createDirectories(file.getParent());
        return Files.writeString(file, text, StandardCharsets.UTF_8);
    }

    /** A repository holding {@code tare.yaml} and one prompt; returns the prompt's path. */
    private Path prompt(String path, String text) throws IOException {
        write("tare.yaml", CONFIG);
        return write(path, text);
    }

    /**
     * Runs the default (safe only) fix and returns the file's text afterwards, with tabs, no-break
     * spaces and other characters one cannot see spelled out, so that a failure shows what changed.
     */
    private String fixed(Path file) throws IOException {
        Cli.Run run = Cli.run("fix", dir.toString());
        assertTrue(run.exitCode() == 0 || run.exitCode() == 1, () -> "fix exit " + run.exitCode() + ": " + run.err() + run.out());
        return visible(Files.readString(file, StandardCharsets.UTF_8));
    }

    /** {@code text} with backslashes doubled and tabs and invisible or no-break characters as escapes; one-to-one. */
    private static String visible(String text) {
        StringBuilder out = new StringBuilder();
        text.codePoints().forEach(c -> out.append(c == '\\' ? "\\\\" : c == '\t' ? "\\t"
                : c == 0xA0 || c == 0x202F || c == 0x2007 || c == 0xAD || c >= 0x200B && c <= 0x200D || c == 0x2060 || c == 0xFEFF
                ? String.format("\\u%04X", c) : new String(Character.toChars(c))));
        return out.toString();
    }

    /** The findings of {@code rule} that {@code tare check --format json} reports for {@code path}. */
    private List<JsonNode> findings(String path, String rule) throws IOException {
        Cli.Run run = Cli.run("check", dir.toString(), "--format", "json", "--no-cache");
        assertTrue(run.exitCode() == 0 || run.exitCode() == 1, () -> "check exit " + run.exitCode() + ": " + run.err() + run.out());
        List<JsonNode> found = new ArrayList<>();
        for (JsonNode finding : JSON.readTree(run.out()).path("findings")) {
            if (finding.path("path").asText().equals(path) && finding.path("rule").asText().equals(rule)) {
                found.add(finding);
            }
        }
        return found;
    }

    private static String lines(List<JsonNode> findings) {
        return findings.stream().map(f -> "line " + f.path("line").asInt() + ": " + f.path("message").asText()).toList().toString();
    }

    // --- 1. repeated-instruction deleted examples, dialogue, code and headings ------------------------

    private static final String FEW_SHOT = """
            Sort each message from a customer of Alder Creek Water into a queue.

            Input: My basement floor is wet next to the meter.
            Output: Send it to the leak crew queue.

            Input: Water is pooling by the shut-off valve at the curb.
            Output: Send it to the leak crew queue.

            Input: Why is my bill twice as high as last month?
            Output: Send it to the billing queue.
            """;

    private static final String DIALOGUE = """
            Follow the tone of this call:

            Customer: My tap water has turned brown since this morning.
            Agent: I am sorry about that. Please run the cold tap for two minutes.
            Customer: Sorry, the line is bad. What should I do?
            Agent: I am sorry about that. Please run the cold tap for two minutes.
            Customer: It is clear now, thank you.
            """;

    private static final String FENCED_CODE = """
            The outage page embeds one map per zone, like this:

            ```html
            <div id="north"></div>
            <script type="module">
            showOutageMap("north");
            </script>
            <div id="south"></div>
            <script type="module">
            showOutageMap("south");
            </script>
            ```
            """;

    /** Code pasted into an example without a fence, as prompts that convert or review code often hold it. */
    private static final String UNFENCED_CODE = """
            Turn the component in the example into plain Markdown.

            <example>
            <script setup>
            import { useOutage } from './outage'

            const { zone } = useOutage()
            </script>

            <template>
              <OutageMap :zone="zone" />
            </template>

            <script setup>
            import { useOutage, useBanner } from './outage'

            const { zone } = useOutage()
            </script>

            <template>
              <OutageBanner :zone="zone" />
            </template>
            </example>
            """;

    private static final String HEADINGS = """
            ## Burst pipe

            ### What to tell the caller

            Shut the main valve under the kitchen sink.

            ## Low pressure

            ### What to tell the caller

            Check whether the neighbours have the same problem.
            """;

    private static final String RULES = """
            Rule 1: flag any meter reading above 9000 litres a day.
            The above rule matches both examples below:
            - 9400 litres on the 3rd
            - 12000 litres on the 4th

            Rule 2: flag any meter with no reading for 60 days.
            The above rule matches both examples below:
            - last read in March
            - never read since it was fitted
            """;

    @Test
    void fewShotExamplesThatShareAnOutputLineAreKept() throws IOException {
        Path file = prompt("prompts/sort.md", FEW_SHOT);
        assertEquals(visible(FEW_SHOT), fixed(file));
    }

    @Test
    void aRepeatedLineOfADialogueIsKept() throws IOException {
        Path file = prompt("prompts/tone.md", DIALOGUE);
        assertEquals(visible(DIALOGUE), fixed(file));
    }

    @Test
    void repeatedCodeLinesInsideAFencedExampleAreKept() throws IOException {
        Path file = prompt("prompts/maps.md", FENCED_CODE);
        assertEquals(visible(FENCED_CODE), fixed(file));
    }

    @Test
    void repeatedCodeLinesOfAnUnfencedExampleAreKept() throws IOException {
        Path file = prompt("prompts/component.md", UNFENCED_CODE);
        assertEquals(visible(UNFENCED_CODE), fixed(file));
    }

    @Test
    void aHeadingRepeatedInEachSectionIsKept() throws IOException {
        Path file = prompt("prompts/faults.md", HEADINGS);
        assertEquals(visible(HEADINGS), fixed(file));
    }

    @Test
    void aSentenceRepeatedUnderEachOfTwoRulesIsKept() throws IOException {
        Path file = prompt("prompts/rules.md", RULES);
        assertEquals(visible(RULES), fixed(file));
    }

    @Test
    void repeatedInstructionDoesNotFlagExamplesDialogueOrCode() throws IOException {
        prompt("prompts/sort.md", FEW_SHOT);
        write("prompts/tone.md", DIALOGUE);
        write("prompts/maps.md", FENCED_CODE);
        write("prompts/component.md", UNFENCED_CODE);
        List<JsonNode> found = new ArrayList<>();
        for (String path : List.of("prompts/sort.md", "prompts/tone.md", "prompts/maps.md", "prompts/component.md")) {
            found.addAll(findings(path, "repeated-instruction"));
        }
        assertEquals(List.of(), found, () -> "flagged " + found);
    }

    @Test
    void repeatedInstructionIsAReviewRule() throws IOException {
        Cli.Run run = Cli.run("rules", "--format", "json");
        assertEquals(0, run.exitCode(), run.err());
        JsonNode rule = null;
        for (JsonNode candidate : JSON.readTree(run.out()).path("rules")) {
            rule = candidate.path("id").asText().equals("repeated-instruction") ? candidate : rule;
        }
        assertTrue(rule != null, run.out());
        assertEquals("review", rule.path("class").asText(), "removing a sentence is a text edit, never safe");
    }

    // --- 2. whitespace rules flattened tab-separated and aligned text and indentation --------------

    @Test
    void aTabSeparatedTableKeepsItsTabs() throws IOException {
        String text = "Pressure by zone this morning:\n\nzone\tpressure\tstatus\nnorth\t42 psi\tok\nsouth\t18 psi\tlow\n";
        Path file = prompt("prompts/zones.md", text);
        assertEquals(visible(text), fixed(file));
    }

    @Test
    void aScaleAlignedWithSpacesKeepsItsSpaces() throws IOException {
        String text = "Ask the caller to rate the water pressure:\n\n1   2   3   4   5\nlow         high\n";
        Path file = prompt("prompts/scale.md", text);
        assertEquals(visible(text), fixed(file));
    }

    @Test
    void aProseFixBesideAnAlignedLineIsWrittenEvenWhenItsGapsThenLineUp() throws IOException {
        // Found by SafeRewritePropertiesTest: taking one space out of the prose line moves its second
        // gap to the column where the aligned line's first gap ends, so the prose line would now be
        // read as aligned too. The aligned line is byte for byte the same, so the fix is safe.
        String text = "Answer  `a  b`\npressures  42 psi   ok\n";
        Path file = prompt("prompts/zones.md", text);
        assertEquals(visible("Answer `a  b`\npressures  42 psi   ok\n"), fixed(file));
    }

    @Test
    void indentationInsideAnExampleIsKept() throws IOException {
        String text = """
                Answer in this shape:

                <example>
                Dear customer,
                    your visit is booked for Tuesday morning.
                        Please leave the meter pit uncovered.
                Alder Creek Water
                </example>
                """;
        Path file = prompt("prompts/letter.md", text);
        assertEquals(visible(text), fixed(file));
    }

    @Test
    void anExampleIndentedWithNoBreakSpacesKeepsItsIndentation() throws IOException {
        // Text pasted from a word processor often indents with no-break spaces; turning them into
        // spaces is a whitespace edit of leading indentation, which is never safe.
        String text = "Answer in this shape:\n\nExample:\n\u00A0\u00A0Dear customer,\n"
                + "\u00A0\u00A0\u00A0\u00A0your visit is booked for Tuesday morning.\n";
        Path file = prompt("prompts/pasted.md", text);
        assertEquals(visible(text), fixed(file));
    }

    @Test
    void aDoubleSpaceBetweenWordsOfProseIsStillFixed() throws IOException {
        Path file = prompt("prompts/short.md", "Keep every reply short  and friendly.\n");
        assertEquals(visible("Keep every reply short and friendly.\n"), fixed(file));
    }

    // --- 3. a rule pack could declare a word-deleting rule safe --------------------------------------

    private static String pack(String rewriteClass) {
        return "rules:\n"
                + "  - id: drop-not\n"
                + "    summary: \"Drops the word 'not'.\"\n"
                + "    why: \"One token fewer per call.\"\n"
                + "    class: " + rewriteClass + "\n"
                + "    severity: info\n"
                + "    scope: prose\n"
                + "    find: 'not '\n"
                + "    replace: ''\n"
                + "    examples:\n"
                + "      - before: \"Do not approve refunds.\\n\"\n"
                + "        after: \"Do approve refunds.\\n\"\n";
    }

    private Path packRepository(String rewriteClass) throws IOException {
        write("tare.yaml", CONFIG + "rules: {packs: [rules]}\n");
        write("rules/house.yaml", pack(rewriteClass));
        return write("prompts/refunds.md", "Do not approve refunds without a supervisor.\n");
    }

    @Test
    void aPackRuleThatDeletesAWordCannotBeSafeForCheck() throws IOException {
        packRepository("safe");
        assertRefusedPack(Cli.run("check", dir.toString()));
    }

    @Test
    void aPackRuleThatDeletesAWordCannotBeSafeForFix() throws IOException {
        Path file = packRepository("safe");
        assertRefusedPack(Cli.run("fix", dir.toString()));
        assertEquals("Do not approve refunds without a supervisor.\n", Files.readString(file));
    }

    private static void assertRefusedPack(Cli.Run run) {
        assertEquals(2, run.exitCode(), () -> "a pack declaring a text edit safe is a configuration error\n" + run.out() + run.err());
        String err = run.err().strip();
        assertEquals(1, err.lines().count(), err);
        assertTrue(err.contains("house.yaml") && err.contains("line") && err.contains("safe"),
                "names the pack file, the rule's line and why: " + err);
    }

    @Test
    void theSamePackRuleLoadsAsReview() throws IOException {
        Path file = packRepository("review");
        Cli.Run check = Cli.run("check", dir.toString());
        assertEquals(0, check.exitCode(), check.err() + check.out());
        assertEquals(visible("Do not approve refunds without a supervisor.\n"), fixed(file), "a review rewrite is not applied by default");
    }

    // --- 4. repeated-instruction matched across a conditional block and across messages ------------

    @Test
    void aSentenceIsNotARepeatOfItsCopyInsideAConditionalBlock() throws IOException {
        prompt("prompts/plans.md", """
                {% if premium %}
                Premium customers may skip one instalment a year.
                Always confirm the account number before you continue.
                {% endif %}
                Always confirm the account number before you continue.
                """);
        List<JsonNode> found = findings("prompts/plans.md", "repeated-instruction");
        assertEquals(List.of(), found, () -> "without premium the only copy would go: " + lines(found));
    }

    @Test
    void aUserMessageIsNotARepeatOfTheSystemMessage() throws IOException {
        prompt("prompts/chat.yaml", """
                messages:
                  - role: system
                    content: |
                      You answer questions for the Alder Creek Water support desk.
                      Never read out a full account number.
                  - role: user
                    content: |
                      Never read out a full account number. What is my balance?
                """);
        List<JsonNode> found = findings("prompts/chat.yaml", "repeated-instruction");
        assertEquals(List.of(), found, () -> "the user's words are theirs, not a repeat: " + lines(found));
    }

    @Test
    void aSentenceTwiceInOneProseMessageIsStillFlagged() throws IOException {
        prompt("prompts/twice.yaml", """
                messages:
                  - role: system
                    content: |
                      Never read out a full account number.

                      Check the meter reading before you quote a bill.

                      Never read out a full account number.
                """);
        List<JsonNode> found = findings("prompts/twice.yaml", "repeated-instruction");
        assertEquals(1, found.size(), () -> lines(found));
    }

    // --- 5. invisible-character removed joiners that a script or an emoji sequence needs ----------

    @Test
    void theZeroWidthJoinerOfADevanagariConjunctIsKept() throws IOException {
        // क्‍ष: KA, VIRAMA, ZERO WIDTH JOINER, SSA; the joiner asks for the half form of KA.
        String text = "Sign replies to the Hindi desk with the code \u0915\u094D\u200D\u0937.\n";
        Path file = prompt("prompts/hindi.md", text);
        assertEquals(visible(text), fixed(file));
    }

    @Test
    void theZeroWidthJoinerOfAnEmojiSequenceIsKept() throws IOException {
        // WOMAN, ZERO WIDTH JOINER, PERSONAL COMPUTER: one picture of a technologist, two without the joiner.
        String text = "Mark tickets for the app team with \uD83D\uDC69\u200D\uD83D\uDCBB.\n";
        Path file = prompt("prompts/emoji.md", text);
        assertEquals(visible(text), fixed(file));
    }

    @Test
    void aZeroWidthSpaceBetweenLatinLettersIsStillRemoved() throws IOException {
        Path file = prompt("prompts/latin.md", "Ask for the adjust\u200Bment date.\n");
        assertEquals(visible("Ask for the adjustment date.\n"), fixed(file));
    }
}
