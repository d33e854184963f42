package dev.tare.app;

import dev.tare.lint.RewriteClass;
import dev.tare.rewrite.FileFix;
import dev.tare.rewrite.FilePlanner;
import dev.tare.rewrite.FileRules;
import dev.tare.rewrite.RuleSaving;
import dev.tare.rewrite.TokenChange;
import dev.tare.source.SourceText;
import dev.tare.template.Template;
import dev.tare.tokenize.Tokenizer;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * Folds what extraction did into the per-file fixes: a file it changed gets its final text and the
 * extracting rule's saving (the tokens of text the file no longer holds itself), on top of any
 * per-file rewrites; a new partial becomes a fix of its own, marked created, whose tokens count as
 * a negative saving, so that savings still add up to the change in text the files hold.
 */
final class Extracted {
    private final TemplateLoader loader;
    private final FileRules fileRules;
    private final Check check;

    Extracted(TemplateLoader loader, FileRules rules, Check check) {
        this.loader = loader;
        this.fileRules = rules;
        this.check = check;
    }

    /**
     * @param originals each selected file as it was read, by path
     */
    void merge(ExtractionPlanner.Result result, Map<String, SourceText> originals, Map<String, FileFix> fixes) {
        result.texts().forEach((path, text) -> {
            Map<String, Integer> rules = result.applied().getOrDefault(path, Map.of());
            if (result.created().contains(path)) {
                fixes.put(path, created(path, text, rules));
            } else {
                fixes.put(path, changed(originals.get(path), text, rules, fixes.get(path)));
            }
        });
    }

    private FileFix created(String path, String text, Map<String, Integer> rules) {
        Template template = parse(path, text, false);
        List<Tokenizer> counters = fileRules.tokenizers(template);
        int[] counts = FilePlanner.tokens(template, counters);
        List<TokenChange> tokens = new ArrayList<>();
        int[] saved = new int[counters.size()];
        for (int k = 0; k < counters.size(); k++) {
            tokens.add(new TokenChange(counters.get(k).name(), 0, counts[k]));
            saved[k] = -counts[k];
        }
        return new FileFix(path, FileFix.Outcome.PLANNED, "", text, savings(rules, counters, saved), tokens, 1, List.of(), true);
    }

    private FileFix changed(SourceText original, String text, Map<String, Integer> rules, FileFix earlier) {
        Template before = loader.parse(original);
        List<Tokenizer> counters = fileRules.tokenizers(before);
        int[] start = FilePlanner.tokens(before, counters);
        int[] middle = start.clone();
        if (earlier != null) {
            for (int k = 0; k < counters.size(); k++) {
                middle[k] = earlier.tokens().get(k).after();
            }
        }
        int[] end = FilePlanner.tokens(parse(original.path(), text, original.hadBom()), counters);
        List<TokenChange> tokens = new ArrayList<>();
        int[] saved = new int[counters.size()];
        for (int k = 0; k < counters.size(); k++) {
            tokens.add(new TokenChange(counters.get(k).name(), start[k], end[k]));
            saved[k] = middle[k] - end[k];
        }
        List<RuleSaving> all = new ArrayList<>(earlier == null ? List.of() : earlier.rules());
        all.addAll(savings(rules, counters, saved));
        all.sort(Comparator.comparing(RuleSaving::rule));
        return new FileFix(original.path(), FileFix.Outcome.PLANNED, original.text(), text, all, tokens,
                earlier == null ? 1 : earlier.rounds(), List.of(), false);
    }

    /** The saving, credited to the first rule (there is one rule across files), each rule's rewrites counted. */
    private List<RuleSaving> savings(Map<String, Integer> rules, List<Tokenizer> counters, int[] saved) {
        List<RuleSaving> savings = new ArrayList<>();
        boolean first = true;
        for (Map.Entry<String, Integer> entry : rules.entrySet()) {
            Map<String, Integer> byTokenizer = new LinkedHashMap<>();
            for (int k = 0; k < counters.size(); k++) {
                byTokenizer.put(counters.get(k).name(), first ? saved[k] : 0);
            }
            RewriteClass rewriteClass = check.catalog().rule(entry.getKey()).descriptor().rewriteClass();
            savings.add(new RuleSaving(entry.getKey(), rewriteClass, entry.getValue(), 1, byTokenizer));
            first = false;
        }
        return savings;
    }

    private Template parse(String path, String text, boolean bom) {
        return loader.parse(SourceText.unwritten(path, loader.workspace().root().resolve(path), text, bom));
    }
}
