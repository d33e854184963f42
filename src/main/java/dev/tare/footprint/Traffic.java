package dev.tare.footprint;

import java.util.OptionalDouble;

/**
 * How often a template is called on a target (design.md, "Prefix caching — hosted").
 *
 * @param callsPerDay       the template's own calls a day, which monthly costs are made of
 * @param sharedCallsPerDay the calls a day of every template whose calls begin with the same cacheable
 *                          prefix, this one's included: they all keep one cache entry alive
 */
public record Traffic(OptionalDouble callsPerDay, OptionalDouble sharedCallsPerDay) {
    /** A template called as often as the target's {@code calls_per_day}, sharing its prefix with no other. */
    public static Traffic of(Target target) {
        return new Traffic(target.callsPerDay(), target.callsPerDay());
    }

    /** A template called {@code callsPerDay} times a day, sharing its prefix with no other. */
    public static Traffic of(double callsPerDay) {
        return new Traffic(OptionalDouble.of(callsPerDay), OptionalDouble.of(callsPerDay));
    }

    /** The same template, its prefix shared by calls of {@code shared} a day in all. */
    public Traffic sharedBy(double shared) {
        return new Traffic(callsPerDay, OptionalDouble.of(shared));
    }
}
