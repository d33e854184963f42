package dev.tare.lint;

import dev.tare.overlap.RepositoryWords;
import dev.tare.template.Template;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.TreeMap;
import java.util.concurrent.atomic.AtomicReference;
import java.util.function.Function;
import java.util.function.Supplier;

/**
 * The templates of a run as the cross-template rules reach them, without every parsed template being
 * held: their paths, each template parsed again when a rule asks for it, and their words for the
 * shared-block analysis.
 *
 * @param paths  every template's path relative to the root, sorted
 * @param loader the template at a path of {@code paths}, parsed again (or held, for a small run)
 * @param words  the words of every template, fresh for each analysis that asks
 */
public record RunTemplates(List<String> paths, Function<String, Template> loader, Supplier<RepositoryWords> words) {
    public RunTemplates {
        paths = List.copyOf(paths);
    }

    /**
     * Templates parsed again when a rule asks for one. The words {@code gathered} while the run read
     * them serve the first analysis that asks; a later one gathers them again, on every core.
     *
     * @param paths every template's path, sorted
     */
    public static RunTemplates reparsed(List<String> paths, Function<String, Template> loader,
                                        Optional<RepositoryWords> gathered) {
        AtomicReference<RepositoryWords> unused = new AtomicReference<>(gathered.orElse(null));
        List<String> sorted = List.copyOf(paths);
        return new RunTemplates(sorted, loader, () -> {
            RepositoryWords first = unused.getAndSet(null);
            if (first != null) {
                return first;
            }
            // The words are numbered in path order when laid out, so the order they are added in is free.
            RepositoryWords again = new RepositoryWords();
            sorted.parallelStream().forEach(path -> again.add(loader.apply(path)));
            return again;
        });
    }

    /** Templates held in memory (a fix's texts, a rule's example, a test). */
    public static RunTemplates held(List<Template> templates) {
        Map<String, Template> byPath = new TreeMap<>();
        templates.forEach(t -> byPath.put(t.path(), t));
        return new RunTemplates(List.copyOf(byPath.keySet()), byPath::get, () -> {
            RepositoryWords words = new RepositoryWords();
            byPath.values().forEach(words::add);
            return words;
        });
    }
}
