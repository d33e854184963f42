package dev.tare.lint.rules;

import dev.tare.footprint.CallSize;
import dev.tare.footprint.Footprint;
import dev.tare.footprint.Footprints;
import dev.tare.footprint.Target;
import dev.tare.lint.CrossTemplateRule;
import dev.tare.lint.Edit;
import dev.tare.lint.EditKind;
import dev.tare.lint.Example;
import dev.tare.lint.Extraction;
import dev.tare.lint.Finding;
import dev.tare.lint.LintContext;
import dev.tare.lint.MessageView;
import dev.tare.lint.Related;
import dev.tare.lint.Replaceable;
import dev.tare.lint.RuleDescriptor;
import dev.tare.lint.Severity;
import dev.tare.lint.Suppressions;
import dev.tare.lint.TemplateView;
import dev.tare.overlap.PartialNames;
import dev.tare.overlap.RepeatedBlock;
import dev.tare.overlap.SharedBlocks;
import dev.tare.template.PlaceholderSyntax;
import dev.tare.template.Template;
import dev.tare.template.TemplateKind;
import dev.tare.tokenize.Tokenizer;
import java.math.BigDecimal;
import java.math.MathContext;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.TreeMap;

/**
 * A block of text (at least {@code rules.limits.shared_block_tokens}, default {@value #MIN_TOKENS},
 * tokens) that two or more templates hold, found by {@link SharedBlocks} with whitespace-only
 * differences counted as the same block. One finding per block, at its first copy outside the
 * partials folder, with every other copy as a related place and what each copy costs per call on
 * each of its template's targets. The rewrite moves the block into a partial (an existing one that
 * holds exactly that text, else a new one named by {@link PartialNames}) and replaces each copy with
 * an include of it; only copies identical to the character are replaced, so that every template
 * renders exactly as before, which the rewrite engine verifies before writing.
 */
final class SharedBlock implements CrossTemplateRule {
    static final int MIN_TOKENS = 50;

    static final RuleDescriptor DESCRIPTOR = RuleDescriptor.builtIn("shared-block", Severity.WARNING, EditKind.TEXT,
            "A block of text that two or more templates hold, each copy pasted in its own file.",
            "Every copy is paid on every call of its template, and copies drift apart as each is edited on its own;"
                    + " the templates share nothing a reader or a prefix cache can see as one piece.",
            "Keep the block once in a partial and include it where it is needed; 'tare fix --include-review'"
                    + " does that when the copies are identical to the character. Put it first in each template"
                    + " when it is static, so that the same leading tokens can be cached.",
            new Example("""
                    >>> prompts/billing.md
                    You answer billing questions for a water utility.

                    ## Promises
                    Never promise a refund, a repair time or a bill credit, and never read out a full account\
                     number, a bank detail or a password.

                    Keep answers short.
                    >>> prompts/outages.md
                    You answer questions about supply outages.

                    ## Promises
                    Never promise a refund, a repair time or a bill credit, and never read out a full account\
                     number, a bank detail or a password.

                    Give the area and the time the supply is due back.
                    """, """
                    >>> prompts/billing.md
                    You answer billing questions for a water utility.

                    {{> promises }}
                    Keep answers short.
                    >>> prompts/outages.md
                    You answer questions about supply outages.

                    {{> promises }}
                    Give the area and the time the supply is due back.
                    >>> prompts/partials/promises.md
                    ## Promises
                    Never promise a refund, a repair time or a bill credit, and never read out a full account\
                     number, a bank detail or a password.
                    """, Map.of(Example.SHARED_BLOCK_TOKENS, 20)));

    @Override
    public RuleDescriptor descriptor() {
        return DESCRIPTOR;
    }

    @Override
    public List<Finding> checkAll(LintContext context) {
        List<Finding> findings = new ArrayList<>();
        for (BlockPlan planned : plan(context)) {
            findings.add(finding(planned, context));
        }
        return findings;
    }

    /** One extraction per block the rule can act on, with the copies it leaves; some may replace nothing. */
    @Override
    public List<Extraction> extractions(LintContext context) {
        return plan(context).stream().map(BlockPlan::extraction).flatMap(Optional::stream).toList();
    }

    /** One block, its places that no directive silences, and what its rewrite would do. */
    private record BlockPlan(RepeatedBlock block, List<Place> places, Optional<Extraction> extraction,
                           String outcome) {
    }

