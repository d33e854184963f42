package dev.tare.rewrite;

import dev.tare.TareException;
import dev.tare.lint.Edit;
import dev.tare.lint.Finding;
import dev.tare.lint.Rewrite;
import dev.tare.lint.RewriteClass;
import dev.tare.source.FileBytes;
import dev.tare.source.SafeReader;
import dev.tare.source.SourceText;
import dev.tare.template.Message;
import dev.tare.template.Template;
import dev.tare.template.TemplateKind;
import dev.tare.tokenize.Tokenizer;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.TreeMap;

/**
 * Rewrites one file to a fixpoint without writing it: in each round the rules check the current
 * text, the selected rewrites that do not overlap are applied, and the rules run again, until they
 * offer nothing more (at most {@value #MAX_ROUNDS} rounds). Safe rewrites run to their own fixpoint
 * first and are checked against what safe promises ({@link SafePromise}); review rewrites, when
 * asked for, follow. The final text is then verified against the original, and the bytes that
 * would be written are read back.
 */
public final class FilePlanner {
    /** Rounds after which a file whose rewrites keep changing it is given up on. */
    static final int MAX_ROUNDS = 8;

    private final FileRules rules;
    private final RewriteSelection selection;
    private final SafeReader reader;

    /**
     * What planning one file gave: its fix, when there is something to fix, and the review rewrites left out.
     *
     * @param fix        the file's fix, when a rule offered a rewrite the selection takes
     * @param reviewLeft per rule, the review rewrites offered and not taken
     */
    public record Plan(Optional<FileFix> fix, Map<String, Integer> reviewLeft) {
    }

    /**
     * @param rules     the run's reading, rules and tokenizers
     * @param selection which rewrites to take
     * @param maxBytes  the largest file the run reads, for reading back the bytes to be written
     */
    public FilePlanner(FileRules rules, RewriteSelection selection, long maxBytes) {
        this.rules = rules;
        this.selection = selection;
        this.reader = new SafeReader(maxBytes);
    }

    /** Plans the rewrites of {@code original}, which parsed to {@code template}. */
    public Plan plan(SourceText original, Template template) {
        List<Tokenizer> counters = rules.tokenizers(template);
        Rounds work = new Rounds(original, counters, tokens(template, counters),
                rules.findings(original, original.text()));
        Map<String, Integer> reviewLeft = selection.reviewLeft(work.findings);
        // Safe rewrites go first, to their fixpoint, and must keep what safe promises before any review
        // rewrite is added on top: a safe rewrite that fails is dropped, never written.
        Optional<String> stuck = work.run(candidate -> candidate.rewriteClass() == RewriteClass.SAFE);
        if (stuck.isEmpty() && work.rounds > 0) {
            List<String> broken = rules.parse(original, work.trace.current())
                    .map(after -> SafePromise.broken(template, after))
                    .orElse(List.of("after the safe rewrites the file no longer parses"));
            if (!broken.isEmpty()) {
                List<String> problems = new ArrayList<>(broken);
                problems.add("the safe rewrites came from " + String.join(", ", work.tallies.keySet())
                        + "; please report this, and fix the file by hand");
                return new Plan(Optional.of(work.fix(FileFix.Outcome.DROPPED, problems)), reviewLeft);
            }
        }
        if (stuck.isEmpty()) {
            stuck = work.run(candidate -> true);
        }
        if (stuck.isPresent()) {
            return new Plan(Optional.of(work.fix(FileFix.Outcome.DROPPED, List.of(stuck.get()))), reviewLeft);
        }
        if (work.rounds == 0) {
            return new Plan(Optional.empty(), reviewLeft);
        }
        List<String> problems = new ArrayList<>(verify(original, template, work.trace));
        if (!problems.isEmpty()) {
            problems.add("the edits came from " + String.join(", ", work.tallies.keySet())
                    + "; please report this, and fix the file by hand");
        }
        FileFix.Outcome outcome = problems.isEmpty() ? FileFix.Outcome.PLANNED : FileFix.Outcome.DROPPED;
        return new Plan(Optional.of(work.fix(outcome, problems)), reviewLeft);
    }

    /** The rounds of rewriting one file: its text so far with where each character came from, and what each rule saved. */
    private final class Rounds {
        private final SourceText original;
        private final List<Tokenizer> counters;
        private final int[] start;
        private final Trace trace;
        private final Map<String, Tally> tallies = new TreeMap<>();
        private int[] current;
        private List<Finding> findings;
        private int rounds;

        Rounds(SourceText original, List<Tokenizer> counters, int[] start, List<Finding> findings) {
            this.original = original;
            this.counters = counters;
            this.start = start;
            this.current = start.clone();
            this.trace = new Trace(original.text());
            this.findings = findings;
        }

