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
 * with a reason ({@link #stopped()}), and the prompts before it are kept.
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
