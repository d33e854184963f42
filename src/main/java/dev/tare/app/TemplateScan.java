package dev.tare.app;

import dev.tare.TareException;
import dev.tare.cache.CacheKey;
import dev.tare.cache.TemplateCache;
import dev.tare.config.TareConfig;
import dev.tare.config.TrafficGlobs;
import dev.tare.footprint.CallSize;
import dev.tare.footprint.Estimates;
import dev.tare.footprint.Framing;
import dev.tare.footprint.Target;
import dev.tare.footprint.Traffic;
import dev.tare.overlap.CachePrefixes;
import dev.tare.source.SourceText;
import dev.tare.template.RenderedPath;
import dev.tare.template.Renderer;
import dev.tare.template.Rendering;
import dev.tare.template.Segment;
import dev.tare.template.ContentOrigin;
import dev.tare.template.Template;
import dev.tare.template.TemplateKind;
import dev.tare.tokenize.LineCounts;
import dev.tare.tokenize.Tokenizer;
import dev.tare.tokenize.TokenizerRegistry;
import dev.tare.workspace.FileSelection;
import dev.tare.workspace.SkippedFile;
import dev.tare.workspace.Workspace;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.ConcurrentHashMap;
import java.util.stream.Collectors;

/**
 * Measures every template of a workspace: finds the files, reads and parses each, renders it with
 * variables empty and with samples, and counts tokens on the primary tokenizer and on each target,
 * whose footprints it then estimates (with the prefix each template shares with others, on targets
 * with a prefix cache).
 * Files are processed in parallel and one at a time each, so memory stays bounded by the files in
 * flight; a file that cannot be used is skipped with its reason and never stops the scan.
 */
public final class TemplateScan {
    private final Workspace workspace;
    private final TokenizerRegistry tokenizers;

    public TemplateScan(Workspace workspace, TokenizerRegistry tokenizers) {
        this.workspace = workspace;
        this.tokenizers = tokenizers;
    }

    /** Runs the scan. Configuration problems (an unknown target or tokenizer) throw before any file is read. */
    public ScanResult run(ScanOptions options) {
        return run(options, ScanProgress.NONE);
    }

    /** Runs the scan, telling {@code progress} how far it has got. */
    public ScanResult run(ScanOptions options, ScanProgress progress) {
        return scan(setUp(options), options, progress);
    }

    /** What a scan is asked for, resolved: the targets, the primary tokenizer's name and the cache key. */
    private record Setup(List<Target> targets, String primaryName, String cacheKey) {
    }

    private Setup setUp(ScanOptions options) {
        TareConfig config = workspace.config();
        List<Target> targets = config.selectTargets(options.targets());
        String primaryName = options.tokenizer()
                .orElse(targets.isEmpty() ? TokenizerRegistry.DEFAULT : targets.get(0).tokenizer());
        String key = options.cache() ? cacheKey(targets, primaryName) : "";
        return new Setup(targets, primaryName, key);
    }

    private ScanResult scan(Setup setup, ScanOptions options, ScanProgress progress) {
        TareConfig config = workspace.config();
        List<Target> targets = setup.targets();
        Tokenizer primary = tokenizers.get(setup.primaryName(), workspace.root());
        Map<String, Tokenizer> byTarget = new LinkedHashMap<>();
        for (Target target : targets) {
            byTarget.put(target.name(), tokenizers.get(target.tokenizer(), workspace.root()));
        }
        // The previous measurements are read while the folders are walked and, when there are
        // none (so every template will be counted), the vocabularies after them, one at a time.
        Set<Tokenizer> used = new LinkedHashSet<>(byTarget.values());
        used.add(primary);
        CompletableFuture<TemplateCache<List<Measurement>>> opening = CompletableFuture.supplyAsync(() -> options.cache()
                ? TemplateCache.open(workspace.root(), workspace.starts().isEmpty(), "scan", setup.cacheKey(), new MeasurementCodec())
                : TemplateCache.disabled(workspace.root()));
        CompletableFuture<Void> loading = opening.thenCompose(opened -> opened.isEmpty()
                ? TokenizerRegistry.prepare(used) : CompletableFuture.completedFuture(null));
        TemplateLoader loader = new TemplateLoader(workspace);
        FileSelection selection = loader.find();
        TemplateCache<List<Measurement>> cache = opening.join();
        Measurer measurer = new Measurer(config, targets, primary, byTarget, loader, cache);

        progress.started(selection.paths().size());
        List<Outcome> outcomes = selection.paths().parallelStream().flatMap(path -> {
            List<Outcome> outcome = measurer.measure(path);
            progress.advanced();
            return outcome.stream();
        }).toList();
        progress.finished();
        // Long done on a real repository; waited for so that no load outlives the command's timings.
        loading.join();
        List<ScannedTemplate> templates = new ArrayList<>();
        List<SkippedFile> skipped = new ArrayList<>(selection.skipped());
        for (Outcome outcome : outcomes) {
            outcome.template().ifPresent(templates::add);
            outcome.skipped().ifPresent(skipped::add);
        }
        skipped.sort(null);
        if (templates.isEmpty() && skipped.isEmpty()) {
            // Every file selected was a source file without prompts: as empty as no file at all.
            throw loader.noTemplates();
        }
        for (Target target : targets) {
            if (target.prefixCache().isPresent()) {
                applySharedPrefixes(target, templates, outcomes);
            }
        }
        cache.save();
        return new ScanResult(workspace.displayName(), primary.name(),
                targets.stream().map(Target::name).toList(), templates, skipped, targets);
    }

