package dev.tare.app;

import dev.tare.TareException;
import dev.tare.lint.CrossTemplateRule;
import dev.tare.lint.Edit;
import dev.tare.lint.Extraction;
import dev.tare.lint.LintContext;
import dev.tare.lint.Rewrite;
import dev.tare.lint.Rule;
import dev.tare.lint.RuleCatalog;
import dev.tare.lint.RunTemplates;
import dev.tare.overlap.RepositoryWords;
import dev.tare.rewrite.NotApplied;
import dev.tare.rewrite.RewriteSelection;
import dev.tare.source.SourceText;
import dev.tare.template.Message;
import dev.tare.template.Renderer;
import dev.tare.template.Rendering;
import dev.tare.template.Template;
import dev.tare.template.TemplateKind;
import dev.tare.tokenize.TokenizerRegistry;
import java.nio.file.Files;
import java.util.ArrayList;
import java.util.Collections;
import java.util.Comparator;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.TreeMap;
import java.util.TreeSet;

/**
 * Applies the rewrites across files that cross-template rules offer (a block moved into a partial,
 * each copy replaced with an include of it) to the texts the per-file rewrites left, without
 * writing. In each round the rules look at every template; the offered extractions are taken most
 * valuable first, one at a time, skipping any that touches a file another one changed in the round;
 * each is verified before it is kept: every file it changes must parse as the same kind of template
 * with the same front matter and messages, and must render, with variables empty and with samples,
 * to exactly the text it rendered to before, the new partial in place. Templates that include a
 * changed file then render as before too, as what they paste in is unchanged. Rounds repeat, so that
 * blocks nested in an extracted one are extracted in turn, until nothing more is offered. An
 * extraction that fails is refused with its reason and not tried again.
 */
final class ExtractionPlanner {
    /** Rounds after which extraction stops even if more is offered. */
    static final int MAX_ROUNDS = 8;

    private final TemplateLoader loader;
    private final RuleCatalog catalog;
    private final RewriteSelection selection;
    private final TokenizerRegistry tokenizers;

    ExtractionPlanner(TemplateLoader loader, RuleCatalog catalog, RewriteSelection selection, TokenizerRegistry tokenizers) {
        this.loader = loader;
        this.catalog = catalog;
        this.selection = selection;
        this.tokenizers = tokenizers;
    }

    /**
     * What extraction did.
     *
     * @param texts   the final text of every file an extraction changed or created, by path
     * @param created the new partials, in path order
     * @param needs   for each changed file, the new partials its final text includes directly
     * @param applied each applied extraction's rule, by the files it changed
     * @param refused copies that were not replaced, with the reason, in path and line order
     */
    record Result(Map<String, String> texts, Set<String> created, Map<String, Set<String>> needs,
                  Map<String, Map<String, Integer>> applied, List<NotApplied> refused) {
        static final Result NONE = new Result(Map.of(), Set.of(), Map.of(), Map.of(), List.of());
    }

    /** Whether some enabled cross-template rule's rewrites are among those asked for, by name. */
    boolean hasRulesNamed() {
        return !rules(false).isEmpty();
    }

    /** How many extractions with something to replace each named cross-template rule offers over {@code texts}. */
    Map<String, Integer> offered(Map<String, String> texts, Map<String, SourceText> originals) {
        Map<String, Integer> offered = new TreeMap<>();
        View view = new View(texts, originals);
        for (CrossTemplateRule rule : rules(false)) {
            for (Extraction extraction : rule.extractions(view.context())) {
                if (!extraction.copies().isEmpty()) {
                    offered.merge(extraction.rule(), 1, Integer::sum);
                }
            }
        }
        return offered;
    }

