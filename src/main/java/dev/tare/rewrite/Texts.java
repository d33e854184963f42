package dev.tare.rewrite;

import java.util.Collections;
import java.util.Map;
import java.util.NavigableSet;
import java.util.TreeMap;
import java.util.TreeSet;
import java.util.function.Function;

/**
 * The text each file of a fix holds at one step: the texts changed so far over a base that gives the
 * others when asked (read again, or from a per-file fix), so that the texts of a whole repository
 * are never all held at once.
 */
final class Texts {
    private final NavigableSet<String> basePaths;
    private final Function<String, String> base;
    private final Map<String, String> changed;

    /** The base texts of {@code paths}, each given by {@code base} when asked. */
    Texts(java.util.Collection<String> paths, Function<String, String> base) {
        this(Collections.unmodifiableNavigableSet(new TreeSet<>(paths)), base, Map.of());
    }

    private Texts(NavigableSet<String> basePaths, Function<String, String> base, Map<String, String> changed) {
        this.basePaths = basePaths;
        this.base = base;
        this.changed = changed;
    }

    /** Whether a file has a text here. */
    boolean has(String path) {
        return changed.containsKey(path) || basePaths.contains(path);
    }

    /** The file's text here, or null when it has none. */
    String get(String path) {
        String text = changed.get(path);
        if (text != null) {
            return text;
        }
        return basePaths.contains(path) ? base.apply(path) : null;
    }

    /** Every path with a text, sorted. */
    NavigableSet<String> paths() {
        if (changed.isEmpty()) {
            return basePaths;
        }
        NavigableSet<String> all = new TreeSet<>(basePaths);
        all.addAll(changed.keySet());
        return Collections.unmodifiableNavigableSet(all);
    }

    /** The texts changed or added over the base, by path. */
    Map<String, String> changed() {
        return Collections.unmodifiableMap(changed);
    }

    /** These texts with {@code next} written over them. */
    Texts with(Map<String, String> next) {
        Map<String, String> all = new TreeMap<>(changed);
        all.putAll(next);
        return new Texts(basePaths, base, all);
    }
}
