package dev.tare.lint;

import com.fasterxml.jackson.databind.JsonNode;
import com.google.re2j.Pattern;
import com.google.re2j.PatternSyntaxException;
import dev.tare.TareException;
import dev.tare.source.YamlDocument;
import java.util.ArrayList;
import java.util.Iterator;
import java.util.List;
import java.util.Optional;
import java.util.OptionalInt;
import java.util.Set;

/**
 * Reads rule packs: YAML texts holding {@code rules:}, a list of rules with {@code id},
 * {@code summary}, {@code why}, {@code class} (safe, review or none), {@code severity} (error,
 * warning or info), {@code scope} (everywhere or prose), {@code find} (an RE2 pattern),
 * {@code replace} (required unless the class is none), {@code examples} ({@code [{before, after}]},
 * at least one) and optionally {@code instead} and {@code message}. Anything missing or wrong is a
 * {@link TareException} naming the file, the line and the rule.
 */
public final class PackParser {
    private static final Set<String> KEYS = Set.of("id", "summary", "why", "class", "severity", "scope", "find",
            "replace", "examples", "instead", "message");
    private static final List<String> REQUIRED = List.of("id", "summary", "why", "class", "severity", "scope", "find",
            "examples");
    private PackParser() {
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
            throw new TareException(name + ", " + e.getMessage(), e);
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
