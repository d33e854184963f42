package dev.tare.workspace;

import java.nio.file.Path;
import java.util.List;

/**
 * What a walk of the scanned root found: the template files to read, in path order, and the
 * entries it could not or would not follow, each with its reason; and what the selection
 * depended on, so that a later run can tell whether walking again would select the same files.
 *
 * @param paths     paths relative to the root, with {@code /} separators, sorted
 * @param skipped   links and folders left alone, sorted by path
 * @param folders   every folder the walk listed, with the names it held
 * @param ruleFiles every file whose presence or text could change the selection without changing
 *                  a listed folder: the {@code .gitignore} files of the folders entered (whether
 *                  they exist or not), git's {@code info/exclude}, and the {@code .git} entries of
 *                  the folders above the root that decide where the git work tree starts
 */
public record FileSelection(List<String> paths, List<SkippedFile> skipped, List<WalkedFolder> folders,
                            List<Path> ruleFiles) {
    public FileSelection {
        paths = List.copyOf(paths);
        skipped = List.copyOf(skipped);
        folders = List.copyOf(folders);
        ruleFiles = List.copyOf(ruleFiles);
    }

    /** A selection that did not come from a walk, and so says nothing about what it depended on. */
    public FileSelection(List<String> paths, List<SkippedFile> skipped) {
        this(paths, skipped, List.of(), List.of());
    }
}
