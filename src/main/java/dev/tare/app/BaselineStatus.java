package dev.tare.app;

import dev.tare.lint.Baseline;
import dev.tare.lint.BaselineChange;
import dev.tare.lint.BaselineComparison;
import java.util.List;

/**
 * How the current counts moved since the recorded baseline.
 *
 * @param file             the baseline file, relative to the root
 * @param tolerancePercent the growth allowed before a change is a breach
 * @param changes          every count that moved, in path then target order
 * @param added            templates measured now that the baseline does not record
 * @param removed          templates the baseline records that were not measured now (only for a
 *                         scan of the whole root; empty otherwise)
 */
public record BaselineStatus(String file, double tolerancePercent, List<BaselineChange> changes, List<String> added,
                             List<String> removed) {
    public BaselineStatus {
        changes = List.copyOf(changes);
        added = List.copyOf(added);
        removed = List.copyOf(removed);
    }

    /** Compares {@code current} with {@code recorded}; {@code wholeRoot} says whether a missing template means removed. */
    public static BaselineStatus compare(String file, double tolerancePercent, Baseline recorded, Baseline current,
                                         boolean wholeRoot) {
        List<String> added = current.tokens().keySet().stream().filter(p -> !recorded.tokens().containsKey(p)).toList();
        List<String> removed = wholeRoot
                ? recorded.tokens().keySet().stream().filter(p -> !current.tokens().containsKey(p)).toList()
                : List.of();
        return new BaselineStatus(file, tolerancePercent,
                BaselineComparison.compare(recorded, current, tolerancePercent), added, removed);
    }

    /** The counts that went up. */
    public List<BaselineChange> grew() {
        return changes.stream().filter(BaselineChange::grew).toList();
    }

    /** The counts that went down. */
    public List<BaselineChange> shrank() {
        return changes.stream().filter(c -> !c.grew()).toList();
    }

    /** The counts that grew by more than the tolerance. */
    public List<BaselineChange> overTolerance() {
        return changes.stream().filter(BaselineChange::overTolerance).toList();
    }
}
