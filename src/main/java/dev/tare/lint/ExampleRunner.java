package dev.tare.lint;

import dev.tare.TareException;
import dev.tare.config.TemplatesConfig;
import dev.tare.source.SourceText;
import dev.tare.template.PartialDirectory;
import dev.tare.template.PlaceholderSyntax;
import dev.tare.template.Renderer;
import dev.tare.template.Template;
import dev.tare.template.TemplateParser;
import dev.tare.template.TemplateSyntaxException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;

/**
 * Runs a rule's worked examples: the rule must flag {@code before} and not {@code after}, and when it
 * offers rewrites, applying all of them to {@code before} must give exactly {@code after}. Examples are
 * double-brace templates; one whose text has a top-level {@code messages:} key is read as a chat file.
 */
public final class ExampleRunner {
    private static final Path ROOT = Path.of(".");

    private ExampleRunner() {
    }

    /**
     * How one example went.
     *
     * @param rule    the rule's id
     * @param number  the example's number, from 1
     * @param origin  where the rule is declared
     * @param problem what went wrong; empty when it passed
     */
    public record Outcome(String rule, int number, String origin, Optional<String> problem) {
        /** Whether the example behaved as written. */
        public boolean passed() {
            return problem.isEmpty();
        }
    }

    /** Every example of every rule in the catalog, rules in id order. */
    public static List<Outcome> runAll(RuleCatalog catalog) {
        List<Outcome> outcomes = new ArrayList<>();
        for (Rule rule : catalog.all()) {
            List<Example> examples = rule.descriptor().examples();
            for (int i = 0; i < examples.size(); i++) {
                outcomes.add(new Outcome(rule.descriptor().id(), i + 1, rule.descriptor().origin(),
                        run(rule, examples.get(i), catalog.ids())));
            }
        }
        return outcomes;
    }

    /** What is wrong with {@code example} of {@code rule}; empty when it behaves as written. */
    public static Optional<String> run(Rule rule, Example example, Set<String> ruleIds) {
        if (rule instanceof CrossTemplateRule across) {
            return runAcross(across, example, ruleIds);
        }
        LintContext context = LintContext.forExample(ROOT, example, ruleIds);
        List<Finding> before;
        try {
            before = findings(rule, example.before(), context);
        } catch (TareException e) {
            return Optional.of("'before' cannot be read: " + e.getMessage());
        }
        if (before.isEmpty()) {
            return Optional.of("flags nothing in 'before'");
        }
        if (rule.descriptor().rewriteClass() != RewriteClass.NONE) {
            List<Edit> edits = new ArrayList<>();
            before.forEach(f -> f.rewrite().ifPresent(r -> edits.addAll(r.edits())));
            String rewritten;
            try {
                rewritten = new Rewrite(edits, 0).applyTo(example.before());
            } catch (IllegalArgumentException e) {
                return Optional.of("its rewrites overlap: " + e.getMessage());
            }
            if (!rewritten.equals(example.after())) {
                return Optional.of("its rewrites give " + show(rewritten) + " but 'after' is " + show(example.after()));
            }
        }
        LintContext afterContext = LintContext.forExample(ROOT, example, ruleIds);
        List<Finding> after;
        try {
            after = findings(rule, example.after(), afterContext);
        } catch (TareException e) {
            return Optional.of("'after' cannot be read: " + e.getMessage());
        }
        if (!after.isEmpty()) {
            return Optional.of("still flags 'after' at line " + after.get(0).line() + ": " + after.get(0).message());
        }
        return Optional.empty();
    }

