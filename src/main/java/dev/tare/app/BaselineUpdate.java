package dev.tare.app;

import dev.tare.lint.Baseline;
import dev.tare.tokenize.TokenizerRegistry;
import dev.tare.workspace.SafeFileWriter;
import dev.tare.workspace.Workspace;
import java.nio.file.Path;

/** Records the repository's current counts as its baseline ({@code baseline.file}). */
public final class BaselineUpdate {
    private BaselineUpdate() {
    }

    /**
     * What recording did.
     *
     * @param file      the baseline file
     * @param templates the templates recorded
     * @param skipped   the files the scan skipped (see {@code tare scan})
     * @param outcome   whether the file was written, already held these counts, or changed meanwhile
     */
    public record Report(Path file, int templates, int skipped, SafeFileWriter.Outcome outcome) {
    }

    /** Scans {@code workspace} and writes its baseline. */
    public static Report run(Workspace workspace) {
        ScanResult scan = new TemplateScan(workspace, new TokenizerRegistry()).run(ScanOptions.defaults());
        Baseline baseline = scan.baseline();
        Path file = BaselineFile.path(workspace.config());
        SafeFileWriter.Outcome outcome = BaselineFile.write(file, baseline);
        return new Report(file, baseline.tokens().size(), scan.skipped().size(), outcome);
    }
}
