package dev.tare.scan;

import dev.tare.TareException;
import dev.tare.config.TareConfig;
import dev.tare.config.TargetConfig;
import dev.tare.footprint.CallSize;
import dev.tare.footprint.Footprint;
import dev.tare.footprint.Footprints;
import dev.tare.footprint.Framing;
import dev.tare.source.FileSelection;
import dev.tare.source.SkippedFile;
import dev.tare.source.SourceText;
import dev.tare.template.Rendering;
import dev.tare.template.Template;
import dev.tare.template.TemplateKind;
import dev.tare.tokenize.Tokenizer;
import dev.tare.tokenize.TokenizerRegistry;
import java.io.File;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.concurrent.ConcurrentHashMap;
import java.util.stream.Collectors;
import java.util.stream.Stream;

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
        TareConfig config = workspace.config();
        List<TargetConfig> targets = config.selectTargets(options.targets());
        String primaryName = options.tokenizer()
                .orElse(targets.isEmpty() ? TokenizerRegistry.DEFAULT : targets.get(0).tokenizer());
        Tokenizer primary = tokenizers.get(primaryName, workspace.root());
        Map<String, Tokenizer> byTarget = new LinkedHashMap<>();
        for (TargetConfig target : targets) {
            byTarget.put(target.name(), tokenizers.get(target.tokenizer(), workspace.root()));
        }

        TemplateLoader loader = new TemplateLoader(workspace);
        FileSelection selection = loader.find();
        ScanCache cache = options.cache()
                ? ScanCache.open(workspace, cacheKey(config, targets, primaryName, options))
                : ScanCache.disabled(workspace.root());
        Measurer measurer = new Measurer(config, targets, primary, byTarget, loader, cache);

        progress.started(selection.paths().size());
        List<Outcome> outcomes = selection.paths().parallelStream().map(path -> {
            Outcome outcome = measurer.measure(path);
            progress.advanced();
            return outcome;
        }).toList();
        progress.finished();
        cache.save();
        List<ScannedTemplate> templates = new ArrayList<>();
        List<SkippedFile> skipped = new ArrayList<>(selection.skipped());
        for (Outcome outcome : outcomes) {
            outcome.template().ifPresent(templates::add);
            outcome.skipped().ifPresent(skipped::add);
        }
        skipped.sort(null);
        for (TargetConfig target : targets) {
            if (target.prefixCacheMinTokens().isPresent()) {
                applySharedPrefixes(target, templates, outcomes);
            }
        }
        return new ScanResult(workspace.displayName(), primary.name(),
                targets.stream().map(TargetConfig::name).toList(), templates, skipped, targets);
    }

    /**
     * Everything besides the template files that decides a scan's results: the configuration as
     * loaded (model shapes read from files included), the options, the tokenizer files' sizes and
     * times, and the names of the partials (a new partial can change what an include resolves to).
     */
    private String cacheKey(TareConfig config, List<TargetConfig> targets, String primaryName, ScanOptions options) {
        StringBuilder key = new StringBuilder(config.toString()).append('\n').append(primaryName).append('\n');
        for (TargetConfig target : targets) {
            key.append(target.name()).append(' ').append(target.tokenizer());
            if (TokenizerRegistry.namesFile(target.tokenizer())) {
                File file = workspace.root().resolve(target.tokenizer()).toFile();
                key.append(' ').append(file.length()).append(' ').append(file.lastModified());
            }
            key.append('\n');
        }
        Path partials = workspace.root().resolve(config.templates().partials());
        if (!config.templates().partials().isEmpty() && Files.isDirectory(partials)) {
            try (Stream<Path> files = Files.walk(partials)) {
                files.map(p -> partials.relativize(p).toString()).sorted().forEach(name -> key.append(name).append('\n'));
            } catch (IOException | UncheckedIOException e) {
                key.append("partials unreadable ").append(System.nanoTime());
            }
        }
        return key.toString();
    }

    /** The most leading token ids kept per template and target: enough for any cache threshold in use. */
    static final int MAX_LEADING_IDS = 16_384;

    /** Re-estimates the footprints on {@code target} of templates that share a prefix with another. */
    private static void applySharedPrefixes(TargetConfig target, List<ScannedTemplate> templates, List<Outcome> outcomes) {
        List<String> paths = new ArrayList<>();
        List<int[]> leading = new ArrayList<>();
        for (Outcome outcome : outcomes) {
            int[] ids = outcome.leadingIds().get(target.name());
            if (ids != null) {
                paths.add(outcome.template().orElseThrow().path());
                leading.add(ids);
            }
        }
        int[] shared = SharedPrefixes.lengths(leading);
        Map<String, Integer> byPath = new LinkedHashMap<>();
        for (int i = 0; i < shared.length; i++) {
            if (shared[i] > 0) {
                byPath.put(paths.get(i), shared[i]);
            }
        }
        for (int i = 0; i < templates.size(); i++) {
            ScannedTemplate t = templates.get(i);
            Integer tokens = byPath.get(t.path());
            if (tokens == null) {
                continue;
            }
            Footprint before = t.targets().get(target.name());
            Map<String, Footprint> footprints = new LinkedHashMap<>(t.targets());
            footprints.put(target.name(), Footprints.estimate(target, new CallSize(before.inputTokens(),
                    before.framingTokens(), before.outputTokens(), tokens)));
            templates.set(i, t.withTargets(footprints));
        }
    }

    /**
     * What became of one file: measured, or skipped with a reason. A measured template carries, per
     * target with a prefix cache, its leading static token ids when there are enough to be cached.
     */
    private record Outcome(Optional<ScannedTemplate> template, Optional<SkippedFile> skipped,
                           Map<String, int[]> leadingIds) {
        static Outcome of(ScannedTemplate template, Map<String, int[]> leadingIds) {
            return new Outcome(Optional.of(template), Optional.empty(), leadingIds);
        }

        static Outcome of(SkippedFile skipped) {
            return new Outcome(Optional.empty(), Optional.of(skipped), Map.of());
        }
    }

    /**
     * Token counts of one template's renderings, each distinct (tokenizer, message) counted once:
     * without samples the static and estimated texts are the same, and several targets often share
     * a tokenizer. The sums are those of {@link Estimates#tokens}.
     */
    private static final class Counts {
        private final Map<Tokenizer, Map<String, Integer>> byTokenizer = new java.util.IdentityHashMap<>();

        int of(Tokenizer tokenizer, Rendering rendering) {
            Map<String, Integer> counted = byTokenizer.computeIfAbsent(tokenizer, t -> new java.util.HashMap<>());
            int total = 0;
            for (String message : rendering.messages()) {
                total += counted.computeIfAbsent(message, tokenizer::count);
            }
            return total;
        }
    }

    /** The per-file work, shared read-only by the scanning threads. */
    private record Measurer(TareConfig config, List<TargetConfig> targets, Map<String, TargetConfig> targetsByName,
                            Tokenizer primary, Map<String, Tokenizer> byTarget, TemplateLoader loader, ScanCache cache,
                            Map<String, Template> toolFiles, Map<String, Integer> toolTokens) {

        Measurer(TareConfig config, List<TargetConfig> targets, Tokenizer primary, Map<String, Tokenizer> byTarget,
                 TemplateLoader loader, ScanCache cache) {
            this(config, targets, targets.stream().collect(Collectors.toMap(TargetConfig::name, t -> t, (a, b) -> a,
                    LinkedHashMap::new)), primary, byTarget, loader, cache, new ConcurrentHashMap<>(),
                    new ConcurrentHashMap<>());
        }

        Outcome measure(String path) {
            Optional<Measurement> remembered = cache.find(path);
            if (remembered.isPresent()) {
                return Outcome.of(remembered.get().template(targetsByName), remembered.get().leadingIds());
            }
            try {
                SourceText text = loader.read(path);
                Template template = loader.parse(text);
                Rendering samples = loader.renderer().renderWithSamples(template);
                Measurement measured = measure(template, samples, text.text().length());
                List<String> dependencies = new ArrayList<>(new LinkedHashSet<>(samples.includes()));
                dependencies.addAll(template.meta().tools());
                cache.remember(path, text.text(), dependencies, measured);
                return Outcome.of(measured.template(targetsByName), measured.leadingIds());
            } catch (TareException e) {
                return Outcome.of(new SkippedFile(path, e.getMessage()));
            }
        }

        private Measurement measure(Template template, Rendering samples, int characters) {
            Rendering empty = loader.renderer().renderStatic(template);
            int declared = Estimates.declaredTokens(samples);
            Counts counts = new Counts();
            List<Template> tools = toolsSentWith(template);
            Map<String, CallSize> callSizes = new LinkedHashMap<>();
            Map<String, Integer> estimatedByTarget = new LinkedHashMap<>();
            for (TargetConfig target : targetsOf(template)) {
                Tokenizer tokenizer = byTarget.get(target.name());
                int estimated = target.scaled(counts.of(tokenizer, samples)) + declared;
                estimatedByTarget.put(target.name(), estimated);
                int framing = template.kind() == TemplateKind.TOOLS
                        ? Framing.toolTokens(target, template.messages().size())
                        : Framing.tokens(target, template.isChat(), template.messages().size());
                for (Template toolFile : tools) {
                    estimated += target.scaled(toolTokens(toolFile, tokenizer));
                    framing += Framing.toolTokens(target, toolFile.messages().size());
                }
                int output = template.meta().outputTokens().orElse(target.outputTokens().orElse(0));
                callSizes.put(target.name(), new CallSize(estimated + framing, framing, output, 0));
            }
            Set<String> variables = new LinkedHashSet<>();
            Set<String> unsized = new LinkedHashSet<>();
            for (Rendering.Occurrence occurrence : samples.variables()) {
                variables.add(occurrence.variable().name());
                if (occurrence.spec().isEmpty() || !occurrence.spec().get().isSized()) {
                    unsized.add(occurrence.variable().name());
                }
            }
            return new Measurement(template.path(), template.kind(), characters, counts.of(primary, empty),
                    counts.of(primary, samples) + declared, List.copyOf(variables), List.copyOf(unsized),
                    List.copyOf(new LinkedHashSet<>(samples.includes())), callSizes, estimatedByTarget,
                    leadingIds(template, samples, callSizes.keySet()));
        }

        /**
         * Leading static token ids per target with a prefix cache, kept only when there are at least
         * the cache's minimum (shorter runs can never count), and at most {@link #MAX_LEADING_IDS}.
         */
        private Map<String, int[]> leadingIds(Template template, Rendering samples, Set<String> measuredTargets) {
            if (template.kind() == TemplateKind.PARTIAL) {
                return Map.of();
            }
            Map<String, int[]> ids = new LinkedHashMap<>();
            List<String> leading = null;
            for (TargetConfig target : targets) {
                if (target.prefixCacheMinTokens().isEmpty() || !measuredTargets.contains(target.name())) {
                    continue;
                }
                if (leading == null) {
                    leading = LeadingText.of(template, loader.renderer(), samples);
                }
                int[] kept = leadingIds(byTarget.get(target.name()), leading);
                if (kept.length > 0 && kept.length >= target.prefixCacheMinTokens().getAsInt()) {
                    ids.put(target.name(), kept);
                }
            }
            return ids;
        }

        private static int[] leadingIds(Tokenizer tokenizer, List<String> messages) {
            int[] kept = new int[0];
            for (String message : messages) {
                int[] ids = tokenizer.encode(message);
                int take = Math.min(ids.length, MAX_LEADING_IDS - kept.length);
                int[] joined = java.util.Arrays.copyOf(kept, kept.length + take);
                System.arraycopy(ids, 0, joined, kept.length, take);
                kept = joined;
                if (kept.length == MAX_LEADING_IDS) {
                    break;
                }
            }
            return kept;
        }

        private List<TargetConfig> targetsOf(Template template) {
            Optional<String> named = template.meta().target();
            if (named.isEmpty()) {
                return targets;
            }
            if (config.targets().stream().noneMatch(t -> t.name().equals(named.get()))) {
                throw new TareException("names target '" + named.get() + "', which "
                        + config.file().map(f -> "tare.yaml").orElse("the configuration") + " does not define"
                        + (config.targets().isEmpty() ? "" : " (defined: "
                        + config.targets().stream().map(TargetConfig::name).collect(Collectors.joining(", ")) + ")"));
            }
            return targets.stream().filter(t -> t.name().equals(named.get())).toList();
        }

        /** A tool file's counted tokens on one tokenizer, counted once per scan however many templates send it. */
        private int toolTokens(Template toolFile, Tokenizer tokenizer) {
            return toolTokens.computeIfAbsent(toolFile.path() + '\u0000' + tokenizer.name(),
                    key -> Estimates.tokens(tokenizer, loader.renderer().renderStatic(toolFile)));
        }

        /** The tool files the template's front matter says are sent with it, each parsed once per scan. */
        private List<Template> toolsSentWith(Template template) {
            List<Template> tools = new ArrayList<>();
            for (String path : template.meta().tools()) {
                Template tool = toolFiles.computeIfAbsent(path, this::loadToolFile);
                tools.add(tool);
            }
            return tools;
        }

        private Template loadToolFile(String path) {
            if (!java.nio.file.Files.isRegularFile(config.root().resolve(path))) {
                throw new TareException("front matter names tool file '" + path + "', which does not exist"
                        + " (tool paths are relative to the folder of tare.yaml)");
            }
            Template tool;
            try {
                tool = loader.load(path);
            } catch (TareException e) {
                throw new TareException("tool file " + path + ": " + e.getMessage(), e);
            }
            if (tool.kind() != TemplateKind.TOOLS) {
                throw new TareException("front matter names '" + path + "' as a tool file, but it holds no list of tools");
            }
            return tool;
        }
    }
}
