package dev.tare.lint;

import com.fasterxml.jackson.databind.JsonNode;
import com.google.re2j.Pattern;
import com.google.re2j.PatternSyntaxException;
import dev.tare.TareException;
import dev.tare.source.SafeReader;
import dev.tare.source.YamlDocument;
import java.io.IOException;
import java.io.InputStream;
import java.net.URISyntaxException;
import java.net.URL;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Iterator;
import java.util.List;
import java.util.Optional;
import java.util.OptionalInt;
import java.util.Set;
import java.util.stream.Stream;

/**
 * Loads rule packs: YAML files holding {@code rules:}, a list of rules with {@code id},
 * {@code summary}, {@code why}, {@code class} (safe, review or none), {@code severity} (error,
 * warning or info), {@code scope} (everywhere or prose), {@code find} (an RE2 pattern),
 * {@code replace} (required unless the class is none), {@code examples} ({@code [{before, after}]},
 * at least one) and optionally {@code instead} and {@code message}. Anything missing or wrong is a
 * {@link TareException} naming the file, the line and the rule.
 */
public final class PackLoader {
    /** The folder of rule packs in the repository and inside the jar. */
    public static final String FOLDER = "rules";

    private static final Set<String> KEYS = Set.of("id", "summary", "why", "class", "severity", "scope", "find",
            "replace", "examples", "instead", "message");
    private static final List<String> REQUIRED = List.of("id", "summary", "why", "class", "severity", "scope", "find",
            "examples");
    private static final long MAX_PACK_BYTES = 1024 * 1024;

    private PackLoader() {
    }

    /**
     * The packs shipped inside Tare (the repository's {@code rules/} folder, packaged into the jar). From
     * the jar they are read by the names in {@link PackIndex#INDEX}, which the build writes, rather than
     * by opening the jar as a file system: that costs a pre-commit hook more than the rules do.
     */
    public static List<Rule> builtIn() {
        return builtIn(PackLoader.class.getClassLoader());
    }

