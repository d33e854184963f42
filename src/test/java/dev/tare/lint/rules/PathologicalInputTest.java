package dev.tare.lint.rules;

import static dev.tare.lint.RuleHarness.findings;
import static dev.tare.lint.RuleHarness.fixed;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.lint.Finding;
import java.util.List;
import java.util.stream.IntStream;
import org.junit.jupiter.api.Test;

/**
 * The findings on the rule-engine benchmark's pathological inputs (see {@code bench.RuleEngineBenchmark}),
 * at sizes a unit test can afford: what each rule must still report once the engine is linear on them.
 * Speed itself is measured by the benchmark, never asserted here.
 */
class PathologicalInputTest {
    private static final String LINE = "Always read the booking reference back to the passenger before you change anything.\n";

    @Test
    void tenThousandIdenticalLinesAreNineThousandNineHundredNinetyNineRepeats() {
        String text = LINE.repeat(10_000);
        List<Finding> found = findings(new RepeatedInstruction(), text);
        assertEquals(9_999, found.size());
        assertEquals(IntStream.rangeClosed(2, 10_000).boxed().toList(), found.stream().map(Finding::line).toList());
        assertTrue(found.stream().allMatch(f -> f.column() == 1 && f.endColumn() == LINE.length()
                && f.related().get(0).line() == 1 && f.rewrite().isPresent()));
        assertEquals("repeats the sentence on line 1 word for word; drop this copy after checking the prompt reads the same",
                found.get(9_998).message());
        assertEquals(LINE, fixed(new RepeatedInstruction(), text));
        assertTrue(findings(new NearDuplicateInstruction(), text).isEmpty(), "exact repeats are not near duplicates");
        assertTrue(findings(new TrailingWhitespace(), text).isEmpty());
        assertTrue(findings(new BlankLines(), text).isEmpty());
    }

    @Test
    void aLongRunOfSpacesBetweenTwoWordsIsLayoutLeftAlone() {
        // Three spaces or more inside a line are read as layout, which a safe rewrite never touches.
        String text = "Reply" + " ".repeat(65_536) + "briefly.\n";
        assertTrue(findings(new SpaceRun(), text).isEmpty());
        assertEquals(text, fixed(new SpaceRun(), text));
        assertTrue(findings(new TrailingWhitespace(), text).isEmpty());
        assertTrue(findings(new ProseTab(), text).isEmpty());
    }

    @Test
    void aLineOfNothingButSpacesIsOneTrailingRun() {
        String text = "Reply briefly.\n" + " ".repeat(65_536) + "\nThen stop.\n";
        List<Finding> found = findings(new TrailingWhitespace(), text);
        assertEquals(1, found.size());
        assertEquals(2, found.get(0).line());
        assertEquals("Reply briefly.\n\nThen stop.\n", fixed(new TrailingWhitespace(), text));
        assertTrue(findings(new SpaceRun(), text).isEmpty());
    }

    @Test
    void repeatsFarIntoOneLongLineAreFoundAtTheirCodePointColumns() {
        // One line of 2,000 sentences, each after an emoji (two UTF-16 units, one column); every tenth
        // sentence is the same, so 199 repeat the first of them, at columns far past 4,096.
        String repeated = "\uD83D\uDEA2 Check the tide window before the sailing closes.";
        StringBuilder line = new StringBuilder();
        for (int i = 0; i < 2_000; i++) {
            line.append(i % 10 == 9 ? repeated : "\uD83D\uDEA2 Sentence number " + i + " is about the ferry.").append(' ');
        }
        String text = line.toString().strip() + "\n";
        List<Finding> found = findings(new RepeatedInstruction(), text);
        List<Integer> columns = new java.util.ArrayList<>();
        for (int at = text.indexOf(repeated, text.indexOf(repeated) + 1); at >= 0; at = text.indexOf(repeated, at + 1)) {
            columns.add(text.codePointCount(0, at) + 1);
        }
        assertEquals(199, columns.size());
        assertEquals(columns, found.stream().map(Finding::column).toList(), "columns count code points");
        assertTrue(found.stream().allMatch(f -> f.line() == 1 && f.rewrite().isPresent()));
        String kept = text.substring(0, text.indexOf(repeated) + repeated.length());
        assertEquals(kept + text.substring(kept.length()).replace(" " + repeated, ""), fixed(new RepeatedInstruction(), text));
    }
}
