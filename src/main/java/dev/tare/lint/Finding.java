package dev.tare.lint;

import java.util.Comparator;
import java.util.List;
import java.util.Optional;

/**
 * One place a rule flags. Lines are 1-based; columns are 1-based and counted in Unicode code points;
 * the end is exclusive (the position just past the flagged text).
 *
 * @param path         the path relative to the scanned root, with {@code /}
 * @param line         line of the start
 * @param column       column of the start
 * @param endLine      line of the end
 * @param endColumn    column just past the end
 * @param rule         the rule's id
 * @param severity     the severity after configuration
 * @param message      what is wrong here and what to do, in one sentence
 * @param rewriteClass the class of the rule's rewrites ({@link RewriteClass#NONE} when it offers none)
 * @param rewrite      the rewrite offered here, when the rule has one and it can be mapped exactly onto the file
 * @param related      other places the finding refers to
 */
public record Finding(String path, int line, int column, int endLine, int endColumn, String rule, Severity severity,
                      String message, RewriteClass rewriteClass, Optional<Rewrite> rewrite, List<Related> related) {
    /** The order of every output: by path, then position, then rule and message. */
    public static final Comparator<Finding> ORDER = Comparator.comparing(Finding::path)
            .thenComparingInt(Finding::line).thenComparingInt(Finding::column)
            .thenComparing(Finding::rule).thenComparing(Finding::message)
            .thenComparingInt(Finding::endLine).thenComparingInt(Finding::endColumn);

    public Finding {
        related = List.copyOf(related);
    }

    /** The same finding at another severity. */
    public Finding withSeverity(Severity newSeverity) {
        return new Finding(path, line, column, endLine, endColumn, rule, newSeverity, message, rewriteClass, rewrite,
                related);
    }

    /** Tokens the rewrite saves, zero without one. */
    public int savingTokens() {
        return rewrite.map(Rewrite::savingTokens).orElse(0);
    }
}
