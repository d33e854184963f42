package dev.tare.rewrite;

import java.util.List;

/**
 * What a fix did, or would do, to one file.
 *
 * @param path     the path relative to the scanned root, with {@code /}
 * @param outcome  what became of the rewrite
 * @param before   the file's text as read (without a byte-order mark)
 * @param after    the rewritten text, verified unless the outcome is {@link Outcome#DROPPED}
 * @param rules    each rule's applied rewrites and savings, sorted by rule id
 * @param tokens   the file's tokens before and after on each of its targets' tokenizers
 * @param rounds   how many rounds of rewriting it took to reach a text no rule rewrites further
 * @param problems why the rewrite was dropped or not written; empty otherwise
 * @param created  whether the file is new (a partial a shared block moved into); {@code before} is then empty
 */
public record FileFix(String path, Outcome outcome, String before, String after, List<RuleSaving> rules,
                      List<TokenChange> tokens, int rounds, List<String> problems, boolean created) {
    /** What became of one file's rewrite. */
    public enum Outcome {
        /** Dry run: the rewrite was verified and would be written. */
        PLANNED,
        /** The rewrite was verified and written. */
        WRITTEN,
        /** The rewrite failed its verification, or did not settle, and was dropped; the file was not touched. */
        DROPPED,
        /** The file changed on disk after it was read, so it was left as it is. */
        CHANGED_MEANWHILE,
        /** Writing failed or was refused; the file is as it was. */
        NOT_WRITTEN;

        /** The lower-case name used in JSON output. */
        public String label() {
            return name().toLowerCase(java.util.Locale.ROOT);
        }
    }

    public FileFix {
        rules = List.copyOf(rules);
        tokens = List.copyOf(tokens);
        problems = List.copyOf(problems);
    }

    /** Whether the rewrite is (or in a dry run would be) in the file. */
    public boolean applied() {
        return outcome == Outcome.PLANNED || outcome == Outcome.WRITTEN;
    }

    /** Whether the file has a verified rewrite, written or not. */
    public boolean verified() {
        return outcome != Outcome.DROPPED;
    }

    /** The same fix with another outcome and, when given, one more problem. */
    FileFix with(Outcome newOutcome, String problem) {
        List<String> more = new java.util.ArrayList<>(problems);
        if (!problem.isEmpty()) {
            more.add(problem);
        }
        return new FileFix(path, newOutcome, before, after, rules, tokens, rounds, more, created);
    }
}
