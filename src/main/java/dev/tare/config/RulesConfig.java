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
 * @param limits   token limits that rules read, by key (see {@link #LIMITS})
 */
public record RulesConfig(List<String> disable, Map<String, String> severity, List<String> packs,
                          Map<String, Integer> limits) {
    /** The limits rules understand. */
    public static final java.util.Set<String> LIMITS = java.util.Set.of("tool_description_tokens", "tool_enum_tokens",
            "shared_block_tokens");
    /** The rule settings when none are configured. */
    public static final RulesConfig DEFAULT = new RulesConfig(List.of(), Map.of(), List.of(), Map.of());

    public RulesConfig {
        disable = List.copyOf(disable);
        severity = java.util.Collections.unmodifiableMap(new LinkedHashMap<>(severity));
        packs = List.copyOf(packs);
        limits = java.util.Collections.unmodifiableMap(new LinkedHashMap<>(limits));
    }

    /** Rule settings without limits. */
    public RulesConfig(List<String> disable, Map<String, String> severity, List<String> packs) {
        this(disable, severity, packs, Map.of());
    }
}