    /**
     * Extracts what the selected cross-template rules offer.
     *
     * @param current   each selected file's text after its per-file rewrites, by path
     * @param originals each selected file as read
     * @param frozen    files that must not change (their per-file rewrite was dropped)
     */
    Result plan(Map<String, String> current, Map<String, SourceText> originals, Set<String> frozen) {
        List<CrossTemplateRule> rules = rules(true);
        if (rules.isEmpty()) {
            return Result.NONE;
        }
        Map<String, String> texts = new TreeMap<>(current);
        Set<String> created = new TreeSet<>();
        Map<String, Map<String, Integer>> applied = new TreeMap<>();
        Map<String, Set<String>> needs = new TreeMap<>();
        Map<String, String> failed = new HashMap<>();
        Map<String, NotApplied> verificationRefusals = new TreeMap<>();
        Map<String, NotApplied> offerRefusals = new TreeMap<>();
        for (int round = 0; round < MAX_ROUNDS; round++) {
            View view = new View(texts, originals);
            List<Extraction> offered = new ArrayList<>();
            for (CrossTemplateRule rule : rules) {
                offered.addAll(rule.extractions(view.context()));
            }
            offered.sort(Comparator.comparingLong((Extraction e) -> -(long) e.tokens() * e.copies().size())
                    .thenComparing(Extraction::partial));
            offerRefusals.clear();
            Set<String> touched = new HashSet<>();
            boolean progress = false;
            for (Extraction extraction : offered) {
                for (Extraction.Refusal refusal : extraction.refused()) {
                    offerRefusals.put(key(refusal.path(), refusal.line(), extraction.rule()),
                            new NotApplied(refusal.path(), refusal.line(), extraction.rule(), refusal.reason()));
                }
                List<Extraction.Copy> copies = new ArrayList<>();
                for (Extraction.Copy copy : extraction.copies()) {
                    if (frozen.contains(copy.path())) {
                        offerRefusals.put(key(copy.path(), copy.line(), extraction.rule()), new NotApplied(copy.path(),
                                copy.line(), extraction.rule(), "the file's other rewrites failed verification, so this"
                                + " copy is not replaced with an include of " + extraction.partial() + " either"));
                    } else {
                        copies.add(copy);
                    }
                }
                String identity = identity(extraction, copies);
                if (copies.isEmpty() || extraction.created().isPresent() && copies.size() < 2 || failed.containsKey(identity)) {
                    continue;
                }
                Set<String> files = new TreeSet<>();
                copies.forEach(c -> files.add(c.path()));
                files.add(extraction.partial());
                if (!Collections.disjoint(files, touched)) {
                    continue;
                }
                Map<String, String> next = new TreeMap<>();
                Optional<String> problem = apply(extraction, copies, texts, next);
                if (problem.isEmpty()) {
                    problem = verify(texts, next, originals, extraction);
                }
                if (problem.isPresent()) {
                    failed.put(identity, problem.get());
                    for (Extraction.Copy copy : copies) {
                        verificationRefusals.put(key(copy.path(), copy.line(), extraction.rule()), new NotApplied(copy.path(),
                                copy.line(), extraction.rule(), "not replaced with an include of " + extraction.partial()
                                + ": " + problem.get()));
                    }
                    continue;
                }
                texts.putAll(next);
                if (extraction.created().isPresent()) {
                    created.add(extraction.partial());
                    copies.forEach(c -> needs.computeIfAbsent(c.path(), p -> new TreeSet<>()).add(extraction.partial()));
                }
                for (String path : next.keySet()) {
                    applied.computeIfAbsent(path, p -> new TreeMap<>()).merge(extraction.rule(),
                            (int) copies.stream().filter(c -> c.path().equals(path)).count(), Integer::sum);
                }
                touched.addAll(files);
                progress = true;
            }
            if (!progress) {
                break;
            }
        }
        Map<String, String> changed = new TreeMap<>();
        texts.forEach((path, text) -> {
            if (!text.equals(current.get(path))) {
                changed.put(path, text);
            }
        });
        Map<String, NotApplied> refused = new TreeMap<>(offerRefusals);
        refused.putAll(verificationRefusals);
        List<NotApplied> ordered = new ArrayList<>(refused.values());
        ordered.sort(Comparator.comparing(NotApplied::path).thenComparingInt(NotApplied::line));
        return new Result(changed, created, needs, applied, ordered);
    }

    /** The enabled cross-template rules asked for: by name only, or also by the class of their rewrites. */
    private List<CrossTemplateRule> rules(boolean byClass) {
        List<CrossTemplateRule> rules = new ArrayList<>();
        for (Rule rule : catalog.enabled()) {
            if (rule instanceof CrossTemplateRule across && (byClass
                    ? selection.takes(rule.descriptor().id(), rule.descriptor().rewriteClass())
                    : selection.named(rule.descriptor().id()))) {
                rules.add(across);
            }
        }
        return rules;
    }

    private static String key(String path, int line, String rule) {
        return path + '\u0000' + String.format("%09d", line) + '\u0000' + rule;
    }

    private static String identity(Extraction extraction, List<Extraction.Copy> copies) {
        StringBuilder out = new StringBuilder(extraction.rule()).append('\u0000').append(extraction.partial());
        copies.forEach(c -> out.append('\u0000').append(c.path()).append(':').append(c.edit()));
        return out.toString();
    }

    /** The extraction's edits applied to {@code texts}, into {@code next}; a problem when they cannot be. */
    private Optional<String> apply(Extraction extraction, List<Extraction.Copy> copies, Map<String, String> texts,
                                   Map<String, String> next) {
        Map<String, List<Edit>> edits = new TreeMap<>();
        for (Extraction.Copy copy : copies) {
            if (!texts.containsKey(copy.path())) {
                return Optional.of(copy.path() + " is not among the files being fixed");
            }
            edits.computeIfAbsent(copy.path(), p -> new ArrayList<>()).add(copy.edit());
        }
        if (extraction.created().isPresent()) {
            if (texts.containsKey(extraction.partial()) || Files.exists(loader.workspace().root().resolve(extraction.partial()))) {
                return Optional.of("a file already stands at " + extraction.partial() + ", and no file is ever replaced by a new partial");
            }
            next.put(extraction.partial(), extraction.created().get());
        }
        try {
            edits.forEach((path, list) -> next.put(path, new Rewrite(list, 0).applyTo(texts.get(path))));
        } catch (IllegalArgumentException | IndexOutOfBoundsException e) {
            return Optional.of("its edits do not fit the file (" + e.getMessage() + ")");
        }
        return Optional.empty();
    }

