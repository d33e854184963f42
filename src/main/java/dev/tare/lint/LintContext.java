package dev.tare.lint;

import dev.tare.TareException;
import dev.tare.config.TareConfig;
import dev.tare.footprint.Estimates;
import dev.tare.footprint.PrefixCache;
import dev.tare.footprint.Target;
import dev.tare.overlap.RepositoryWords;
import dev.tare.source.YamlDocument;
import dev.tare.template.IncludeResolver;
import dev.tare.template.Renderer;
import dev.tare.template.Rendering;
import dev.tare.template.Template;
import dev.tare.template.TemplateKind;
import dev.tare.template.ToolDefinition;
import dev.tare.template.ToolFileParser;
import dev.tare.tokenize.Tokenizer;
import dev.tare.tokenize.TokenizerRegistry;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalInt;
import java.util.Set;
import java.util.concurrent.ConcurrentHashMap;
import java.util.function.Function;
import java.util.function.Predicate;
import java.util.function.Supplier;

/**
 * What a rule may consult beyond the template in hand: the configuration, the tokenizers of the
 * template's targets, a renderer that resolves includes, every template of the run (for rules that
 * look across templates) and the ids of all known rules. Per-template preparation is computed once
 * and shared by every rule.
 */
public final class LintContext {
    /**
     * The shortest cacheable prefix assumed when no target says (common practice among hosted
     * providers, no source).
     */
    public static final int DEFAULT_PREFIX_CACHE_MIN_TOKENS = 1024;

    /** Shared by every example run, so each encoding is loaded once per process. */
    private static final TokenizerRegistry EXAMPLE_TOKENIZERS = new TokenizerRegistry();

    private final TareConfig config;
    private final TokenizerRegistry tokenizers;
    private final Renderer renderer;
    private final RunTemplates templates;
    private final Set<String> ruleIds;
    private final Map<String, Integer> settings;
    private final Map<String, TemplateView> texts = new ConcurrentHashMap<>();
    private final Map<String, Optional<Rendering>> renderings = new ConcurrentHashMap<>();
    private final Supplier<Optional<Baseline>> baseline;
    private final Map<String, List<ToolDefinition>> tools = new ConcurrentHashMap<>();
    private final Set<String> paths;
    private final Predicate<String> files;
    private final Function<String, Optional<Template>> toolFiles;
    /** Each tokenizer of the registry as rules get it, remembering its counts of long texts. */
    private final Map<Tokenizer, Tokenizer> remembering = new ConcurrentHashMap<>();

    /**
     * A context over templates held in memory and nothing else: no other file exists, and there is
     * no baseline.
     *
     * @param settings example settings that stand in for target values (see {@link Example#settings()})
     */
    public LintContext(TareConfig config, TokenizerRegistry tokenizers, Renderer renderer, List<Template> templates,
                       Set<String> ruleIds, Map<String, Integer> settings) {
        this(config, tokenizers, renderer, RunTemplates.held(templates), ruleIds, settings, path -> false,
                path -> templates.stream().filter(t -> t.path().equals(path) && t.kind() == TemplateKind.TOOLS).findFirst(),
                Optional::empty);
    }

    /**
     * A context over a run whose templates may be parsed again when a cross-template rule asks for
     * one (a check of a whole repository).
     *
     * @param settings example settings that stand in for target values (see {@link Example#settings()})
     * @param files     whether a root-relative path names a file besides the run's templates
     * @param toolFiles the tool file at a root-relative path, parsed, or empty when there is none there
     * @param baseline  the committed baseline, asked for only when a rule needs it
     */
    public LintContext(TareConfig config, TokenizerRegistry tokenizers, Renderer renderer, RunTemplates templates,
                       Set<String> ruleIds, Map<String, Integer> settings, Predicate<String> files,
                       Function<String, Optional<Template>> toolFiles, Supplier<Optional<Baseline>> baseline) {
        this.config = config;
        this.tokenizers = tokenizers;
        this.renderer = renderer;
        this.templates = templates;
        this.ruleIds = Set.copyOf(ruleIds);
        this.settings = Map.copyOf(settings);
        this.paths = Set.copyOf(templates.paths());
        this.files = files;
        this.toolFiles = toolFiles;
        this.baseline = baseline;
    }

