package dev.tare.lint.rules;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.HashMap;
import java.util.Locale;
import java.util.Map;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/**
 * The hand-written text steps of the sentence rules give what the regular expressions they replace
 * give: single spacing as {@code replaceAll("\\s+", " ")}, content words as a split at
 * {@code [^\p{L}\p{N}]+}, and the pointing-word check with its prefilter as the pattern alone.
 */
class SentenceTextTest {
    private static final String ALPHABET = "aB Z\t\n\r\u000B\f\u00a0é9٣Ⅻ²-.İK\uD835\uDC00";
    private static final String[] PIECES = {"above", "ABOVE", "Below", "following", "preceding", "previous",
            "foregoing", "hereafter", "abovementioned", "the", "one", "twelve", " ", "\n", "_", "x"};

    @Test
    void randomTextsGiveWhatTheExpressionsGive() {
        SplittableRandom random = new SplittableRandom(26);
        for (int c = 0; c < 50_000; c++) {
            StringBuilder text = new StringBuilder();
            int length = random.nextInt(30);
            for (int i = 0; i < length; i++) {
                if (random.nextInt(4) == 0) {
                    text.append(PIECES[random.nextInt(PIECES.length)]);
                } else {
                    int at = random.nextInt(ALPHABET.length());
                    char ch = ALPHABET.charAt(at);
                    text.append(Character.isHighSurrogate(ch) ? ALPHABET.substring(at, at + 2) : String.valueOf(ch));
                }
            }
            String s = text.toString();
            assertEquals(s.replaceAll("\\s+", " "), Sentences.singleSpaced(s, 0, s.length()), s);
            assertEquals(Sentences.POINTS_AROUND.matcher(s).find(), Sentences.pointsAround(s), s);
            assertEquals(splitWords(s), NearDuplicateInstruction.words(s), s);
        }
    }

    /** The content words as the rule split them before. */
    private static Map<CharSequence, Integer> splitWords(String sentence) {
        Map<CharSequence, Integer> counts = new HashMap<>();
        for (String word : sentence.toLowerCase(Locale.ROOT).split("[^\\p{L}\\p{N}]+")) {
            if (!word.isEmpty() && !NearDuplicateInstruction.isFunctionWord(word)) {
                counts.merge(NearDuplicateInstruction.number(word), 1, Integer::sum);
            }
        }
        return counts;
    }
}
