package dev.tare.lint;

import dev.tare.app.Check;
import dev.tare.app.CheckOptions;
import dev.tare.app.CheckResult;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.app.TemplateLoader;
import dev.tare.tokenize.TokenizerRegistry;
import dev.tare.workspace.Workspace;
import java.nio.file.Path;
import java.util.HashSet;
import java.util.List;
import java.util.Optional;
import java.util.Set;
import org.junit.jupiter.api.Test;

/** {@code check} on the hostile corpus finishes, and every file is checked or skipped with a reason (corpora/hostile/README.md). */
class HostileCorpusTest {
    private static final Path HOSTILE = Path.of(System.getProperty("tare.project.dir", ".")).resolve("corpora/hostile");

    @Test
    void everyFileIsCheckedOrSkippedAndNothingCrashes() {
        Workspace workspace = Workspace.open(List.of(HOSTILE), Optional.empty());
        CheckResult result = new Check(workspace, new TokenizerRegistry()).run(CheckOptions.defaults());
        List<String> files = new TemplateLoader(workspace).find().paths();
        Set<String> skipped = new HashSet<>();
        result.skipped().forEach(s -> skipped.add(s.path()));
        long unparsed = result.findings().stream().filter(f -> f.rule().equals("unterminated-placeholder"))
                .map(Finding::path).distinct().count();
        assertEquals(files.size(), result.templates() + skipped.size() + unparsed,
                "every file is checked, skipped with a reason, or reported as unparseable");
        assertTrue(skipped.contains("binary.md"));
        assertTrue(skipped.contains("alias-bomb.chat.yaml"));
        assertTrue(result.findings().stream().anyMatch(f -> f.path().equals("unterminated-placeholder.md")
                && f.rule().equals("unterminated-placeholder") && f.line() == 7 && f.column() == 29));
        assertTrue(result.findings().stream().anyMatch(f -> f.path().equals("unterminated-tag.md")
                && f.rule().equals("unterminated-placeholder") && f.line() == 4 && f.column() == 1));
        assertTrue(result.findings().stream().anyMatch(f -> f.path().equals("include-cycle.md")
                && f.rule().equals("unresolved-include")));
        assertTrue(result.findings().stream().noneMatch(f -> skipped.contains(f.path())));
    }
}
