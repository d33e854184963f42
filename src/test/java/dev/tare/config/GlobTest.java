package dev.tare.config;

import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.TareException;
import org.junit.jupiter.api.Test;

class GlobTest {
    @Test
    void doubleStarSlashMatchesNoFolderOrMany() {
        Glob glob = Glob.of("prompts/**/*.md");
        assertTrue(glob.matches("prompts/a.md"));
        assertTrue(glob.matches("prompts/x/y/a.md"));
        assertFalse(glob.matches("other/prompts2/a.md"));
        assertFalse(glob.matches("prompts/a.txt"));
    }

    @Test
    void leadingDoubleStarMatchesAtTheTop() {
        Glob glob = Glob.of("**/drafts/**");
        assertTrue(glob.matches("drafts/a.md"));
        assertTrue(glob.matches("prompts/drafts/x/a.md"));
        assertFalse(glob.matches("prompts/drafted/a.md"));
    }

    @Test
    void singleStarStaysInOneSegment() {
        Glob glob = Glob.of("*.md");
        assertTrue(glob.matches("a.md"));
        assertFalse(glob.matches("dir/a.md"));
    }

    @Test
    void bracesClassesAndQuestionMarks() {
        assertTrue(Glob.of("**/*.{md,txt}").matches("a/b.txt"));
        assertFalse(Glob.of("**/*.{md,txt}").matches("a/b.json"));
        assertTrue(Glob.of("v[0-9].md").matches("v7.md"));
        assertFalse(Glob.of("v[!0-9].md").matches("v7.md"));
        assertTrue(Glob.of("a?.md").matches("ab.md"));
        assertFalse(Glob.of("a?.md").matches("a/.md"));
    }

    @Test
    void regexCharactersAreLiteral() {
        assertTrue(Glob.of("a+b (1).md").matches("a+b (1).md"));
        assertFalse(Glob.of("a.md").matches("aXmd"));
    }

    /** The plain-text pre-check must never reject a path the expression would match. */
    @Test
    void plainTextShortcutsAgreeWithTheFullMatch() {
        assertTrue(Glob.of("**/x.md").matches("x.md"));
        assertTrue(Glob.of("a/**/**/b.md").matches("a/b.md"));
        assertTrue(Glob.of("**/node_modules/**").matches("node_modules/p/a.md"));
        assertTrue(Glob.of("notes\\*.md").matches("notes*.md"));
        assertFalse(Glob.of("notes\\*.md").matches("notesX.md"));
        assertTrue(Glob.of("{a,b}/c.md").matches("b/c.md"));
        assertTrue(Glob.of("[ab]x/**").matches("bx/y"));
        assertTrue(Glob.of("prompts/a,b.md").matches("prompts/a,b.md"));
        assertFalse(Glob.of("*.md").matches("a.mdx"));
        assertFalse(Glob.of("**/drafts/**").matches("prompts/draft/a.md"));
    }

    @Test
    void malformedPatternsAreClearErrors() {
        TareException bracket = assertThrows(TareException.class, () -> Glob.of("a[bc.md"));
        assertTrue(bracket.getMessage().contains("never closed"), bracket.getMessage());
        assertThrows(TareException.class, () -> Glob.of("{a,b.md"));
    }
}
