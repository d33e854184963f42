package dev.tare.rewrite;

import dev.tare.lint.Finding;
import dev.tare.source.SourceText;
import dev.tare.template.Template;
import dev.tare.tokenize.Tokenizer;
import java.util.List;
import java.util.Optional;

/**
 * What planning a file's rewrites asks of the run it is part of: reading a version of the file as
 * the run reads it, the rules' findings on it, and the tokenizers its savings are counted with. The
 * run (the app layer) answers; the planner itself reads and writes no file.
 */
public interface FileRules {
    /** The template {@code text} parses to as a version of the file {@code original}; empty when it does not parse. */
    Optional<Template> parse(SourceText original, String text);

    /** The findings of every rule on {@code text}, read as a version of the file {@code original}. */
    List<Finding> findings(SourceText original, String text);

    /** The tokenizers of the template's targets, which its savings are counted on. */
    List<Tokenizer> tokenizers(Template template);
}
