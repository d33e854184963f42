package dev.tare.rewrite;

import dev.tare.TareException;
import dev.tare.lint.Edit;
import dev.tare.lint.EditKind;
import dev.tare.lint.Finding;
import dev.tare.lint.RewriteClass;
import dev.tare.lint.Rule;
import dev.tare.lint.RuleCatalog;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;

/**
 * Which of the rewrites the rules offer a fix takes: safe ones, review ones too when asked, and only
 * those of the named rules when rules are named. It takes what the rules offer and never adds to it.
 */
public final class RewriteSelection {
    private final RuleCatalog catalog;
    private final FixOptions options;

    private RewriteSelection(RuleCatalog catalog, FixOptions options) {
        this.catalog = catalog;
        this.options = options;
    }

    /**
     * The selection for {@code options}.
     *
     * @throws TareException when a named rule is unknown, switched off, offers no rewrite, or offers
     *                       review rewrites without review rewrites being asked for
     */
    public static RewriteSelection of(RuleCatalog catalog, FixOptions options) {
        for (String id : options.only()) {
            Rule rule = catalog.rule(id);
            if (catalog.isDisabled(id)) {
                throw new TareException("--only " + id + ": the rule is switched off by rules.disable in the configuration;"
                        + " enable it to apply its rewrites");
            }
            RewriteClass rewriteClass = rule.descriptor().rewriteClass();
            if (rewriteClass == RewriteClass.NONE) {
                throw new TareException("--only " + id + ": the rule only reports and offers no rewrite;"
                        + " 'tare explain " + id + "' says what to write instead");
            }
            if (rewriteClass == RewriteClass.REVIEW && !options.includeReview()) {
                throw new TareException("--only " + id + ": the rule's rewrites are review-class; add --include-review"
                        + " to apply them, and evaluate the prompts they change before they ship");
            }
        }
        return new RewriteSelection(catalog, options);
    }

    /**
     * The rewrites of {@code findings} to apply to {@code text}, without edits that would leave the
     * text as it is.
     */
    List<Candidate> candidates(List<Finding> findings, String text) {
        List<Candidate> candidates = new ArrayList<>();
        for (Finding finding : findings) {
            if (finding.rewrite().isEmpty() || !wanted(finding)) {
                continue;
            }
            List<Edit> edits = new ArrayList<>();
            for (Edit edit : finding.rewrite().get().edits()) {
                if (edit.end() > text.length()) {
                    throw new IllegalStateException(finding.rule() + " offered an edit past the end of " + finding.path());
                }
                if (!text.substring(edit.start(), edit.end()).equals(edit.replacement())) {
                    edits.add(edit);
                }
            }
            if (!edits.isEmpty()) {
                Rule rule = catalog.rule(finding.rule());
                candidates.add(new Candidate(finding.rule(), finding.rewriteClass(),
                        rule.descriptor().editKind().orElse(EditKind.TEXT), edits));
            }
        }
        return candidates;
    }

    /** How many review-class rewrites of each rule {@code findings} offer that this selection leaves out. */
    Map<String, Integer> reviewLeft(List<Finding> findings) {
        Map<String, Integer> left = new TreeMap<>();
        if (options.includeReview()) {
            return left;
        }
        for (Finding finding : findings) {
            if (finding.rewrite().isPresent() && finding.rewriteClass() == RewriteClass.REVIEW
                    && (options.only().isEmpty() || options.only().contains(finding.rule()))) {
                left.merge(finding.rule(), 1, Integer::sum);
            }
        }
        return left;
    }

    private boolean wanted(Finding finding) {
        return takes(finding.rule(), finding.rewriteClass());
    }

    /** Whether rewrites of class {@code rewriteClass} by rule {@code rule} are applied. */
    public boolean takes(String rule, RewriteClass rewriteClass) {
        boolean byClass = rewriteClass == RewriteClass.SAFE
                || (rewriteClass == RewriteClass.REVIEW && options.includeReview());
        return byClass && named(rule);
    }

    /** Whether {@code rule} is among the rules asked for (every rule when none is named). */
    public boolean named(String rule) {
        return options.only().isEmpty() || options.only().contains(rule);
    }
}
