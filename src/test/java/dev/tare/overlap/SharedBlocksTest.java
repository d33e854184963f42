package dev.tare.overlap;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.lint.RuleHarness;
import dev.tare.template.Template;
import dev.tare.tokenize.Tokenizer;
import dev.tare.tokenize.TokenizerRegistry;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;

/**
 * Shared blocks in hand-built template sets whose answer is known by construction: which runs of
 * words two or more templates hold, where each copy stands, and which nested or overlapping runs
 * are blocks of their own. Token counts are Tare's o200k_base, which TiktokenReferenceTest checks
 * against the reference encoder; each test first checks that its pieces are on the intended side of
 * the minimum, so that a change of tokenizer shows as a broken premise rather than a wrong answer.
 */
class SharedBlocksTest {
    private static final Tokenizer O200K = new TokenizerRegistry().get("o200k_base", Path.of("."));
    private static final int MIN = 20;

    private static final String X = "Harbour pilots board inbound freighters at the outer buoy, two nautical miles east"
            + " of the breakwater, and stay on the bridge until every mooring line is fast.";
    private static final String Y = "Tug crews answer on channel twelve; give them the berth number, the draught in"
            + " metres and the expected time alongside before the tow line goes across.";
    private static final String Z = "Customs officers meet each arrival on the quay with the cargo manifest, the crew"
            + " list and the certificate of the last port, and nobody lands before they sign.";

    @Test
    void thePiecesAreOnTheIntendedSideOfTheMinimum() {
        for (String piece : List.of(X, Y, Z)) {
            assertTrue(O200K.count(piece) >= MIN, piece);
        }
        assertTrue(O200K.count("Note well.") < MIN);
    }

    @Test
    void aParagraphInTwoTemplatesIsOneBlockWithBothPlaces() {
        Map<String, String> files = files(
                "a.md", "Start of the first prompt.\n\n" + X + "\n\nFirst prompt ends here.\n",
                "b.md", "Quite another opening line.\n\n" + X + "\n",
                "c.md", "Nothing in common at all with the others, only this line.\n");
        List<RepeatedBlock> blocks = find(files);
        assertEquals(1, blocks.size());
        RepeatedBlock block = blocks.get(0);
        assertEquals(X, block.text());
        assertEquals(List.of("a.md", "b.md"), block.paths());
        assertEquals(List.of(X, X), copies(block, files));
        assertEquals(O200K.count(X), block.tokens());
    }

    @Test
    void copiesDifferingOnlyInWhitespaceAreTheSameBlock() {
        String reflowed = X.replace(" two nautical", "\ntwo nautical").replace("the bridge", "the  bridge")
                .replace(" and stay", "\t and stay").replace("east", "east  \n");
        Map<String, String> files = files(
                "a.md", "Arrivals desk.\n\n" + X + "\n\nSigned, the harbour master.\n",
                "b.md", "Departures office.\n\n" + reflowed + "\n\nEnd of notice.\n");
        List<RepeatedBlock> blocks = find(files);
        assertEquals(1, blocks.size());
        assertEquals(List.of(X, reflowed), copies(blocks.get(0), files));
    }

    @Test
    void aBlockNestedInAWiderSharedOneIsItsOwnBlockWhenItAddsEnough() {
        // a and b share X Y Z; c shares only Y. X and Z add far more than the minimum beyond Y, so both
        // the pair's block and the trio's block are found.
        Map<String, String> files = files(
                "a.md", "Arrivals desk.\n\n" + X + " " + Y + " " + Z + "\n\nPrompt a is over.\n",
                "b.md", "Departures office.\n\n" + X + "\n" + Y + "\n" + Z + "\n",
                "c.md", "Weather watch.\n\n" + Y + "\n\nPrompt c is over.\n");
        List<RepeatedBlock> blocks = find(files);
        assertEquals(2, blocks.size(), blocks.toString());
        assertEquals(List.of("a.md", "b.md"), blocks.get(0).paths());
        assertEquals(X + " " + Y + " " + Z, blocks.get(0).text());
        assertEquals(List.of("a.md", "b.md", "c.md"), blocks.get(1).paths());
        assertEquals(Y, blocks.get(1).text());
    }

