package dev.tare.app;

import dev.tare.footprint.Footprint;
import dev.tare.footprint.Target;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.OptionalLong;

/**
 * One target's figures over the templates that run on it (partials left out, as in the scan's
 * totals). Money, memory and time are planning estimates, never measurements or invoices.
 *
 * @param target          the target's configuration
 * @param templates       how many templates run on it
 * @param inputTokens     input tokens per call, summed over those templates
 * @param costPerMonth    cost per month summed over those templates, each at its own traffic (front
 *                        matter, traffic globs, else the target's {@code calls_per_day}); empty when the
 *                        target is not priced or no template has traffic
 * @param currency        the currency of {@code costPerMonth}
 * @param largestRequest  the template with the largest KV cache, on targets with a model and KV precision
 * @param largestKvCacheBytes the KV-cache bytes of that template's request
 * @param fewestConcurrent how many requests of that size fit beside the weights, when the device is known
 * @param weightBytes     the memory the weights take, on targets with a model and weight precision
 */
public record TargetTotals(Target target, int templates, long inputTokens, OptionalDouble costPerMonth,
                           Optional<String> currency, Optional<String> largestRequest, OptionalLong largestKvCacheBytes,
                           OptionalLong fewestConcurrent, OptionalLong weightBytes) {

    /** The totals of every selected target of a scan, in the scan's target order. */
    public static List<TargetTotals> of(ScanResult scan) {
        List<TargetTotals> totals = new ArrayList<>();
        for (Target target : scan.targetConfigs()) {
            totals.add(of(target, scan));
        }
        return List.copyOf(totals);
    }

    private static TargetTotals of(Target target, ScanResult scan) {
        int templates = 0;
        long input = 0;
        double cost = 0;
        boolean priced = false;
        Optional<String> currency = Optional.empty();
        ScannedTemplate largest = null;
        long largestBytes = -1;
        for (ScannedTemplate template : scan.templates()) {
            Footprint f = template.targets().get(target.name());
            if (f == null || !template.countsInTotals()) {
                continue;
            }
            templates++;
            input += f.inputTokens();
            if (f.costPerMonth().isPresent()) {
                priced = true;
                cost += f.costPerMonth().getAsDouble();
                currency = currency.or(f::currency);
            }
            if (f.kvCacheBytes().isPresent() && f.kvCacheBytes().getAsLong() > largestBytes) {
                largest = template;
                largestBytes = f.kvCacheBytes().getAsLong();
            }
        }
        if (largest == null) {
            return new TargetTotals(target, templates, input, priced ? OptionalDouble.of(cost) : OptionalDouble.empty(),
                    currency, Optional.empty(), OptionalLong.empty(), OptionalLong.empty(), OptionalLong.empty());
        }
        Footprint worst = largest.targets().get(target.name());
        return new TargetTotals(target, templates, input, priced ? OptionalDouble.of(cost) : OptionalDouble.empty(),
                currency, Optional.of(largest.key()), OptionalLong.of(largestBytes), worst.maxConcurrent(),
                worst.weightBytes());
    }
}
