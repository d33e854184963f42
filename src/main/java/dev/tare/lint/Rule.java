package dev.tare.lint;

import dev.tare.template.Template;
import java.util.List;

/**
 * A check over templates. A rule reads a template (and, through the context, its tokenizer,
 * configuration and the other templates), and returns findings, each with an optional rewrite. It
 * never writes files and never formats output.
 */
public interface Rule {

    /** What the rule is, declared once. */
    RuleDescriptor descriptor();

    /** The findings of this rule in {@code template}, in any order. */
    List<Finding> check(Template template, LintContext context);
}
