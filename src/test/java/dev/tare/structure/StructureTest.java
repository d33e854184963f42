package dev.tare.structure;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.source.SourceText;
import dev.tare.template.Message;
import dev.tare.template.PlaceholderSyntax;
import dev.tare.template.Template;
import dev.tare.template.TemplateParser;
import java.nio.file.Path;
import java.util.List;
import java.util.Optional;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/**
 * The structure model on small invented texts: Markdown blocks as the CommonMark specification
 * (0.31.2) and GitHub's table extension define them, and the layouts, examples, sections and
 * branches Tare adds. Each expectation is worked out by hand from the text.
 */
class StructureTest {

    private static Structure of(String text) {
        Template template = new TemplateParser(PlaceholderSyntax.DOUBLE_BRACE)
                .parse(new SourceText("a.md", Path.of("a.md"), text, false, text.length()), false);
        Message message = template.messages().get(0);
        return Structure.of(message.content(), message.segments(), template.bodyStart(), 0);
    }

    /** The role at the first character of the first occurrence of {@code needle}. */
    private static Role roleOf(String text, String needle) {
        int at = text.indexOf(needle);
        assertTrue(at >= 0, needle);
        return of(text).at(at).orElseThrow().role();
    }

    @Test
    void markdownBlocksGetTheirRoles() {
        String text = "# Title\n\nSome prose here.\n\n- an item\n- another\n\n> quoted words\n\n"
                + "```python\nprint(1)\n\n\nprint(2)\n```\n\n    indented code\n\n| a | b |\n|---|---|\n| 1 | 2 |\n\n<pre>\nraw  text\n</pre>\n";
        assertEquals(Role.HEADING, roleOf(text, "# Title"));
        assertEquals(Role.PROSE, roleOf(text, "Some prose"));
        assertEquals(Role.LIST_ITEM, roleOf(text, "an item"));
        assertEquals(Role.QUOTE, roleOf(text, "quoted"));
        assertEquals(Role.FENCED_CODE, roleOf(text, "print(1)"));
        assertEquals(Role.FENCED_CODE, of(text).at(text.indexOf("print(1)\n") + 9).orElseThrow().role(),
                "blank lines inside a fence are the fence's, though the parser gives them no span");
        assertEquals(Role.INDENTED_CODE, roleOf(text, "    indented"));
        assertEquals(Role.TABLE_ROW, roleOf(text, "| 1 | 2 |"));
        assertEquals(Role.HTML, roleOf(text, "<pre>"));
        assertEquals(Role.HTML, roleOf(text, "raw  text"), "preformatted HTML is no section of prose");
        assertEquals(Role.BLANK, of(text).at(text.indexOf("\n\n") + 1).orElseThrow().role());
    }

    @Test
    void fencesKnowTheirBodyAndInfo() {
        String text = "Intro.\n```json\n{\"a\": 1}\n```\nAfter.\n~~~\nopen to the end\n";
        List<Fence> fences = of(text).fences();
        assertEquals(2, fences.size());
        Fence json = fences.get(0);
        assertEquals("json", json.language());
        assertTrue(json.closed());
        assertEquals("{\"a\": 1}\n", text.substring(json.bodyStart(), json.bodyEnd()));
        assertEquals("```json\n{\"a\": 1}\n```\n", text.substring(json.start(), json.end()));
        assertFalse(fences.get(1).closed());
        assertEquals(text.length(), fences.get(1).end());
    }

    @Test
    void inlineCodeUrlsAndPlaceholdersAreTheirOwnRegions() {
        String text = "Run `make  all` for {{ name }} at https://example.org/x now.\n";
        assertEquals(Role.INLINE_CODE, roleOf(text, "`make"));
        assertEquals(Role.PLACEHOLDER, roleOf(text, "{{ name }}"));
        assertEquals(Role.URL, roleOf(text, "https://"));
        assertEquals(Role.PROSE, roleOf(text, " now."));
    }

    @Test
    void tabSeparatedLinesAreLaidOut() {
        String text = "Prose\twith one tab.\n\nname\tage\nAda\t36\n\nx\ty\tz\n\n\t\t\n";
        assertEquals(Role.PROSE, roleOf(text, "Prose"), "one tab between words, alone, is a slip");
        assertEquals(Role.TAB_SEPARATED, roleOf(text, "name"));
        assertEquals(Role.TAB_SEPARATED, roleOf(text, "Ada"));
        assertEquals(Role.TAB_SEPARATED, roleOf(text, "x\ty"), "two tabs on one line are columns");
        assertEquals(Role.TAB_SEPARATED, of(text).at(text.indexOf("\t\t\n")).orElseThrow().role(), "a row of empty cells");
    }

