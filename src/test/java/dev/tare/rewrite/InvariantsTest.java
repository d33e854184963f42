package dev.tare.rewrite;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.lint.Edit;
import dev.tare.lint.EditKind;
import dev.tare.source.SourceText;
import dev.tare.template.PlaceholderSyntax;
import dev.tare.template.Template;
import dev.tare.template.TemplateParser;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * Each invariant of design.md "Rewrites that are safe" catches the change it exists for. Markdown
 * structure follows CommonMark 0.31.2 (section numbers from memory): fenced code blocks §4.5,
 * paragraphs separated by blank lines §4.8 and §4.9, code spans §6.1, line endings LF, CR and CRLF
 * §2.1. JSON equality follows RFC 8259 (member order is not significant, §4).
 */
class InvariantsTest {
    private static final Trace.Author WHITESPACE = new Trace.Author("a-whitespace-rule", EditKind.WHITESPACE);
    private static final Trace.Author TEXT = new Trace.Author("a-text-rule", EditKind.TEXT);
    private static final Trace.Author JSON = new Trace.Author("a-json-rule", EditKind.JSON_LAYOUT);

    private static Template parse(String path, String text) {
        return parse(PlaceholderSyntax.DOUBLE_BRACE, path, text);
    }

    private static Template parse(PlaceholderSyntax syntax, String path, String text) {
        return new TemplateParser(syntax).parse(new SourceText(path, Path.of(path), text, false, text.length()), false);
    }

    /** The problems of applying {@code edits} (all by {@code author}) to {@code text} in one round. */
    private static List<String> problems(String path, String text, Trace.Author author, Edit... edits) {
        return problems(PlaceholderSyntax.DOUBLE_BRACE, path, text, author, edits);
    }

    private static List<String> problems(PlaceholderSyntax syntax, String path, String text, Trace.Author author,
                                         Edit... edits) {
        Trace trace = new Trace(text);
        List<Trace.AuthoredEdit> authored = new ArrayList<>();
        for (Edit edit : edits) {
            authored.add(new Trace.AuthoredEdit(edit, author));
        }
        authored.sort((a, b) -> a.edit().compareTo(b.edit()));
        String after = trace.apply(authored);
        return Invariants.violations(parse(syntax, path, text), parse(syntax, path, after), trace);
    }

    private static List<String> problems(String text, Trace.Author author, Edit... edits) {
        return problems("a.md", text, author, edits);
    }

    private static Edit replace(String text, String from, String to) {
        int at = text.indexOf(from);
        return new Edit(at, at + from.length(), to);
    }

    private static void assertProblem(List<String> problems, String words) {
        assertTrue(problems.stream().anyMatch(p -> p.contains(words)), "expected '" + words + "' in " + problems);
    }

    @Test
    void aWhitespaceOnlyRewriteKeepsEverything() {
        String text = "Hello  there {{ name }}.   \n\n\n\nUse `a  b` here.\n";
        assertEquals(List.of(), problems(text, WHITESPACE, replace(text, "  there", " there"),
                new Edit(text.indexOf(".   ") + 1, text.indexOf(".   ") + 4, ""), replace(text, "\n\n\n\nUse", "\n\nUse")));
    }

    @Test
    void aLostVariableOrIncludeIsCaught() {
        String text = "Hi {{ name }}, see {{> policy }}.\n";
        assertProblem(problems(text, TEXT, replace(text, " {{ name }}", "")), "variable 'name'");
        assertProblem(problems(text, TEXT, replace(text, " {{> policy }}", "")), "include 'policy'");
    }

    @Test
    void aLostOrChangedFunctionCallIsCaught() {
        String text = "Weather: {{weather.forecast  $city}} for {{$city}}.\n";
        PlaceholderSyntax syntax = PlaceholderSyntax.DOLLAR_DOUBLE_BRACE;
        assertProblem(problems(syntax, "a.md", text, TEXT, replace(text, " {{weather.forecast  $city}}", "")),
                "call 'weather.forecast'");
        assertProblem(problems(syntax, "a.md", text, WHITESPACE, replace(text, "forecast  $city", "forecast $city")),
                "call 'weather.forecast'");
    }

    @Test
    void aChangedFilterOrTagIsCaughtThoughTheNameStays() {
        String text = "Pay {{ amount | currency }} {% if late %}now{% endif %}.\n";
        assertProblem(problems(text, TEXT, replace(text, " | currency", "")), "variable 'amount'");
        assertProblem(problems(text, TEXT, replace(text, "{% if late %}", "{% if early %}")), "tag {% if late %}");
    }

    @Test
    void fencedCodeAndCodeSpansMustStayAsWritten() {
        String text = "Run this:\n\n```sh\necho  hi   \n```\n\nThen `ls  -l`.\n";
        assertProblem(problems(text, WHITESPACE, replace(text, "echo  hi", "echo hi")), "fenced code block at line 3");
        assertProblem(problems(text, WHITESPACE, replace(text, "ls  -l", "ls -l")), "inline code");
    }

