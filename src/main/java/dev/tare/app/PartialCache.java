package dev.tare.app;

import dev.tare.TareException;
import dev.tare.config.TemplatesConfig;
import dev.tare.source.SafeReader;
import dev.tare.template.Template;
import dev.tare.template.TemplateParser;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.ConcurrentHashMap;

/**
 * Loads included templates by root-relative path, each file read and parsed once per run and
 * shared by every thread. A file that cannot be used is remembered with its reason.
 */
final class PartialCache {
    private record LoadAttempt(Optional<Template> template, TareException failure) {
    }

    private final Path root;
    private final Path realRoot;
    private final TemplatesConfig templates;
    private final SafeReader reader;
    private final TemplateParser parser;
    private final Map<String, LoadAttempt> cache = new ConcurrentHashMap<>();

    PartialCache(Path root, TemplatesConfig templates, SafeReader reader, TemplateParser parser) {
        this.root = root;
        try {
            this.realRoot = root.toRealPath();
        } catch (IOException e) {
            throw new TareException(root + ": cannot be read (" + e.getMessage() + ")", e);
        }
        this.templates = templates;
        this.reader = reader;
        this.parser = parser;
    }

    /** The template at {@code path}, empty when no such file exists. */
    Optional<Template> load(String path) {
        LoadAttempt loaded = cache.computeIfAbsent(path, this::read);
        if (loaded.failure() != null) {
            throw loaded.failure();
        }
        return loaded.template();
    }

    private LoadAttempt read(String path) {
        Path file = root.resolve(path).normalize();
        if (!Files.isRegularFile(file)) {
            return new LoadAttempt(Optional.empty(), null);
        }
        try {
            if (!file.toRealPath().startsWith(realRoot)) {
                return new LoadAttempt(Optional.empty(), new TareException(path + " is a link to a place outside the scanned root"));
            }
            return new LoadAttempt(Optional.of(parser.parse(reader.read(path, file), templates.isPartial(path))), null);
        } catch (TareException e) {
            return new LoadAttempt(Optional.empty(), new TareException(path + ": " + e.getMessage(), e));
        } catch (IOException e) {
            return new LoadAttempt(Optional.empty(), new TareException(path + ": cannot be read (" + e.getMessage() + ")", e));
        }
    }
}