    @Test
    void aBlockAddingLessThanTheMinimumAroundAWiderSharedOneIsNotReportedAgain() {
        // a and b put "Note well." before Y and "Thank you." after it; c has Y alone. The pair's block
        // would be Y plus a handful of tokens, so only the trio's block is found.
        Map<String, String> files = files(
                "a.md", "Prompt a begins.\n\nNote well. " + Y + " Thank you.\n",
                "b.md", "Prompt b begins.\n\nNote well. " + Y + " Thank you.\n",
                "c.md", "Weather watch.\n\n" + Y + "\n");
        List<RepeatedBlock> blocks = find(files);
        assertEquals(1, blocks.size(), blocks.toString());
        assertEquals(Y, blocks.get(0).text());
        assertEquals(List.of("a.md", "b.md", "c.md"), blocks.get(0).paths());
    }

    @Test
    void aWiderBlockAroundAPieceBelowTheMinimumIsFoundWhole() {
        // The trio shares only "Note well.", below the minimum, so the pair's X-and-note block stands alone.
        Map<String, String> files = files(
                "a.md", "Arrivals desk.\n\n" + X + " Note well.\n",
                "b.md", "Departures office.\n\n" + X + " Note well.\n",
                "c.md", "Prompt c begins.\n\nNote well.\n");
        List<RepeatedBlock> blocks = find(files);
        assertEquals(1, blocks.size(), blocks.toString());
        assertEquals(X + " Note well.", blocks.get(0).text());
        assertEquals(List.of("a.md", "b.md"), blocks.get(0).paths());
    }

    @Test
    void overlappingBlocksAreEachFound() {
        // a and b share X Y; b and c share Y Z; the three share only Y, here cut below the minimum by
        // taking its first words. The two blocks overlap in b.
        String y = "Tug crews answer on channel twelve.";
        assertTrue(O200K.count(y) < MIN);
        Map<String, String> files = files(
                "a.md", "Arrivals desk.\n\n" + X + " " + y + "\n\nPrompt a is over.\n",
                "b.md", "Departures office.\n\n" + X + " " + y + " " + Z + "\n",
                "c.md", "Weather watch.\n\n" + y + " " + Z + "\n\nPrompt c is over.\n");
        List<RepeatedBlock> blocks = find(files);
        assertEquals(2, blocks.size(), blocks.toString());
        assertEquals(X + " " + y, blocks.get(0).text());
        assertEquals(List.of("a.md", "b.md"), blocks.get(0).paths());
        assertEquals(y + " " + Z, blocks.get(1).text());
        assertEquals(List.of("b.md", "c.md"), blocks.get(1).paths());
        RepeatedBlock.Place inB = blocks.get(0).places().get(1);
        RepeatedBlock.Place alsoInB = blocks.get(1).places().get(0);
        assertTrue(alsoInB.start() < inB.end(), "the two copies in b overlap");
    }

    @Test
    void placeholdersEndABlock() {
        Map<String, String> files = files(
                "a.md", "Arrivals desk.\n\n" + X + " {{ berth }} " + Z + "\n",
                "b.md", "Departures office.\n\n" + X + " " + Z + "\n");
        List<RepeatedBlock> blocks = find(files);
        assertEquals(List.of(X, Z), blocks.stream().map(RepeatedBlock::text).toList());
    }

    @Test
    void aBlockTwiceInOneTemplateAndOnceInAnotherHasThreePlaces() {
        Map<String, String> files = files(
                "a.md", "First section.\n\n" + X + "\n\nSecond section.\n\n" + X + "\n",
                "b.md", "Only once here.\n\n" + X + "\n");
        List<RepeatedBlock> blocks = find(files);
        assertEquals(1, blocks.size());
        assertEquals(3, blocks.get(0).places().size());
        assertEquals(List.of("a.md", "b.md"), blocks.get(0).paths());
    }