    /**
     * One copy, located, with all the rule needs of its template, so that the templates need not be
     * held while the blocks are planned.
     *
     * @param copy        the copy's text
     * @param following   up to four characters of the message after the copy
     * @param remaining   how many characters of the message follow the copy
     * @param replaceable where an include could replace the copy and the line break after it: by the
     *                    line break ({@code ""}, {@code "\n"} or {@code "\r\n"}) that follows it
     * @param located     a finding over the copy, for its lines and columns
     * @param related     the copy as a related place, for its line and column
     * @param costs       what the copy costs per call on each target of its template
     */
    private record Place(String path, TemplateKind kind, PlaceholderSyntax syntax, int start, int end, int line,
                         int lastLine, String copy, String following, int remaining,
                         Map<String, Replaceable> replaceable, Finding located, Related related, String costs) {
        /** "line 4" or "lines 4-9". */
        String lines() {
            return line == lastLine ? "line " + line : "lines " + line + "-" + lastLine;
        }

        boolean followedBy(String text) {
            return following.startsWith(text);
        }

        Optional<Edit> replacement(String lineBreak, String tag) {
            Replaceable at = replaceable.get(lineBreak);
            return at == null ? Optional.empty() : at.by(tag);
        }
    }

    private List<BlockPlan> plan(LintContext context) {
        int minimum = context.limit("shared_block_tokens", MIN_TOKENS);
        List<RepeatedBlock> blocks = SharedBlocks.find(context.words(), context::template,
                context.primaryTokenizer(), minimum);
        List<List<Place>> located = locate(blocks, context);
        Set<String> named = new HashSet<>();
        List<BlockPlan> planned = new ArrayList<>();
        for (int b = 0; b < blocks.size(); b++) {
            List<Place> places = located.get(b);
            if (places.stream().map(Place::path).distinct().count() < 2) {
                continue;
            }
            planned.add(extraction(blocks.get(b), places, context, named));
        }
        return planned;
    }

    /**
     * Every block's places that no directive silences, in the block's order; each template that holds
     * one is asked of the context once.
     */
    private static List<List<Place>> locate(List<RepeatedBlock> blocks, LintContext context) {
        Map<String, List<int[]>> byPath = new TreeMap<>();
        Map<List<Object>, String> known = new HashMap<>();
        List<Place[]> found = new ArrayList<>();
        for (int b = 0; b < blocks.size(); b++) {
            List<RepeatedBlock.Place> at = blocks.get(b).places();
            found.add(new Place[at.size()]);
            for (int k = 0; k < at.size(); k++) {
                byPath.computeIfAbsent(at.get(k).path(), p -> new ArrayList<>()).add(new int[] {b, k});
            }
        }
        for (Map.Entry<String, List<int[]>> entry : byPath.entrySet()) {
            Template template = context.template(entry.getKey());
            TemplateView text = TemplateView.of(template);
            Suppressions suppressions = Suppressions.of(text);
            for (int[] item : entry.getValue()) {
                RepeatedBlock.Place at = blocks.get(item[0]).places().get(item[1]);
                MessageView message = text.messages().get(at.message());
                int line = text.line(message, at.start());
                if (!suppressions.silences(DESCRIPTOR.id(), line)) {
                    found.get(item[0])[item[1]] = place(template, text, message, at, line, context, known);
                }
            }
        }
        List<List<Place>> places = new ArrayList<>();
        for (Place[] each : found) {
            places.add(java.util.Arrays.stream(each).filter(java.util.Objects::nonNull).toList());
        }
        return places;
    }

    private static Place place(Template template, TemplateView text, MessageView message,
                               RepeatedBlock.Place at, int line, LintContext context, Map<List<Object>, String> known) {
        String content = message.content();
        int start = at.start();
        int end = at.end();
        Map<String, Replaceable> replaceable = new HashMap<>();
        for (String lineBreak : List.of("", "\n", "\r\n")) {
            if (content.startsWith(lineBreak, end)) {
                message.replaceable(start, end + lineBreak.length()).ifPresent(r -> replaceable.put(lineBreak, r));
            }
        }
        String copy = content.substring(start, end);
        return new Place(template.path(), template.kind(), template.syntax(), start, end, line,
                text.line(message, Math.max(start, end - 1)), copy,
                content.substring(end, Math.min(content.length(), end + 4)), content.length() - end, replaceable,
                text.finding(DESCRIPTOR, message, start, end, "", Optional.empty(), List.of()),
                text.related(message, start, ""), costs(template, copy, context, known));
    }

