package dev.tare.cache;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;

import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/**
 * The text hash that tells an edited template from an unchanged one: every kind of small edit, in
 * each of its four interleaved lanes and across the blocks it reads the text in, changes it.
 */
class TemplateCacheHashTest {

    @Test
    void anyOneCharChangedAnywhereChangesTheHash() {
        String text = randomText(new SplittableRandom(3), 20_003);
        long original = TemplateCache.hash(text);
        assertEquals(original, TemplateCache.hash(new String(text.toCharArray())), "equal texts hash alike");
        for (int at = 0; at < text.length(); at++) {
            char[] edited = text.toCharArray();
            edited[at] = edited[at] == 'x' ? 'y' : 'x';
            assertNotEquals(original, TemplateCache.hash(new String(edited)), "a char changed at " + at);
        }
    }

    @Test
    void swappedCharsAndOtherLengthsChangeTheHash() {
        String text = randomText(new SplittableRandom(4), 9_000);
        long original = TemplateCache.hash(text);
        for (int at = 0; at + 1 < text.length(); at += 7) {
            char[] swapped = text.toCharArray();
            if (swapped[at] != swapped[at + 1]) {
                char first = swapped[at];
                swapped[at] = swapped[at + 1];
                swapped[at + 1] = first;
                assertNotEquals(original, TemplateCache.hash(new String(swapped)), "chars swapped at " + at);
            }
        }
        for (int length = 0; length < 40; length++) {
            assertNotEquals(TemplateCache.hash(text.substring(0, length)), TemplateCache.hash(text.substring(0, length + 1)),
                    "a char added after " + length);
        }
        assertNotEquals(TemplateCache.hash("a"), TemplateCache.hash("a\0"), "a trailing NUL counts");
    }

    private static String randomText(SplittableRandom random, int length) {
        StringBuilder text = new StringBuilder(length);
        String alphabet = "abcdefgh {}\n\u00e9\u4e2d";
        for (int i = 0; i < length; i++) {
            text.append(alphabet.charAt(random.nextInt(alphabet.length())));
        }
        return text.toString();
    }
}
