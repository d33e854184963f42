package dev.tare.lint.rules;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.ObjectMapper;
import dev.tare.lint.Edit;
import dev.tare.lint.EditKind;
import dev.tare.lint.Example;
import dev.tare.lint.Finding;
import dev.tare.lint.LintContext;
import dev.tare.lint.Rewrite;
import dev.tare.lint.RuleDescriptor;
import dev.tare.lint.Severity;
import dev.tare.lint.ToolRule;
import dev.tare.template.Template;
import dev.tare.template.TemplateKind;
import dev.tare.tokenize.Tokenizer;
import java.util.List;
import java.util.Locale;
import java.util.Optional;

/**
 * A JSON tool file laid out for reading. Applications often send such a file as it is written, so
 * its indentation is paid on every call; minified, it parses to the same JSON tree.
 */
final class PrettyToolFile implements ToolRule {
    static final RuleDescriptor DESCRIPTOR = RuleDescriptor.builtIn("pretty-tool-file", Severity.WARNING, EditKind.JSON_LAYOUT,
            "A JSON tool file written with indentation and line breaks.",
            "If the application sends the file as written, every space and line break of the layout is paid on every call"
                    + " (Tare counts tool definitions minified, so its own figures assume you minify).",
            "Keep the file minified, one line; a formatter can show it pretty while you edit.",
            Example.of("[\n  {\"name\": \"lookup_account\", \"description\": \"Find an account.\"}\n]\n",
                    "[{\"name\":\"lookup_account\",\"description\":\"Find an account.\"}]\n"));

    /** Built on first use: every check loads this class for its descriptor, few ever meet a JSON tool file. */
    private static final class Json {
        static final ObjectMapper MAPPER = new ObjectMapper();
    }

    @Override
    public RuleDescriptor descriptor() {
        return DESCRIPTOR;
    }

    @Override
    public List<Finding> check(Template template, LintContext context) {
        if (template.kind() != TemplateKind.TOOLS || !template.path().toLowerCase(Locale.ROOT).endsWith(".json")) {
            return List.of();
        }
        String source = template.source();
        String minified;
        try {
            minified = Json.MAPPER.writeValueAsString(Json.MAPPER.readTree(source));
        } catch (JsonProcessingException e) {
            return List.of();
        }
        String ending = source.endsWith("\r\n") ? "\r\n" : source.endsWith("\n") ? "\n" : "";
        String after = minified + ending;
        if (after.equals(source)) {
            return List.of();
        }
        Tokenizer tokenizer = context.tokenizer(template);
        int saving = tokenizer.count(source) - tokenizer.count(after);
        Rewrite rewrite = new Rewrite(List.of(new Edit(0, source.length(), after)), saving);
        int lines = source.strip().split("\n", -1).length;
        String layout = lines == 1 ? "tool file written with spaces between its JSON tokens"
                : String.format(Locale.ROOT, "tool file laid out over %d lines", lines);
        return List.of(ToolFindings.at(template, context, DESCRIPTOR, 1, String.format(Locale.ROOT,
                "%s; minified it parses to the same JSON and saves %,d tokens per call when sent as written", layout,
                saving), Optional.of(rewrite)));
    }
}