    /** Everything besides the template files that decides a scan's results (see {@link CacheKey}). */
    private String cacheKey(List<Target> targets, String primaryName) {
        CacheKey key = CacheKey.of(workspace.root(), workspace.config()).tokenizer(primaryName);
        for (Target target : targets) {
            key.with("target", target.name()).tokenizer(target.tokenizer());
        }
        return key.toString();
    }

    /**
     * Re-estimates the footprints on {@code target} with each template's static prefix cached as
     * the traffic of every template sharing it allows.
     */
    private static void applySharedPrefixes(Target target, List<ScannedTemplate> templates, List<Outcome> outcomes) {
        Map<String, CachePrefixes.LeadingIds> byPath = new LinkedHashMap<>();
        Map<String, CallSize> calls = new LinkedHashMap<>();
        Map<String, Traffic> traffic = new LinkedHashMap<>();
        for (Outcome outcome : outcomes) {
            CachePrefixes.LeadingIds ids = outcome.leadingIds().get(target.name());
            if (ids != null) {
                String key = outcome.template().orElseThrow().key();
                byPath.put(key, ids);
                calls.put(key, outcome.callSizes().get(target.name()));
                traffic.put(key, outcome.traffic().get(target.name()));
            }
        }
        List<Integer> indexes = new ArrayList<>();
        List<CachePrefixes.Prefix> prefixes = new ArrayList<>();
        for (int i = 0; i < templates.size(); i++) {
            String path = templates.get(i).key();
            CachePrefixes.LeadingIds ids = byPath.get(path);
            if (ids != null) {
                indexes.add(i);
                prefixes.add(new CachePrefixes.Prefix(calls.get(path), ids, traffic.get(path)));
            }
        }
        List<CachePrefixes.Shared> shared = CachePrefixes.share(target, prefixes);
        for (int k = 0; k < indexes.size(); k++) {
            int at = indexes.get(k);
            templates.set(at, templates.get(at).withPrefix(target.name(), shared.get(k).footprint(), shared.get(k).share()));
        }
    }

    /**
     * What became of one file: measured, or skipped with a reason. A measured template carries its
     * call on each target and, per target with a prefix cache, its leading static token ids.
     */
    private record Outcome(Optional<ScannedTemplate> template, Optional<SkippedFile> skipped,
                           Map<String, CallSize> callSizes, Map<String, CachePrefixes.LeadingIds> leadingIds,
                           Map<String, Traffic> traffic) {
        static Outcome of(Measurement measured, Map<String, Target> targets, TrafficGlobs globs) {
            Map<String, Traffic> traffic = new LinkedHashMap<>();
            measured.callSizes().keySet().forEach(name -> traffic.put(name, measured.traffic(targets.get(name), globs)));
            return new Outcome(Optional.of(measured.template(targets, globs)), Optional.empty(), measured.callSizes(),
                    measured.leadingIds(), traffic);
        }

        static Outcome of(SkippedFile skipped) {
            return new Outcome(Optional.empty(), Optional.of(skipped), Map.of(), Map.of(), Map.of());
        }
    }

    /**
     * Token counts of one template's renderings, each distinct (tokenizer, message) counted once:
     * without samples the static and estimated texts are the same, and several targets often share
     * a tokenizer. The sums are those of {@link Estimates#tokens}.
     */
    private static final class Counts {
        /** A rendering's messages as counted on one tokenizer. */
        private record MessageCounts(List<String> messages, LineCounts[] counts) {
        }

        /** The first rendering counted on each tokenizer, which later ones are counted against. */
        private final Map<Tokenizer, MessageCounts> firstByTokenizer = new java.util.IdentityHashMap<>();

