package dev.tare.cache;

import dev.tare.config.TareConfig;
import dev.tare.tokenize.TokenizerRegistry;
import java.io.File;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.stream.Stream;

/**
 * Everything besides the template files that decides what a run of Tare finds, written out as the
 * key of its {@link TemplateCache}: the configuration as loaded (model shapes read from files
 * included), the names of the partials (a new partial can change what an include resolves to), and
 * whatever a command adds (its options, its tokenizer files, rule packs, a baseline).
 */
public final class CacheKey {
    private final Path root;
    private final StringBuilder text = new StringBuilder(1024);

    private CacheKey(Path root) {
        this.root = root;
    }

    /** The key of a run over the repository at {@code root}: its configuration and the names of its partials. */
    public static CacheKey of(Path root, TareConfig config) {
        CacheKey key = new CacheKey(root);
        key.text.append(config).append('\n');
        Path partials = root.resolve(config.templates().partials());
        if (!config.templates().partials().isEmpty() && Files.isDirectory(partials)) {
            try (Stream<Path> files = Files.walk(partials)) {
                files.map(p -> partials.relativize(p).toString()).sorted()
                        .forEach(name -> key.text.append(name).append('\n'));
            } catch (IOException | UncheckedIOException e) {
                key.text.append("partials unreadable ").append(System.nanoTime()).append('\n');
            }
        }
        return key;
    }

    /** Adds a value, such as an option. */
    public CacheKey with(String label, Object value) {
        text.append(label).append(' ').append(value).append('\n');
        return this;
    }

    /** Adds a tokenizer's name, and the size and time of its file when it names one. */
    public CacheKey tokenizer(String tokenizer) {
        text.append("tokenizer ").append(tokenizer);
        if (TokenizerRegistry.namesFile(tokenizer)) {
            File file = root.resolve(tokenizer).toFile();
            text.append(' ').append(file.length()).append(' ').append(file.lastModified());
        }
        text.append('\n');
        return this;
    }

    /**
     * Adds a file's text, or every file's under a folder (by name and text), as a hash; a path that
     * does not exist adds that it does not, and one that cannot be read a value no other run has.
     */
    public CacheKey contents(Path path) {
        text.append("contents ").append(path).append('\n');
        if (!Files.exists(path)) {
            text.append("absent\n");
            return this;
        }
        try (Stream<Path> walk = Files.walk(path)) {
            for (Path file : walk.filter(Files::isRegularFile).sorted().toList()) {
                byte[] bytes = Files.readAllBytes(file);
                text.append(path.relativize(file)).append(' ')
                        .append(TemplateCache.hash(new String(bytes, java.nio.charset.StandardCharsets.ISO_8859_1)))
                        .append('\n');
            }
        } catch (IOException | UncheckedIOException e) {
            text.append("unreadable ").append(System.nanoTime()).append('\n');
        }
        return this;
    }

    @Override
    public String toString() {
        return text.toString();
    }
}
