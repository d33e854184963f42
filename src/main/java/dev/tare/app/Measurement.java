package dev.tare.app;

import dev.tare.config.TrafficGlobs;
import dev.tare.footprint.CallSize;
import dev.tare.footprint.Footprint;
import dev.tare.footprint.Footprints;
import dev.tare.footprint.Target;
import dev.tare.footprint.Traffic;
import dev.tare.overlap.CachePrefixes;
import dev.tare.template.Rendering;
import dev.tare.template.TemplateKind;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.OptionalDouble;

/**
 * What counting one template found, before footprints are estimated from it: the part of a scan
 * that reads and counts, and so the part the scan's {@link TemplateCache} keeps. Fields as in {@link ScannedTemplate}.
 *
 * @param callSizes  per target the template runs on, the size of one call (tokens, framing, output)
 * @param leadingIds  per target with a prefix cache, the template's leading static token ids, as
 *                    written and with its per-call parts last
 * @param callsPerDay the calls a day its front matter states
 */
record Measurement(String path, String name, int line, TemplateKind kind, int characters, int staticTokens, int estimatedTokens,
                   int shortestEstimatedTokens, List<String> variables, List<String> unsizedVariables,
                   List<String> includes, List<Rendering.Loop> loops, Map<String, CallSize> callSizes,
                   Map<String, Integer> estimatedByTarget, Map<String, CachePrefixes.LeadingIds> leadingIds,
                   OptionalDouble callsPerDay, List<String> notes) {

    /**
     * The template as the scan reports it, with footprints estimated on {@code targets} (by name) at
     * its own traffic, its prefix shared with no other template.
     */
    ScannedTemplate template(Map<String, Target> targets, TrafficGlobs traffic) {
        Map<String, Footprint> footprints = new LinkedHashMap<>();
        callSizes.forEach((name, size) -> footprints.put(name,
                Footprints.estimate(targets.get(name), size, traffic(targets.get(name), traffic))));
        return new ScannedTemplate(path, name, line, kind, characters, staticTokens, estimatedTokens, shortestEstimatedTokens,
                variables, unsizedVariables, includes, loops, footprints, estimatedByTarget, Map.of(), notes);
    }

    /** How often the template is called on {@code target}. */
    Traffic traffic(Target target, TrafficGlobs traffic) {
        return traffic.of(path, callsPerDay, target);
    }
}
