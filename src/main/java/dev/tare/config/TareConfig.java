package dev.tare.config;

import dev.tare.TareException;
import dev.tare.footprint.Target;
import dev.tare.source.SafeReader;
import dev.tare.source.YamlDocument;
import java.nio.file.Path;
import java.util.List;
import java.util.Optional;
import java.util.OptionalInt;
import java.util.stream.Collectors;

/**
 * The whole of a repository's {@code tare.yaml}, validated.
 *
 * @param root      the folder the configuration applies to (where {@code tare.yaml} stands)
 * @param file      the configuration file, when there is one
 * @param templates where templates live and how they are written
 * @param targets   deployment targets, in file order
 * @param budgets   token budgets
 * @param baseline  the baseline file and growth tolerance
 * @param rules     rule selection and severities
 * @param hookFix   whether the pre-commit hook applies safe rewrites before checking
 */
public record TareConfig(Path root, Optional<Path> file, TemplatesConfig templates, List<Target> targets,
                         Budgets budgets, BaselineConfig baseline, RulesConfig rules, boolean hookFix,
                         TrafficGlobs traffic) {
    public TareConfig {
        targets = List.copyOf(targets);
    }

    /** The configuration of a repository without {@code tare.yaml}. */
    public static TareConfig defaults(Path root) {
        return new TareConfig(root, Optional.empty(), TemplatesConfig.defaults(), List.of(), Budgets.NONE,
                BaselineConfig.DEFAULT, RulesConfig.DEFAULT, false, TrafficGlobs.NONE);
    }

    /**
     * The targets called {@code names}, in the order given; all targets when none are named.
     *
     * @throws TareException naming the configured targets when a name is unknown
     */
    public List<Target> selectTargets(List<String> names) {
        if (names.isEmpty()) {
            return targets;
        }
        return names.stream().map(this::target).toList();
    }

    /** The target called {@code name}. */
    public Target target(String name) {
        return targets.stream().filter(t -> t.name().equals(name)).findFirst()
                .orElseThrow(() -> new TareException("unknown target '" + name + "'"
                        + (targets.isEmpty() ? "; " + describeFile() + " configures no targets"
                        : "; configured targets: " + targets.stream().map(Target::name).collect(Collectors.joining(", ")))));
    }

    /**
     * How a message about {@code key} begins: the configuration file, the line the key is on when it
     * can be found, and the key ({@code "tare.yaml, line 4: rules.disable[0]: "}).
     */
    public String where(String key) {
        String name = file.map(Path::toString).orElse("configuration");
        OptionalInt line = file.map(f -> lineOf(f, key)).orElse(OptionalInt.empty());
        return name + (line.isPresent() ? ", line " + line.getAsInt() : "") + ": " + key + ": ";
    }

    private static OptionalInt lineOf(Path file, String key) {
        try {
            return YamlDocument.parseYaml(new SafeReader(SafeReader.DEFAULT_MAX_BYTES).read(file.toString(), file).text())
                    .line(key);
        } catch (TareException e) {
            return OptionalInt.empty();
        }
    }

    private String describeFile() {
        return file.map(Path::toString).orElse("no tare.yaml was found here or above (give --config FILE), so the"
                + " repository");
    }
}
