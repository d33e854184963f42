package dev.tare.tokenize;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * The hand-written splitters against the encodings' published splitting patterns run by
 * {@code java.util.regex} with {@code UNICODE_CHARACTER_CLASS}: the patterns and the flag are the
 * ones jtokkit 1.1.0 compiles (its {@code EncodingFactory}), which {@code TiktokenReferenceTest}
 * holds to the reference encoder. Every piece must be the same, on tens of thousands of strings.
 */
class PretokenizerTest {

    static Stream<Arguments> splitters() {
        return Stream.of(
                Arguments.of("o200k_base", new O200kPieces()),
                Arguments.of("cl100k_base", new Cl100kPieces()),
                Arguments.of("r50k_base and p50k_base", new Gpt2Pieces()));
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("splitters")
    void splitsAsThePublishedPatternOnRandomText(String encoding, Pretokenizer splitter) {
        Pattern pattern = Pattern.compile(splitter.pattern(), Pattern.UNICODE_CHARACTER_CLASS);
        SplittableRandom random = new SplittableRandom(20261202L);
        for (int i = 0; i < 30_000; i++) {
            String text = TrickyText.next(random, i < 20_000 ? 6 : 40);
            assertEquals(regexPieces(pattern, text), pieces(splitter, text), () -> encoding + " on " + escaped(text));
        }
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("splitters")
    void splitsAsThePublishedPatternOnEdgeCases(String encoding, Pretokenizer splitter) {
        Pattern pattern = Pattern.compile(splitter.pattern(), Pattern.UNICODE_CHARACTER_CLASS);
        List<String> cases = List.of("a", " ", "  ", " \n", "\n ", "   x", "x   ", "'", "'s", "'S", "'\u017F", "'ll",
                "'LL", "'re'", "A'S", "ABCd", "ABC", "AB\u0301C", "\u0301", "\u0301a", " \u0301", "ǅa", "\u02B0\u02B0",
                "1234567", " 12", "!!\n/", "a\r\n\r\nb", "\t\tx", " \u00A0x", "\uD800", "\uD83D\uDE00abc", "x\uD835\uDC00y");
        for (String text : cases) {
            assertEquals(regexPieces(pattern, text), pieces(splitter, text), () -> encoding + " on " + escaped(text));
        }
    }

    private static List<String> regexPieces(Pattern pattern, String text) {
        List<String> pieces = new ArrayList<>();
        Matcher matcher = pattern.matcher(text);
        while (matcher.find()) {
            pieces.add(matcher.group());
        }
        return pieces;
    }

    private static List<String> pieces(Pretokenizer splitter, String text) {
        List<String> pieces = new ArrayList<>();
        for (int start = 0; start < text.length(); ) {
            int end = splitter.pieceEnd(text.toCharArray(), start, text.length());
            pieces.add(text.substring(start, end));
            start = end;
        }
        return pieces;
    }

    private static String escaped(String text) {
        StringBuilder out = new StringBuilder("\"");
        text.codePoints().forEach(cp -> out.append(cp >= 0x20 && cp < 0x7f ? Character.toString(cp) : String.format("\\u{%X}", cp)));
        return out.append('"').toString();
    }
}
