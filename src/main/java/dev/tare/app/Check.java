package dev.tare.app;

import dev.tare.TareException;
import dev.tare.cache.CacheKey;
import dev.tare.cache.TemplateCache;
import dev.tare.config.TareConfig;
import dev.tare.footprint.Target;
import dev.tare.lint.CrossTemplateRule;
import dev.tare.lint.Finding;
import dev.tare.lint.LintContext;
import dev.tare.lint.Rule;
import dev.tare.lint.RuleCatalog;
import dev.tare.lint.RuleDescriptor;
import dev.tare.lint.RunTemplates;
import dev.tare.lint.Severity;
import dev.tare.lint.Suppressions;
import dev.tare.lint.SyntaxErrorRule;
import dev.tare.lint.ToolRule;
import dev.tare.overlap.RepositoryWords;
import dev.tare.source.SourceText;
import dev.tare.template.Renderer;
import dev.tare.template.Rendering;
import dev.tare.template.Template;
import dev.tare.template.TemplateKind;
import dev.tare.template.TemplateSyntaxException;
import dev.tare.tokenize.TokenizerRegistry;
import dev.tare.workspace.FileSelection;
import dev.tare.workspace.SkippedFile;
import dev.tare.workspace.StagedTemplates;
import dev.tare.workspace.Workspace;
import java.nio.file.Files;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.concurrent.CompletableFuture;
import java.util.function.Function;
import java.util.function.Predicate;

