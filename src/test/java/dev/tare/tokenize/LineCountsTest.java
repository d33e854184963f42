package dev.tare.tokenize;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

class LineCountsTest {
    private final TokenizerRegistry registry = new TokenizerRegistry();

    @Test
    void aSafeLineStartIsAfterABreakBeforeAVisibleAsciiCharOtherThanASlash() {
        Tokenizer o200k = registry.get("o200k_base", Path.of("."));
        String text = "Be brief.\nAnswer in English.\n  indented\n/path\n\u00C9cole\n- last";
        LineCounts counted = o200k.countLines(text);
        int answer = text.indexOf("Answer");
        int last = text.indexOf("- last");
        assertArrayEquals(new int[] {answer, last}, counted.starts());
        assertArrayEquals(new int[] {o200k.count(text.substring(0, answer)), o200k.count(text.substring(0, last))},
                counted.before());
        assertEquals(o200k.count(text), counted.total());
    }

    @Test
    void anEncodingWhosePiecesRunAcrossLinesHasNoSafeLineStarts() {
        Tokenizer p50k = registry.get("p50k_base", Path.of("."));
        LineCounts counted = p50k.countLines("one \ntwo\nthree");
        assertEquals(0, counted.starts().length);
        assertEquals(p50k.count("one \ntwo\nthree"), counted.total());
    }

    /**
     * The count of an edited text from the original's line counts equals counting it whole, on every
     * built-in encoding, over random texts of tricky lines with lines replaced, added and removed in up
     * to three places.
     */
    @Test
    void theCountOfAnEditedTextIsTheCountOfTheWholeText() {
        SplittableRandom random = new SplittableRandom(20261205);
        for (String name : TokenizerRegistry.BUILT_IN) {
            Tokenizer tokenizer = registry.get(name, Path.of("."));
            for (int i = 0; i < 5_000; i++) {
                List<String> lines = lines(random, random.nextInt(12));
                List<String> edited = new ArrayList<>(lines);
                for (int edits = 1 + random.nextInt(3); edits > 0; edits--) {
                    int from = random.nextInt(edited.size() + 1);
                    int to = from + random.nextInt(edited.size() - from + 1);
                    edited.subList(from, to).clear();
                    edited.addAll(from, lines(random, random.nextInt(4)));
                }
                String text = String.join("", lines);
                String other = String.join("", edited);
                assertEquals(tokenizer.count(other), tokenizer.countLines(text).countOf(other, text, tokenizer),
                        () -> name + ": " + escaped(text) + " edited to " + escaped(other));
            }
        }
    }

    private static List<String> lines(SplittableRandom random, int count) {
        List<String> lines = new ArrayList<>();
        for (int i = 0; i < count; i++) {
            String start = random.nextBoolean() ? "Step " : "";
            String end = random.nextInt(5) == 0 ? "" : random.nextInt(4) == 0 ? "\r\n" : "\n";
            lines.add(start + TrickyText.next(random, 6) + end);
        }
        return lines;
    }

    private static String escaped(String text) {
        StringBuilder out = new StringBuilder("\"");
        text.codePoints().forEach(c -> out.append(c >= 0x20 && c < 0x7f ? Character.toString(c) : String.format("\\u%04X", c)));
        return out.append('"').toString();
    }
}
