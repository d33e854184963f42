package dev.tare.lint;

import dev.tare.template.Template;
import java.util.List;

/**
 * A rule about the templates of a run taken together, such as a block of text that several of them
 * hold. The check runs it once, after the rules that read one template at a time, with every
 * template of the run in the context; asked about one template alone it finds nothing. Its rewrites
 * span several files, so it offers them as {@link Extraction}s rather than on its findings.
 */
public interface CrossTemplateRule extends Rule {

    /** The findings over every template in {@code context}, in any order. */
    List<Finding> checkAll(LintContext context);

    /** Nothing: the rule looks at templates only together. */
    @Override
    default List<Finding> check(Template template, LintContext context) {
        return List.of();
    }

    /** The rewrites across files the rule offers over the templates in {@code context}; none by default. */
    default List<Extraction> extractions(LintContext context) {
        return List.of();
    }
}
