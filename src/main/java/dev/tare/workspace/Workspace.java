package dev.tare.workspace;

import dev.tare.TareException;
import dev.tare.config.ConfigLoader;
import dev.tare.config.TareConfig;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

/**
 * The repository a command works on: its root (where {@code tare.yaml} stands, or the folder given),
 * its configuration, and the files or folders inside it that were asked for.
 *
 * @param root   the scanned root; every output path is relative to it
 * @param config the loaded configuration, or the defaults
 * @param starts the files and folders to walk, inside the root; empty for the whole root
 */
public record Workspace(Path root, TareConfig config, List<Path> starts) {
    public Workspace {
        starts = List.copyOf(starts);
    }

    /**
     * Opens the workspace for {@code paths} (the current folder when empty, or the whole root of the
     * configuration when one is given). With {@code --config} the root is that file's folder. Otherwise the root is the nearest folder at or above the first
     * path holding {@code tare.yaml}, looking no higher than the git work tree's top; failing that,
     * the git work tree's top, or outside git the first path itself (or its folder, for a file).
     */
    public static Workspace open(List<Path> paths, Optional<Path> configFile) {
        if (paths.isEmpty() && configFile.isPresent()) {
            TareConfig config = ConfigLoader.load(configFile.get());
            return new Workspace(config.root(), config, List.of());
        }
        List<Path> absolute = new ArrayList<>();
        for (Path path : paths.isEmpty() ? List.of(Path.of(".")) : paths) {
            Path normalized = path.toAbsolutePath().normalize();
            if (!Files.exists(normalized)) {
                throw new TareException(path + ": no such file or folder");
            }
            absolute.add(normalized);
        }
        Path first = absolute.get(0);
        Path firstFolder = Files.isDirectory(first) ? first : first.getParent();
        TareConfig config;
        if (configFile.isPresent()) {
            config = ConfigLoader.load(configFile.get());
        } else {
            Optional<Path> found = findUpwards(firstFolder);
            config = found.map(ConfigLoader::load)
                    .orElseGet(() -> TareConfig.defaults(gitTop(firstFolder).orElse(firstFolder)));
        }
        Path root = config.root();
        List<Path> starts = new ArrayList<>();
        for (Path path : absolute) {
            if (!path.startsWith(root)) {
                throw new TareException(path + " is outside " + root + ", the folder of the configuration in use;"
                        + " scan it separately");
            }
            starts.add(path);
        }
        return new Workspace(root, config, starts.contains(root) ? List.of() : starts);
    }

    /** The root as a person would name it: relative to the current folder when inside it. */
    public String displayName() {
        Path here = Path.of("").toAbsolutePath().normalize();
        if (root.equals(here)) {
            return ".";
        }
        return root.startsWith(here) ? here.relativize(root).toString().replace('\\', '/') : root.toString();
    }

    private static Optional<Path> gitTop(Path folder) {
        for (Path dir = folder; dir != null; dir = dir.getParent()) {
            if (Files.exists(dir.resolve(".git"))) {
                return Optional.of(dir);
            }
        }
        return Optional.empty();
    }

    private static Optional<Path> findUpwards(Path folder) {
        for (Path dir = folder; dir != null; dir = dir.getParent()) {
            Optional<Path> file = ConfigLoader.find(dir);
            if (file.isPresent()) {
                return file;
            }
            if (Files.exists(dir.resolve(".git"))) {
                break;
            }
        }
        return Optional.empty();
    }
}