    /** A context for running one rule's examples: default configuration, no includes, no other templates. */
    public static LintContext forExample(Path root, Example example, Set<String> ruleIds) {
        return new LintContext(TareConfig.defaults(root), EXAMPLE_TOKENIZERS, new Renderer(IncludeResolver.NONE),
                List.of(), ruleIds, example.settings());
    }

    /**
     * A context for running a cross-template rule's example: default configuration, the example's
     * templates, includes resolved among them, and no file anywhere else.
     */
    public static LintContext forExample(Path root, Example example, Set<String> ruleIds, List<Template> templates,
                                         Renderer renderer) {
        return new LintContext(TareConfig.defaults(root), EXAMPLE_TOKENIZERS, renderer, templates, ruleIds,
                example.settings());
    }

    /** Whether a root-relative path names a file: a template of the run, or another file where the run looks. */
    public boolean fileExists(String path) {
        return paths.contains(path) || files.test(path);
    }

    /** The configuration in force. */
    public TareConfig config() {
        return config;
    }

    /** The paths of every template of the run, sorted. */
    public List<String> templatePaths() {
        return templates.paths();
    }

    /**
     * The template of the run at {@code path}, parsed again unless the run holds it: a rule that
     * looks across templates asks for one at a time and lets it go.
     */
    public Template template(String path) {
        return templates.loader().apply(path);
    }

    /** The words of every template of the run (tool files too; the analysis leaves them out), for one analysis. */
    public RepositoryWords words() {
        return templates.words().get();
    }

    /**
     * Forgets what was prepared for {@code template} (its text, rendering, tool definitions), once
     * every per-template rule has run on it, so that a check of many templates holds none of it.
     */
    public void forget(Template template) {
        texts.remove(template.key());
        renderings.remove(template.key());
        tools.remove(template.key());
    }

    /** The ids of every rule known to this run, enabled or not. */
    public Set<String> ruleIds() {
        return ruleIds;
    }

    /** The template prepared for rules. */
    public TemplateView text(Template template) {
        return texts.computeIfAbsent(template.key(), path -> new TemplateView(template));
    }

    /** The targets the template runs on: the one it names, else all configured targets. */
    public List<Target> targets(Template template) {
        Optional<String> named = template.meta().target();
        if (named.isPresent()) {
            List<Target> match = config.targets().stream().filter(t -> t.name().equals(named.get())).toList();
            if (!match.isEmpty()) {
                return match;
            }
        }
        return config.targets();
    }

    /** The template's primary tokenizer: its first target's, else the default encoding. */
    public Tokenizer tokenizer(Template template) {
        List<Target> targets = targets(template);
        String name = targets.isEmpty() ? TokenizerRegistry.DEFAULT : targets.get(0).tokenizer();
        try {
            return remembering(tokenizers.get(name, config.root()));
        } catch (TareException e) {
            return remembering(tokenizers.defaultTokenizer());
        }
    }

    /** The repository's primary tokenizer: the first target's, else the default encoding. */
    public Tokenizer primaryTokenizer() {
        String name = config.targets().isEmpty() ? TokenizerRegistry.DEFAULT : config.targets().get(0).tokenizer();
        try {
            return remembering(tokenizers.get(name, config.root()));
        } catch (TareException e) {
            return remembering(tokenizers.defaultTokenizer());
        }
    }

    private Tokenizer remembering(Tokenizer tokenizer) {
        return remembering.computeIfAbsent(tokenizer, RememberedCounts::new);
    }

    /** The tokenizers of every target the template runs on (the default encoding when there are none), without repeats. */
    public List<Tokenizer> targetTokenizers(Template template) {
        List<Target> targets = targets(template);
        if (targets.isEmpty()) {
            return List.of(tokenizer(template));
        }
        java.util.LinkedHashMap<String, Tokenizer> byName = new java.util.LinkedHashMap<>();
        for (Target target : targets) {
            try {
                Tokenizer tokenizer = tokenizers.get(target.tokenizer(), config.root());
                byName.putIfAbsent(tokenizer.name(), remembering(tokenizer));
            } catch (TareException e) {
                byName.putIfAbsent(TokenizerRegistry.DEFAULT, remembering(tokenizers.defaultTokenizer()));
            }
        }
        return List.copyOf(byName.values());
    }