    @Test
    void aFencedJsonBlockMayBeReLaidOutOnlyToAnEqualTree() {
        String text = "Reply:\n\n```json\n{\n  \"a\": 1,\n  \"b\": [true, null]\n}\n```\n";
        String body = "{\n  \"a\": 1,\n  \"b\": [true, null]\n}\n";
        assertEquals(List.of(), problems(text, JSON, replace(text, body, "{\"a\":1,\"b\":[true,null]}\n")));
        assertEquals(List.of(), problems(text, JSON, replace(text, body, "{\"b\":[true,null],\"a\":1}\n")),
                "member order is not significant (RFC 8259 §4)");
        assertProblem(problems(text, JSON, replace(text, body, "{\"a\":1.0,\"b\":[true,null]}\n")), "fenced code block");
        assertEquals(List.of(), problems(text, TEXT, replace(text, body, "{\"a\":1,\"b\":[true,null]}\n")),
                "a review rewrite that keeps the value keeps the block (pretty-json-block)");
        assertProblem(problems(text, TEXT, replace(text, body, "{\"a\":2,\"b\":[true,null]}\n")), "fenced code block");
    }

    @Test
    void aMessageThatWasJsonMustKeepItsValue() {
        String chat = "{\"messages\": [{\"role\": \"user\", \"content\": \"{\\\"q\\\": \\\"a  b\\\"}\"}]}";
        assertProblem(problems("a.chat.json", chat, WHITESPACE, replace(chat, "a  b", "a b")),
                "no longer holds the same JSON value");
    }

    @Test
    void aWhitespaceRuleMayNotTouchOtherCharacters() {
        String text = "One two.\n";
        assertProblem(problems(text, WHITESPACE, replace(text, "two", "tw")), "removed the character");
        assertProblem(problems(text, WHITESPACE, replace(text, " ", " x")), "wrote the character 'x'");
        assertEquals(List.of(), problems(text, TEXT, replace(text, "two", "2")), "a text rule may change words");
    }

    @Test
    void paragraphBreaksMayNeitherBeRemovedNorAdded() {
        String text = "First paragraph.\n\nSecond paragraph.\nSame paragraph.\n";
        assertProblem(problems(text, WHITESPACE, replace(text, ".\n\nSecond", ".\nSecond")), "paragraph break was removed");
        assertProblem(problems(text, WHITESPACE, replace(text, ".\nSame", ".\n\nSame")), "paragraph break was added");
        String zeroWidth = "First line.\n\u200B\nSecond line.\n";
        assertProblem(problems(zeroWidth, TEXT, replace(zeroWidth, "\u200B", "")), "paragraph break was added");
    }

    @Test
    void droppingAWholeParagraphKeepsTheBreakAroundIt() {
        String text = "Keep this.\n\nDrop this one.\n\nKeep that.\n";
        assertEquals(List.of(), problems(text, TEXT, replace(text, "Drop this one.\n\n", "")));
        assertProblem(problems(text, TEXT, replace(text, "\n\nDrop this one.\n\n", "\n")), "paragraph break was removed");
    }

    @Test
    void blankLinesInsideAFenceAreNotParagraphBreaks() {
        String text = "Reply:\n```json\n{\n\n  \"a\": 1\n}\n```\nDone.\n";
        assertEquals(List.of(), problems(text, JSON, replace(text, "{\n\n  \"a\": 1\n}\n", "{\"a\":1}\n")));
    }

    @Test
    void theFinalNewlineStateIsKept() {
        String text = "One.  \nTwo.\n";
        assertProblem(problems(text, WHITESPACE, replace(text, "Two.\n", "Two.")), "ended with a line break");
        String none = "One.";
        assertProblem(problems(none, WHITESPACE, new Edit(4, 4, "\n")), "did not end with a line break");
    }

    @Test
    void aLineEndingStyleTheFileDidNotUseIsCaught() {
        String crlf = "One.  \r\nTwo.\r\n\r\n\r\n\r\nThree.\r\n";
        assertEquals(List.of(), problems(crlf, WHITESPACE, replace(crlf, "\r\n\r\n\r\n\r\n", "\r\n\r\n")));
        assertProblem(problems(crlf, WHITESPACE, replace(crlf, "\r\n\r\n\r\n\r\n", "\r\n\n")), "brings LF line endings");
        assertProblem(problems(crlf, WHITESPACE, replace(crlf, "One.  \r\n", "One.\r")), "brings CR line endings");
    }

    @Test
    void editsOverSeveralRoundsAreJudgedFromTheOriginal() {
        String text = "Alpha  beta.\n\n\n\nGamma.\n";
        Trace trace = new Trace(text);
        String once = trace.apply(List.of(new Trace.AuthoredEdit(replace(text, "  beta", " beta"), WHITESPACE)));
        String twice = trace.apply(List.of(new Trace.AuthoredEdit(replace(once, "\n\n\n\n", "\n"), WHITESPACE)));
        assertEquals("Alpha beta.\nGamma.\n", twice);
        assertProblem(Invariants.violations(parse("a.md", text), parse("a.md", twice), trace), "paragraph break was removed");
    }

    @Test
    void frontMatterMustNotChange() {
        String text = "---\nbudget: 500\n---\nBody  text.\n";
        assertProblem(problems(text, TEXT, replace(text, "500", "600")), "front matter");
    }

    @Test
    void roleMarkedTextKeepsItsMessagesAndRoles() {
        String text = "system:\nBe  brief.  \n\nuser:\n{{ question }}\n";
        assertEquals(List.of(), problems(text, WHITESPACE, replace(text, "Be  brief.  ", "Be brief.")));
        assertProblem(problems(text, TEXT, replace(text, "user:", "assistant:")), "the role of message 2 changed");
        assertProblem(problems(text, TEXT, replace(text, "Be  brief.", "Be brief.\nuser:\nHi")), "the same number of messages");
    }
}