        /**
         * The rendering's count. A message is compared only with its twin, the message at its own
         * place in the first rendering counted on the same tokenizer (the static, sample and
         * shortest-path renderings hold their messages in the same order): an equal twin gives its
         * count, and a different one leaves to count only the lines where the two differ. Unlike a
         * map of texts, that never hashes a message of thousands of characters, and stays linear in a
         * chat of thousands of messages.
         */
        int of(Tokenizer tokenizer, Rendering rendering) {
            MessageCounts first = firstByTokenizer.get(tokenizer);
            List<String> messages = rendering.messages();
            LineCounts[] counts = new LineCounts[messages.size()];
            int total = 0;
            for (int i = 0; i < counts.length; i++) {
                String message = messages.get(i);
                counts[i] = first == null || i >= first.messages().size() ? tokenizer.countLines(message)
                        : LineCounts.whole(first.counts()[i].countOf(message, first.messages().get(i), tokenizer));
                total += counts[i].total();
            }
            firstByTokenizer.putIfAbsent(tokenizer, new MessageCounts(messages, counts));
            return total;
        }
    }

    /** The per-file work, shared read-only by the scanning threads. */
    private record Measurer(TareConfig config, List<Target> targets, Map<String, Target> targetsByName,
                            Tokenizer primary, Map<String, Tokenizer> byTarget, TemplateLoader loader, TemplateCache<List<Measurement>> cache,
                            ToolFiles toolFiles, Map<String, Integer> toolTokens) {

        Measurer(TareConfig config, List<Target> targets, Tokenizer primary, Map<String, Tokenizer> byTarget,
                 TemplateLoader loader, TemplateCache<List<Measurement>> cache) {
            this(config, targets, targets.stream().collect(Collectors.toMap(Target::name, t -> t, (a, b) -> a,
                    LinkedHashMap::new)), primary, byTarget, loader, cache, new ToolFiles(loader),
                    new ConcurrentHashMap<>());
        }

        /** The file's outcomes: one for a template file, one per prompt for a source file. */
        List<Outcome> measure(String path) {
            Optional<List<Measurement>> remembered = cache.find(path);
            if (remembered.isPresent()) {
                return remembered.get().stream().map(m -> Outcome.of(m, targetsByName, config.traffic())).toList();
            }
            try {
                SourceText text = loader.read(path);
                List<Measurement> measured = new ArrayList<>();
                Set<String> dependencies = new LinkedHashSet<>();
                for (Template template : loader.parse(text).prompts()) {
                    RenderedPath longest = loader.renderer().render(template, Renderer.Path.LONGEST);
                    int characters = template.kind() == TemplateKind.CODE
                            ? template.messages().get(0).content().length() : text.text().length();
                    measured.add(measure(template, longest, characters));
                    dependencies.addAll(longest.samples().includes());
                    dependencies.addAll(template.meta().tools());
                }
                cache.remember(path, text.text(), List.copyOf(dependencies), measured);
                return measured.stream().map(m -> Outcome.of(m, targetsByName, config.traffic())).toList();
            } catch (TareException e) {
                return List.of(Outcome.of(new SkippedFile(path, e.getMessage())));
            }
        }

        private Measurement measure(Template template, RenderedPath longest, int characters) {
            // Without a sample, both renderings hold the same strings, and Counts sees that at once.
            Rendering samples = longest.samples();
            Rendering empty = longest.empty();
            int declared = Estimates.declaredTokens(samples);
            Counts counts = new Counts();
            List<Template> tools = toolFiles.sentWith(template);
            Optional<CachePrefixes.Texts> texts = leadingTexts(template, samples);
            Map<String, CachePrefixes.LeadingIds> leading = new LinkedHashMap<>();
            Map<String, CallSize> callSizes = new LinkedHashMap<>();
            Map<String, Integer> estimatedByTarget = new LinkedHashMap<>();
            List<String> notes = new ArrayList<>();
            for (Target target : targetsOf(template, notes)) {
                Tokenizer tokenizer = byTarget.get(target.name());
                int estimated = target.scaled(counts.of(tokenizer, samples)) + declared;
                estimatedByTarget.put(target.name(), estimated);
                int framing = template.kind() == TemplateKind.TOOLS
                        ? Framing.toolTokens(target, template.messages().size())
                        : Framing.tokens(target, template.isChat(), template.messages().size());
                // A provider reads the tool definitions first, so they open the static prefix.
                int toolPart = 0;
                for (Template toolFile : tools) {
                    Estimates.SentTools sent = Estimates.sentTools(target, toolTokens(toolFile, tokenizer),
                            toolFile.messages().size());
                    estimated += sent.definitions();
                    framing += sent.framing();
                    toolPart += sent.total();
                }
                int output = template.meta().outputTokens().orElse(target.outputTokens().orElse(0));
                int input = estimated + framing;
                int prefix = 0;
                if (texts.isPresent() && target.prefixCache().isPresent()) {
                    CachePrefixes.LeadingIds ids = CachePrefixes.leading(toolsHead(template), texts.get(), tokenizer);
                    leading.put(target.name(), ids);
                    // Without a per-call part every token of the call is the same each time.
                    prefix = samples.variables().isEmpty() ? input : toolPart
                            + (template.isChat() ? texts.get().now().size() * target.messageOverheadTokens() : 0)
                            + target.scaled(ids.now().length);
                }
                callSizes.put(target.name(), new CallSize(input, framing, output, Math.min(prefix, input)));
            }
            Set<String> variables = new LinkedHashSet<>();
            Set<String> unsized = new LinkedHashSet<>();
            for (Rendering.Occurrence occurrence : samples.variables()) {
                // A call is listed by the variables it is passed, a variable by the input it reads; either
                // is unsized under its input, the name its size is declared under (a call's function).
                if (occurrence.part() instanceof Segment.Call call) {
                    variables.addAll(call.variableNames());
                } else {
                    variables.add(occurrence.input());
                }
                if (occurrence.spec().isEmpty() || !occurrence.spec().get().isSized()) {
                    unsized.add(occurrence.input());
                }
            }
            int estimated = counts.of(primary, samples) + declared;
            return new Measurement(template.path(), template.name(), line(template), template.kind(), characters,
                    counts.of(primary, empty),
                    estimated, shortestEstimate(template, longest, estimated, counts), List.copyOf(variables),
                    List.copyOf(unsized), List.copyOf(new LinkedHashSet<>(samples.includes())), samples.loops(),
                    callSizes, estimatedByTarget, leading, template.meta().callsPerDay(), notes);
        }

        /** The line a prompt written in source code starts on; 0 for a template file. */
        private static int line(Template template) {
            return template.kind() == TemplateKind.CODE
                    && template.messages().get(0).origin() instanceof ContentOrigin.Literal literal ? literal.line() : 0;
        }

        /** The estimated tokens on the template's shortest path: on its only path when it has no branches. */
        private int shortestEstimate(Template template, RenderedPath longest, int estimated, Counts counts) {
            if (!longest.branched()) {
                return estimated;
            }
            Rendering shortest = loader.renderer().render(template, Renderer.Path.SHORTEST).samples();
            return counts.of(primary, shortest) + Estimates.declaredTokens(shortest);
        }

        /**
         * The template's leading texts, when some target has a prefix cache; none for partials and
         * tool files, which are never sent alone.
         */
        private Optional<CachePrefixes.Texts> leadingTexts(Template template, Rendering samples) {
            if (template.kind() == TemplateKind.PARTIAL || template.kind() == TemplateKind.TOOLS
                    || targets.stream().allMatch(target -> target.prefixCache().isEmpty())) {
                return Optional.empty();
            }
            return Optional.of(CachePrefixes.texts(template, loader.renderer(), samples));
        }

        /**
         * The targets the template is measured on: the one it names, else all. Without a tare.yaml no
         * target is defined, so one it names is noted and it is measured as every other template is.
         */
        private List<Target> targetsOf(Template template, List<String> notes) {
            Optional<String> named = template.meta().target();
            if (named.isEmpty()) {
                return targets;
            }
            if (config.file().isEmpty() && config.targets().isEmpty()) {
                notes.add("names target '" + named.get() + "', which is defined in no tare.yaml; measured on "
                        + primary.name() + " alone (tare init writes a tare.yaml to define targets in)");
                return targets;
            }
            if (config.targets().stream().noneMatch(t -> t.name().equals(named.get()))) {
                throw new TareException("names target '" + named.get() + "', which "
                        + config.file().map(f -> "tare.yaml").orElse("the configuration") + " does not define"
                        + (config.targets().isEmpty() ? "" : " (defined: "
                        + config.targets().stream().map(Target::name).collect(Collectors.joining(", ")) + ")"));
            }
            return targets.stream().filter(t -> t.name().equals(named.get())).toList();
        }

        /**
         * What stands for the tools a template's prefix opens with, so that only templates sending
         * the same tools share a prefix: the tool files' paths and the inline definitions' JSON.
         */
        private static String toolsHead(Template template) {
            List<String> parts = new ArrayList<>(template.meta().tools());
            template.meta().inlineTools().forEach(tool -> parts.add(tool.json()));
            return String.join("\n", parts);
        }

        /** A tool file's counted tokens on one tokenizer, counted once per scan however many templates send it. */
        private int toolTokens(Template toolFile, Tokenizer tokenizer) {
            return toolTokens.computeIfAbsent(toolFile.path() + '\u0000' + tokenizer.name(),
                    key -> Estimates.tokens(tokenizer, loader.renderer().renderStatic(toolFile)));
        }
    }
}
