package dev.tare.app;

import dev.tare.footprint.CallSize;
import dev.tare.footprint.Footprint;
import dev.tare.footprint.Footprints;
import dev.tare.footprint.Target;
import dev.tare.overlap.CachePrefixes;
import dev.tare.template.TemplateKind;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * What counting one template found, before footprints are estimated from it: the part of a scan
 * that reads and counts, and so the part the scan's {@link TemplateCache} keeps. Fields as in {@link ScannedTemplate}.
 *
 * @param callSizes  per target the template runs on, the size of one call (tokens, framing, output)
 * @param leadingIds per target with a prefix cache, the template's leading static token ids, as
 *                   written and with its per-call parts last
 */
record Measurement(String path, TemplateKind kind, int characters, int staticTokens, int estimatedTokens,
                   List<String> variables, List<String> unsizedVariables, List<String> includes,
                   Map<String, CallSize> callSizes, Map<String, Integer> estimatedByTarget,
                   Map<String, CachePrefixes.LeadingIds> leadingIds) {

    /** The template as the scan reports it, with footprints estimated on {@code targets} (by name). */
    ScannedTemplate template(Map<String, Target> targets) {
        Map<String, Footprint> footprints = new LinkedHashMap<>();
        callSizes.forEach((name, size) -> footprints.put(name, Footprints.estimate(targets.get(name), size)));
        return new ScannedTemplate(path, kind, characters, staticTokens, estimatedTokens, variables, unsizedVariables,
                includes, footprints, estimatedByTarget);
    }
}
