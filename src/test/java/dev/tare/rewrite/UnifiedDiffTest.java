package dev.tare.rewrite;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/** Unified diff format as GNU diff and git print it (hunk headers "@@ -l,s +l,s @@", 3 lines of context). */
class UnifiedDiffTest {
    @Test
    void showsOneHunkWithThreeLinesOfContext() {
        String before = "1\n2\n3\n4 \n5\n6\n7\n8\n";
        String after = "1\n2\n3\n4\n5\n6\n7\n8\n";
        assertEquals("""
                --- a/p.md
                +++ b/p.md
                @@ -1,7 +1,7 @@
                 1
                 2
                 3
                -4\s
                +4
                 5
                 6
                 7
                """, UnifiedDiff.of("p.md", before, after, false));
    }

    @Test
    void equalTextsHaveNoDiffAndColourIsOptIn() {
        assertEquals("", UnifiedDiff.of("p.md", "same\n", "same\n", true));
        String coloured = UnifiedDiff.of("p.md", "a\n", "b\n", true);
        assertTrue(coloured.contains("\u001b[31m-a\u001b[0m") && coloured.contains("\u001b[32m+b\u001b[0m"), coloured);
        String plain = UnifiedDiff.of("p.md", "a\r\n", "b\r\n", false);
        assertTrue(!plain.contains("\r") && !plain.contains("\u001b"), plain);
    }

    @Test
    void marksAMissingFinalNewline() {
        assertTrue(UnifiedDiff.of("p.md", "a\nb", "a\nc", false).contains("\\ No newline at end of file"));
    }
}
