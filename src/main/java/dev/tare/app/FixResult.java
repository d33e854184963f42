package dev.tare.app;

import dev.tare.lint.RewriteClass;
import dev.tare.rewrite.FileFix;
import dev.tare.rewrite.FixOptions;
import dev.tare.rewrite.NotApplied;
import dev.tare.rewrite.RuleSaving;
import dev.tare.rewrite.TokenChange;
import dev.tare.workspace.SkippedFile;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;

/**
 * Everything a fix did or planned, ready for a report.
 *
 * @param root       the fixed root, as the user named it
 * @param options    what was asked for
 * @param templates  how many templates were read and checked
 * @param files      the files with rewrites (verified or dropped), sorted by path
 * @param skipped    files found but not fixed, with the reason, sorted by path
 * @param reviewLeft review-class rewrites the rules offered that were not applied, by rule id
 * @param refused    places a rewrite across files (a shared block's extraction) left as they are, with the reason
 */
public record FixResult(String root, FixOptions options, int templates, List<FileFix> files, List<SkippedFile> skipped,
                        Map<String, Integer> reviewLeft, List<NotApplied> refused) {
    public FixResult {
        files = List.copyOf(files);
        skipped = List.copyOf(skipped);
        reviewLeft = java.util.Collections.unmodifiableMap(new TreeMap<>(reviewLeft));
        refused = List.copyOf(refused);
    }

    /** The files whose rewrite is (or in a dry run would be) in the file. */
    public List<FileFix> applied() {
        return files.stream().filter(FileFix::applied).toList();
    }

    /** The files whose rewrite was dropped or could not be written. */
    public List<FileFix> notFixed() {
        return files.stream().filter(f -> !f.applied()).toList();
    }

    /**
     * Whether something could not be fixed as planned: a dropped rewrite, a file changed meanwhile, a
     * failed write, or a place a rewrite across files had to leave.
     */
    public boolean failed() {
        return !notFixed().isEmpty() || !refused.isEmpty();
    }

    /** The new files (partials) that are, or in a dry run would be, written. */
    public List<FileFix> created() {
        return applied().stream().filter(FileFix::created).toList();
    }

    /** The names of every tokenizer the applied rewrites were measured on, in the order the targets list them. */
    public List<String> tokenizers() {
        LinkedHashSet<String> names = new LinkedHashSet<>();
        for (FileFix file : applied()) {
            file.tokens().forEach(t -> names.add(t.tokenizer()));
        }
        return List.copyOf(names);
    }

    /** Tokens before and after over every applied file, per tokenizer (files count only on their targets' tokenizers). */
    public List<TokenChange> totals() {
        List<TokenChange> totals = new ArrayList<>();
        for (String tokenizer : tokenizers()) {
            int before = 0;
            int after = 0;
            for (FileFix file : applied()) {
                for (TokenChange change : file.tokens()) {
                    if (change.tokenizer().equals(tokenizer)) {
                        before += change.before();
                        after += change.after();
                    }
                }
            }
            totals.add(new TokenChange(tokenizer, before, after));
        }
        return totals;
    }

    /** Each rule's rewrites and savings over every applied file, sorted by rule id. */
    public List<RuleSaving> rules() {
        Map<String, RuleSaving> byRule = new TreeMap<>();
        for (FileFix file : applied()) {
            for (RuleSaving saving : file.rules()) {
                byRule.merge(saving.rule(), saving, RuleSaving::plus);
            }
        }
        return List.copyOf(byRule.values());
    }

    /** The applied rewrites of review-class rules, by rule id: prompts they changed should be evaluated before they ship. */
    public Map<String, Integer> reviewApplied() {
        Map<String, Integer> applied = new LinkedHashMap<>();
        for (RuleSaving saving : rules()) {
            if (saving.rewriteClass() == RewriteClass.REVIEW) {
                applied.put(saving.rule(), saving.rewrites());
            }
        }
        return applied;
    }
}
