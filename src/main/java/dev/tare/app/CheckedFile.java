package dev.tare.app;

import dev.tare.lint.Finding;
import dev.tare.lint.Suppressions;
import java.util.List;
import java.util.Optional;

/**
 * What the per-template rules found in one file, as a check keeps it between runs: the findings no
 * directive silences, at their configured severities; the file's directives when it has any (the
 * cross-template rules' findings heed them too); and the hash of its text when it parsed (a file
 * that did not parse takes no part in the cross-template rules).
 */
record CheckedFile(List<Finding> findings, Optional<Suppressions> suppressions, Optional<Integer> hash) {
    CheckedFile {
        findings = List.copyOf(findings);
    }
}