    @Test
    void alignedLinesAndDrawingsAreLaidOut() {
        String text = "Reply briefly.  Then stop.\n\n1   2   3\n\nName  Role\nAnna  Lead\n\n\u250c\u2500\u2510 box\n";
        assertEquals(Role.PROSE, roleOf(text, "Reply"), "two spaces after a full stop are a slip");
        assertEquals(Role.ALIGNED, roleOf(text, "1   2"));
        assertEquals(Role.ALIGNED, roleOf(text, "Name"));
        assertEquals(Role.ALIGNED, roleOf(text, "Anna"));
        assertEquals(Role.ALIGNED, roleOf(text, "\u250c"));
    }

    @Test
    void labelledExamplesAndDialogueAreExamples() {
        String text = "Classify the message.\n\nInput: my bill is high\nOutput: billing\n\nOutput format: one word.\n\n"
                + "Example 2:\n\nthe water is brown\n\nAnna: Hello.\nBen: Hi.\nAnna: The meter?\n";
        assertEquals(Role.PROSE, roleOf(text, "Classify"));
        assertEquals(Role.EXAMPLE, roleOf(text, "Input:"));
        assertEquals(Role.EXAMPLE, roleOf(text, "Output: billing"));
        assertEquals(Role.PROSE, roleOf(text, "Output format"), "a label that instructs is not an example");
        assertEquals(Role.EXAMPLE, roleOf(text, "the water"), "a bare label introduces the paragraph after it");
        assertEquals(Role.EXAMPLE, roleOf(text, "Ben: Hi."), "turns of speakers who speak again are dialogue");
    }

    @Test
    void aHeadingThatNamesExamplesMakesItsSectionExamples() {
        String text = "# Rules\n\nBe brief.\n\n## Examples\n\nThe customer asks twice.\n\n### One\n\nMore.\n\n\n\n# Style\n\nPlain words.\n";
        assertEquals(Role.PROSE, roleOf(text, "Be brief"));
        assertEquals(Role.EXAMPLE, roleOf(text, "The customer"));
        assertEquals(Role.HEADING, roleOf(text, "### One"));
        assertEquals(Role.EXAMPLE, roleOf(text, "More."));
        assertEquals(Role.BLANK, of(text).at(text.indexOf("More.") + 7).orElseThrow().role(),
                "blank lines before the next heading separate sections");
        assertEquals(Role.PROSE, roleOf(text, "Plain words"));
    }

    @Test
    void taggedSectionsAreReadAsMarkdownAndNamed() {
        String text = "<rules>\nBe brief.\n\n<example>\nSay hello.\n</example>\n</rules>\nOutside.\n";
        Structure structure = of(text);
        assertEquals(Role.SECTION_TAG, roleOf(text, "<rules>"));
        Region brief = structure.at(text.indexOf("Be brief")).orElseThrow();
        assertEquals(Role.PROSE, brief.role(), "a section's text is Markdown, not raw HTML");
        assertEquals(Optional.of("rules"), brief.section());
        Region hello = structure.at(text.indexOf("Say hello")).orElseThrow();
        assertEquals(Optional.of("example"), hello.section(), "the innermost section");
        assertEquals(Role.EXAMPLE, hello.role());
        assertEquals(Optional.empty(), structure.at(text.indexOf("Outside")).orElseThrow().section());
    }

    @Test
    void blockTagsOpenBranchesAndElseStartsAnother() {
        String text = "Always.\n{% if premium %}\nPremium.\n{% else %}\nBasic.\n{% endif %}\nAgain.\n{{#each items}}Item.{{/each}}\n";
        Structure structure = of(text);
        int always = structure.branchAt(text.indexOf("Always"));
        int premium = structure.branchAt(text.indexOf("Premium"));
        int basic = structure.branchAt(text.indexOf("Basic"));
        assertEquals(0, always);
        assertNotEquals(0, premium);
        assertNotEquals(premium, basic);
        assertEquals(0, structure.branchAt(text.indexOf("Again")));
        assertNotEquals(0, structure.branchAt(text.indexOf("Item.")));
        assertEquals(0, structure.branchAt(text.length() - 1), "the block closed");
    }

