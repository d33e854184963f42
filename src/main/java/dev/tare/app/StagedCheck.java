package dev.tare.app;

import dev.tare.footprint.Target;
import dev.tare.rewrite.FixOptions;
import dev.tare.tokenize.TokenizerRegistry;
import dev.tare.workspace.FileSystemOps;
import dev.tare.workspace.Workspace;
import java.util.List;
import java.util.Optional;

/**
 * What the pre-commit hook runs: the safe rewrites of the staged templates when {@code hook.fix} is
 * on, then the check of the staged templates, per-template and cross-template rules alike.
 */
public final class StagedCheck {
    private StagedCheck() {
    }

    /**
     * What the hook found.
     *
     * @param fixed  what the safe rewrites did, when the hook applies them
     * @param result the check of the staged templates
     */
    public record Outcome(Optional<FixResult> fixed, CheckResult result) {
    }

    /** Fixes (when configured) and checks the staged templates of {@code workspace}. */
    public static Outcome run(Workspace workspace) {
        TokenizerRegistry tokenizers = new TokenizerRegistry();
        // Every staged template is counted with every target's tokenizer: load them while git is read
        // and the rules are set up.
        List<String> needed = workspace.config().targets().stream().map(Target::tokenizer).toList();
        tokenizers.preload(needed.isEmpty() ? List.of(TokenizerRegistry.DEFAULT) : needed, workspace.config().root());
        Optional<FixResult> fixed = Optional.empty();
        if (workspace.config().hookFix()) {
            fixed = Optional.of(new Fix(workspace, tokenizers, FileSystemOps.DEFAULT).runStaged(FixOptions.defaults()));
        }
        return new Outcome(fixed, new Check(workspace, tokenizers).runStaged(CheckOptions.defaults()));
    }
}