    /** The packs {@code loader} holds under {@value #FOLDER}. */
    static List<Rule> builtIn(ClassLoader loader) {
        URL folder = loader.getResource(FOLDER);
        if (folder == null) {
            return List.of();
        }
        try {
            if (folder.getProtocol().equals("file")) {
                return loadFolder(Path.of(folder.toURI()), FOLDER);
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
                rules.addAll(parse(name, new String(text, StandardCharsets.UTF_8)));
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
            return loadFolder(folder, shownAs);
        } catch (IOException e) {
            throw new TareException(shownAs + ": cannot be read (" + e.getMessage() + ")", e);
        }
    }

    private static List<Rule> loadFolder(Path folder, String shownAs) throws IOException {
        List<Path> files;
        try (Stream<Path> list = Files.list(folder)) {
            files = list.filter(p -> PackIndex.isPack(p.getFileName().toString())).sorted(
                    java.util.Comparator.comparing(p -> p.getFileName().toString())).toList();
        }
        List<Rule> rules = new ArrayList<>();
        for (Path file : files) {
            String name = shownAs + "/" + file.getFileName();
            rules.addAll(parse(name, read(file, name)));
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

    /**
     * The rules of one pack file's text.
     *
     * @param name the file as messages name it
     */
    public static List<Rule> parse(String name, String text) {
        YamlDocument document;
        try {
            document = YamlDocument.parseYaml(text);
        } catch (TareException e) {
            throw new TareException(name + ", " + e.getMessage() + "; fix the YAML syntax", e);
        }
        JsonNode root = document.root();
        if (!root.isObject() || !root.path("rules").isArray()) {
            throw new TareException(name + ": a rule pack must be a mapping with a 'rules' list");
        }
        List<Rule> rules = new ArrayList<>();
        JsonNode list = root.get("rules");
        for (int i = 0; i < list.size(); i++) {
            rules.add(new Entry(name, document, "rules[" + i + "]", list.get(i)).rule());
        }
        return rules;
    }

    /** One rule of a pack being read, for located messages. */
    private record Entry(String file, YamlDocument document, String path, JsonNode node) {
        Rule rule() {
            if (!node.isObject()) {
                throw problem(path, "each rule must be a mapping with " + String.join(", ", REQUIRED));
            }
            for (Iterator<String> it = node.fieldNames(); it.hasNext(); ) {
                String key = it.next();
                if (!KEYS.contains(key)) {
                    throw problem(path + "." + key, "unknown key '" + key + "'; a rule has "
                            + String.join(", ", new java.util.TreeSet<>(KEYS)));
                }
            }
            for (String key : REQUIRED) {
                if (!node.has(key) || node.get(key).isNull()) {
                    throw problem(path, "missing '" + key + "'; every rule needs " + String.join(", ", REQUIRED));
                }
            }
            String id = text("id");
            if (!id.matches("[a-z][a-z0-9]*(-[a-z0-9]+)*")) {
                throw problem(path + ".id", "id '" + id + "' must be lower-case words joined by hyphens");
            }
            RewriteClass rewriteClass = parsed(() -> RewriteClass.parse(text("class"), "class"), "class");
            Severity severity = parsed(() -> Severity.parse(text("severity"), "severity"), "severity");
            Scope scope = parsed(() -> Scope.parse(text("scope"), "scope"), "scope");
            Pattern find;
            try {
                find = Pattern.compile(text("find"));
            } catch (PatternSyntaxException e) {
                throw problem(path + ".find", "'find' is not a valid RE2 pattern (" + e.getMessage() + ")");
            }
            Optional<String> replace = optionalText("replace");
            if (rewriteClass == RewriteClass.NONE && replace.isPresent()) {
                throw problem(path + ".replace", "class none offers no rewrite, so 'replace' must go (or use class review)");
            }
            if (rewriteClass != RewriteClass.NONE && replace.isEmpty()) {
                throw problem(path, "missing 'replace'; class " + rewriteClass.label() + " needs the text to write instead");
            }
            if (rewriteClass == RewriteClass.SAFE) {
                // Safe is a promise that no word changes; a pattern can keep it only by touching whitespace alone.
                Optional<String> whyNot = WhitespaceOnlyRewrite.whyNot(find.pattern(), replace.get());
                if (whyNot.isPresent()) {
                    throw problem(path + ".class", "class safe is only for rewrites that change nothing but whitespace, and "
                            + whyNot.get() + "; declare class review");
                }
            }
            Optional<EditKind> editKind = switch (rewriteClass) {
                case SAFE -> Optional.of(EditKind.WHITESPACE);
                case REVIEW -> Optional.of(EditKind.TEXT);
                case NONE -> Optional.empty();
            };
            String instead = optionalText("instead").orElse(replace.map(r -> r.isEmpty()
                    ? "Leave the matched text out." : "Write '" + r + "' in its place.").orElse("Rephrase so the pattern no longer matches."));
            RuleDescriptor descriptor = new RuleDescriptor(id, text("summary"), text("why"), instead, severity,
                    editKind, examples(), file);
            return new PatternRule(descriptor, find, scope, replace, optionalText("message"));
        }

        private List<Example> examples() {
            JsonNode examples = node.get("examples");
            if (!examples.isArray() || examples.isEmpty()) {
                throw problem(path + ".examples", "'examples' must be a list of {before, after}, at least one");
            }
            List<Example> out = new ArrayList<>();
            for (int i = 0; i < examples.size(); i++) {
                JsonNode example = examples.get(i);
                String at = path + ".examples[" + i + "]";
                if (!example.isObject() || !example.path("before").isTextual() || !example.path("after").isTextual()) {
                    throw problem(at, "each example needs 'before' and 'after' text");
                }
                out.add(Example.of(example.get("before").asText(), example.get("after").asText()));
            }
            return out;
        }

        private <T> T parsed(java.util.function.Supplier<T> parse, String key) {
            try {
                return parse.get();
            } catch (TareException e) {
                throw problem(path + "." + key, e.getMessage());
            }
        }

        private String text(String key) {
            JsonNode value = node.get(key);
            if (value == null || !value.isTextual() || (value.asText().isBlank() && !key.equals("replace"))) {
                throw problem(path + "." + key, "'" + key + "' must be text");
            }
            return value.asText();
        }

        private Optional<String> optionalText(String key) {
            return node.has(key) && !node.get(key).isNull() ? Optional.of(text(key)) : Optional.empty();
        }

        private TareException problem(String at, String message) {
            OptionalInt line = document.line(at);
            String id = node.path("id").isTextual() ? "rule '" + node.get("id").asText() + "'" : path;
            return new TareException(file + (line.isPresent() ? ", line " + line.getAsInt() : "") + ": " + id + ": "
                    + message);
        }
    }
}
