package dev.tare.lint;

import dev.tare.TareException;
import dev.tare.config.RulesConfig;
import dev.tare.config.Suggestion;
import dev.tare.config.TareConfig;
import dev.tare.lint.rules.BuiltInRules;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeMap;

/**
 * Every rule a run knows: the built-in rules and the rules of the packs it read (those shipped with
 * Tare and the folders {@code rules.packs} names); with {@code rules.disable} and
 * {@code rules.severity} applied. Ids are
 * unique across all of them.
 */
public final class RuleCatalog {
    private final Map<String, Rule> rules;
    private final Set<String> disabled;
    private final Map<String, Severity> severities;

    private RuleCatalog(Map<String, Rule> rules, Set<String> disabled, Map<String, Severity> severities) {
        this.rules = rules;
        this.disabled = disabled;
        this.severities = severities;
    }

    /**
     * The catalog for {@code config}: the built-in rules and {@code packRules}, the rules of every
     * pack the run reads (those shipped with Tare and those {@code rules.packs} names).
     *
     * @throws TareException when two rules share an id, or the configuration names an unknown rule or
     *                       severity (naming the file, line and key)
     */
    public static RuleCatalog of(TareConfig config, List<Rule> packRules) {
        Map<String, Rule> byId = new TreeMap<>();
        add(byId, BuiltInRules.all());
        add(byId, packRules);
        RulesConfig settings = config.rules();
        Set<String> disabled = new java.util.TreeSet<>();
        for (int i = 0; i < settings.disable().size(); i++) {
            String id = settings.disable().get(i);
            requireKnown(config, byId, id, "rules.disable[" + i + "]");
            disabled.add(id);
        }
        Map<String, Severity> severities = new LinkedHashMap<>();
        for (Map.Entry<String, String> entry : settings.severity().entrySet()) {
            String key = "rules.severity." + entry.getKey();
            requireKnown(config, byId, entry.getKey(), key);
            try {
                severities.put(entry.getKey(), Severity.parse(entry.getValue(), key));
            } catch (TareException e) {
                throw new TareException(config.where(key) + "unknown severity '" + entry.getValue()
                        + "'; use error, warning or info");
            }
        }
        return new RuleCatalog(java.util.Collections.unmodifiableMap(byId), Set.copyOf(disabled), Map.copyOf(severities));
    }

    private static void add(Map<String, Rule> byId, List<Rule> rules) {
        for (Rule rule : rules) {
            RuleDescriptor descriptor = rule.descriptor();
            Rule existing = byId.putIfAbsent(descriptor.id(), rule);
            if (existing != null) {
                throw new TareException(descriptor.origin() + ": rule '" + descriptor.id() + "' is already defined in "
                        + existing.descriptor().origin() + "; give it another id");
            }
        }
    }

    private static void requireKnown(TareConfig config, Map<String, Rule> byId, String id, String key) {
        if (!byId.containsKey(id)) {
            throw new TareException(config.where(key) + "unknown rule '" + id + "'" + Suggestion.didYouMean(id, byId.keySet())
                    + "; 'tare rules' lists every rule");
        }
    }

    /** Every rule, sorted by id. */
    public List<Rule> all() {
        return List.copyOf(rules.values());
    }

    /** The rules that run, sorted by id. */
    public List<Rule> enabled() {
        return rules.values().stream().filter(r -> !disabled.contains(r.descriptor().id())).toList();
    }

    /** Whether {@code id} is switched off in the configuration. */
    public boolean isDisabled(String id) {
        return disabled.contains(id);
    }

    /** The severity findings of {@code rule} carry: the configured one, else the rule's default. */
    public Severity severity(RuleDescriptor rule) {
        return severities.getOrDefault(rule.id(), rule.severity());
    }

    /** Every id, sorted. */
    public Set<String> ids() {
        return rules.keySet();
    }

    /**
     * The rule called {@code id}.
     *
     * @throws TareException suggesting the nearest id when there is none
     */
    public Rule rule(String id) {
        Rule rule = rules.get(id);
        if (rule == null) {
            throw new TareException("unknown rule '" + id + "'" + Suggestion.didYouMean(id, rules.keySet())
                    + "; 'tare rules' lists every rule");
        }
        return rule;
    }

    /** The descriptors of every rule, sorted by id. */
    public List<RuleDescriptor> descriptors() {
        List<RuleDescriptor> all = new ArrayList<>();
        rules.values().forEach(r -> all.add(r.descriptor()));
        return all;
    }
}
