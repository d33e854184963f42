package dev.tare.overlap;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;

import java.util.List;
import org.junit.jupiter.api.Test;

class SharedPrefixesTest {
    @Test
    void sharedPrefixesOfIdSequences() {
        // By hand: [1,2,3,4] and [1,2,3,9] share 3; [1,2] shares 2 with both; [7] shares nothing.
        int[] lengths = SharedPrefixes.lengths(List.of(new int[] {1, 2, 3, 4}, new int[] {7}, new int[] {1, 2, 3, 9},
                new int[] {1, 2}));
        assertArrayEquals(new int[] {3, 0, 3, 2}, lengths);
        assertArrayEquals(new int[] {0}, SharedPrefixes.lengths(List.of(new int[] {5, 6})));
    }

    @Test
    void identicalSequencesShareAllOfThemselves() {
        // Two equal sequences sort next to each other and share their whole length; an empty one shares nothing.
        int[] lengths = SharedPrefixes.lengths(List.of(new int[] {4, 4, 4}, new int[] {}, new int[] {4, 4, 4}));
        assertArrayEquals(new int[] {3, 0, 3}, lengths);
    }
}
