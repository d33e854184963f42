package dev.tare.app;

import dev.tare.TareException;
import dev.tare.rewrite.FileFix;
import dev.tare.rewrite.FilePlanner;
import dev.tare.rewrite.FixOptions;
import dev.tare.rewrite.NotApplied;
import dev.tare.rewrite.RewriteSelection;
import dev.tare.source.SourceText;
import dev.tare.template.Template;
import dev.tare.tokenize.TokenizerRegistry;
import dev.tare.workspace.FileSelection;
import dev.tare.workspace.FileSystemOps;
import dev.tare.workspace.GitIndex;
import dev.tare.workspace.SkippedFile;
import dev.tare.workspace.StagedTemplates;
import dev.tare.workspace.Workspace;
import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.TreeMap;
import java.util.TreeSet;
import java.util.function.Function;

/**
 * Applies the rewrites the rules offer to every template of a workspace: each file is rewritten to a
 * fixpoint, verified against its original, and (unless it is a dry run) written crash-safely. It
 * decides nothing about what to rewrite: the rules offer, {@link FixOptions} selects, and overlapping
 * rewrites wait for the next round in a fixed priority (safe before review, then rule id, then
 * position). A partial is one file among the others, so its rewrite is made once, in its own file.
 */
public final class Fix {
    private final Workspace workspace;
    private final TokenizerRegistry tokenizers;
    private final FileSystemOps files;

    public Fix(Workspace workspace, TokenizerRegistry tokenizers, FileSystemOps files) {
        this.workspace = workspace;
        this.tokenizers = tokenizers;
        this.files = files;
    }

    /** Fixes the files of the workspace as they are on disk. */
    public FixResult run(FixOptions options) {
        TemplateLoader loader = new TemplateLoader(workspace);
        return run(options, loader, loader.find(), loader::read);
    }

    /**
     * Fixes the templates staged for the next commit and stages the result. Only files whose working
     * tree equals the index are rewritten; a partially staged file is reported and left alone, so
     * staged and unstaged changes are never mixed.
     */
    public FixResult runStaged(FixOptions options) {
        TemplateLoader loader = new TemplateLoader(workspace);
        StagedTemplates index = loader.staged();
        List<String> partial = index.partiallyStaged();
        List<String> whole = index.selection().paths().stream().filter(p -> !partial.contains(p)).toList();
        List<SkippedFile> left = partial.stream().map(p -> new SkippedFile(p, "partially staged (the working tree"
                + " differs from the index), so it is not fixed; stage or stash the rest, then commit again")).toList();
        FixResult result = run(options, loader, new FileSelection(whole, left), index::read, false);
        if (!options.dryRun()) {
            List<String> written = result.files().stream().filter(f -> f.outcome() == FileFix.Outcome.WRITTEN)
                    .map(FileFix::path).toList();
            GitIndex.stage(workspace.root(), written);
        }
        return result;
    }

    /**
     * Fixes the selected files, reading each through {@code reader}. A rewrite is written to the file
     * the text says it came from, and only while that file still holds exactly the text that was read.
     *
     * @throws TareException when the rules cannot be loaded or {@code options} name rules that cannot be applied
     */
    public FixResult run(FixOptions options, TemplateLoader loader, FileSelection selection,
                         Function<String, SourceText> reader) {
        return run(options, loader, selection, reader, true);
    }

    /**
     * @param acrossFiles whether rewrites across files (a shared block moved into a partial) are made;
     *                    not for staged files, whose partials would be new files outside the index
     */
    private FixResult run(FixOptions options, TemplateLoader loader, FileSelection selection,
                          Function<String, SourceText> reader, boolean acrossFiles) {
        Check check = new Check(workspace, tokenizers);
        RewriteSelection rewrites = RewriteSelection.of(check.catalog(), options);
        RunFileRules rules = new RunFileRules(check, loader, tokenizers);
        FilePlanner planner = new FilePlanner(rules, rewrites, workspace.config().templates().maxFileBytes());
        Map<String, FileFix> fixes = new TreeMap<>();
        Map<String, SourceText> originals = new TreeMap<>();
        ExtractionPlanner across = new ExtractionPlanner(loader, check.catalog(), rewrites, tokenizers);
        boolean extracting = acrossFiles && across.hasRulesNamed();
        List<SkippedFile> skipped = new ArrayList<>(selection.skipped());
        Map<String, Integer> reviewLeft = new TreeMap<>();
        Map<Path, String> seen = new HashMap<>();
        int templates = 0;
        // Files are planned on every core; what each gave is taken in path order, as one thread would.
        List<FileAttempt> planned = selection.paths().parallelStream().map(path -> plan(path, reader, loader, planner))
                .toList();
        for (FileAttempt one : planned) {
            String path = one.path();
            if (one.unreadable().isPresent()) {
                skipped.add(new SkippedFile(path, one.unreadable().get()));
                continue;
            }
            String first = seen.putIfAbsent(one.identity(), path);
            if (first != null) {
                skipped.add(new SkippedFile(path, "the same file as " + first + ", which is fixed under that name"));
                continue;
            }
            if (one.unparsable().isPresent()) {
                skipped.add(new SkippedFile(path, "does not parse, so it is not fixed (" + one.unparsable().get()
                        + "); 'tare check' shows where"));
                continue;
            }
            templates++;
            originals.put(path, one.original());
            FilePlanner.Plan plan = one.plan();
            plan.reviewLeft().forEach((rule, count) -> reviewLeft.merge(rule, count, Integer::sum));
            plan.fix().ifPresent(fix -> fixes.put(path, fix));
        }
        List<NotApplied> refused = List.of();
        Map<String, Set<String>> needs = Map.of();
        if (extracting) {
            Map<String, String> current = new TreeMap<>();
            Set<String> frozen = new TreeSet<>();
            originals.forEach((path, original) -> {
                FileFix fix = fixes.get(path);
                current.put(path, fix != null && fix.verified() ? fix.after() : original.text());
                if (fix != null && !fix.verified()) {
                    frozen.add(path);
                }
            });
            if (options.includeReview()) {
                ExtractionPlanner.Result extracted = across.plan(current, originals, frozen);
                new Extracted(loader, rules, check).merge(extracted, originals, fixes);
                refused = extracted.refused();
                needs = extracted.needs();
            } else {
                across.offered(current, originals).forEach((rule, count) -> reviewLeft.merge(rule, count, Integer::sum));
            }
        }
        List<FileFix> done = options.dryRun() ? new ArrayList<>(fixes.values()) : write(fixes, originals, needs);
        skipped.sort(null);
        return new FixResult(workspace.displayName(), options, templates, done, skipped, reviewLeft, refused);
    }

