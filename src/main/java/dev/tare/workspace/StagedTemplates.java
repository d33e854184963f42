package dev.tare.workspace;

import dev.tare.TareException;
import dev.tare.source.SafeReader;
import dev.tare.source.SourceText;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * The templates staged for the next commit, as the git index holds them: those under the scanned
 * root (and inside the paths asked for) that the configuration selects. Reading one gives its staged
 * text, not the working tree's. Includes are still resolved from the working tree.
 */
public final class StagedTemplates {
    private final Map<String, StagedFile> byPath;
    private final Path root;
    private final SafeReader reader;

    private StagedTemplates(Map<String, StagedFile> byPath, Path root, SafeReader reader) {
        this.byPath = byPath;
        this.root = root;
        this.reader = reader;
    }

    public static StagedTemplates read(Workspace workspace, TemplateFinder finder, SafeReader reader) {
        Path root = workspace.root();
        // Only staged files that are selected templates are read out of git at all.
        GitIndex index = GitIndex.read(root, absolute -> absolute.startsWith(root) && inStarts(absolute, workspace.starts())
                && finder.selects(relative(root, absolute)));
        Path top = index.workTree();
        Map<String, StagedFile> byPath = new LinkedHashMap<>();
        for (StagedFile file : index.files()) {
            byPath.put(relative(root, top.resolve(file.path()).normalize()), file);
        }
        return new StagedTemplates(byPath, root, reader);
    }

    private static String relative(Path root, Path absolute) {
        return root.relativize(absolute).toString().replace('\\', '/');
    }

    private static boolean inStarts(Path file, List<Path> starts) {
        return starts.isEmpty() || starts.stream().anyMatch(file::startsWith);
    }

    /** The staged templates, by root-relative path. */
    public FileSelection selection() {
        return new FileSelection(new ArrayList<>(byPath.keySet()).stream().sorted().toList(), List.<SkippedFile>of());
    }

    /** The staged text of a selected path. */
    public SourceText read(String path) {
        StagedFile file = byPath.get(path);
        if (file == null) {
            throw new TareException("is not staged");
        }
        return reader.decode(path, root.resolve(path), file.staged());
    }

    /** Root-relative paths of staged templates whose working tree differs from the index. */
    public List<String> partiallyStaged() {
        return byPath.entrySet().stream().filter(e -> !e.getValue().matchesWorkTree()).map(Map.Entry::getKey).sorted().toList();
    }
}