    @Test
    void aRepeatWithinOneTemplateOnlyOrBelowTheMinimumIsNoBlock() {
        assertEquals(List.of(), find(files("a.md", X + "\n\n" + X + "\n", "b.md", "Something else.\n")));
        assertEquals(List.of(), find(files("a.md", "Note well. Keep it short.\n", "b.md", "Note well. Keep it short.\n")));
    }

    @Test
    void chatMessagesAndPartialsArePlacesAndToolFilesAreNot() {
        Map<String, String> files = files(
                "prompts/partials/pilots.md", X + "\n",
                "prompts/arrival.chat.yaml", "messages:\n  - role: system\n    content: |\n      Arrivals desk.\n\n      "
                        + X + "\n  - role: user\n    content: \"{{ question }}\"\n",
                "tools/port.tools.json", "[{\"name\": \"berth\", \"description\": \"" + X + "\"}]\n");
        List<RepeatedBlock> blocks = find(files);
        assertEquals(1, blocks.size());
        assertEquals(List.of("prompts/arrival.chat.yaml", "prompts/partials/pilots.md"), blocks.get(0).paths());
        assertEquals(0, blocks.get(0).places().get(0).message());
    }

    @Test
    void wordsGatheredInAnyOrderGiveTheBlocksOfTheTemplatesAndOnlyTheirHoldersAreAskedForAgain() {
        Map<String, String> files = files(
                "a.md", "Start of the first prompt.\n\n" + X + "\n\n" + Y + "\n",
                "b.md", Y + "\n\nQuite another opening line.\n\n" + X + "\n",
                "c.md", "Nothing in common at all with the others, only this line: " + Z + "\n",
                "d.md", "Yet another: " + Y + "\n");
        RepositoryWords words = new RepositoryWords();
        List<String> reversed = new ArrayList<>(files.keySet());
        java.util.Collections.reverse(reversed);
        reversed.forEach(path -> words.add(RuleHarness.template(path, files.get(path))));
        List<String> asked = new ArrayList<>();
        List<RepeatedBlock> blocks = SharedBlocks.find(words, path -> {
            asked.add(path);
            return RuleHarness.template(path, files.get(path));
        }, O200K, MIN);
        assertEquals(find(files), blocks);
        assertEquals(2, blocks.size());
        assertTrue(!asked.contains("c.md"), "c.md holds no block, so it is not parsed again: " + asked);
        assertTrue(asked.containsAll(List.of("a.md", "b.md", "d.md")), asked.toString());
    }

    @Test
    void aTemplateWhoseWordsChangedAfterTheyWereGatheredIsRefused() {
        Map<String, String> files = files("a.md", X + "\n", "b.md", "Opening.\n\n" + X + "\n");
        RepositoryWords words = new RepositoryWords();
        files.forEach((path, text) -> words.add(RuleHarness.template(path, text)));
        dev.tare.TareException e = org.junit.jupiter.api.Assertions.assertThrows(dev.tare.TareException.class,
                () -> SharedBlocks.find(words, path -> RuleHarness.template(path, "An edit: " + files.get(path)), O200K,
                        MIN));
        assertTrue(e.getMessage().startsWith("a.md changed"), e.getMessage());
    }

    private static Map<String, String> files(String... pathsAndTexts) {
        Map<String, String> files = new LinkedHashMap<>();
        for (int i = 0; i < pathsAndTexts.length; i += 2) {
            files.put(pathsAndTexts[i], pathsAndTexts[i + 1]);
        }
        return files;
    }

    private static List<RepeatedBlock> find(Map<String, String> files) {
        List<Template> templates = new ArrayList<>();
        files.forEach((path, text) -> templates.add(RuleHarness.template(path, text)));
        return SharedBlocks.find(templates, O200K, MIN);
    }

    /** The text of each place, cut from its template's message. */
    private static List<String> copies(RepeatedBlock block, Map<String, String> files) {
        List<String> copies = new ArrayList<>();
        for (RepeatedBlock.Place place : block.places()) {
            Template template = RuleHarness.template(place.path(), files.get(place.path()));
            copies.add(template.messages().get(place.message()).content().substring(place.start(), place.end()));
        }
        return copies;
    }
}