    /**
     * Writes every verified fix: new partials first, each only once the partials it includes exist,
     * then the other files, each only if every new partial it includes was written; so no file ever
     * includes a partial that is not there.
     */
    private List<FileFix> write(Map<String, FileFix> fixes, Map<String, SourceText> originals,
                                Map<String, Set<String>> needs) {
        FixWriter writer = new FixWriter(files);
        Map<String, FileFix> done = new TreeMap<>();
        Set<String> missing = new TreeSet<>();
        List<FileFix> created = fixes.values().stream().filter(FileFix::created).toList();
        List<FileFix> waiting = new ArrayList<>(created);
        while (!waiting.isEmpty()) {
            boolean progress = false;
            for (FileFix fix : List.copyOf(waiting)) {
                Set<String> wanted = needs.getOrDefault(fix.path(), Set.of());
                if (wanted.stream().anyMatch(missing::contains)) {
                    done.put(fix.path(), fix.with(FileFix.Outcome.NOT_WRITTEN, "it includes a new partial that could not be created"));
                    missing.add(fix.path());
                } else if (wanted.stream().allMatch(done::containsKey)) {
                    FileFix result = writer.create(fix, workspace.root().resolve(fix.path()), like(fix.path(), needs, originals));
                    done.put(fix.path(), result);
                    if (result.outcome() != FileFix.Outcome.WRITTEN) {
                        missing.add(fix.path());
                    }
                } else {
                    continue;
                }
                waiting.remove(fix);
                progress = true;
            }
            if (!progress) {
                waiting.forEach(fix -> done.put(fix.path(), fix.with(FileFix.Outcome.NOT_WRITTEN,
                        "its partials include each other, so it was not written")));
                break;
            }
        }
        for (FileFix fix : fixes.values()) {
            if (fix.created()) {
                continue;
            }
            List<String> absent = needs.getOrDefault(fix.path(), Set.of()).stream().filter(missing::contains).toList();
            done.put(fix.path(), absent.isEmpty() ? writer.write(fix, originals.get(fix.path()))
                    : fix.with(FileFix.Outcome.NOT_WRITTEN, "it would include " + String.join(", ", absent)
                    + ", which could not be created, so the file is as it was; run the fix again"));
        }
        return new ArrayList<>(done.values());
    }

    /** A file a new partial takes its permissions from: one of the templates it was made from. */
    private Path like(String partial, Map<String, Set<String>> needs, Map<String, SourceText> originals) {
        for (Map.Entry<String, Set<String>> entry : needs.entrySet()) {
            if (entry.getValue().contains(partial) && originals.containsKey(entry.getKey())) {
                return originals.get(entry.getKey()).file();
            }
        }
        return originals.values().iterator().next().file();
    }

    /**
     * What reading and planning one file gave: why it could not be read, or the file it is (links
     * followed) and what it was, then why it does not parse, or its plan.
     */
    private record FileAttempt(String path, Optional<String> unreadable, Path identity, SourceText original,
                           Optional<String> unparsable, FilePlanner.Plan plan) {
    }

    /**
     * Reads, parses and plans one file. A file that is another's under a second name is planned too
     * and then set aside in path order, so the outcome is the one a single thread gives.
     */
    private static FileAttempt plan(String path, Function<String, SourceText> reader, TemplateLoader loader,
                                FilePlanner planner) {
        SourceText original;
        try {
            original = reader.apply(path);
        } catch (TareException e) {
            return new FileAttempt(path, Optional.of(e.getMessage()), null, null, Optional.empty(), null);
        }
        Path identity = identity(original.file());
        Template template;
        try {
            template = loader.parse(original);
        } catch (TareException e) {
            return new FileAttempt(path, Optional.empty(), identity, null, Optional.of(e.getMessage()), null);
        }
        if (template.prompts().isEmpty()) {
            // A source file without prompts: nothing to rewrite.
            return new FileAttempt(path, Optional.empty(), identity, original, Optional.empty(),
                    new FilePlanner.Plan(Optional.empty(), java.util.Map.of()));
        }
        return new FileAttempt(path, Optional.empty(), identity, original, Optional.empty(),
                planner.plan(original, template));
    }

    /** The file a path names once links are followed, so that two names of one file are fixed once. */
    private static Path identity(Path file) {
        try {
            return file.toRealPath();
        } catch (IOException e) {
            return file.toAbsolutePath().normalize();
        }
    }
}
