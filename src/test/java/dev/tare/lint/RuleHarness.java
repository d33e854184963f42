package dev.tare.lint;

import dev.tare.config.TareConfig;
import dev.tare.source.SourceText;
import dev.tare.template.IncludeResolver;
import dev.tare.template.PartialDirectory;
import dev.tare.template.PlaceholderSyntax;
import dev.tare.template.Renderer;
import dev.tare.template.Template;
import dev.tare.template.TemplateParser;
import dev.tare.tokenize.TokenizerRegistry;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;

/** Runs one rule on text given in a test, the way the check engine would, without files. */
public final class RuleHarness {
    private RuleHarness() {
    }

    /** The template parsed from {@code text} as the file {@code path} (a chat file for .yaml/.json names). */
    public static Template template(String path, String text) {
        return template(PlaceholderSyntax.DOUBLE_BRACE, path, text);
    }

    /** The template parsed from {@code text} as the file {@code path}, with placeholders written in {@code syntax}. */
    public static Template template(PlaceholderSyntax syntax, String path, String text) {
        return new TemplateParser(syntax)
                .parse(new SourceText(path, Path.of(path), text, false, text.length()), path.contains("partials/"));
    }

    /** The findings of {@code rule} in {@code text}, read as {@code example.md}. */
    public static List<Finding> findings(Rule rule, String text) {
        return findings(rule, "example.md", text, Map.of());
    }

    /** The findings of {@code rule} in {@code text}, read as {@code path}, with example settings. */
    public static List<Finding> findings(Rule rule, String path, String text, Map<String, Integer> settings) {
        return findings(rule, PlaceholderSyntax.DOUBLE_BRACE, path, text, settings);
    }

    /** The findings of {@code rule} in {@code text} with placeholders written in {@code syntax}, read as {@code example.md}. */
    public static List<Finding> findings(Rule rule, PlaceholderSyntax syntax, String text) {
        return findings(rule, syntax, "example.md", text, Map.of());
    }

    /** The findings of {@code rule} in {@code text} with placeholders written in {@code syntax}, read as {@code path}, with example settings. */
    public static List<Finding> findings(Rule rule, PlaceholderSyntax syntax, String path, String text,
                                         Map<String, Integer> settings) {
        Template template = template(syntax, path, text);
        LintContext context = LintContext.forExample(Path.of("."), new Example(text, text, settings), java.util.Set.of());
        List<Finding> findings = new ArrayList<>(rule.check(template, context));
        findings.sort(Finding.ORDER);
        return findings;
    }

    /** The findings of {@code rule} in {@code text}, read as {@code path}, under {@code config} (no includes resolve). */
    public static List<Finding> findings(Rule rule, String path, String text, TareConfig config) {
        LintContext context = new LintContext(config, new TokenizerRegistry(), new Renderer(IncludeResolver.NONE), List.of(),
                java.util.Set.of(), Map.of());
        List<Finding> findings = new ArrayList<>(rule.check(template(path, text), context));
        findings.sort(Finding.ORDER);
        return findings;
    }

    /**
     * A context over {@code templates} whose includes resolve among them in {@code prompts/partials},
     * with example settings.
     */
    public static LintContext withPartials(List<Template> templates, Map<String, Integer> settings) {
        Renderer renderer = new Renderer(new PartialDirectory("prompts/partials",
                path -> templates.stream().filter(t -> t.path().equals(path)).findFirst()));
        return LintContext.forExample(Path.of("."), new Example("", "", settings), java.util.Set.of(), templates, renderer);
    }

    /** {@code text} (read as {@code path}) with every rewrite of {@code rule} applied. */
    public static String fixed(Rule rule, String path, String text) {
        List<Edit> edits = new ArrayList<>();
        for (Finding finding : findings(rule, path, text, Map.of())) {
            finding.rewrite().ifPresent(r -> edits.addAll(r.edits()));
        }
        return new Rewrite(edits, 0).applyTo(text);
    }

    /** {@code text} (read as {@code example.md}) with every rewrite of {@code rule} applied. */
    public static String fixed(Rule rule, String text) {
        return fixed(rule, "example.md", text);
    }
}
