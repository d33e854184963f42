package dev.tare.template;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;

/** Line starts, lines and columns, with every kind of line ending. */
class LineIndexTest {
    /** The definition the index follows, written as a pattern: {@code \r\n}, {@code \n} or a lone {@code \r}. */
    private static final Pattern BREAK = Pattern.compile("\r\n|\n|\r");

    private static int[] expectedStarts(String text) {
        List<Integer> starts = new ArrayList<>(List.of(0));
        Matcher matcher = BREAK.matcher(text);
        while (matcher.find()) {
            starts.add(matcher.end());
        }
        return starts.stream().mapToInt(Integer::intValue).toArray();
    }

    @Test
    void eachKindOfLineEndingStartsALine() {
        assertArrayEquals(new int[] {0}, LineIndex.of("").starts());
        assertArrayEquals(new int[] {0}, LineIndex.of("no break").starts());
        assertArrayEquals(new int[] {0, 2, 4}, LineIndex.of("a\nb\n").starts());
        assertArrayEquals(new int[] {0, 3, 6}, LineIndex.of("a\r\nb\r\n").starts());
        assertArrayEquals(new int[] {0, 2, 4}, LineIndex.of("a\rb\r").starts());
        assertArrayEquals(new int[] {0, 1, 3, 5}, LineIndex.of("\n\r\n\r\n").starts());
        assertArrayEquals(new int[] {0, 1, 2}, LineIndex.of("\r\r").starts());
    }

    @Test
    void linesAndColumnsCountFromTheGivenPlace() {
        LineIndex index = LineIndex.of("ab\r\ncd\ref", 5, 7);
        assertEquals(5, index.line(0));
        assertEquals(8, index.column(1));
        assertEquals(5, index.line(3));
        assertEquals(6, index.line(4));
        assertEquals(2, index.column(5));
        assertEquals(7, index.line(7));
        assertEquals(1, index.column(7));
        assertEquals(7, index.line(9));
    }

    @Test
    void agreesWithThePatternOnRandomTexts() {
        Random random = new Random(42);
        String alphabet = "ab \t{}\u00e9\u4e2d";
        for (int round = 0; round < 5_000; round++) {
            boolean carriageReturns = round % 2 == 0;
            StringBuilder text = new StringBuilder();
            int length = random.nextInt(60);
            for (int i = 0; i < length; i++) {
                int pick = random.nextInt(10);
                if (pick == 0) {
                    text.append('\n');
                } else if (pick == 1 && carriageReturns) {
                    text.append('\r');
                } else {
                    text.append(alphabet.charAt(random.nextInt(alphabet.length())));
                }
            }
            String s = text.toString();
            assertArrayEquals(expectedStarts(s), LineIndex.of(s).starts(), () -> "for " + s.replace("\r", "\\r").replace("\n", "\\n"));
        }
    }
}
