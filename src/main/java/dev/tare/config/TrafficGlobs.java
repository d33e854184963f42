package dev.tare.config;

import dev.tare.footprint.Target;
import dev.tare.footprint.Traffic;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.OptionalDouble;

/**
 * {@code traffic}: calls a day for the templates a glob matches, the first matching glob in file
 * order winning; templates no glob matches get their target's {@code calls_per_day}.
 *
 * @param byGlob calls a day per glob, in file order
 */
public record TrafficGlobs(Map<String, Double> byGlob) {
    /** No traffic globs. */
    public static final TrafficGlobs NONE = new TrafficGlobs(Map.of());

    public TrafficGlobs {
        byGlob = Collections.unmodifiableMap(new LinkedHashMap<>(byGlob));
    }

    /**
     * How often the template at {@code path} is called on {@code target}: what its front matter
     * states, else the first matching glob, else the target's {@code calls_per_day}; its prefix
     * shared with no other template.
     */
    public Traffic of(String path, OptionalDouble stated, Target target) {
        OptionalDouble calls = stated.isPresent() ? stated : callsPerDay(path);
        return calls.isPresent() ? Traffic.of(calls.getAsDouble()) : Traffic.of(target);
    }

    /** The calls a day of a root-relative template path, when a glob matches it. */
    public OptionalDouble callsPerDay(String path) {
        for (Map.Entry<String, Double> entry : byGlob.entrySet()) {
            if (Glob.of(entry.getKey()).matches(path)) {
                return OptionalDouble.of(entry.getValue());
            }
        }
        return OptionalDouble.empty();
    }
}
