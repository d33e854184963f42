package dev.tare.app;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.tare.TareException;
import dev.tare.config.TareConfig;
import dev.tare.lint.Baseline;
import dev.tare.source.SafeReader;
import dev.tare.source.YamlDocument;
import dev.tare.workspace.SafeFileWriter;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Iterator;
import java.util.Map;
import java.util.Optional;
import java.util.TreeMap;
import java.util.function.Supplier;

/**
 * The baseline file: {@code {"tool": "tare", "format": 1, "templates": {PATH: {TARGET: TOKENS}}}},
 * keys sorted, one template per line, so that review diffs show exactly what changed. It carries no
 * version or date, which would change on every write.
 */
public final class BaselineFile {
    private static final int FORMAT = 1;

    private BaselineFile() {
    }

    /** Where {@code config}'s baseline file is ({@code baseline.file} under the root). */
    static Path path(TareConfig config) {
        return config.root().resolve(config.baseline().file());
    }

    /** The baseline at {@code file}, read when first asked for and then kept. */
    static Supplier<Optional<Baseline>> readOnce(Path file) {
        return new Supplier<>() {
            private Optional<Baseline> read;

            @Override
            public synchronized Optional<Baseline> get() {
                if (read == null) {
                    read = BaselineFile.read(file);
                }
                return read;
            }
        };
    }

    /** The baseline at {@code file}, empty when there is no such file. */
    public static Optional<Baseline> read(Path file) {
        if (!Files.isRegularFile(file)) {
            return Optional.empty();
        }
        String text;
        try {
            text = new SafeReader(64L * 1024 * 1024).read(file.toString(), file).text();
        } catch (TareException e) {
            throw new TareException(file + ": " + e.getMessage(), e);
        }
        JsonNode root;
        try {
            root = YamlDocument.parseJson(text).root();
        } catch (TareException e) {
            throw new TareException(file + ", " + e.getMessage() + "; rewrite it with 'tare baseline'", e);
        }
        JsonNode templates = root.path("templates");
        if (!root.path("tool").asText().equals("tare") || !templates.isObject()) {
            throw new TareException(file + ": not a Tare baseline; rewrite it with 'tare baseline'");
        }
        Map<String, Map<String, Integer>> tokens = new TreeMap<>();
        for (Iterator<Map.Entry<String, JsonNode>> it = templates.fields(); it.hasNext(); ) {
            Map.Entry<String, JsonNode> entry = it.next();
            Map<String, Integer> byTarget = new TreeMap<>();
            for (Iterator<Map.Entry<String, JsonNode>> targets = entry.getValue().fields(); targets.hasNext(); ) {
                Map.Entry<String, JsonNode> target = targets.next();
                if (!target.getValue().canConvertToInt() || target.getValue().asInt() < 0) {
                    throw new TareException(file + ": " + entry.getKey() + " has a bad count for " + target.getKey()
                            + "; rewrite it with 'tare baseline'");
                }
                byTarget.put(target.getKey(), target.getValue().asInt());
            }
            tokens.put(entry.getKey(), byTarget);
        }
        return Optional.of(new Baseline(tokens));
    }

    /** The file's text for {@code baseline}. */
    public static String text(Baseline baseline) {
        StringBuilder out = new StringBuilder();
        out.append("{\n  \"tool\": \"tare\",\n  \"format\": ").append(FORMAT).append(",\n  \"templates\": {");
        boolean first = true;
        for (Map.Entry<String, Map<String, Integer>> entry : baseline.tokens().entrySet()) {
            ObjectNode counts = com.fasterxml.jackson.databind.node.JsonNodeFactory.instance.objectNode();
            entry.getValue().forEach(counts::put);
            out.append(first ? "\n" : ",\n").append("    ")
                    .append(com.fasterxml.jackson.databind.node.TextNode.valueOf(entry.getKey())).append(": ").append(counts);
            first = false;
        }
        out.append(first ? "}\n}\n" : "\n  }\n}\n");
        return out.toString();
    }

    /** Writes {@code baseline} to {@code file} crash-safely; an unchanged file is not touched. */
    public static SafeFileWriter.Outcome write(Path file, Baseline baseline) {
        byte[] updated = text(baseline).getBytes(StandardCharsets.UTF_8);
        try {
            if (!Files.exists(file)) {
                Files.createDirectories(file.toAbsolutePath().getParent());
                return new SafeFileWriter().create(file, updated);
            }
            return new SafeFileWriter().replace(file, Files.readAllBytes(file), updated);
        } catch (IOException e) {
            throw new TareException(file + ": cannot be written (" + e.getMessage() + ")", e);
        }
    }
}
