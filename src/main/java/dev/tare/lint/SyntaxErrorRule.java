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
     * @param path   the file's path relative to the root
     * @param source the file's text
     * @param error  the parser's error, with its line and column
     */
    List<Finding> onSyntaxError(String path, String source, TemplateSyntaxException error);

    /** The code-point column of a parser's line and UTF-16 column in {@code source}. */
    static int codePointColumn(String source, int line, int utf16Column) {
        SourceLines lines = new SourceLines(source);
        return lines.column(lines.offset(line, utf16Column));
    }
}
