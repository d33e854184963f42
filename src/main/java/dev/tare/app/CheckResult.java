package dev.tare.app;

import dev.tare.lint.Finding;
import dev.tare.lint.RuleDescriptor;
import dev.tare.lint.Severity;
import dev.tare.workspace.SkippedFile;
import java.util.List;

/**
 * Everything a check found, ready for a report.
 *
 * @param root      the checked root, as the user named it
 * @param rules     the descriptors of the rules that ran, sorted by id, with configured severities
 * @param findings  every finding, in {@link Finding#ORDER}
 * @param skipped   files found but not checked, with the reason, sorted by path
 * @param templates how many templates were checked
 * @param failOn    the failing severity
 */
public record CheckResult(String root, List<RuleDescriptor> rules, List<Finding> findings, List<SkippedFile> skipped,
                          int templates, Severity failOn) {
    public CheckResult {
        rules = List.copyOf(rules);
        findings = List.copyOf(findings);
        skipped = List.copyOf(skipped);
    }

    /** Whether any finding is at or above the failing severity. */
    public boolean failed() {
        return findings.stream().anyMatch(f -> f.severity().atLeast(failOn));
    }

    /** How many findings have {@code severity}. */
    public long count(Severity severity) {
        return findings.stream().filter(f -> f.severity() == severity).count();
    }

    /** How many findings offer a rewrite. */
    public long rewrites() {
        return findings.stream().filter(f -> f.rewrite().isPresent()).count();
    }

    /** Tokens all offered rewrites would save, summed (a planning estimate). */
    public long savingTokens() {
        return findings.stream().mapToLong(Finding::savingTokens).sum();
    }

    /** The number of distinct files with findings. */
    public long filesWithFindings() {
        return findings.stream().map(Finding::path).distinct().count();
    }
}
