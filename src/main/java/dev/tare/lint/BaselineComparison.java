package dev.tare.lint;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;

/**
 * Compares current counts with a baseline. Growth beyond the tolerance is a breach; shrinkage is
 * reported so that the baseline can be lowered. Templates that are new, or no longer there, are
 * not breaches: a new template is governed by its budget until the baseline is rewritten.
 */
public final class BaselineComparison {
    private BaselineComparison() {
    }

    /** Every count that moved, in path then target order. */
    public static List<BaselineChange> compare(Baseline recorded, Baseline current, double tolerancePercent) {
        List<BaselineChange> changes = new ArrayList<>();
        for (Map.Entry<String, Map<String, Integer>> entry : current.tokens().entrySet()) {
            Map<String, Integer> before = recorded.tokens().get(entry.getKey());
            if (before == null) {
                continue;
            }
            for (Map.Entry<String, Integer> now : entry.getValue().entrySet()) {
                Integer old = before.get(now.getKey());
                if (old == null || old.intValue() == now.getValue()) {
                    continue;
                }
                double limit = old * (1 + tolerancePercent / 100.0);
                changes.add(new BaselineChange(entry.getKey(), now.getKey(), old, now.getValue(), now.getValue() > limit));
            }
        }
        return changes;
    }
}
