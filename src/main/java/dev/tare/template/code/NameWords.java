package dev.tare.template.code;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Set;

/**
 * The words of a name as code writes them ({@code system_prompt}, {@code systemPrompt},
 * {@code SYSTEM_PROMPT}, {@code few-shot}), and whether they say the name holds a prompt.
 */
final class NameWords {
    /** Words that say a name holds a prompt. */
    private static final Set<String> PROMPT = Set.of("prompt", "prompts", "system", "instruction", "instructions",
            "template", "templates", "tmpl", "tpl", "persona", "personas", "preamble", "guideline", "guidelines",
            "fewshot", "message", "messages", "msg", "msgs", "directive", "directives");
    /** Words that say it even for a key, a call or an annotation, where "message" is too common to count. */
    private static final Set<String> STRONG = Set.of("prompt", "prompts", "system", "instruction", "instructions",
            "template", "templates", "tmpl", "tpl", "persona", "personas", "preamble", "guideline", "guidelines",
            "fewshot");
    /** Words that say a name holds something else: a message for a log or an error, a query, a place, a setting. */
    private static final Set<String> OTHER = Set.of("error", "errors", "err", "exception", "log", "logs", "logger",
            "logging", "debug", "sql", "query", "url", "urls", "uri", "path", "paths", "file", "files", "filename",
            "dir", "directory", "regex", "pattern", "id", "ids", "name", "names", "key", "keys", "version", "config",
            "settings", "options", "params", "metadata", "kwargs", "headers", "env", "endpoint", "route");
    /** The keys whose value is a prompt in the chat formats and prompt-building calls. */
    private static final Set<String> KEYS = Set.of("content", "system", "prompt", "instructions", "template");

    /**
     * Every word that can make a name, key or call say it holds a prompt, lower case: a text that
     * holds none of them, in any case and anywhere, has no place that names a prompt.
     */
    static final List<String> ANY_PROMPT_WORD = anyPromptWord();

    private NameWords() {
    }

    private static List<String> anyPromptWord() {
        Set<String> all = new java.util.TreeSet<>(PROMPT);
        all.addAll(STRONG);
        all.addAll(KEYS);
        all.add("few");
        return List.copyOf(all);
    }

    /** The lower-case words of {@code name}: split at {@code _}, {@code -}, {@code .}, digits and case changes. */
    static List<String> of(String name) {
        List<String> words = new ArrayList<>();
        StringBuilder word = new StringBuilder();
        for (int k = 0; k < name.length(); k++) {
            char c = name.charAt(k);
            if (!Character.isLetter(c)) {
                flush(words, word);
                continue;
            }
            boolean upper = Character.isUpperCase(c);
            if (upper && word.length() > 0) {
                char before = name.charAt(k - 1);
                boolean nextLower = k + 1 < name.length() && Character.isLowerCase(name.charAt(k + 1));
                if (Character.isLowerCase(before) || Character.isUpperCase(before) && nextLower) {
                    flush(words, word);
                }
            }
            word.append(Character.toLowerCase(c));
        }
        flush(words, word);
        return words;
    }

    private static void flush(List<String> words, StringBuilder word) {
        if (word.length() > 0) {
            words.add(word.toString());
            word.setLength(0);
        }
    }

    /** Whether a variable or argument name says it holds a prompt. */
    static boolean saysPrompt(String name) {
        return says(name, PROMPT);
    }

    /** Whether a key, a call or an annotation says so, by a word stronger than "message". */
    static boolean saysPromptStrongly(String name) {
        return says(name, STRONG);
    }

    /** Whether {@code key} is one of the keys whose value is a prompt ({@code content}, {@code system}, ...). */
    static boolean isPromptKey(String key) {
        return KEYS.contains(key.toLowerCase(Locale.ROOT));
    }

    private static boolean says(String name, Set<String> words) {
        List<String> parts = of(name);
        boolean prompt = false;
        for (int k = 0; k < parts.size(); k++) {
            String part = parts.get(k);
            if (OTHER.contains(part)) {
                return false;
            }
            prompt |= words.contains(part) || part.equals("few") && k + 1 < parts.size()
                    && parts.get(k + 1).startsWith("shot");
        }
        return prompt;
    }

    /** The chat role a name speaks for ({@code SystemMsg}, {@code user_prompt}), if it says one. */
    static String role(String name) {
        List<String> parts = of(name);
        if (parts.contains("system")) {
            return "system";
        }
        if (parts.contains("user") || parts.contains("human")) {
            return "user";
        }
        if (parts.contains("assistant")) {
            return "assistant";
        }
        return "";
    }
}
