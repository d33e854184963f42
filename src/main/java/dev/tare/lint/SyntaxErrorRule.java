package dev.tare.lint;

import dev.tare.template.TemplateSyntaxException;
import java.util.List;

/**
 * A rule that also speaks for files that cannot be parsed at all, so that a broken placeholder is a
 * located finding of {@code check} rather than a skipped file.
 */
public interface SyntaxErrorRule extends Rule {

    /**
     * The findings for a file that failed to parse.
     *
     * @param path  the file's path relative to the root
     * @param error the parser's error, with its line and column
     */
    List<Finding> onSyntaxError(String path, TemplateSyntaxException error);
}
