package dev.tare.workspace;

import java.util.List;

/**
 * What a walk of the scanned root found: the template files to read, in path order, and the
 * entries it could not or would not follow, each with its reason.
 *
 * @param paths   paths relative to the root, with {@code /} separators, sorted
 * @param skipped links and folders left alone, sorted by path
 */
public record FileSelection(List<String> paths, List<SkippedFile> skipped) {
    public FileSelection {
        paths = List.copyOf(paths);
        skipped = List.copyOf(skipped);
    }
}
