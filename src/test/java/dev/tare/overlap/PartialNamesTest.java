package dev.tare.overlap;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.Set;
import org.junit.jupiter.api.Test;

/** Names for new partials: from the first heading or the first words, unique, never an existing file. */
class PartialNamesTest {
    @Test
    void theFirstHeadingNamesThePartial() {
        assertEquals("prompts/partials/safety-first.md", PartialNames.choose("Intro line.\n\n## Safety first ##\n\nText.",
                "prompts/partials", path -> false));
    }

    @Test
    void withoutAHeadingTheFirstWordsOfTheFirstSentenceDo() {
        assertEquals("p/never-promise-a-refund-a.md", PartialNames.choose("Never promise a refund, a repair time or a"
                + " credit. More.", "p", path -> false));
        assertEquals("p/dont-guess.md", PartialNames.choose("Don't guess. Ask.", "p", path -> false));
        assertEquals("p/cafe-creme.md", PartialNames.choose("Café crème: served hot.", "p", path -> false));
        assertEquals("p/shared-block.md", PartialNames.choose("—— ✓ ——", "p", path -> false));
    }

    @Test
    void aTakenNameGetsTheNextNumberAndABareFileCountsAsTaken() {
        Set<String> taken = Set.of("p/safety.md", "p/safety-2");
        assertEquals("p/safety-3.md", PartialNames.choose("# Safety\n", "p", taken::contains));
    }
}
