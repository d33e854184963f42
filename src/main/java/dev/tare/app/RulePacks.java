package dev.tare.app;

import dev.tare.TareException;
import dev.tare.config.TareConfig;
import dev.tare.lint.PackParser;
import dev.tare.lint.Rule;
import dev.tare.lint.RuleCatalog;
import dev.tare.source.SafeReader;
import java.io.IOException;
import java.io.InputStream;
import java.net.URISyntaxException;
import java.net.URL;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.stream.Stream;

/**
 * Reads the rule packs a run uses, those shipped inside Tare and the folders {@code rules.packs}
 * names, and builds the run's {@link RuleCatalog} from them.
 */
public final class RulePacks {
    /** The folder of rule packs in the repository and inside the jar. */
    public static final String FOLDER = "rules";

    private static final long MAX_PACK_BYTES = 1024 * 1024;

    private RulePacks() {
    }

    /**
     * The catalog for {@code config}: the built-in rules, the shipped packs and the configured ones.
     *
     * @throws TareException when a pack is missing or broken, two rules share an id, or the
     *                       configuration names an unknown rule or severity (naming the file, line and key)
     */
    public static RuleCatalog catalog(TareConfig config) {
        List<Rule> packRules = new ArrayList<>(builtIn());
        List<String> folders = config.rules().packs();
        for (int i = 0; i < folders.size(); i++) {
            String folder = folders.get(i);
            try {
                packRules.addAll(folder(config.root().resolve(folder).normalize(), folder));
            } catch (TareException e) {
                throw new TareException(config.where("rules.packs[" + i + "]") + e.getMessage(), e);
            }
        }
        return RuleCatalog.of(config, packRules);
    }

    /**
     * The packs shipped inside Tare (the repository's {@code rules/} folder, packaged into the jar). From
     * the jar they are read by the names in {@link PackIndex#INDEX}, which the build writes, rather than
     * by opening the jar as a file system, which would cost a pre-commit hook more than the rules do.
     */
    public static List<Rule> builtIn() {
        return builtIn(RulePacks.class.getClassLoader());
    }

    /** The packs {@code loader} holds under {@value #FOLDER}. */
    static List<Rule> builtIn(ClassLoader loader) {
        URL folder = loader.getResource(FOLDER);
        if (folder == null) {
            return List.of();
        }
        try {
            if (folder.getProtocol().equals("file")) {
                return readFolder(Path.of(folder.toURI()), FOLDER);
            }
            byte[] index = resource(loader, PackIndex.INDEX);
            if (index == null) {
                throw new IllegalStateException(PackIndex.INDEX + " is missing from the jar; build it with mvn package");
            }
            List<Rule> rules = new ArrayList<>();
            for (String file : new String(index, StandardCharsets.UTF_8).lines().filter(line -> !line.isBlank()).toList()) {
                String name = FOLDER + "/" + file;
                byte[] text = resource(loader, name);
                if (text == null) {
                    throw new IllegalStateException(name + " is listed in " + PackIndex.INDEX + " but missing from the jar");
                }
                rules.addAll(PackParser.parse(name, new String(text, StandardCharsets.UTF_8)));
            }
            return rules;
        } catch (URISyntaxException | IOException e) {
            throw new IllegalStateException("the built-in rule packs cannot be read", e);
        }
    }

    private static byte[] resource(ClassLoader loader, String name) throws IOException {
        try (InputStream in = loader.getResourceAsStream(name)) {
            return in == null ? null : in.readAllBytes();
        }
    }

    /**
     * Every pack in {@code folder}, files in name order.
     *
     * @param shownAs how messages and outputs name the folder
     */
    public static List<Rule> folder(Path folder, String shownAs) {
        if (!Files.isDirectory(folder)) {
            throw new TareException(shownAs + ": no such rule-pack folder; create it or remove it from rules.packs");
        }
        try {
            return readFolder(folder, shownAs);
        } catch (IOException e) {
            throw new TareException(shownAs + ": cannot be read (" + e.getMessage() + ")", e);
        }
    }

    private static List<Rule> readFolder(Path folder, String shownAs) throws IOException {
        List<Path> files;
        try (Stream<Path> list = Files.list(folder)) {
            files = list.filter(p -> PackIndex.isPack(p.getFileName().toString()))
                    .sorted(Comparator.comparing(p -> p.getFileName().toString())).toList();
        }
        List<Rule> rules = new ArrayList<>();
        for (Path file : files) {
            String name = shownAs + "/" + file.getFileName();
            rules.addAll(PackParser.parse(name, read(file, name)));
        }
        return rules;
    }

    private static String read(Path file, String name) {
        try {
            return new SafeReader(MAX_PACK_BYTES).read(name, file).text();
        } catch (TareException e) {
            throw new TareException(name + ": " + e.getMessage(), e);
        }
    }
}
