package dev.tare.rewrite;

import dev.tare.TareException;
import dev.tare.lint.Check;
import dev.tare.scan.StagedTemplates;
import dev.tare.scan.TemplateLoader;
import dev.tare.source.GitIndex;
import dev.tare.scan.Workspace;
import dev.tare.source.FileSelection;
import dev.tare.source.SkippedFile;
import dev.tare.source.SourceText;
import dev.tare.template.Template;
import dev.tare.tokenize.TokenizerRegistry;
import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
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
        FixResult result = run(options, loader, new FileSelection(whole, left), index::read);
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
        Check check = new Check(workspace, tokenizers);
        FilePlanner planner = new FilePlanner(check, loader, RewriteSelection.of(check.catalog(), options), tokenizers);
        FixWriter writer = new FixWriter(files);
        List<FileFix> fixes = new ArrayList<>();
        List<SkippedFile> skipped = new ArrayList<>(selection.skipped());
        Map<String, Integer> reviewLeft = new TreeMap<>();
        Map<Path, String> seen = new HashMap<>();
        int templates = 0;
        for (String path : selection.paths()) {
            SourceText original;
            Template template;
            try {
                original = reader.apply(path);
            } catch (TareException e) {
                skipped.add(new SkippedFile(path, e.getMessage()));
                continue;
            }
            String first = seen.putIfAbsent(identity(original.file()), path);
            if (first != null) {
                skipped.add(new SkippedFile(path, "the same file as " + first + ", which is fixed under that name"));
                continue;
            }
            try {
                template = loader.parse(original);
            } catch (TareException e) {
                skipped.add(new SkippedFile(path, "does not parse, so it is not fixed (" + e.getMessage()
                        + "); 'tare check' shows where"));
                continue;
            }
            templates++;
            FilePlanner.Plan plan = planner.plan(original, template);
            plan.reviewLeft().forEach((rule, count) -> reviewLeft.merge(rule, count, Integer::sum));
            if (plan.fix().isPresent()) {
                fixes.add(options.dryRun() ? plan.fix().get() : writer.write(plan.fix().get(), original));
            }
        }
        skipped.sort(null);
        return new FixResult(workspace.displayName(), options, templates, fixes, skipped, reviewLeft);
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
