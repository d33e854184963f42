package dev.tare.scan;

import dev.tare.TareException;
import dev.tare.config.TareConfig;
import dev.tare.config.TargetConfig;
import dev.tare.footprint.Footprint;
import dev.tare.footprint.Framing;
import dev.tare.source.FileSelection;
import dev.tare.source.SkippedFile;
import dev.tare.source.SourceText;
import dev.tare.template.Rendering;
import dev.tare.template.Template;
import dev.tare.tokenize.Tokenizer;
import dev.tare.tokenize.TokenizerRegistry;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.stream.Collectors;

/**
 * Measures every template of a workspace: finds the files, reads and parses each, renders it with
 * variables empty and with samples, and counts tokens on the primary tokenizer and on each target.
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
        Measurer measurer = new Measurer(config, targets, primary, byTarget, loader);

        List<Outcome> outcomes = selection.paths().parallelStream().map(measurer::measure).toList();
        List<ScannedTemplate> templates = new ArrayList<>();
        List<SkippedFile> skipped = new ArrayList<>(selection.skipped());
        for (Outcome outcome : outcomes) {
            outcome.template().ifPresent(templates::add);
            outcome.skipped().ifPresent(skipped::add);
        }
        skipped.sort(null);
        return new ScanResult(workspace.displayName(), primary.name(),
                targets.stream().map(TargetConfig::name).toList(), templates, skipped);
    }

    /** What became of one file: measured, or skipped with a reason. */
    private record Outcome(Optional<ScannedTemplate> template, Optional<SkippedFile> skipped) {
        static Outcome of(ScannedTemplate template) {
            return new Outcome(Optional.of(template), Optional.empty());
        }

        static Outcome of(SkippedFile skipped) {
            return new Outcome(Optional.empty(), Optional.of(skipped));
        }
    }

    /** The per-file work, shared read-only by the scanning threads. */
    private record Measurer(TareConfig config, List<TargetConfig> targets, Tokenizer primary,
                            Map<String, Tokenizer> byTarget, TemplateLoader loader) {

        Outcome measure(String path) {
            try {
                SourceText text = loader.read(path);
                return Outcome.of(measure(loader.parse(text), text.text().length()));
            } catch (TareException e) {
                return Outcome.of(new SkippedFile(path, e.getMessage()));
            }
        }

        private ScannedTemplate measure(Template template, int characters) {
            Rendering empty = loader.renderer().renderStatic(template);
            Rendering samples = loader.renderer().renderWithSamples(template);
            int declared = Estimates.declaredTokens(samples);
            Map<String, Footprint> footprints = new LinkedHashMap<>();
            for (TargetConfig target : targetsOf(template)) {
                int estimated = count(byTarget.get(target.name()), samples) + declared;
                int framing = Framing.tokens(target, template.isChat(), template.messages().size());
                footprints.put(target.name(), new Footprint(estimated + framing, framing));
            }
            Set<String> variables = new LinkedHashSet<>();
            Set<String> unsized = new LinkedHashSet<>();
            for (Rendering.Occurrence occurrence : samples.variables()) {
                variables.add(occurrence.variable().name());
                if (occurrence.spec().isEmpty() || !occurrence.spec().get().isSized()) {
                    unsized.add(occurrence.variable().name());
                }
            }
            return new ScannedTemplate(template.path(), template.kind(), characters, count(primary, empty),
                    count(primary, samples) + declared, new ArrayList<>(variables), new ArrayList<>(unsized),
                    new ArrayList<>(new LinkedHashSet<>(samples.includes())), footprints);
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

        private static int count(Tokenizer tokenizer, Rendering rendering) {
            int total = 0;
            for (String message : rendering.messages()) {
                total += tokenizer.count(message);
            }
            return total;
        }
    }
}
