package dev.tare.lint;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.google.re2j.Matcher;
import com.google.re2j.Pattern;
import com.google.re2j.PatternSyntaxException;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/** The text every match of a rule-pack pattern must contain, so the pattern need not run where it is absent. */
class RequiredLiteralTest {
    @ParameterizedTest(name = "{0}")
    @CsvSource(delimiterString = " => ", value = {
            "\\bin order to\\b => in order to",
            "\\b[Dd]ue to the fact that\\b => ue to the fact that",
            "abc => abc",
            "ab?c => a",
            "abc*d => ab",
            "ab+cd => ab",
            "xy{2}z => xy",
            "xy{0,3}zz => zz",
            "a{,2}b => a{,2}b",
            "(?:please )?note that => note that",
            "colou?r scheme => r scheme",
            "a\\.b\\\\c => a.b\\c",
            "[a-z]+ing\\s+the => ing",
            "no|yes => ''",
            "(?i)case => ''",
            "\\x41bc => ''",
            "\\pLabc => ''",
            "a.b.cd => cd",
            "x[]a]yz => yz",
            "^start here$ => start here",
    })
    void readsTheRunEveryMatchContains(String pattern, String required) {
        assertEquals(required, RequiredLiteral.filter(pattern).run());
    }

    @ParameterizedTest(name = "{0}")
    @CsvSource(delimiterString = " => ", value = {
            "([!?])[!?]+ => !?",
            "[!?]{2,} => !?",
            "[a-c]x? => abc",
            "[a-z]+ => ''",
            "[^!?]+ => ''",
            "[!?]?x => ''",
            "[\\.,;]\\s => .,;",
    })
    void withoutARunAClassEveryMatchNeedsGivesItsCharacters(String pattern, String anyOf) {
        RequiredLiteral.Filter filter = RequiredLiteral.filter(pattern);
        assertEquals(anyOf, filter.anyOf());
        if (!anyOf.isEmpty()) {
            assertTrue(filter.admits("ok" + anyOf.charAt(anyOf.length() - 1)));
            assertTrue(!filter.admits("none of them here"));
        }
    }

    @Test
    void everyMatchOfRandomPatternsContainsTheRun() {
        // RE2J itself is the judge: whenever it finds a match, the run must be in the matched text.
        SplittableRandom random = new SplittableRandom(2026);
        int withRun = 0;
        int withSet = 0;
        int matched = 0;
        for (int i = 0; i < 20_000; i++) {
            String pattern = pattern(random);
            Pattern compiled;
            try {
                compiled = Pattern.compile(pattern);
            } catch (PatternSyntaxException e) {
                continue;
            }
            RequiredLiteral.Filter filter = RequiredLiteral.filter(pattern);
            String run = filter.run();
            withRun += run.isEmpty() ? 0 : 1;
            withSet += filter.anyOf().isEmpty() ? 0 : 1;
            for (int t = 0; t < 20; t++) {
                String text = text(random);
                Matcher matcher = compiled.matcher(text);
                while (matcher.find()) {
                    matched++;
                    assertTrue(matcher.group().contains(run),
                            () -> "'" + pattern + "' matched '" + matcher.group() + "' without '" + run + "'");
                    assertTrue(filter.admits(matcher.group()), () -> "'" + pattern + "' matched '" + matcher.group()
                            + "', which the filter " + filter + " refuses");
                }
            }
        }
        assertTrue(withRun > 5_000 && withSet > 200 && matched > 5_000,
                withRun + " patterns with a run, " + withSet + " with a set, " + matched + " matches");
    }

    private static final String[] ATOMS = {"a", "b", "c", " ", "\\.", ".", "[ab]", "[^a]", "[a-c]", "[]a]", "[.,]", "[\\.b]", "\\b", "\\s", "\\w", "(ab|c)",
            "(?:b)", "^", "$", "\\B"};
    private static final String[] QUANTIFIERS = {"", "", "", "", "?", "*", "+", "{2}", "{0,2}", "{1,}", "??", "+?", "{,2}"};

    private static String pattern(SplittableRandom random) {
        StringBuilder pattern = new StringBuilder();
        int atoms = 1 + random.nextInt(8);
        for (int i = 0; i < atoms; i++) {
            pattern.append(random.nextInt(3) == 0 ? ATOMS[random.nextInt(ATOMS.length)] : "abc ".charAt(random.nextInt(4)));
            pattern.append(QUANTIFIERS[random.nextInt(QUANTIFIERS.length)]);
            if (random.nextInt(40) == 0) {
                pattern.append('|');
            }
        }
        return pattern.toString();
    }

    private static String text(SplittableRandom random) {
        StringBuilder text = new StringBuilder();
        int length = random.nextInt(24);
        for (int i = 0; i < length; i++) {
            text.append("abc .{},2".charAt(random.nextInt(9)));
        }
        return text.toString();
    }
}
