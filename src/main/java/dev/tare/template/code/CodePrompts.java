package dev.tare.template.code;

import dev.tare.template.LineIndex;
import dev.tare.template.Message;
import dev.tare.template.PlaceholderSyntax;
import dev.tare.template.Template;
import dev.tare.template.TemplateKind;
import dev.tare.template.TemplateMeta;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * The prompts written as string literals in one source file, with what Tare could not read there.
 * Nothing a file holds makes {@link #find} throw: a literal or comment left open ends the reading
 * with a reason ({@link #stopped()}), and the prompts before it are kept. A file that holds no word
 * that names prompts is not read literal by literal, so nothing in it is reported.
 *
 * @param prompts  the prompts found, in file order
 * @param problems {@code tare:} comments Tare could not apply, each naming its line and what to write
 * @param stopped  why the reading ended before the end of the file, naming the line, when it did
 */
public record CodePrompts(List<CodePrompt> prompts, List<String> problems, Optional<String> stopped) {
    public CodePrompts {
        prompts = List.copyOf(prompts);
        problems = List.copyOf(problems);
    }

    /**
     * Finds the prompts of a source file.
     *
     * @param path     the file's path (its extension tells whether it may hold JSX)
     * @param source   the file's text, without a byte-order mark
     * @param language the language to read it as, usually {@link Language#of(String)}
     * @param calls    the calls whose arguments are prompts ({@code templates.code.calls}), each a
     *                 dotted name that matches a call ending in it ({@code assistant.ask} matches
     *                 {@code self.assistant.ask(...)})
     */
    public static CodePrompts find(String path, String source, Language language, List<String> calls) {
        if (!mayHoldPrompt(source, calls)) {
            return new CodePrompts(List.of(), List.of(), Optional.empty());
        }
        LineIndex lines = LineIndex.of(source);
        CodeLexer lexer = switch (language) {
            case PYTHON -> new PythonLexer(source, lines);
            case JAVASCRIPT, TYPESCRIPT -> new ScriptLexer(source, lines, Language.mayHoldMarkup(path));
            case JAVA -> new JavaLexer(source, lines);
            case GO -> new GoLexer(source, lines);
        };
        CodeTokens tokens = lexer.run();
        PromptFinder finder = new PromptFinder(source, language, List.copyOf(calls), tokens, lines);
        List<CodePrompt> found = finder.find();
        return new CodePrompts(found, finder.problems(), Optional.ofNullable(tokens.stopReason()));
    }

    /**
     * The words {@link #mayHoldPrompt} looks for, by their first letter ({@code 'a'} at 0): those of
     * {@link NameWords#ANY_PROMPT_WORD} that hold no other of them, and {@code tare:}.
     */
    private static final String[][] WORDS_BY_LETTER = wordsByLetter();

    /**
     * Whether some literal of {@code source} can be a prompt: only a file that holds a word that
     * names prompts (in any case, anywhere), a {@code tare:} comment or a configured call's name is
     * read further, so the many source files of a repository that hold no prompt cost one pass over
     * their text.
     */
    static boolean mayHoldPrompt(String source, List<String> calls) {
        int length = source.length();
        for (int i = 0; i + 1 < length; i++) {
            int letter = (source.charAt(i) | 0x20) - 'a';
            if (letter < 0 || letter >= 26 || WORDS_BY_LETTER[letter] == null) {
                continue;
            }
            char second = (char) (source.charAt(i + 1) | 0x20);
            for (String word : WORDS_BY_LETTER[letter]) {
                if (word.charAt(1) == second && spells(source, i, word)) {
                    return true;
                }
            }
        }
        for (String call : calls) {
            if (source.contains(call.substring(call.lastIndexOf('.') + 1))) {
                return true;
            }
        }
        return false;
    }

    /**
     * Whether {@code source} holds {@code word} at {@code at}, ASCII letters in either case: a name
     * that says prompt in other letters is not read as one ({@link NameWords}).
     */
    private static boolean spells(String source, int at, String word) {
        if (at + word.length() > source.length()) {
            return false;
        }
        for (int k = 0; k < word.length(); k++) {
            char c = source.charAt(at + k);
            char wanted = word.charAt(k);
            if (c != wanted && !(wanted >= 'a' && wanted <= 'z' && c == wanted - 0x20)) {
                return false;
            }
        }
        return true;
    }

    private static String[][] wordsByLetter() {
        List<String> words = new ArrayList<>(List.of("tare:"));
        for (String word : NameWords.ANY_PROMPT_WORD) {
            if (NameWords.ANY_PROMPT_WORD.stream().noneMatch(other -> !other.equals(word) && word.contains(other))) {
                words.add(word);
            }
        }
        String[][] byLetter = new String[26][];
        for (String word : words) {
            int letter = word.charAt(0) - 'a';
            String[] before = byLetter[letter] == null ? new String[0] : byLetter[letter];
            String[] now = java.util.Arrays.copyOf(before, before.length + 1);
            now[before.length] = word;
            byLetter[letter] = now;
        }
        return byLetter;
    }

    /**
     * The source file as a template of kind {@link TemplateKind#CODE}: one message per prompt, each
     * under its name, a name used twice in the file taking {@code @2}, {@code @3}, ... in file order.
     * {@link Template#prompts()} splits it into one template per prompt.
     */
    public Template template(String path, String source) {
        Map<String, Integer> seen = new HashMap<>();
        List<Message> messages = new ArrayList<>();
        for (CodePrompt prompt : prompts) {
            int times = seen.merge(prompt.name(), 1, Integer::sum);
            String unique = times == 1 ? prompt.name() : prompt.name() + "@" + times;
            messages.add(prompt.message(source, unique));
        }
        return new Template(path, TemplateKind.CODE, TemplateMeta.EMPTY, messages, source, 0, PlaceholderSyntax.NONE);
    }
}
