package dev.tare.lint;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.google.re2j.Matcher;
import com.google.re2j.Pattern;
import com.google.re2j.PatternSyntaxException;
import java.util.Optional;
import java.util.SplittableRandom;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

/** Which rewrites change nothing but whitespace, so a pack may declare them safe. */
class WhitespaceOnlyRewriteTest {
    static Stream<Arguments> whitespaceOnly() {
        return Stream.of(
                Arguments.of("[ \\t]+$", ""),
                Arguments.of("  +", " "),
                Arguments.of("\\n{3,}", "\n\n"),
                Arguments.of("(\\s)\\s+", "$1"),
                Arguments.of("(?m)[ \\t]+$", ""),
                Arguments.of("\\t", " "),
                Arguments.of("[\\t ]{2,}", " "),
                Arguments.of("(?P<gap>\\x20|\\x{9})+?", "$0"),
                Arguments.of("(?i:[[:space:]]|[[:blank:]])\\r?\\n", "\n"),
                Arguments.of("\\A\\ +\\b|\\B\\v\\f\\z", ""),
                Arguments.of("[\\t-\\r ]*(?:\\s{0}\\s)", "\r\n\t\f\u000B"),
                Arguments.of("(?<lead>^\\s+)(?s)\\s??", "$1$9"));
    }

    @ParameterizedTest(name = "{0} -> \"{1}\"")
    @MethodSource("whitespaceOnly")
    void acceptsRewritesOfWhitespaceIntoWhitespace(String find, String replace) {
        Pattern.compile(find);
        assertEquals(Optional.empty(), WhitespaceOnlyRewrite.whyNot(find, replace));
    }

    static Stream<Arguments> notWhitespaceOnly() {
        return Stream.of(
                Arguments.of("not ", "", "'n' at column 1"),
                Arguments.of(".", "", "'.' at column 1"),
                Arguments.of("\\s+x", " ", "'x' at column 4"),
                Arguments.of("[^ ]", "", "'[^' at column 1"),
                Arguments.of("\\S", "", "'\\S' at column 1"),
                Arguments.of("\\w+", "", "'\\w' at column 1"),
                Arguments.of("a|\\s", " ", "'a' at column 1"),
                Arguments.of(" ", "x", "'replace' writes 'x' (column 1)"),
                Arguments.of("\\s", "$$", "'replace' writes '$' (column 1)"),
                Arguments.of("^", " ", "'find' matches only empty text"),
                Arguments.of("[a-z ]", "", "'a-z' at column 2"),
                Arguments.of("", "", "'find' matches only empty text"),
                Arguments.of("\\b|(?i)", " ", "'find' matches only empty text"),
                Arguments.of("\\s{0}", "", "'find' matches only empty text"),
                Arguments.of("\\s{00}", "", "'{' at column 3"),
                Arguments.of("\\s{,2}", "", "'{' at column 3"),
                Arguments.of("\\d", "", "'\\d' at column 1"),
                Arguments.of("\\s\\p{Zs}", "", "'\\p{Zs}' at column 3"),
                Arguments.of("\\pL", "", "'\\pL' at column 1"),
                Arguments.of("\\x41", "", "'\\x41' at column 1"),
                Arguments.of("\\.", "", "'\\.' at column 1"),
                Arguments.of("[[:alpha:] ]", "", "'[:alpha:]' at column 2"),
                Arguments.of("[ -~]", "", "' -~' at column 2"),
                Arguments.of("[\\t-]", "", "'-' at column 4"),
                Arguments.of("[] ]", "", "']' at column 2"),
                Arguments.of("\u00a0", "", "'\\x{A0}' at column 1"),
                Arguments.of("\u00e9\u00a0", "", "'\u00e9' at column 1"),
                Arguments.of("\\Q \\E", "", "'\\Q' at column 1"),
                Arguments.of("(?= )", "", "'(?=' at column 1"),
                Arguments.of("( ", "", "'(' at column 1"),
                Arguments.of(" )", "", "')' at column 2"),
                Arguments.of("[ ", "", "'[' at column 1"),
                Arguments.of("[\\t ", "", "'[' at column 1"),
                Arguments.of("[\\x{20]", "", "'\\x{' at column 2"),
                Arguments.of("*", "", "'*' at column 1"),
                Arguments.of(" ", " $x", "'replace' writes '$' (column 2)"),
                Arguments.of(" ", "\u00a0", "'replace' writes '\\x{A0}' (column 1)"));
    }

    @ParameterizedTest(name = "{0} -> \"{1}\"")
    @MethodSource("notWhitespaceOnly")
    void refusesAnythingElseNamingTheFirstOffendingPiece(String find, String replace, String piece) {
        String reason = WhitespaceOnlyRewrite.whyNot(find, replace).orElseThrow();
        assertTrue(reason.contains(piece), reason);
        assertTrue(reason.startsWith(piece.startsWith("'replace'") ? "'replace'" : "'find'"), reason);
    }

    /** The check is only worth having if it never passes a pattern that can match something else. */
    @Test
    void noAcceptedPatternMatchesAnythingButWhitespace() {
        String[] pieces = {" ", "\\t", "\\s", "\\S", "a", ".", "[ \\t]", "[^ ]", "[\\t-\\r]", "[ -~]", "\\x20",
                "\\x41", "(", ")", "(?:", "(?i)", "|", "*", "+", "?", "{2}", "{0}", "{00}", "{1,}", "^", "$",
                "\\b", "\\ ", "\\.", "[[:space:]]", "[[:alpha:]]", "{", "}", "]", "-"};
        String[] texts = {" a  b\t\tc\n\n\nd \r\n", " {00}\t{2} .-]} {,2}", "x\u000B\f y", "   ", "a", ""};
        SplittableRandom random = new SplittableRandom(19);
        int accepted = 0;
        for (int n = 0; n < 20_000; n++) {
            StringBuilder find = new StringBuilder();
            for (int k = 1 + random.nextInt(5); k > 0; k--) {
                find.append(pieces[random.nextInt(pieces.length)]);
            }
            Pattern pattern;
            try {
                pattern = Pattern.compile(find.toString());
            } catch (PatternSyntaxException e) {
                continue;
            }
            if (WhitespaceOnlyRewrite.whyNot(find.toString(), "").isPresent()) {
                continue;
            }
            accepted++;
            for (String text : texts) {
                Matcher matcher = pattern.matcher(text);
                while (matcher.find()) {
                    assertTrue(matcher.group().chars().allMatch(c -> " \t\n\r\f\u000B".indexOf(c) >= 0), find + " matched '" + matcher.group() + "'");
                }
            }
        }
        assertTrue(accepted > 500, "only " + accepted + " patterns accepted");
    }
}
