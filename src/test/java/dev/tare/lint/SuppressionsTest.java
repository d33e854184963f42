package dev.tare.lint;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.template.Template;
import java.nio.file.Path;
import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.Test;

/** Inline directives: per line, next line, whole file. */
class SuppressionsTest {
    private static Finding at(String rule, int line) {
        return new Finding("a.md", line, 1, line, 2, rule, Severity.WARNING, "m", RewriteClass.NONE, Optional.empty(), List.of());
    }

    private static Suppressions of(String text) {
        Template template = RuleHarness.template("a.md", text);
        LintContext context = LintContext.forExample(Path.of("."), Example.of(text, text), java.util.Set.of());
        return Suppressions.of(context.text(template));
    }

    @Test
    void aLineDirectiveSilencesItsOwnLineOnly() {
        Suppressions s = of("One.  {# tare-ignore space-run, trailing-whitespace #}\nTwo.\n");
        assertTrue(s.silences(at("space-run", 1)));
        assertTrue(s.silences(at("trailing-whitespace", 1)));
        assertFalse(s.silences(at("space-run", 2)));
        assertFalse(s.silences(at("blank-lines", 1)));
    }

    @Test
    void aNextLineDirectiveSilencesTheFollowingLine() {
        Suppressions s = of("{# tare-ignore-next-line costly-character #}\nPress \u2192 here.\n");
        assertTrue(s.silences(at("costly-character", 2)));
        assertFalse(s.silences(at("costly-character", 1)));
    }

    @Test
    void aFileDirectiveInFrontMatterSilencesEveryLine() {
        Suppressions s = of("---\n# tare-ignore-file blank-lines\nbudget: 10\n---\nText.\n");
        assertTrue(s.silences(at("blank-lines", 40)));
        assertFalse(s.silences(at("space-run", 40)));
        assertTrue(of("{# tare-ignore-file all #}\n").silences(at("anything", 3)));
        assertEquals(1, of("{# tare-ignore-file all #}\n").directives().size());
    }
}