    @Test
    void aMustacheElseStartsAnotherBranchAndClosesNothing() {
        String text = "{{#if paperless}}\nEmail it.\n{{^}}\nPost it.\n{{/if}}\nDone.\n";
        Structure structure = of(text);
        int email = structure.branchAt(text.indexOf("Email"));
        assertNotEquals(0, email);
        assertNotEquals(email, structure.branchAt(text.indexOf("Post")));
        assertNotEquals(0, structure.branchAt(text.indexOf("Post")));
        assertEquals(0, structure.branchAt(text.indexOf("Done")));
    }

    @Test
    void anAssignmentIsNoBlock() {
        String text = "{% set tone = 'calm' %}\nBe calm.\n";
        assertEquals(0, of(text).branchAt(text.indexOf("Be calm")));
    }

    @Test
    void rawSectionsAreKeptAsWritten() {
        String text = "Show {% raw %}{{ literally }}  this{% endraw %} please.\n";
        assertEquals(Role.RAW, roleOf(text, "{{ literally"));
        assertTrue(of(text).verbatimBlocks().stream().anyMatch(t -> t.contains("{{ literally }}  this")));
    }

    @Test
    void whitespaceEditsAreAllowedInProseOnly() {
        String text = "Prose line.  \n\nInput: x  \n\n```\ncode  \n```\n";
        Structure structure = of(text);
        int prose = text.indexOf(".  ") + 1;
        assertTrue(structure.allowsWhitespaceEdit(prose, prose + 2));
        int example = text.indexOf("x  ") + 1;
        assertFalse(structure.allowsWhitespaceEdit(example, example + 2));
        int code = text.indexOf("code  ") + 4;
        assertFalse(structure.allowsWhitespaceEdit(code, code + 2));
    }

    @Test
    void instructionsAreProseOrListItemsInOneBranchOutsideSections() {
        String text = "Check the meter first.\n\n- Call back.\n\n> Quoted rule here.\n\n<notes>\nA note.\n</notes>\n";
        Structure structure = of(text);
        assertTrue(structure.isInstruction(0, "Check the meter first.".length()));
        int item = text.indexOf("Call back.");
        assertTrue(structure.isInstruction(item, item + 10));
        int quote = text.indexOf("Quoted");
        assertFalse(structure.isInstruction(quote, quote + 6));
        int note = text.indexOf("A note.");
        assertFalse(structure.isInstruction(note, note + 7));
    }

    @Test
    void regionsCoverTheTextAndTouchingAnswersAsAWalkDoes() {
        SplittableRandom random = new SplittableRandom(7);
        String[] pieces = {"word ", "  ", "\t", "\n", "\n\n", "# H\n", "- item\n", "`c`", "{{ v }}", "```\nx\n```\n",
                "Input: a\n", "1   2\n", "<ex>\n", "</ex>\n", "{% if a %}", "{% endif %}"};
        for (int round = 0; round < 200; round++) {
            StringBuilder text = new StringBuilder();
            // Blocks must balance to parse: a stray end is left out, and open blocks are closed at the end.
            int open = 0;
            for (int i = 0; i < 30; i++) {
                String piece = pieces[random.nextInt(pieces.length)];
                if (piece.equals("{% endif %}") && open == 0) {
                    continue;
                }
                open += piece.equals("{% if a %}") ? 1 : piece.equals("{% endif %}") ? -1 : 0;
                text.append(piece);
            }
            text.append("{% endif %}".repeat(open));
            Structure structure = of(text.toString());
            List<Region> regions = structure.regions();
            int at = 0;
            for (Region region : regions) {
                assertEquals(at, region.start(), text.toString());
                assertTrue(region.end() > region.start());
                at = region.end();
            }
            assertEquals(text.length(), at);
            for (int k = 0; k < 30; k++) {
                int from = random.nextInt(text.length() + 1);
                int to = Math.min(text.length(), from + random.nextInt(12));
                List<Region> walked = regions.stream().filter(r -> r.overlaps(from, to) || (from == to && r.start() <= from
                        && r.end() >= from && (from < text.length() || r.end() == from))).toList();
                List<Region> touching = structure.touching(from, to);
                if (from < to) {
                    assertEquals(walked, touching, "[" + from + ", " + to + ") of " + text);
                } else {
                    assertTrue(walked.containsAll(touching), "[" + from + ") of " + text);
                }
            }
        }
    }
}
