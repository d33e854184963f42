package dev.tare.app;

import dev.tare.footprint.Footprint;
import dev.tare.overlap.PrefixShare;
import dev.tare.template.Rendering;
import dev.tare.template.TemplateKind;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * One template's measurements.
 *
 * @param path             path relative to the root, with {@code /}
 * @param name             for a prompt written in source code, the name it was found under (unique in
 *                         its file); empty for a template file
 * @param line             for a prompt written in source code, the 1-based line of its first literal; 0
 *                         for a template file
 * @param kind             text, chat or partial
 * @param characters       characters of the file's text
 * @param staticTokens     tokens with every variable empty, on the scan's primary tokenizer
 * @param estimatedTokens  tokens with samples and declared sizes on the template's longest path (the
 *                         heaviest branch of each conditional, each loop's expected items), on the
 *                         primary tokenizer
 * @param shortestEstimatedTokens the same on the shortest path (the lightest branch of each conditional)
 * @param variables        distinct variable names in order of first use, includes' variables and the
 *                         variables passed to function calls too
 * @param unsizedVariables the variables, and the function calls by their function's name, with neither a
 *                         sample nor a token size: the estimate leaves them out
 * @param includes         the distinct templates pasted in, in order of first use
 * @param loops            the loops on the longest path, with the items assumed for each
 * @param targets          footprint per target name, for the targets this template runs on
 * @param estimatedByTarget the template's own estimated tokens on each of its targets: scaled by the
 *                         target's calibration, without framing or the tool files sent with it
 * @param prefixes         per target with a prefix cache, how the template's leading static tokens
 *                         are shared with other templates; empty for partials and tool files
 * @param notes            what a reader of the figures should know about how they were made (a target
 *                         the template names that the configuration lacks, say), one sentence each
 */
public record ScannedTemplate(String path, String name, int line, TemplateKind kind, int characters, int staticTokens, int estimatedTokens,
                              int shortestEstimatedTokens, List<String> variables, List<String> unsizedVariables,
                              List<String> includes, List<Rendering.Loop> loops, Map<String, Footprint> targets,
                              Map<String, Integer> estimatedByTarget, Map<String, PrefixShare> prefixes,
                              List<String> notes) {
    public ScannedTemplate {
        notes = List.copyOf(notes);
        variables = List.copyOf(variables);
        unsizedVariables = List.copyOf(unsizedVariables);
        includes = List.copyOf(includes);
        loops = List.copyOf(loops);
        targets = java.util.Collections.unmodifiableMap(new LinkedHashMap<>(targets));
        estimatedByTarget = java.util.Collections.unmodifiableMap(new LinkedHashMap<>(estimatedByTarget));
        prefixes = java.util.Collections.unmodifiableMap(new LinkedHashMap<>(prefixes));
    }

    /** A template measured before prefix sharing is known. */
    public ScannedTemplate(String path, String name, int line, TemplateKind kind, int characters, int staticTokens, int estimatedTokens,
                           int shortestEstimatedTokens, List<String> variables, List<String> unsizedVariables,
                           List<String> includes, List<Rendering.Loop> loops, Map<String, Footprint> targets,
                           Map<String, Integer> estimatedByTarget) {
        this(path, name, line, kind, characters, staticTokens, estimatedTokens, shortestEstimatedTokens, variables, unsizedVariables,
                includes, loops, targets, estimatedByTarget, Map.of(), List.of());
    }

    /** What reports and baselines know it by: its path, or for a prompt in source code its path and name. */
    public String key() {
        return name.isEmpty() ? path : path + "#" + name;
    }

    /** The same template with other footprints. */
    public ScannedTemplate withTargets(Map<String, Footprint> footprints) {
        return new ScannedTemplate(path, name, line, kind, characters, staticTokens, estimatedTokens, shortestEstimatedTokens,
                variables, unsizedVariables, includes, loops, footprints, estimatedByTarget, prefixes, notes);
    }

    /** The same template with its footprint and prefix sharing on one more target with a prefix cache. */
    public ScannedTemplate withPrefix(String target, Footprint footprint, PrefixShare share) {
        Map<String, Footprint> footprints = new LinkedHashMap<>(targets);
        footprints.put(target, footprint);
        Map<String, PrefixShare> shares = new LinkedHashMap<>(prefixes);
        shares.put(target, share);
        return new ScannedTemplate(path, name, line, kind, characters, staticTokens, estimatedTokens, shortestEstimatedTokens,
                variables, unsizedVariables, includes, loops, footprints, estimatedByTarget, shares, notes);
    }

    /**
     * Whether this template counts toward totals: partials are counted inside their includers, and
     * tool files inside the templates sent with them.
     */
    public boolean countsInTotals() {
        return kind != TemplateKind.PARTIAL && kind != TemplateKind.TOOLS;
    }
}
