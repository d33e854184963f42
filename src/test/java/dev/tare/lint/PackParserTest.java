package dev.tare.lint;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.TareException;
import java.util.List;
import org.junit.jupiter.api.Test;

/** Rule packs, including hostile ones. */
class PackParserTest {
    private static String pack(String find, String extra) {
        return "rules:\n  - id: hostile\n    summary: s\n    why: w\n    class: none\n    severity: warning\n"
                + "    scope: everywhere\n    find: '" + find + "'\n" + extra
                + "    examples:\n      - {before: \"aaa!\", after: \"bbb\"}\n";
    }

    @Test
    void aCatastrophicBacktrackingPatternRunsInLinearTime() {
        // (a+)+$ against a's followed by one other character takes exponential time in a backtracking
        // engine; RE2 (and its Java port RE2J 1.8, per its documentation) guarantees time linear in the
        // input. With 100,000 characters a backtracking engine would not finish; here the check completes.
        Rule rule = PackParser.parse("rules/hostile.yaml", pack("(a+)+$", "")).get(0);
        String input = "a".repeat(100_000) + "!";
        List<Finding> found = RuleHarness.findings(rule, input);
        assertTrue(found.isEmpty());
        List<Finding> match = RuleHarness.findings(rule, "aaaa");
        assertEquals(1, match.size());
    }

    @Test
    void anInvalidPatternNamesTheFileLineAndRule() {
        TareException e = assertThrows(TareException.class, () -> PackParser.parse("rules/hostile.yaml", pack("(a+", "")));
        assertTrue(e.getMessage().startsWith("rules/hostile.yaml, line 8: rule 'hostile': 'find' is not a valid RE2 pattern"),
                e.getMessage());
    }

    @Test
    void backreferencesAreRefusedBecauseRe2CannotRunThemInLinearTime() {
        TareException e = assertThrows(TareException.class, () -> PackParser.parse("p.yaml", pack("(a)\\1", "")));
        assertTrue(e.getMessage().contains("not a valid RE2 pattern"), e.getMessage());
    }

    @Test
    void missingFieldsAreNamedWithTheRule() {
        String text = "rules:\n  - id: no-why\n    summary: s\n    class: none\n    severity: info\n    scope: prose\n"
                + "    find: x\n    examples: [{before: x, after: y}]\n";
        TareException e = assertThrows(TareException.class, () -> PackParser.parse("rules/bad.yaml", text));
        assertEquals("rules/bad.yaml, line 2: rule 'no-why': missing 'why'; every rule needs id, summary, why, class,"
                + " severity, scope, find, examples", e.getMessage());
    }

    @Test
    void otherMistakesAreLocatedToo() {
        assertMessage(pack("x", "    replace: y\n"), "class none offers no rewrite");
        assertMessage(pack("x", "").replace("severity: warning", "severity: loud"), "unknown severity 'loud'");
        assertMessage(pack("x", "").replace("scope: everywhere", "scope: code"), "unknown scope 'code'");
        assertMessage(pack("x", "").replace("class: none", "class: safe"), "missing 'replace'");
        assertMessage(pack("x", "    colour: red\n"), "unknown key 'colour'");
        assertMessage("rules: 3\n", "a rule pack must be a mapping with a 'rules' list");
        assertMessage("rules: [\n", "fix the YAML syntax");
    }

    @Test
    void aReplacementFillsInGroupsAndSkipsPlaceholders() {
        String text = "rules:\n  - id: swap\n    summary: s\n    why: w\n    class: review\n    severity: info\n"
                + "    scope: prose\n    find: '(\\w+)=(\\w+)'\n    replace: '$2=$1 $$'\n"
                + "    examples: [{before: 'a=b', after: 'b=a $'}]\n";
        Rule rule = PackParser.parse("p.yaml", text).get(0);
        assertEquals("b=a $ and `c=d` {{ e }}\n", RuleHarness.fixed(rule, "a=b and `c=d` {{ e }}\n"));
    }

    private static void assertMessage(String text, String part) {
        TareException e = assertThrows(TareException.class, () -> PackParser.parse("rules/p.yaml", text));
        assertTrue(e.getMessage().startsWith("rules/p.yaml"), e.getMessage());
        assertTrue(e.getMessage().contains(part), e.getMessage());
    }
}