/**
 * Runs the enabled rules over every template of a workspace: finds, reads and parses the files
 * through the shared {@link TemplateLoader}, turns a file that fails to parse into the findings of
 * the syntax-error rules, runs the cross-template rules once over all the templates, applies
 * configured severities and inline suppressions, and sorts the findings. Files that cannot be read
 * at all are listed as skipped, with the reason.
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
            catalog = RulePacks.catalog(workspace.config());
        }
        return catalog;
    }

    /**
     * Checks the files of the workspace as they are on disk. With {@link CheckOptions#cache()} a
     * file whose text, partials and tool files are unchanged since an earlier check with the same
     * build, configuration, rule packs, baseline and tokenizer files is not read or linted again,
     * and when no template changed at all neither are the cross-template rules run again (see
     * {@link TemplateCache}).
     */
    public CheckResult run(CheckOptions options) {
        String key = options.cache() ? cacheKey() : "";
        TemplateLoader loader = new TemplateLoader(workspace);
        CompletableFuture<TemplateCache<CheckedFile>> opening = CompletableFuture.supplyAsync(() -> options.cache()
                ? TemplateCache.open(workspace.root(), workspace.starts().isEmpty(), "check", key, new CheckedFileCodec())
                : TemplateCache.disabled(workspace.root()));
        FileSelection selection = loader.find();
        TemplateCache<CheckedFile> cache = opening.join();
        CheckResult result = run(options, loader, selection, loader::read, cache);
        cache.save();
        if (result.templates() == 0 && result.findings().isEmpty() && result.skipped().isEmpty()) {
            // Every file selected was a source file without prompts: as empty as no file at all.
            throw loader.noTemplates();
        }
        return result;
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
        return run(options, loader, selection, reader, TemplateCache.disabled(workspace.root()));
    }

    /**
     * Everything besides the template files that decides a check's findings: the configuration and
     * partials ({@link CacheKey}), the tokenizers of the targets, the rule packs' files and the
     * baseline's text.
     */
    private String cacheKey() {
        TareConfig config = workspace.config();
        CacheKey key = CacheKey.of(workspace.root(), workspace.config()).tokenizer(TokenizerRegistry.DEFAULT);
        for (Target target : config.targets()) {
            key.tokenizer(target.tokenizer());
        }
        for (String pack : config.rules().packs()) {
            key.contents(config.root().resolve(pack).normalize());
        }
        return key.contents(BaselineFile.path(config)).toString();
    }

    private CheckResult run(CheckOptions options, TemplateLoader loader, FileSelection selection,
                        Function<String, SourceText> reader, TemplateCache<CheckedFile> cache) {
        RuleCatalog catalog = catalog();
        List<Rule> rules = catalog.enabled();
        boolean across = rules.stream().anyMatch(rule -> rule instanceof CrossTemplateRule);
        Findings findings = new Findings(catalog);
        List<SkippedFile> skipped = new ArrayList<>(selection.skipped());
        // Each template is linted and let go; the cross-template rules get its words, and parse it
        // again only if they need more of it.
        LintContext each = onDisk(loader, tokenizers, loader.renderer(), RunTemplates.held(List.of()), catalog.ids());
        RepositoryWords words = new RepositoryWords();
        Map<String, Integer> stamps = new HashMap<>();
        Map<String, Suppressions> silenced = new HashMap<>();
        // The templates are linted on every core, each let go once linted; what each gave is taken in
        // path order, so the findings come in the order a single thread would give them.
        List<FileVerdict> linted = selection.paths().parallelStream()
                // What the cache gives was kept at the configured severities, which its key holds.
                .map(path -> cache.find(path).map(kept -> new FileVerdict(path, Optional.of(kept), Optional.empty(), true))
                        .orElseGet(() -> lint(path, reader, loader, rules, each, across ? words : null, findings, cache)))
                .toList();
        boolean everyWordGathered = true;
        for (FileVerdict one : linted) {
            one.skipped().ifPresent(skipped::add);
            one.checked().ifPresent(checked -> {
                checked.findings().forEach(findings::addConfigured);
                checked.suppressions().ifPresent(suppressions -> silenced.put(one.path(), suppressions));
                checked.hash().ifPresent(hash -> stamps.put(one.path(), hash));
            });
            everyWordGathered &= !one.remembered();
        }
        if (across) {
            Optional<Long> fingerprint = cache.fingerprint(stamps.keySet());
            Optional<CheckedFile> kept = fingerprint.flatMap(cache::findWhole);
            if (kept.isPresent()) {
                kept.get().findings().forEach(findings::addConfigured);
            } else {
                LintContext all = onDisk(loader, tokenizers, loader.renderer(),
                        runTemplates(stamps, everyWordGathered ? words : null, loader, reader), catalog.ids());
                List<Finding> found = new ArrayList<>();
                for (Rule rule : rules) {
                    if (rule instanceof CrossTemplateRule acrossRule) {
                        for (Finding finding : acrossRule.checkAll(all)) {
                            Suppressions suppressions = silenced.get(finding.path());
                            if (suppressions == null || !suppressions.silences(finding)) {
                                found.add(findings.configure(finding));
                            }
                        }
                    }
                }
                found.forEach(findings::addConfigured);
                fingerprint.ifPresent(f -> cache.rememberWhole(f, new CheckedFile(found, Optional.empty(),
                        Optional.empty())));
            }
        }
        List<Finding> configured = findings.sorted();
        skipped.sort(null);
        List<RuleDescriptor> descriptors = rules.stream().map(Rule::descriptor)
                .map(d -> d.withSeverity(catalog.severity(d)))
                .toList();
        return new CheckResult(workspace.root().toString(), descriptors, configured, skipped, stamps.size(),
                options.failOn());
    }

    /**
     * What became of one file: checked (now, or in an earlier run whose result the cache gave back),
     * or skipped with the reason.
     */
    private record FileVerdict(String path, Optional<CheckedFile> checked, Optional<SkippedFile> skipped,
                          boolean remembered) {
        static FileVerdict of(String path, CheckedFile checked) {
            return new FileVerdict(path, Optional.of(checked), Optional.empty(), false);
        }
    }

    /**
     * Reads, parses and lints one file with the per-template rules (a file that does not parse gets
     * the findings of the syntax-error rules), keeping the findings no directive silences; adds its
     * words to {@code words} unless that is null, and gives {@code cache} what it found with what it
     * depends on: its partials and tool files. A template whose includes do not resolve is not
     * remembered, since which files would change that is not known.
     */
    private static FileVerdict lint(String path, Function<String, SourceText> reader, TemplateLoader loader, List<Rule> rules,
                               LintContext context, RepositoryWords words, Findings configured,
                               TemplateCache<CheckedFile> cache) {
        SourceText text = null;
        Template template;
        try {
            text = reader.apply(path);
            template = loader.parse(text);
        } catch (TareException e) {
            Optional<TemplateSyntaxException> syntax = syntaxError(e);
            if (syntax.isPresent() && text != null) {
                List<Finding> findings = new ArrayList<>();
                for (Rule rule : rules) {
                    if (rule instanceof SyntaxErrorRule parseRule) {
                        parseRule.onSyntaxError(path, text.text(), syntax.get()).forEach(f -> findings.add(configured.configure(f)));
                    }
                }
                CheckedFile checked = new CheckedFile(findings, Optional.empty(), Optional.empty());
                cache.remember(path, text.text(), List.of(), checked);
                return FileVerdict.of(path, checked);
            }
            return new FileVerdict(path, Optional.empty(), Optional.of(new SkippedFile(path, e.getMessage())), false);
        }
        List<Finding> findings = new ArrayList<>();
        Suppressions suppressions = Suppressions.of(context.text(template));
        if (template.kind() == TemplateKind.CODE) {
            // A source file as a whole is read for its directives only; each prompt has a view of its own.
            context.forget(template);
        }
        Optional<List<String>> dependencies = cache.isDisabled() ? Optional.empty() : Optional.of(new ArrayList<>());
        for (Template prompt : template.prompts()) {
            try {
                for (Rule rule : rules) {
                    if (rule instanceof CrossTemplateRule
                            || prompt.kind() == TemplateKind.TOOLS && !(rule instanceof ToolRule)) {
                        continue;
                    }
                    for (Finding finding : rule.check(prompt, context)) {
                        if (!suppressions.silences(finding)) {
                            findings.add(configured.configure(finding));
                        }
                    }
                }
                if (dependencies.isPresent()) {
                    Optional<Rendering> rendering = context.rendering(prompt);
                    if (rendering.isEmpty()) {
                        dependencies = Optional.empty();
                    } else {
                        dependencies.get().addAll(new java.util.LinkedHashSet<>(rendering.get().includes()));
                        dependencies.get().addAll(prompt.meta().tools());
                    }
                }
            } finally {
                context.forget(prompt);
            }
        }
        if (words != null) {
            // The rules across templates read a source file as a whole, its prompts its messages.
            words.add(template);
        }
        CheckedFile checked = new CheckedFile(findings,
                suppressions.directives().isEmpty() ? Optional.empty() : Optional.of(suppressions),
                // A source file without prompts holds no template: nothing for the rules across templates.
                template.prompts().isEmpty() ? Optional.empty() : Optional.of(template.source().hashCode()));
        String read = text.text();
        dependencies.ifPresent(paths -> cache.remember(path, read, paths, checked));
        return FileVerdict.of(path, checked);
    }

    /**
     * The checked templates as the cross-template rules reach them: parsed again through
     * {@code reader}, and refused when the text is no longer what was checked.
     */
    private static RunTemplates runTemplates(Map<String, Integer> stamps, RepositoryWords words, TemplateLoader loader,
                                             Function<String, SourceText> reader) {
        Function<String, Template> again = path -> {
            Template template = loader.parse(reader.apply(path));
            Integer stamp = stamps.get(path);
            if (stamp == null || stamp != template.source().hashCode()) {
                throw new TareException(path + " changed while it was checked; run the check again");
            }
            return template;
        };
        return RunTemplates.reparsed(new java.util.TreeSet<>(stamps.keySet()).stream().toList(), again,
                Optional.ofNullable(words));
    }

    /**
     * The findings of a run as they come, each at its configured severity. Many findings say the
     * same thing (the same character, the same variable): on a large repository keeping one copy of
     * each message is tens of megabytes less.
     */
    private static final class Findings {
        private final RuleCatalog catalog;
        private final List<Finding> all = new ArrayList<>();
        private final Map<String, String> messages = new java.util.concurrent.ConcurrentHashMap<>();

        Findings(RuleCatalog catalog) {
            this.catalog = catalog;
        }

        /** The finding at its configured severity, with the one copy of its message; from any thread. */
        Finding configure(Finding finding) {
            Severity severity = catalog.severity(catalog.rule(finding.rule()).descriptor());
            String message = messages.computeIfAbsent(finding.message(), m -> m);
            return new Finding(finding.path(), finding.line(), finding.column(), finding.endLine(),
                    finding.endColumn(), finding.rule(), severity, message, finding.rewriteClass(), finding.rewrite(),
                    finding.related());
        }

        /** Adds a finding {@link #configure} gave. */
        void addConfigured(Finding finding) {
            all.add(finding);
        }

        List<Finding> sorted() {
            all.sort(Finding.ORDER);
            return all;
        }
    }

    private static Optional<TemplateSyntaxException> syntaxError(Throwable e) {
        for (Throwable t = e; t != null; t = t.getCause()) {
            if (t instanceof TemplateSyntaxException syntax) {
                return Optional.of(syntax);
            }
        }
        return Optional.empty();
    }

    /**
     * A context over the files of the loader's workspace: a path names a file when it is there under
     * the root, tool files are read through the loader once each, and the committed baseline is read
     * once, when a rule first asks for it.
     */
    static LintContext onDisk(TemplateLoader loader, TokenizerRegistry tokenizers, Renderer renderer,
                              RunTemplates templates, Set<String> ruleIds) {
        return onDisk(loader, tokenizers, renderer, templates, ruleIds, path -> false);
    }

    /** As {@link #onDisk}, where a path also names a file when {@code unwritten} holds it (a fix not yet written). */
    static LintContext onDisk(TemplateLoader loader, TokenizerRegistry tokenizers, Renderer renderer,
                              RunTemplates templates, Set<String> ruleIds, Predicate<String> unwritten) {
        TareConfig config = loader.workspace().config();
        ToolFiles tools = new ToolFiles(loader);
        return new LintContext(config, tokenizers, renderer, templates, ruleIds, Map.of(),
                unwritten.or(path -> Files.exists(config.root().resolve(path))), tools::find,
                BaselineFile.readOnce(BaselineFile.path(config)));
    }
}