    /** The template's token budget: its own, else the first matching glob, else the default; partials only their own. */
    public OptionalInt budget(Template template) {
        if (template.meta().budget().isPresent()) {
            return template.meta().budget();
        }
        if (template.kind() == TemplateKind.PARTIAL) {
            return OptionalInt.empty();
        }
        return config.budgets().budgetFor(template.path());
    }

    /** The shortest prefix the providers of the template's targets cache: the smallest configured, else {@value #DEFAULT_PREFIX_CACHE_MIN_TOKENS}. */
    public int prefixCacheMinTokens(Template template) {
        Integer setting = settings.get(Example.PREFIX_CACHE_MIN_TOKENS);
        if (setting != null) {
            return setting;
        }
        // A provider's minimum: a server's cache of small blocks would make nearly every template's
        // start cacheable, which is not what this minimum is for.
        return targets(template).stream().flatMap(target -> target.prefixCache().stream())
                .filter(cache -> cache.ttlSeconds().isPresent())
                .mapToInt(PrefixCache::minTokens).min().orElse(DEFAULT_PREFIX_CACHE_MIN_TOKENS);
    }

    /** The tokenizer of one target. */
    public Tokenizer tokenizer(Target target) {
        return remembering(tokenizers.get(target.tokenizer(), config.root()));
    }

    /**
     * The template's recorded counts by target (or tokenizer) name in the committed baseline
     * ({@code baseline.file}), read once per run; empty when there is no baseline or no entry.
     */
    public Optional<Map<String, Integer>> recordedTokens(Template template) {
        Integer setting = settings.get(Example.BASELINE_TOKENS);
        if (setting != null) {
            return Optional.of(Map.of(tokenizer(template).name(), setting));
        }
        return baseline.get().map(b -> b.tokens().get(template.key()));
    }

    /** The definitions of a tool file, parsed once per run; empty for other templates. */
    public List<ToolDefinition> toolDefinitions(Template template) {
        if (template.kind() != TemplateKind.TOOLS) {
            return List.of();
        }
        return tools.computeIfAbsent(template.key(), path -> ToolFileParser.definitions(
                path.toLowerCase(java.util.Locale.ROOT).endsWith(".json") ? YamlDocument.parseJson(template.source())
                        : YamlDocument.parseYaml(template.source())));
    }

    /**
     * The tokens the tool definitions sent with {@code template} add to a call on {@code target}, which
     * a provider reads before the messages: each tool file's definitions, and those the template
     * defines in place, counted (and scaled) as the scan counts them, and the target's framing around
     * each tool. Tool files that cannot be read add nothing; the scan reports them.
     */
    public int sentToolTokens(Template template, Target target) {
        List<Template> sent = new ArrayList<>();
        for (String path : template.meta().tools()) {
            toolFiles.apply(path).ifPresent(sent::add);
        }
        template.inlineToolFile().ifPresent(sent::add);
        int total = 0;
        for (Template tools : sent) {
            total += Estimates.sentTools(target, Estimates.tokens(tokenizer(target), renderer.renderStatic(tools)),
                    tools.messages().size()).total();
        }
        return total;
    }

    /** A numeric limit from {@code rules.limits} (or an example's setting of that name), else its default. */
    public int limit(String key, int fallback) {
        Integer setting = settings.get(key);
        return setting != null ? setting : config.rules().limits().getOrDefault(key, fallback);
    }

    /** The renderer that resolves this run's includes. */
    public Renderer renderer() {
        return renderer;
    }

    /** The template rendered with samples, or empty when an include cannot be resolved. */
    public Optional<Rendering> rendering(Template template) {
        return renderings.computeIfAbsent(template.key(), path -> {
            try {
                return Optional.of(renderer.renderWithSamples(template));
            } catch (TareException e) {
                return Optional.empty();
            }
        });
    }
}