    /** How the block would move into a partial, or why it cannot. */
    private BlockPlan extraction(RepeatedBlock block, List<Place> places, LintContext context,
                               Set<String> named) {
        Place first = places.get(0);
        if (!first.syntax().hasIncludes()) {
            return new BlockPlan(block, places, Optional.empty(), "it is not moved into a partial, as "
                    + first.syntax().label() + " templates have no includes");
        }
        String folder = context.config().templates().partials();
        if (folder.isEmpty()) {
            return new BlockPlan(block, places, Optional.empty(), "it is not moved into a partial, as no partials"
                    + " folder is configured; set templates.partials in tare.yaml");
        }
        Optional<Reuse> reuse = reusable(places);
        String canonical;
        String partial;
        Optional<String> created;
        String lineBreak;
        if (reuse.isPresent()) {
            canonical = reuse.get().place().copy();
            partial = reuse.get().place().path();
            created = Optional.empty();
            lineBreak = reuse.get().lineBreak();
        } else {
            canonical = mostCommonCopy(places);
            lineBreak = blankLineAfterEvery(places, canonical);
            partial = PartialNames.choose(canonical, folder, p -> context.fileExists(p) || named.contains(p));
            created = Optional.of(canonical + lineBreak);
        }
        String name = includeName(partial, folder, context);
        String tag = name.matches("[\\w./-]+") ? "{{> " + name + " }}" : "{{> \"" + name + "\" }}";
        List<Extraction.Copy> copies = new ArrayList<>();
        List<Extraction.Refusal> refused = new ArrayList<>();
        for (Place place : places) {
            if (place.path().equals(partial)) {
                continue;
            }
            if (!place.copy().equals(canonical)) {
                refused.add(new Extraction.Refusal(place.path(), place.line(), "this copy of the shared block ("
                        + place.lines() + ") differs from " + partial + " in whitespace, so an"
                        + " include would change the text the model sees; make it the same, or include the partial by hand"));
                continue;
            }
            if (!lineBreak.isEmpty() && !place.followedBy(lineBreak)) {
                refused.add(new Extraction.Refusal(place.path(), place.line(), "this copy of the shared block ("
                        + place.lines() + ") is not followed by a line break as the text of "
                        + partial + " is, so an include would change the text the model sees; include it by hand"));
                continue;
            }
            Optional<Edit> edit = place.replacement(lineBreak, tag);
            if (edit.isEmpty()) {
                refused.add(new Extraction.Refusal(place.path(), place.line(), "this copy of the shared block ("
                        + place.lines() + ") stands where Tare cannot replace it exactly (a chat"
                        + " value written as a folded or multi-line plain scalar, or a list of parts); include "
                        + partial + " there by hand"));
                continue;
            }
            copies.add(new Extraction.Copy(place.path(), place.line(), edit.get()));
        }
        if (copies.isEmpty() || created.isPresent() && copies.size() < 2) {
            // Nothing can be replaced; the fix still hears of every copy it leaves, and why.
            for (Extraction.Copy lone : copies) {
                Place place = places.stream().filter(p -> p.path().equals(lone.path()) && p.line() == lone.line())
                        .findFirst().orElseThrow();
                refused.add(new Extraction.Refusal(lone.path(), lone.line(), "this copy of the shared block ("
                        + place.lines() + ") is the only one in its exact form, so it is not moved into a new partial;"
                        + " make the other copies the same to the character first"));
            }
            long identical = places.stream().filter(p -> !p.path().equals(partial) && p.copy().equals(canonical)).count();
            String why = identical < (created.isPresent() ? 2 : 1)
                    ? "no two of its copies are the same to the character; make them the same first"
                    : refused.get(0).reason();
            Extraction none = new Extraction(DESCRIPTOR.id(), partial, created, List.of(), refused, block.tokens());
            return new BlockPlan(block, places, Optional.of(none), "it is not moved into a partial: " + why);
        }
        if (created.isPresent()) {
            named.add(partial);
        }
        Extraction extraction = new Extraction(DESCRIPTOR.id(), partial, created, copies, refused, block.tokens());
        String outcome = "'tare fix --include-review' replaces " + count(copies.size(), "copy", "copies") + " with "
                + tag + (created.isPresent() ? ", a new partial " + partial : ", as " + partial + " holds the same text")
                + (refused.isEmpty() ? "" : "; " + count(refused.size(), "copy stays", "copies stay") + " (see 'tare fix')");
        return new BlockPlan(block, places, Optional.of(extraction), outcome);
    }

    /** A partial whose whole text is the block, perhaps with one line break after it. */
    private record Reuse(Place place, String lineBreak) {
    }

    private static Optional<Reuse> reusable(List<Place> places) {
        for (Place place : places) {
            if (place.kind() != TemplateKind.PARTIAL || place.start() != 0) {
                continue;
            }
            String rest = place.remaining() == place.following().length() ? place.following() : null;
            if (rest != null && (rest.isEmpty() || rest.equals("\n") || rest.equals("\r\n"))) {
                return Optional.of(new Reuse(place, rest));
            }
        }
        return Optional.empty();
    }