    /** What is wrong with changing {@code texts} by {@code next}; empty when every changed file renders as before. */
    private Optional<String> verify(Map<String, String> texts, Map<String, String> next,
                                    Map<String, SourceText> originals, Extraction extraction) {
        Map<String, String> afterTexts = new TreeMap<>(texts);
        afterTexts.putAll(next);
        View before = new View(texts, originals);
        View after = new View(afterTexts, originals);
        if (extraction.created().isPresent()) {
            Optional<Template> partial;
            try {
                partial = after.template(extraction.partial());
            } catch (TareException e) {
                return Optional.of("the new partial would not parse (" + e.getMessage() + ")");
            }
            if (partial.isEmpty() || partial.get().kind() != TemplateKind.PARTIAL) {
                return Optional.of(extraction.partial() + " would not be read as a partial; check templates.partials");
            }
        }
        for (String path : next.keySet()) {
            if (path.equals(extraction.partial()) && extraction.created().isPresent()) {
                continue;
            }
            Template was = before.template(path).orElseThrow();
            Template is;
            try {
                is = after.template(path).orElseThrow();
            } catch (TareException e) {
                return Optional.of(path + " would no longer parse (" + e.getMessage() + ")");
            }
            if (was.kind() != is.kind() || !was.meta().equals(is.meta()) || !roles(was).equals(roles(is))) {
                return Optional.of(path + " would change its front matter, keys or messages");
            }
            try {
                Optional<String> problem = same(path, "with every variable empty", before.renderer.renderStatic(was),
                        after.renderer.renderStatic(is));
                if (problem.isEmpty()) {
                    problem = same(path, "with samples", before.renderer.renderWithSamples(was),
                            after.renderer.renderWithSamples(is));
                }
                if (problem.isPresent()) {
                    return problem;
                }
            } catch (TareException e) {
                return Optional.of(path + " would no longer render (" + e.getMessage() + ")");
            }
        }
        return Optional.empty();
    }

    private static List<String> roles(Template template) {
        return template.messages().stream().map(Message::role).toList();
    }

    private static Optional<String> same(String path, String how, Rendering was, Rendering is) {
        List<String> a = was.messages();
        List<String> b = is.messages();
        for (int m = 0; m < Math.max(a.size(), b.size()); m++) {
            String x = m < a.size() ? a.get(m) : "";
            String y = m < b.size() ? b.get(m) : "";
            if (!x.equals(y)) {
                int at = 0;
                while (at < Math.min(x.length(), y.length()) && x.charAt(at) == y.charAt(at)) {
                    at++;
                }
                return Optional.of(path + " would render differently " + how + " (message " + (m + 1) + ", from character "
                        + (at + 1) + ")");
            }
        }
        List<String> names = was.variables().stream().map(o -> o.part().name()).toList();
        List<String> now = is.variables().stream().map(o -> o.part().name()).toList();
        if (!names.equals(now)) {
            return Optional.of(path + " would fill its variables in another order");
        }
        return Optional.empty();
    }

    /**
     * Files as they would stand: the given texts over the files on disk. A template is parsed when it
     * is asked for and not kept, so a round over a whole repository holds its words, not its templates.
     */
    private final class View {
        private final Map<String, String> texts;
        private final Map<String, SourceText> originals;
        private final Renderer renderer;

        View(Map<String, String> texts, Map<String, SourceText> originals) {
            this.texts = texts;
            this.originals = originals;
            this.renderer = loader.renderer(this::template);
        }

        /** The template a path would hold, when the texts have it (else the renderer reads the disk). */
        Optional<Template> template(String path) {
            String text = texts.get(path);
            if (text == null) {
                return Optional.empty();
            }
            SourceText original = originals.get(path);
            boolean bom = original != null && original.hadBom();
            return Optional.of(loader.parse(SourceText.unwritten(path, loader.workspace().root().resolve(path), text,
                    bom)));
        }

        /** A context over every text that parses; their words are gathered here, a template at a time. */
        LintContext context() {
            List<String> parsed = new ArrayList<>();
            RepositoryWords words = new RepositoryWords();
            for (String path : texts.keySet()) {
                try {
                    template(path).ifPresent(template -> {
                        words.add(template);
                        parsed.add(path);
                    });
                } catch (TareException e) {
                    // A file that no longer parses takes no part; its own fix was dropped already.
                }
            }
            RunTemplates run = RunTemplates.reparsed(parsed, path -> template(path).orElseThrow(), Optional.of(words));
            return Check.onDisk(loader, tokenizers, renderer, run, catalog.ids(), texts::containsKey);
        }
    }
}
