package dev.tare.lint;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/**
 * The shortcut that keeps long texts linear gives exactly what the plain walk gave: code-point
 * columns from checkpoints.
 */
class LongTextIndexesTest {

    @Test
    void columnsFromCheckpointsEqualCountingFromTheLineStart() {
        SplittableRandom random = new SplittableRandom(3);
        // Short lines and lines far longer than the 4,096-character checkpoints, of letters, spaces
        // and astral characters, so that surrogate pairs fall across checkpoints; every kind of break.
        String[] pieces = {"a", "b", " ", "\uD83D\uDCA7", "\u00E9", "\uD83D\uDE42"};
        String[] breaks = {"\n", "\r\n", "\r"};
        int[] lengths = {0, 12, 5_000, 21_000};
        StringBuilder text = new StringBuilder();
        for (int line = 0; line < 8; line++) {
            int length = lengths[random.nextInt(lengths.length)];
            for (int i = 0; i < length; i++) {
                text.append(pieces[random.nextInt(pieces.length)]);
            }
            text.append(breaks[random.nextInt(breaks.length)]);
        }
        text.append(pieces[0].repeat(9_000));
        String source = text.toString();
        SourceLines lines = new SourceLines(source);
        for (int offset = 0; offset <= source.length(); offset++) {
            int lineStart = lines.lineStart(lines.line(offset));
            assertEquals(source.codePointCount(lineStart, offset) + 1, lines.column(offset), "offset " + offset);
        }
    }
}
