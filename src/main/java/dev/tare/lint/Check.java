package dev.tare.lint;

import dev.tare.TareException;
import dev.tare.scan.StagedTemplates;
import dev.tare.scan.TemplateLoader;
import dev.tare.scan.Workspace;
import dev.tare.source.FileSelection;
import dev.tare.source.SkippedFile;
import dev.tare.source.SourceText;
import dev.tare.template.Template;
import dev.tare.template.TemplateKind;
import dev.tare.template.TemplateSyntaxException;
import dev.tare.tokenize.TokenizerRegistry;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.function.Function;

/**
 * Runs the enabled rules over every template of a workspace: finds, reads and parses the files
 * through the shared {@link TemplateLoader}, turns a file that fails to parse into the findings of
 * the syntax-error rules, runs the cross-template rules once over all the templates, applies
 * configured severities and inline suppressions, and sorts the findings. Files that cannot be read at all are listed as skipped, with the reason.
 */
public final class Check {
    private final Workspace workspace;
    private final TokenizerRegistry tokenizers;
    private RuleCatalog catalog;

    public Check(Workspace workspace, TokenizerRegistry tokenizers) {
        this.workspace = workspace;
        this.tokenizers = tokenizers;
    }

    /**
     * The rules of this workspace, loaded once and shared by every run of this check.
     *
     * @throws TareException when a rule pack or the rules configuration is broken
     */
    public synchronized RuleCatalog catalog() {
        if (catalog == null) {
            catalog = RuleCatalog.load(workspace.config());
        }
        return catalog;
    }

    /** Checks the files of the workspace as they are on disk. */
    public CheckResult run(CheckOptions options) {
        TemplateLoader loader = new TemplateLoader(workspace);
        return run(options, loader, loader.find(), loader::read);
    }

    /** Checks the templates staged for the next commit, as the git index holds them. */
    public CheckResult runStaged(CheckOptions options) {
        TemplateLoader loader = new TemplateLoader(workspace);
        StagedTemplates index = loader.staged();
        return run(options, loader, index.selection(), index::read);
    }

    /**
     * Checks the selected files, reading each through {@code reader} (the file on disk, or another
     * version of it such as the staged one).
     */
    public CheckResult run(CheckOptions options, TemplateLoader loader, FileSelection selection,
                           Function<String, SourceText> reader) {
        RuleCatalog catalog = catalog();
        List<Rule> rules = catalog.enabled();
        List<Template> templates = new ArrayList<>();
        List<Finding> findings = new ArrayList<>();
        List<SkippedFile> skipped = new ArrayList<>(selection.skipped());
        for (String path : selection.paths()) {
            SourceText text = null;
            try {
                text = reader.apply(path);
                templates.add(loader.parse(text));
            } catch (TareException e) {
                Optional<TemplateSyntaxException> syntax = syntaxError(e);
                if (syntax.isPresent() && text != null) {
                    for (Rule rule : rules) {
                        if (rule instanceof SyntaxErrorRule parseRule) {
                            findings.addAll(parseRule.onSyntaxError(path, text.text(), syntax.get()));
                        }
                    }
                } else {
                    skipped.add(new SkippedFile(path, e.getMessage()));
                }
            }
        }
        LintContext context = new LintContext(workspace.config(), tokenizers, loader.renderer(), templates,
                catalog.ids(), Map.of());
        Map<String, Suppressions> silenced = new java.util.HashMap<>();
        for (Template template : templates) {
            Suppressions suppressions = Suppressions.of(context.text(template));
            silenced.put(template.path(), suppressions);
            for (Rule rule : rules) {
                if (rule instanceof CrossTemplateRule
                        || template.kind() == TemplateKind.TOOLS && !(rule instanceof ToolRule)) {
                    continue;
                }
                for (Finding finding : rule.check(template, context)) {
                    if (!suppressions.silences(finding)) {
                        findings.add(finding);
                    }
                }
            }
        }
        for (Rule rule : rules) {
            if (rule instanceof CrossTemplateRule across) {
                for (Finding finding : across.checkAll(context)) {
                    Suppressions suppressions = silenced.get(finding.path());
                    if (suppressions == null || !suppressions.silences(finding)) {
                        findings.add(finding);
                    }
                }
            }
        }
        List<Finding> configured = new ArrayList<>();
        for (Finding finding : findings) {
            configured.add(finding.withSeverity(catalog.severity(catalog.rule(finding.rule()).descriptor())));
        }
        configured.sort(Finding.ORDER);
        skipped.sort(null);
        List<RuleDescriptor> descriptors = rules.stream().map(Rule::descriptor)
                .map(d -> new RuleDescriptor(d.id(), d.summary(), d.why(), d.instead(), catalog.severity(d),
                        d.rewriteClass(), d.examples(), d.origin()))
                .toList();
        return new CheckResult(workspace.root().toString(), descriptors, configured, skipped, templates.size(),
                options.failOn());
    }

    private static Optional<TemplateSyntaxException> syntaxError(Throwable e) {
        for (Throwable t = e; t != null; t = t.getCause()) {
            if (t instanceof TemplateSyntaxException syntax) {
                return Optional.of(syntax);
            }
        }
        return Optional.empty();
    }
}
