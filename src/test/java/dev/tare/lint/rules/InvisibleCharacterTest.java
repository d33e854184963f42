package dev.tare.lint.rules;

import static dev.tare.lint.RuleHarness.findings;
import static dev.tare.lint.RuleHarness.fixed;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.lint.Finding;
import java.util.List;
import org.junit.jupiter.api.Test;

/** Invisible characters; code points as named in The Unicode Standard 15.0, chapter 23 (format characters). */
class InvisibleCharacterTest {
    private final InvisibleCharacter rule = new InvisibleCharacter();

    @Test
    void zeroWidthAndSoftHyphenAreRemovedAndNoBreakSpacesBecomeSpaces() {
        String text = "ad\u200Bjust ner\u00ADvous 555\u00A00177 word\u2060joined mid\uFEFFline a\u202Fb\n";
        List<Finding> found = findings(rule, text);
        assertEquals(6, found.size());
        assertEquals(3, found.get(0).column());
        assertEquals("adjust nervous 555 0177 wordjoined midline a b\n", fixed(rule, text));
    }

    @Test
    void theMessageNamesTheCharacterAndWhatToDo() {
        List<Finding> found = findings(rule, "Call 555\u00A00177 to re\u200Bport it.\n");
        assertEquals("a no-break space (U+00A0) looks like a space; type a plain space", found.get(0).message());
        assertEquals("a zero-width space (U+200B) shows nothing; delete it", found.get(1).message());
        assertEquals(List.of(9, 20), found.stream().map(Finding::column).toList());
    }

    @Test
    void aJoinerInsideAnEmojiSequenceIsMeaningful() {
        String family = "\uD83D\uDC69\u200D\uD83D\uDC67";
        assertTrue(findings(rule, "Family " + family + " here.\n").isEmpty());
    }

    @Test
    void aNonJoinerBetweenPersianLettersIsMeaningfulButBetweenLatinLettersIsNot() {
        assertTrue(findings(rule, "\u0645\u06CC\u200C\u062E\u0648\u0627\u0647\u0645\n").isEmpty());
        assertEquals("ab\n", fixed(rule, "a\u200Cb\n"));
    }

    @Test
    void aJoinerThatAScriptNeedsIsKept() {
        // Devanagari ka, virama, zero-width joiner, ssa: the joiner asks for the half form of ka.
        String devanagari = "Write \u0915\u094D\u200D\u0937 as it is.\n";
        assertTrue(findings(rule, devanagari).isEmpty());
        assertEquals(devanagari, fixed(rule, devanagari));
        assertEquals("Confirm the adjustment.\n", fixed(rule, "Confirm the ad\u200Djustment.\n"), "between Latin letters it is noise");
    }

    @Test
    void laidOutTextIsLeftAsItIs() {
        String table = "| name | note |\n|---|---|\n| a\u200Bb | c |\n";
        assertTrue(findings(rule, table).isEmpty(), "a table row stays byte for byte");
    }

    @Test
    void itsEditsAreInvisibleKindAndSafe() {
        assertEquals(java.util.Optional.of(dev.tare.lint.EditKind.INVISIBLE), InvisibleCharacter.DESCRIPTOR.editKind());
        assertEquals(dev.tare.lint.RewriteClass.SAFE, InvisibleCharacter.DESCRIPTOR.rewriteClass());
    }

    @Test
    void insideCodeNothingIsTouched() {
        assertTrue(findings(rule, "`a\u200Bb`\n").isEmpty());
        assertTrue(findings(rule, "Plain text.\n").isEmpty());
    }
}
