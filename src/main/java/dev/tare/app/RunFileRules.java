package dev.tare.app;

import dev.tare.TareException;
import dev.tare.lint.Finding;
import dev.tare.lint.LintContext;
import dev.tare.rewrite.FileRules;
import dev.tare.source.SourceText;
import dev.tare.template.Template;
import dev.tare.tokenize.Tokenizer;
import dev.tare.tokenize.TokenizerRegistry;
import dev.tare.workspace.FileSelection;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;

/**
 * A fix run's answers to the planner: a version of a file is parsed by the run's loader and checked
 * by the run's check, exactly as the file itself would be on disk.
 */
final class RunFileRules implements FileRules {
    private final Check check;
    private final TemplateLoader loader;
    private final TokenizerRegistry tokenizers;

    RunFileRules(Check check, TemplateLoader loader, TokenizerRegistry tokenizers) {
        this.check = check;
        this.loader = loader;
        this.tokenizers = tokenizers;
    }

    @Override
    public Optional<Template> parse(SourceText original, String text) {
        try {
            return Optional.of(loader.parse(original.withText(text)));
        } catch (TareException e) {
            return Optional.empty();
        }
    }

    @Override
    public List<Finding> findings(SourceText original, String text) {
        SourceText version = original.withText(text);
        return check.run(CheckOptions.defaults(), loader, new FileSelection(List.of(original.path()), List.of()),
                path -> version).findings();
    }

    @Override
    public List<Tokenizer> tokenizers(Template template) {
        LintContext context = new LintContext(loader.workspace().config(), tokenizers, loader.renderer(),
                List.of(template), Set.of(), Map.of());
        return context.targetTokenizers(template);
    }
}
