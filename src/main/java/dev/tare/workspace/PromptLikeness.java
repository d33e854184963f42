package dev.tare.workspace;

import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.Set;
import java.util.regex.Pattern;

/**
 * Whether a file looks like a prompt template, by its name and the start of its text, for the files
 * no include glob selects: to say where the prompts are when a scan finds none, to scan a folder
 * named on the command line, and for {@code tare init}. A guess, made without parsing: template
 * extensions, folders named for prompts, and text with placeholders, role lines, prompt front
 * matter or chat messages.
 */
public final class PromptLikeness {
    /** How much of a file is looked at. */
    static final int HEAD_BYTES = 16 * 1024;

    /** Extensions only templates have. */
    private static final Set<String> TEMPLATE_EXTENSIONS = Set.of("prompt", "j2", "jinja", "jinja2", "mustache", "hbs",
            "tmpl", "tpl");
    /** Extensions of text that may be a template. */
    private static final Set<String> TEXT_EXTENSIONS = Set.of("md", "txt", "markdown");
    /** Extensions of structured files that may be a chat file or a serialized prompt. */
    private static final Set<String> DATA_EXTENSIONS = Set.of("yaml", "yml", "json");
    /** Names of a repository's own documents, never prompts whatever they hold. */
    private static final Pattern PROJECT_DOCUMENT = Pattern.compile(
            "(?i)(readme|changelog|changes|license|licence|contributing|code_of_conduct|security|authors|notice|history)(\\..*)?");
    private static final Pattern PLACEHOLDER = Pattern.compile(
            "\\{\\{\\s*[$#/>^!&]?\\s*[A-Za-z_][\\w.]*[^{}\\n]*}}|\\{%-?\\s*\\w+[^%\\n]*%}|\\$\\{[A-Za-z_][\\w.]*}"
                    + "|(?<![{$])\\{[A-Za-z_]\\w*}(?!})");
    private static final Pattern ROLE_LINE = Pattern.compile("(?im)^[ \\t]*(#{1,6}[ \\t]*)?(system|user|assistant)[ \\t]*:[ \\t]*$");
    private static final Pattern PROMPT_KEY = Pattern.compile(
            "(?m)^(variables|budget|target|inputs|model|calls_per_day|output_tokens|sample)[ \\t]*:");
    private static final Pattern CHAT_KEY = Pattern.compile("[\"']?messages[\"']?\\s*:");
    private static final Pattern ROLE_KEY = Pattern.compile("[\"']?role[\"']?\\s*:");
    private static final Pattern TEMPLATE_KEY = Pattern.compile("[\"']?template[\"']?\\s*:");

    private PromptLikeness() {
    }

    /**
     * Whether the file at {@code file} (root-relative {@code relative}) looks like a prompt template.
     * A file that cannot be read does not.
     */
    public static boolean test(Path file, String relative) {
        String name = relative.substring(relative.lastIndexOf('/') + 1);
        String extension = extension(name);
        boolean template = TEMPLATE_EXTENSIONS.contains(extension) || name.toLowerCase(Locale.ROOT).contains(".prompt.");
        boolean text = TEXT_EXTENSIONS.contains(extension);
        boolean data = DATA_EXTENSIONS.contains(extension);
        if (!template && !text && !data || PROJECT_DOCUMENT.matcher(name).matches()) {
            return false;
        }
        if (template) {
            return true;
        }
        String head = head(file);
        if (head == null) {
            return false;
        }
        if (data) {
            return CHAT_KEY.matcher(head).find() && ROLE_KEY.matcher(head).find()
                    || TEMPLATE_KEY.matcher(head).find() && head.contains("input_variables");
        }
        return inPromptFolder(relative) || PLACEHOLDER.matcher(head).find() || ROLE_LINE.matcher(head).find()
                || PROMPT_KEY.matcher(frontMatter(head)).find();
    }

    /** The text between a first line {@code ---} and the next {@code ---} line, or empty. */
    private static String frontMatter(String head) {
        String text = head.startsWith("\uFEFF") ? head.substring(1) : head;
        if (!text.startsWith("---\n") && !text.startsWith("---\r\n")) {
            return "";
        }
        int close = text.indexOf("\n---", 3);
        return close < 0 ? "" : text.substring(4, close);
    }

    /** Whether a folder on the way to the file is named for prompts or templates. */
    static boolean inPromptFolder(String relative) {
        String[] parts = relative.toLowerCase(Locale.ROOT).split("/");
        for (int i = 0; i < parts.length - 1; i++) {
            if (parts[i].contains("prompt") || parts[i].contains("template") || parts[i].equals("instructions")) {
                return true;
            }
        }
        return false;
    }

    /** The lower-case text after the name's last dot, or empty. */
    static String extension(String name) {
        int dot = name.lastIndexOf('.');
        return dot < 0 ? "" : name.substring(dot + 1).toLowerCase(Locale.ROOT);
    }

    /** The first {@value #HEAD_BYTES} bytes as text, or null for an unreadable or binary file. */
    private static String head(Path file) {
        byte[] bytes;
        try (InputStream in = Files.newInputStream(file)) {
            bytes = in.readNBytes(HEAD_BYTES);
        } catch (IOException e) {
            return null;
        }
        for (byte b : bytes) {
            if (b == 0) {
                return null;
            }
        }
        return new String(bytes, StandardCharsets.UTF_8);
    }
}
