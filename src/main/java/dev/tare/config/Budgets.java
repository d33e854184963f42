package dev.tare.config;

import java.util.LinkedHashMap;
import java.util.Map;
import java.util.OptionalInt;

/**
 * Token budgets: one per glob, tried in the order written, and a default for the rest.
 *
 * @param defaultBudget the budget of templates no glob matches
 * @param byGlob        budgets for templates matching a glob, in file order
 */
public record Budgets(OptionalInt defaultBudget, Map<String, Integer> byGlob) {
    /** No budgets at all. */
    public static final Budgets NONE = new Budgets(OptionalInt.empty(), Map.of());

    public Budgets {
        byGlob = java.util.Collections.unmodifiableMap(new LinkedHashMap<>(byGlob));
    }

    /** The budget for a root-relative template path: the first glob that matches, else the default. */
    public OptionalInt budgetFor(String path) {
        for (Map.Entry<String, Integer> entry : byGlob.entrySet()) {
            if (Glob.of(entry.getKey()).matches(path)) {
                return OptionalInt.of(entry.getValue());
            }
        }
        return defaultBudget;
    }
}