    /** The copy that most places hold to the character; among equals, the first place's. */
    private static String mostCommonCopy(List<Place> places) {
        Map<String, Integer> counts = new LinkedHashMap<>();
        for (Place place : places) {
            counts.merge(place.copy(), 1, Integer::sum);
        }
        String best = places.get(0).copy();
        for (Map.Entry<String, Integer> entry : counts.entrySet()) {
            if (entry.getValue() > counts.get(best)) {
                best = entry.getKey();
            }
        }
        return best;
    }

    /**
     * The line break that follows every copy of {@code canonical} and is itself followed by another (a
     * blank line), or empty. A new partial then ends with that line break and the include takes its
     * place, so the partial is a text file with a final line break and the include stands on its own
     * line; otherwise the partial ends where the block does.
     */
    private static String blankLineAfterEvery(List<Place> places, String canonical) {
        String lineBreak = null;
        for (Place place : places) {
            if (!place.copy().equals(canonical)) {
                continue;
            }
            String here = place.followedBy("\r\n") ? "\r\n" : place.followedBy("\n") ? "\n" : "";
            if (here.isEmpty() || !place.following().startsWith(here, here.length())
                    || lineBreak != null && !lineBreak.equals(here)) {
                return "";
            }
            lineBreak = here;
        }
        return lineBreak == null ? "" : lineBreak;
    }

    /** The shortest name an include can give that finds {@code partial} first. */
    private static String includeName(String partial, String folder, LintContext context) {
        String relative = partial.substring(folder.length() + 1);
        if (relative.endsWith(".md")) {
            String bare = relative.substring(0, relative.length() - 3);
            if (!context.fileExists(folder + "/" + bare)) {
                return bare;
            }
        }
        return relative;
    }

    private Finding finding(BlockPlan planned, LintContext context) {
        List<Place> places = planned.places();
        Place at = places.stream().filter(p -> p.kind() != TemplateKind.PARTIAL).findFirst().orElse(places.get(0));
        long templates = places.stream().map(Place::path).distinct().count();
        String message = String.format(Locale.ROOT, "%s hold this %,d-token block (copies that differ only in"
                        + " whitespace count as the same); this copy (%s) costs %s per call (planning"
                        + " estimates); %s",
                templates == places.size() ? templates + " templates" : places.size() + " places in " + templates
                        + " templates", planned.block().tokens(), at.lines(), at.costs(),
                planned.outcome());
        List<Related> related = new ArrayList<>();
        for (Place place : places) {
            if (place == at) {
                continue;
            }
            String what = (place.kind() == TemplateKind.PARTIAL ? "copy in partial " : "copy in ") + place.path();
            related.add(new Related(place.path(), place.related().line(), place.related().column(), what + " ("
                    + place.lines() + "): " + place.costs() + " per call"));
        }
        Finding located = at.located();
        return new Finding(located.path(), located.line(), located.column(), located.endLine(), located.endColumn(),
                located.rule(), located.severity(), message, located.rewriteClass(), Optional.empty(), related);
    }

    /** What a copy costs per call on each target of its template, tokens and (on priced targets) money. */
    private static String costs(Template template, String copy, LintContext context, Map<List<Object>, String> known) {
        List<Target> targets = context.targets(template);
        // Copies of one block are mostly the same text on the same targets: each is counted once.
        List<Object> key = targets.isEmpty() ? List.of(context.tokenizer(template).name(), copy) : List.of(targets, copy);
        String cost = known.get(key);
        if (cost == null) {
            cost = costs(template, copy, context, targets);
            known.put(key, cost);
        }
        return cost;
    }

    private static String costs(Template template, String copy, LintContext context, List<Target> targets) {
        if (targets.isEmpty()) {
            Tokenizer tokenizer = context.tokenizer(template);
            return tokenizer.count(copy) + " tokens on " + tokenizer.name();
        }
        List<String> parts = new ArrayList<>();
        for (Target target : targets) {
            Tokenizer tokenizer;
            try {
                tokenizer = context.tokenizer(target);
            } catch (dev.tare.TareException e) {
                continue;
            }
            int tokens = target.scaled(tokenizer.count(copy));
            Footprint footprint = Footprints.estimate(target, CallSize.of(tokens, 0));
            parts.add(target.name() + " " + String.format(Locale.ROOT, "%,d", tokens) + " tokens"
                    + footprint.costPerCall().stream().mapToObj(cost -> " (" + footprint.currency().orElse("") + " "
                    + significant(cost) + ")").findFirst().orElse(""));
        }
        return String.join(", ", parts);
    }

    /** Three significant digits, written out in full: 0.000428, not 4.28e-04. */
    private static String significant(double value) {
        return new BigDecimal(value).round(new MathContext(3)).stripTrailingZeros().toPlainString();
    }

    private static String count(long n, String one, String many) {
        return n + " " + (n == 1 ? one : many);
    }
}
