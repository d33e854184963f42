package dev.tare.workspace;

import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Which files look like prompts when no include glob says; invented examples of each sign. */
class PromptLikenessTest {
    @TempDir
    Path root;

    private boolean looks(String path, String text) throws IOException {
        Path file = root.resolve(path);
        Files.createDirectories(file.getParent());
        Files.writeString(file, text);
        return PromptLikeness.test(file, path);
    }

    @Test
    void templateExtensionsAndPromptNamesAreEnough() throws IOException {
        assertTrue(looks("agents/triage.j2", "Sort the meter readings."));
        assertTrue(looks("agents/triage.hbs", "Sort the meter readings."));
        assertTrue(looks("billing.prompt.md", "Sort the meter readings."));
    }

    @Test
    void textInAPromptsOrTemplatesFolderIsAPrompt() throws IOException {
        assertTrue(looks("templates/billing.md", "You answer questions about water bills."));
        assertTrue(looks("src/app/prompts/x.txt", "You answer questions about water bills."));
    }

    @Test
    void textWithPlaceholdersRoleLinesOrPromptFrontMatterIsAPrompt() throws IOException {
        assertTrue(looks("notes/a.md", "Answer {{ question }} briefly.\n"));
        assertTrue(looks("notes/b.md", "Answer ${question} briefly.\n"));
        assertTrue(looks("notes/c.md", "Answer {question} briefly.\n"));
        assertTrue(looks("notes/d.md", "{% if outage %}Mention the outage.{% endif %}\n"));
        assertTrue(looks("notes/e.md", "system:\nYou are the utility's assistant.\nuser:\nHi\n"));
        assertTrue(looks("notes/f.md", "# System:\nYou are the utility's assistant.\n"));
        assertTrue(looks("notes/g.md", "---\nvariables: {name: {tokens: 3}}\n---\nHello.\n"));
    }

    @Test
    void ordinaryDocumentsAreNot() throws IOException {
        assertFalse(looks("docs/guide.md", "# Guide\n\nRun the service with `make run`.\n"));
        assertFalse(looks("docs/setup.md", "---\ntitle: Setup\n---\nInstall it.\n"));
        assertFalse(looks("README.md", "Hello {{ name }}\n"), "the project's own documents never are");
        assertFalse(looks("templates/CHANGELOG.md", "1.0\n"));
        assertFalse(looks("src/Main.java", "class Main {}\n"));
        assertFalse(looks("data/blob.txt", "a\u0000b{{ x }}"), "binary files are not");
    }

    @Test
    void dataFilesAreChatFilesOrSerializedPromptsOnly() throws IOException {
        assertTrue(looks("config/chat.yaml", "messages:\n  - role: system\n    content: Be brief.\n"));
        assertTrue(looks("config/chat.json", "{\"messages\": [{\"role\": \"user\", \"content\": \"Hi\"}]}"));
        assertTrue(looks("config/p.json", "{\"input_variables\": [\"q\"], \"template\": \"Answer {q}\"}"));
        assertFalse(looks("config/app.yaml", "server:\n  port: 8080\n"));
        assertFalse(looks("package.json", "{\"name\": \"x\", \"version\": \"1.0.0\"}"));
    }
}
