package dev.tare.config;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * Which rules run and how loudly.
 *
 * @param disable  rule ids that do not run
 * @param severity rule id to severity name, overriding the rule's default
 * @param packs    folders of rule packs, relative to the root, loaded besides the built-in ones
 */
public record RulesConfig(List<String> disable, Map<String, String> severity, List<String> packs) {
    /** The rule settings when none are configured. */
    public static final RulesConfig DEFAULT = new RulesConfig(List.of(), Map.of(), List.of());

    public RulesConfig {
        disable = List.copyOf(disable);
        severity = java.util.Collections.unmodifiableMap(new LinkedHashMap<>(severity));
        packs = List.copyOf(packs);
    }
}