    /**
     * An example of a rule across templates: {@code before} and {@code after} are sets of files
     * ({@link ExampleFiles}); the rule must flag {@code before}, its extractions must turn it into
     * exactly the files of {@code after} (new partials included), and it must flag nothing there.
     */
    private static Optional<String> runAcross(CrossTemplateRule rule, Example example, Set<String> ruleIds) {
        Map<String, String> before;
        Map<String, String> after;
        try {
            before = ExampleFiles.parse(example.before());
            after = ExampleFiles.parse(example.after());
        } catch (IllegalArgumentException e) {
            return Optional.of(e.getMessage());
        }
        List<Finding> found;
        LintContext context;
        try {
            context = acrossContext(before, example, ruleIds);
            found = rule.checkAll(context);
        } catch (TareException e) {
            return Optional.of("'before' cannot be read: " + e.getMessage());
        }
        if (found.isEmpty()) {
            return Optional.of("flags nothing in 'before'");
        }
        if (rule.descriptor().rewriteClass() != RewriteClass.NONE) {
            Map<String, String> files = new java.util.TreeMap<>(before);
            Map<String, List<Edit>> edits = new java.util.TreeMap<>();
            for (Extraction extraction : rule.extractions(context)) {
                extraction.created().ifPresent(text -> files.put(extraction.partial(), text));
                extraction.copies().forEach(c -> edits.computeIfAbsent(c.path(), p -> new ArrayList<>()).add(c.edit()));
            }
            try {
                edits.forEach((path, list) -> files.put(path, new Rewrite(list, 0).applyTo(files.get(path))));
            } catch (IllegalArgumentException e) {
                return Optional.of("its extractions overlap: " + e.getMessage());
            }
            if (!files.equals(new java.util.TreeMap<>(after))) {
                return Optional.of("its extractions give " + show(ExampleFiles.format(files)) + " but 'after' is "
                        + show(ExampleFiles.format(new java.util.TreeMap<>(after))));
            }
        }
        List<Finding> left;
        try {
            left = rule.checkAll(acrossContext(after, example, ruleIds));
        } catch (TareException e) {
            return Optional.of("'after' cannot be read: " + e.getMessage());
        }
        if (!left.isEmpty()) {
            return Optional.of("still flags 'after' in " + left.get(0).path() + " at line " + left.get(0).line() + ": "
                    + left.get(0).message());
        }
        return Optional.empty();
    }

    /** A context over the example's files, its includes resolved among them in the default partials folder. */
    private static LintContext acrossContext(Map<String, String> files, Example example, Set<String> ruleIds) {
        String partials = TemplatesConfig.DEFAULT_PARTIALS;
        TemplateParser parser = new TemplateParser(PlaceholderSyntax.DOUBLE_BRACE);
        Map<String, Template> templates = new java.util.LinkedHashMap<>();
        files.forEach((path, text) -> templates.put(path, parser.parse(
                new SourceText(path, ROOT.resolve(path), text, false, text.length()), path.startsWith(partials + "/"))));
        Renderer renderer = new Renderer(new PartialDirectory(
                partials, path -> Optional.ofNullable(templates.get(path))));
        return LintContext.forExample(ROOT, example, ruleIds, List.copyOf(templates.values()), renderer);
    }

    private static List<Finding> findings(Rule rule, String text, LintContext context) {
        String path = text.startsWith("[") ? "example.tools.json"
                : text.startsWith("tools:") ? "example.tools.yaml"
                : text.startsWith("messages:") || text.contains("\nmessages:") ? "example.chat.yaml" : "example.md";
        Template template;
        try {
            template = new TemplateParser(PlaceholderSyntax.DOUBLE_BRACE)
                    .parse(new SourceText(path, ROOT.resolve(path), text, false, text.length()), false);
        } catch (TareException e) {
            for (Throwable t = e; t != null; t = t.getCause()) {
                if (t instanceof TemplateSyntaxException syntax && rule instanceof SyntaxErrorRule parseRule) {
                    return parseRule.onSyntaxError(path, text, syntax);
                }
            }
            throw e;
        }
        return rule.check(template, context);
    }

    private static String show(String text) {
        String escaped = text.replace("\\", "\\\\").replace("\n", "\\n").replace("\t", "\\t").replace("\r", "\\r");
        return "\"" + (escaped.length() > 200 ? escaped.substring(0, 197) + "..." : escaped) + "\"";
    }
}
