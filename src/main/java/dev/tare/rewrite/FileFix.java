package dev.tare.rewrite;

import java.util.List;

/**
 * What a fix did, or would do, to one file: its text before and after (after is verified unless the
 * outcome is {@link Outcome#DROPPED}), each rule's rewrites and savings, its tokens before and after
 * on each of its targets' tokenizers, how many rounds of rewriting it took, and why it was dropped or
 * not written. A created file (a partial a shared block moved into) has an empty text before.
 */
public final class FileFix {
    private final String path;
    private final Outcome outcome;
    private final String before;
    private final String after;
    private final List<RuleSaving> rules;
    private final List<TokenChange> tokens;
    private final int rounds;
    private final List<String> problems;
    private final boolean created;

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

    public FileFix(String path, Outcome outcome, String before, String after, List<RuleSaving> rules,
                   List<TokenChange> tokens, int rounds, List<String> problems, boolean created) {
        this.path = path;
        this.outcome = outcome;
        this.before = before;
        this.after = after;
        this.rules = List.copyOf(rules);
        this.tokens = List.copyOf(tokens);
        this.rounds = rounds;
        this.problems = List.copyOf(problems);
        this.created = created;
    }

    /** The path relative to the scanned root, with {@code /}. */
    public String path() {
        return path;
    }

    /** What became of the rewrite. */
    public Outcome outcome() {
        return outcome;
    }

    /** The file's text as read (without a byte-order mark); empty for a new file. */
    public String before() {
        return before;
    }

    /** The rewritten text. */
    public String after() {
        return after;
    }

    /** Each rule's applied rewrites and savings, sorted by rule id. */
    public List<RuleSaving> rules() {
        return rules;
    }

    /** The file's tokens before and after on each of its targets' tokenizers. */
    public List<TokenChange> tokens() {
        return tokens;
    }

    /** How many rounds of rewriting it took. */
    public int rounds() {
        return rounds;
    }

    /** Why the rewrite was dropped or not written; empty otherwise. */
    public List<String> problems() {
        return problems;
    }

    /** Whether the file is new. */
    public boolean created() {
        return created;
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
    public FileFix with(Outcome newOutcome, String problem) {
        List<String> more = new java.util.ArrayList<>(problems);
        if (!problem.isEmpty()) {
            more.add(problem);
        }
        return new FileFix(path, newOutcome, before, after, rules, tokens, rounds, more, created);
    }
}
