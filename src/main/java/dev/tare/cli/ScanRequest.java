package dev.tare.cli;

import dev.tare.scan.ScanOptions;
import dev.tare.scan.ScanResult;
import dev.tare.scan.Workspace;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;

/**
 * What a {@code tare scan} command line asks for, as picocli parsed it: what {@link ScanCommand}
 * runs, and what {@link ScanReplay} remembers of it, as lines of text.
 *
 * @param paths     the folders or files to scan, as given
 * @param config    the configuration file given with {@code --config}
 * @param targets   the targets to measure on; empty for all
 * @param tokenizer the primary tokenizer given with {@code --tokenizer}
 * @param cache     false with {@code --no-cache}
 */
record ScanRequest(List<Path> paths, Optional<Path> config, List<String> targets, Optional<String> tokenizer,
                   ScanCommand.Format format, ScanCommand.Sort sort, boolean cache) {
    ScanRequest {
        paths = List.copyOf(paths);
        targets = List.copyOf(targets);
    }

    Workspace workspace() {
        return Workspace.open(paths, config);
    }

    ScanOptions options() {
        return new ScanOptions(targets, tokenizer, cache);
    }

    ScanResult.Order order() {
        return ScanResult.Order.valueOf(sort.name().toUpperCase(Locale.ROOT));
    }

    /** Whether the report is the one {@code TemplateScan.report} stores: text or JSON, with the cache on. */
    boolean stored() {
        return cache && (format == ScanCommand.Format.text || format == ScanCommand.Format.json);
    }

    /** What besides the scan decides the report: its format and order (the stored report's key). */
    String form() {
        return format + " " + order();
    }

    /** The request as lines of text, which {@link #of(List)} reads back. */
    List<String> lines() {
        List<String> lines = new ArrayList<>(List.of(format.name(), sort.name(), Boolean.toString(cache),
                config.map(path -> "+" + path).orElse("-"), tokenizer.map(name -> "+" + name).orElse("-"),
                Integer.toString(paths.size())));
        paths.forEach(path -> lines.add(path.toString()));
        lines.addAll(targets);
        return lines;
    }

    /** The request {@link #lines()} wrote; empty for lines it did not write. */
    static Optional<ScanRequest> of(List<String> lines) {
        try {
            int pathCount = Integer.parseInt(lines.get(5));
            if (pathCount < 0 || 6 + pathCount > lines.size()) {
                return Optional.empty();
            }
            List<Path> paths = lines.subList(6, 6 + pathCount).stream().map(Path::of).toList();
            return Optional.of(new ScanRequest(paths, present(lines.get(3)).map(Path::of),
                    lines.subList(6 + pathCount, lines.size()), present(lines.get(4)),
                    ScanCommand.Format.valueOf(lines.get(0)), ScanCommand.Sort.valueOf(lines.get(1)),
                    Boolean.parseBoolean(lines.get(2))));
        } catch (RuntimeException e) {
            return Optional.empty();
        }
    }

    private static Optional<String> present(String line) {
        if (line.equals("-")) {
            return Optional.empty();
        }
        if (!line.startsWith("+")) {
            throw new IllegalArgumentException("not a remembered value: " + line);
        }
        return Optional.of(line.substring(1));
    }
}
