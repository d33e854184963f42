package dev.tare.app;

import dev.tare.TareException;
import dev.tare.config.BaselineConfig;
import dev.tare.lint.LintContext;
import dev.tare.lint.RunTemplates;
import dev.tare.rewrite.FixOptions;
import dev.tare.workspace.FileSystemOps;
import dev.tare.tokenize.TokenizerRegistry;
import dev.tare.workspace.Workspace;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.Set;

/**
 * Builds an {@link Overview} of a workspace: scans it, runs the rules over it, compares the counts
 * with the baseline file when there is one, and, when asked, counts each template's tokens line by
 * line on the scan's primary tokenizer.
 */
public final class OverviewRun {
    private final Workspace workspace;
    private final TokenizerRegistry tokenizers;

    public OverviewRun(Workspace workspace, TokenizerRegistry tokenizers) {
        this.workspace = workspace;
        this.tokenizers = tokenizers;
    }

    /**
     * Runs everything.
     *
     * @param options   what to scan on
     * @param withLines whether to count each template's lines (for a report that shows them)
     * @throws TareException for configuration problems and an unreadable baseline file
     */
    public Overview run(ScanOptions options, boolean withLines) {
        ScanResult scan = new TemplateScan(workspace, tokenizers).run(options);
        CheckResult check = new Check(workspace, tokenizers)
                .run(new CheckOptions(CheckOptions.defaults().failOn(), options.cache()));
        // What applying the rewrites saves, as fix would (safe ones first, review ones on top), so
        // that the report's savings are fix's numbers, not the findings' one by one.
        FixResult planned = new Fix(workspace, tokenizers, FileSystemOps.DEFAULT)
                .run(new FixOptions(true, java.util.Set.of(), true));
        BaselineConfig config = workspace.config().baseline();
        Optional<BaselineStatus> baseline = BaselineFile.read(BaselineFile.path(workspace.config()))
                .map(recorded -> BaselineStatus.compare(config.file(), config.tolerancePercent(), recorded,
                        scan.baseline(), workspace.starts().isEmpty()));
        List<TemplateLines> lines = withLines ? lines(scan) : List.of();
        return new Overview(scan, check, RuleTally.of(check, planned), TargetTotals.of(scan), config.file(), baseline,
                lines);
    }

    private List<TemplateLines> lines(ScanResult scan) {
        TemplateLoader loader = new TemplateLoader(workspace);
        LintContext context = Check.onDisk(loader, tokenizers, loader.renderer(), RunTemplates.held(List.of()), Set.of());
        LineCounter counter = new LineCounter(tokenizers.get(scan.tokenizer(), workspace.root()), loader.renderer(),
                context);
        List<TemplateLines> lines = new ArrayList<>();
        for (ScannedTemplate template : scan.templates()) {
            try {
                lines.add(counter.count(loader.load(template.path())));
            } catch (TareException e) {
                // The file changed or vanished since the scan read it; its figures stand without a line view.
            }
        }
        return lines;
    }
}
