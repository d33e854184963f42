package dev.tare.overlap;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;

import java.util.List;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import org.junit.jupiter.api.Test;

/**
 * The induced suffix sort against the definition (every suffix compared with every other, a proper
 * prefix first), and the common-prefix array against direct comparison of neighbours.
 */
class SuffixArrayTest {
    @Test
    void aWorkedExample() {
        // "banana" as 1 0 3 0 3 0 (b=1, a=0, n=3): sorted suffixes a, ana, anana, banana, na, nana.
        int[] text = {1, 0, 3, 0, 3, 0};
        assertArrayEquals(new int[] {5, 3, 1, 0, 4, 2}, SuffixArray.naive(text));
        // Neighbours share: a|ana 1, ana|anana 3, anana|banana 0, banana|na 0, na|nana 2; by text position
        // (b a n a n a): banana 0, anana 3, nana 2, ana 1, na 0, a 0 (first in order).
        assertArrayEquals(new int[] {0, 3, 2, 1, 0, 0}, SuffixArray.plcp(text, SuffixArray.naive(text), -1));
    }

    @Test
    void commonPrefixesStopAtTheSeparator() {
        // 5 7 0 5 7 0 with 0 as separator: the two suffixes starting "5 7 0" share 2, not 3.
        int[] text = {5, 7, 0, 5, 7, 0};
        int[] sa = SuffixArray.of(text, 7);
        int[] plcp = SuffixArray.plcp(text, sa, 0);
        int max = 0;
        for (int value : plcp) {
            max = Math.max(max, value);
        }
        assertArrayEquals(new int[] {2}, new int[] {max});
    }

    @Property(tries = 400)
    void inducedSortingAgreesWithTheDefinition(@ForAll("texts") int[] text) {
        int upper = 0;
        for (int value : text) {
            upper = Math.max(upper, value);
        }
        assertArrayEquals(SuffixArray.naive(text), SuffixArray.of(text, upper));
    }

    @Property(tries = 200)
    void commonPrefixesAgreeWithDirectComparison(@ForAll("texts") int[] text) {
        int[] sa = SuffixArray.naive(text);
        int[] plcp = SuffixArray.plcp(text, sa, 0);
        for (int i = 1; i < sa.length; i++) {
            int h = 0;
            while (sa[i] + h < text.length && sa[i - 1] + h < text.length && text[sa[i] + h] == text[sa[i - 1] + h]
                    && text[sa[i] + h] != 0) {
                h++;
            }
            assertArrayEquals(new int[] {h}, new int[] {plcp[sa[i]]}, "position " + i);
        }
    }

    /** Short and long texts over small alphabets, where repeats (and so the hard cases) are common. */
    @Provide
    Arbitrary<int[]> texts() {
        Arbitrary<Integer> alphabet = Arbitraries.integers().between(1, 6);
        return alphabet.flatMap(size -> Arbitraries.integers().between(0, size).list().ofMaxSize(400)
                .map(SuffixArrayTest::array));
    }

    private static int[] array(List<Integer> values) {
        return values.stream().mapToInt(Integer::intValue).toArray();
    }
}
