package dev.tare.lint;

import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.tare.tokenize.Tokenizer;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;

/** Long texts are counted once while they are recent; short ones every time; every count is the tokenizer's. */
class RememberedCountsTest {
    /** Counts characters, and records what it was asked to count. */
    private static final class Recording implements Tokenizer {
        final List<Integer> asked = new ArrayList<>();

        @Override
        public String name() {
            return "recording";
        }

        @Override
        public int count(String text) {
            asked.add(text.length());
            return text.length();
        }

        @Override
        public int[] encode(String text) {
            return new int[text.length()];
        }
    }

    @Test
    void aLongTextCountedTwiceIsCountedOnceAndAShortOneEveryTime() {
        Recording tokenizer = new Recording();
        RememberedCounts counts = new RememberedCounts(tokenizer);
        String whole = "x".repeat(RememberedCounts.MIN_CHARS);
        // An equal text built anew, as a second rule would render it, is found too.
        assertEquals(whole.length(), counts.count(whole));
        assertEquals(whole.length(), counts.count(new StringBuilder(whole).toString()));
        assertEquals(3, counts.count("abc"));
        assertEquals(3, counts.count("abc"));
        assertEquals(List.of(RememberedCounts.MIN_CHARS, 3, 3), tokenizer.asked);
        assertEquals("recording", counts.name());
    }

    @Test
    void onlyTheLastFewLongTextsAreRemembered() {
        Recording tokenizer = new Recording();
        RememberedCounts counts = new RememberedCounts(tokenizer);
        List<String> texts = new ArrayList<>();
        for (int i = 0; i < 5; i++) {
            texts.add("y".repeat(RememberedCounts.MIN_CHARS + i));
            counts.count(texts.get(i));
        }
        counts.count(texts.get(4));
        counts.count(texts.get(0));
        assertEquals(6, tokenizer.asked.size(), "the newest is remembered, the oldest was let go");
    }
}