        /**
         * Applies the rewrites {@code wanted} admits, round after round, until the rules offer no more
         * of them; the reason the file cannot be fixed when it never settles or stops parsing.
         */
        Optional<String> run(java.util.function.Predicate<Candidate> wanted) {
            while (true) {
                List<Candidate> offered = selection.candidates(findings, trace.current()).stream().filter(wanted).toList();
                if (offered.isEmpty()) {
                    return Optional.empty();
                }
                if (rounds == MAX_ROUNDS) {
                    return Optional.of("its rewrites still change it after " + MAX_ROUNDS + " rounds (rules "
                            + String.join(", ", offered.stream().map(Candidate::rule).distinct().sorted().toList())
                            + " keep offering edits), so applying them twice would not give the same text");
                }
                rounds++;
                String roundText = trace.current();
                List<Trace.AuthoredEdit> applied = new ArrayList<>();
                for (List<Candidate> group : byRule(Overlaps.choose(offered))) {
                    Candidate first = group.get(0);
                    for (Candidate candidate : group) {
                        for (Edit edit : candidate.edits()) {
                            applied.add(new Trace.AuthoredEdit(edit, new Trace.Author(candidate.rule(), candidate.kind())));
                        }
                    }
                    applied.sort((a, b) -> a.edit().compareTo(b.edit()));
                    String text = Rewrite.apply(roundText, applied.stream().map(Trace.AuthoredEdit::edit).toList());
                    Optional<Template> parsed = rules.parse(original, text);
                    if (parsed.isEmpty()) {
                        return Optional.of("after the edits of " + first.rule() + " the file no longer parses");
                    }
                    int[] counts = tokens(parsed.get(), counters);
                    Tally tally = tallies.computeIfAbsent(first.rule(), r -> new Tally(first.rewriteClass(), counters.size()));
                    tally.add(group.size(), current, counts);
                    current = counts;
                }
                trace.apply(applied);
                findings = rules.findings(original, trace.current());
            }
        }

        FileFix fix(FileFix.Outcome outcome, List<String> problems) {
            List<RuleSaving> savings = new ArrayList<>();
            tallies.forEach((rule, tally) -> savings.add(tally.saving(rule, counters)));
            List<TokenChange> tokens = new ArrayList<>();
            for (int k = 0; k < counters.size(); k++) {
                tokens.add(new TokenChange(counters.get(k).name(), start[k], current[k]));
            }
            return new FileFix(original.path(), outcome, original.text(), trace.current(), savings, tokens, rounds, problems,
                    false);
        }
    }

    private List<String> verify(SourceText original, Template before, Trace trace) {
        Optional<Template> after = rules.parse(original, trace.current());
        if (after.isEmpty()) {
            return List.of("the rewritten file no longer parses");
        }
        List<String> problems = new ArrayList<>(Invariants.violations(before, after.get(), trace));
        byte[] bytes = FileBytes.encode(trace.current(), original.hadBom());
        try {
            SourceText reread = reader.decode(original.path(), original.file(), bytes);
            if (!reread.text().equals(trace.current()) || reread.hadBom() != original.hadBom()) {
                problems.add("the bytes to be written do not read back as the rewritten text");
            }
        } catch (TareException e) {
            problems.add("the bytes to be written would not read back: " + e.getMessage());
        }
        return problems;
    }

    /**
     * Tokens of the prompt text the template itself holds: its messages as written, includes not
     * expanded; a tool file's whole text as written, which is what re-laying it out changes (the
     * scan counts the definitions minified, as a provider receives them when the application sends
     * them as parsed JSON).
     */
    public static int[] tokens(Template template, List<Tokenizer> counters) {
        int[] counts = new int[counters.size()];
        for (int k = 0; k < counters.size(); k++) {
            if (template.kind() == TemplateKind.TOOLS) {
                counts[k] = counters.get(k).count(template.source());
                continue;
            }
            for (Message message : template.messages()) {
                counts[k] += counters.get(k).count(message.content());
            }
        }
        return counts;
    }

    /** The chosen rewrites grouped by rule, in priority order. */
    private static List<List<Candidate>> byRule(List<Candidate> chosen) {
        Map<String, List<Candidate>> groups = new LinkedHashMap<>();
        for (Candidate candidate : chosen) {
            groups.computeIfAbsent(candidate.rule(), r -> new ArrayList<>()).add(candidate);
        }
        return List.copyOf(groups.values());
    }

    /** One rule's rewrites and savings in one file, summed over rounds. */
    private static final class Tally {
        private final RewriteClass rewriteClass;
        private final int[] saved;
        private int rewrites;

        Tally(RewriteClass rewriteClass, int tokenizers) {
            this.rewriteClass = rewriteClass;
            this.saved = new int[tokenizers];
        }

        void add(int count, int[] before, int[] after) {
            rewrites += count;
            for (int k = 0; k < saved.length; k++) {
                saved[k] += before[k] - after[k];
            }
        }

        RuleSaving saving(String rule, List<Tokenizer> counters) {
            Map<String, Integer> byTokenizer = new LinkedHashMap<>();
            for (int k = 0; k < counters.size(); k++) {
                byTokenizer.put(counters.get(k).name(), saved[k]);
            }
            return new RuleSaving(rule, rewriteClass, rewrites, 1, byTokenizer);
        }
    }
}
