package dev.tare.lint;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/**
 * The shortcuts that keep long texts linear give exactly what the plain walks gave: code-point
 * columns from checkpoints, and overlap questions answered by binary search over the regions.
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

    @Test
    void aRegionIndexAnswersAsAWalkOverEveryRegionDoes() {
        SplittableRandom random = new SplittableRandom(5);
        for (int round = 0; round < 200; round++) {
            List<Region> regions = new ArrayList<>();
            int count = random.nextInt(12);
            for (int i = 0; i < count; i++) {
                int start = random.nextInt(60);
                // Nested, touching, overlapping and empty regions all occur.
                regions.add(new Region(start, start + random.nextInt(15), Region.Kind.values()[random.nextInt(4)]));
            }
            regions.sort(java.util.Comparator.comparingInt(Region::start).thenComparingInt(Region::end));
            RegionIndex index = new RegionIndex(regions);
            for (int from = 0; from < 80; from++) {
                for (int to = from; to < from + 20; to++) {
                    int a = from;
                    int b = to;
                    List<Region> touching = regions.stream().filter(r -> r.overlaps(a, b)).toList();
                    assertEquals(!touching.isEmpty(), index.overlaps(from, to), regions + " [" + from + ", " + to + ")");
                    assertEquals(touching, index.touching(from, to), regions + " [" + from + ", " + to + ")");
                }
            }
        }
    }
}
