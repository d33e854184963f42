package dev.tare.config;

import com.fasterxml.jackson.databind.JsonNode;
import dev.tare.TareException;
import dev.tare.footprint.PrefixCache;
import dev.tare.footprint.Price;
import dev.tare.footprint.Target;
import dev.tare.source.SafeReader;
import dev.tare.source.SourceText;
import dev.tare.source.YamlDocument;
import dev.tare.template.PlaceholderSyntax;
import dev.tare.template.RoleMarkers;
import dev.tare.tokenize.TokenizerRegistry;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.OptionalInt;
import java.util.Set;

/** Finds and loads {@code tare.yaml}, refusing anything it does not understand with the file, line and key. */
public final class ConfigLoader {
    /** The configuration file's name. */
    public static final String FILE_NAME = "tare.yaml";

    private static final Set<String> TOP = Set.of("templates", "targets", "budgets", "baseline", "rules", "hook",
            "traffic");
    private static final Set<String> TEMPLATES = Set.of("include", "exclude", "placeholder", "partials", "max_file_bytes",
            "roles", "code");
    private static final Set<String> CODE = Set.of("include", "calls");
    /** A call name as {@code templates.code.calls} takes it: identifiers joined by dots. */
    private static final java.util.regex.Pattern CALL = java.util.regex.Pattern.compile(
            "[A-Za-z_$][A-Za-z0-9_$]*(\\.[A-Za-z_$][A-Za-z0-9_$]*)*");
    private static final Set<String> TARGET = Set.of("name", "tokenizer", "price", "prefix_cache",
            "message_overhead_tokens", "reply_overhead_tokens", "calls_per_day", "output_tokens", "model", "weight_bits",
            "kv_bits", "device", "scale", "tool_overhead_tokens", "concurrency");
    private static final Set<String> PRICE = Set.of("input", "cached_input", "cache_write", "output", "currency");
    private static final Set<String> PREFIX_CACHE = Set.of("min_tokens", "step_tokens", "ttl_seconds", "block_tokens");
    /** Five minutes: the shortest entry lifetime in the prompt-caching documentation of the providers we know (from memory). */
    private static final double DEFAULT_TTL_SECONDS = 300;
    private static final Set<String> BASELINE = Set.of("file", "tolerance_percent");
    private static final Set<String> RULES = Set.of("disable", "severity", "packs", "limits");
    private static final Set<String> HOOK = Set.of("fix");

    private ConfigLoader() {
    }

    /** The {@code tare.yaml} in {@code folder}, when there is one. */
    public static Optional<Path> find(Path folder) {
        Path file = folder.resolve(FILE_NAME);
        return Files.isRegularFile(file) ? Optional.of(file) : Optional.empty();
    }

    /** Loads {@code file}; the root is the folder it stands in. */
    public static TareConfig load(Path file) {
        Path absolute = file.toAbsolutePath().normalize();
        if (!Files.isRegularFile(absolute)) {
            throw new TareException(file + ": no such configuration file; check --config, or run 'tare init' to write a starter file");
        }
        SourceText text;
        try {
            text = new SafeReader(SafeReader.DEFAULT_MAX_BYTES).read(file.toString(), absolute);
        } catch (TareException e) {
            throw new TareException(file + ": " + e.getMessage(), e);
        }
        YamlDocument document;
        try {
            document = YamlDocument.parseYaml(text.text());
        } catch (TareException e) {
            throw new TareException(file + ", " + e.getMessage(), e);
        }
        return read(absolute.getParent(), Optional.of(absolute), new ConfigReader(file.toString(), document), document.root());
    }

    private static TareConfig read(Path root, Optional<Path> file, ConfigReader in, JsonNode top) {
        if (top.isMissingNode() || top.isNull()) {
            return new TareConfig(root, file, TemplatesConfig.defaults(), List.of(), Budgets.NONE,
                    BaselineConfig.DEFAULT, RulesConfig.DEFAULT, false, TrafficGlobs.NONE);
        }
        if (!top.isObject()) {
            throw in.problem("", "the file must be a mapping with keys such as templates, targets and budgets");
        }
        in.onlyKeys(top, "", TOP);
        JsonNode hook = in.object(top, "hook", "hook");
        boolean hookFix = false;
        if (hook != null) {
            in.onlyKeys(hook, "hook", HOOK);
            hookFix = in.bool(hook, "fix", "hook.fix").orElse(false);
        }
        return new TareConfig(root, file, templates(in, top), targets(in, top, root), budgets(in, top), baseline(in, top),
                rules(in, top), hookFix, traffic(in, top));
    }

    private static TemplatesConfig templates(ConfigReader in, JsonNode top) {
        TemplatesConfig defaults = TemplatesConfig.defaults();
        JsonNode node = in.object(top, "templates", "templates");
        if (node == null) {
            return defaults;
        }
        in.onlyKeys(node, "templates", TEMPLATES);
        List<String> include = node.has("include") ? in.texts(node, "include", "templates.include") : defaults.include();
        List<String> exclude = node.has("exclude") ? in.texts(node, "exclude", "templates.exclude") : defaults.exclude();
        checkGlobs(in, include, "templates.include");
        checkGlobs(in, exclude, "templates.exclude");
        PlaceholderSyntax syntax = defaults.placeholder();
        Optional<String> placeholder = in.text(node, "placeholder", "templates.placeholder");
        if (placeholder.isPresent()) {
            try {
                syntax = PlaceholderSyntax.fromLabel(placeholder.get());
            } catch (TareException e) {
                throw in.problem("templates.placeholder", e.getMessage());
            }
        }
        String partials = in.text(node, "partials", "templates.partials").orElse(defaults.partials());
        if (partials.startsWith("/") || partials.startsWith("..")) {
            throw in.problem("templates.partials", "must be a folder inside the repository, relative to tare.yaml");
        }
        long maxBytes = in.wholeNumber(node, "max_file_bytes", "templates.max_file_bytes", 1)
                .orElse((int) defaults.maxFileBytes());
        return new TemplatesConfig(include, exclude, syntax, partials, maxBytes, roles(in, node, defaults.roles()),
                code(in, node, defaults.code()));
    }

    /** {@code templates.code}: the source files read for prompts and the calls whose arguments are prompts. */
    private static TemplatesConfig.Code code(ConfigReader in, JsonNode templates, TemplatesConfig.Code defaults) {
        JsonNode node = in.object(templates, "code", "templates.code");
        if (node == null) {
            return defaults;
        }
        in.onlyKeys(node, "templates.code", CODE);
        List<String> include = node.has("include") ? in.texts(node, "include", "templates.code.include")
                : defaults.include();
        checkGlobs(in, include, "templates.code.include");
        List<String> calls = in.texts(node, "calls", "templates.code.calls");
        for (int i = 0; i < calls.size(); i++) {
            if (!CALL.matcher(calls.get(i)).matches()) {
                throw in.problem("templates.code.calls[" + i + "]", "'" + calls.get(i)
                        + "' is not a call name; write the name as the code calls it, such as client.chat or ask_model");
            }
        }
        return new TemplatesConfig.Code(include, calls);
    }

    /** {@code templates.roles}: {@code auto} or {@code off}, which YAML 1.1 reads as false when unquoted. */
    private static RoleMarkers roles(ConfigReader in, JsonNode templates, RoleMarkers fallback) {
        JsonNode node = templates.get("roles");
        if (node != null && node.isBoolean()) {
            return node.asBoolean() ? RoleMarkers.AUTO : RoleMarkers.OFF;
        }
        Optional<String> label = in.text(templates, "roles", "templates.roles");
        if (label.isEmpty()) {
            return fallback;
        }
        try {
            return RoleMarkers.fromLabel(label.get());
        } catch (TareException e) {
            throw in.problem("templates.roles", e.getMessage());
        }
    }

    private static void checkGlobs(ConfigReader in, List<String> globs, String path) {
        for (int i = 0; i < globs.size(); i++) {
            try {
                Glob.of(globs.get(i));
            } catch (TareException e) {
                throw in.problem(path + "[" + i + "]", e.getMessage());
            }
        }
    }

    private static List<Target> targets(ConfigReader in, JsonNode top, Path root) {
        DeploymentReader deployment = new DeploymentReader(in, root);
        JsonNode node = top.get("targets");
        List<Target> targets = new ArrayList<>();
        if (node == null || node.isNull()) {
            return targets;
        }
        if (!node.isArray()) {
            throw in.problem("targets", "must be a list of targets, each with a name and a tokenizer");
        }
        Set<String> names = new HashSet<>();
        for (int i = 0; i < node.size(); i++) {
            String path = "targets[" + i + "]";
            JsonNode target = node.get(i);
            if (!target.isObject()) {
                throw in.problem(path, "must be a mapping with at least name and tokenizer");
            }
            if (target.has("prefix_cache_min_tokens")) {
                throw in.problem(path + ".prefix_cache_min_tokens", "is replaced by prefix_cache: {min_tokens: N,"
                        + " step_tokens: S, ttl_seconds: T} (see the README); write the minimum there");
            }
            in.onlyKeys(target, path, TARGET);
            String name = in.text(target, "name", path + ".name")
                    .orElseThrow(() -> in.problem(path, "has no name"));
            if (!names.add(name)) {
                throw in.problem(path + ".name", "target '" + name + "' is configured twice");
            }
            String tokenizer = in.text(target, "tokenizer", path + ".tokenizer")
                    .orElseThrow(() -> in.problem(path, "target '" + name + "' names no tokenizer"));
            if (!TokenizerRegistry.namesFile(tokenizer) && !TokenizerRegistry.BUILT_IN.contains(tokenizer)) {
                throw in.problem(path + ".tokenizer", "unknown tokenizer '" + tokenizer + "'"
                        + Suggestion.didYouMean(tokenizer, TokenizerRegistry.BUILT_IN) + " (built in: "
                        + String.join(", ", TokenizerRegistry.BUILT_IN) + "; or the path of a tokenizer.json)");
            }
            if (TokenizerRegistry.namesFile(tokenizer) && !Files.isRegularFile(root.resolve(tokenizer))) {
                throw in.problem(path + ".tokenizer", "no such file " + root.resolve(tokenizer).normalize()
                        + "; give the path of a tokenizer.json relative to tare.yaml, or one of "
                        + String.join(", ", TokenizerRegistry.BUILT_IN));
            }
            targets.add(new Target(name, tokenizer, price(in, target, path),
                    prefixCache(in, target, path),
                    in.wholeNumber(target, "message_overhead_tokens", path + ".message_overhead_tokens", 0).orElse(0),
                    in.wholeNumber(target, "reply_overhead_tokens", path + ".reply_overhead_tokens", 0).orElse(0),
                    in.number(target, "calls_per_day", path + ".calls_per_day", 0),
                    in.wholeNumber(target, "output_tokens", path + ".output_tokens", 0),
                    deployment.model(target, path), deployment.bits(target, "weight_bits", path),
                    deployment.bits(target, "kv_bits", path), deployment.device(target, path),
                    scale(in, target, path),
                    in.wholeNumber(target, "tool_overhead_tokens", path + ".tool_overhead_tokens", 0).orElse(0),
                    in.wholeNumber(target, "concurrency", path + ".concurrency", 1)));
        }
        return targets;
    }

    private static double scale(ConfigReader in, JsonNode target, String path) {
        double scale = in.number(target, "scale", path + ".scale", 0).orElse(1.0);
        if (scale <= 0) {
            throw in.problem(path + ".scale", "must be above zero (a multiplier on counted tokens, such as 1.08)");
        }
        return scale;
    }

    /**
     * {@code prefix_cache}: a provider's ({@code min_tokens}, {@code step_tokens}, default 1, and
     * {@code ttl_seconds}, default 300) or a server's ({@code block_tokens}).
     */
    private static Optional<PrefixCache> prefixCache(ConfigReader in, JsonNode target, String path) {
        String at = path + ".prefix_cache";
        JsonNode node = in.object(target, "prefix_cache", at);
        if (node == null) {
            return Optional.empty();
        }
        in.onlyKeys(node, at, PREFIX_CACHE);
        OptionalInt block = in.wholeNumber(node, "block_tokens", at + ".block_tokens", 1);
        OptionalInt min = in.wholeNumber(node, "min_tokens", at + ".min_tokens", 1);
        OptionalInt step = in.wholeNumber(node, "step_tokens", at + ".step_tokens", 1);
        OptionalDouble ttl = in.number(node, "ttl_seconds", at + ".ttl_seconds", 0);
        if (block.isPresent()) {
            if (min.isPresent() || step.isPresent() || ttl.isPresent()) {
                throw in.problem(at, "has block_tokens (a server's cache) beside min_tokens, step_tokens or ttl_seconds"
                        + " (a provider's); keep one kind");
            }
            return Optional.of(PrefixCache.blocks(block.getAsInt()));
        }
        if (min.isEmpty()) {
            throw in.problem(at, "names no min_tokens (a provider's shortest cached prefix) or block_tokens"
                    + " (a server's KV block size)");
        }
        if (ttl.isPresent() && ttl.getAsDouble() == 0) {
            throw in.problem(at + ".ttl_seconds", "must be above 0 (how long an entry lives after its last use)");
        }
        return Optional.of(new PrefixCache(min.getAsInt(), step.orElse(1),
                OptionalDouble.of(ttl.orElse(DEFAULT_TTL_SECONDS))));
    }

    private static Optional<Price> price(ConfigReader in, JsonNode target, String path) {
        String at = path + ".price";
        JsonNode node = in.object(target, "price", at);
        if (node == null) {
            return Optional.empty();
        }
        in.onlyKeys(node, at, PRICE);
        double input = in.number(node, "input", at + ".input", 0)
                .orElseThrow(() -> in.problem(at, "has no input price (per million tokens)"));
        double output = in.number(node, "output", at + ".output", 0)
                .orElseThrow(() -> in.problem(at, "has no output price (per million tokens)"));
        OptionalDouble cached = in.number(node, "cached_input", at + ".cached_input", 0);
        OptionalDouble write = in.number(node, "cache_write", at + ".cache_write", 0);
        String currency = in.text(node, "currency", at + ".currency").orElse("USD");
        Price price = new Price(input, cached, write, output, currency);
        // A write that costs less than a read would make caching free money; it is a typo.
        if (write.isPresent() && price.cacheWrite() < price.cachedInput()) {
            throw in.problem(at + ".cache_write", "must be at least the cached_input price ("
                    + price.cachedInput() + "): writing a token to the cache costs the input price or more");
        }
        return Optional.of(price);
    }

    private static Budgets budgets(ConfigReader in, JsonNode top) {
        JsonNode node = in.object(top, "budgets", "budgets");
        if (node == null) {
            return Budgets.NONE;
        }
        OptionalInt fallback = OptionalInt.empty();
        Map<String, Integer> byGlob = new LinkedHashMap<>();
        for (Map.Entry<String, JsonNode> entry : ConfigReader.fields(node)) {
            String key = entry.getKey();
            OptionalInt budget = in.wholeNumber(node, key, "budgets." + key, 1);
            if (budget.isEmpty()) {
                continue;
            }
            if (key.equals("default")) {
                fallback = budget;
            } else {
                try {
                    Glob.of(key);
                } catch (TareException e) {
                    throw in.problem("budgets." + key, e.getMessage());
                }
                byGlob.put(key, budget.getAsInt());
            }
        }
        return new Budgets(fallback, byGlob);
    }

    /** {@code traffic}: calls a day per template glob, first match wins. */
    private static TrafficGlobs traffic(ConfigReader in, JsonNode top) {
        JsonNode node = in.object(top, "traffic", "traffic");
        if (node == null) {
            return TrafficGlobs.NONE;
        }
        Map<String, Double> byGlob = new LinkedHashMap<>();
        for (Map.Entry<String, JsonNode> entry : ConfigReader.fields(node)) {
            String key = entry.getKey();
            try {
                Glob.of(key);
            } catch (TareException e) {
                throw in.problem("traffic." + key, e.getMessage());
            }
            OptionalDouble calls = in.number(node, key, "traffic." + key, 0);
            calls.ifPresent(value -> byGlob.put(key, value));
        }
        return new TrafficGlobs(byGlob);
    }

    private static BaselineConfig baseline(ConfigReader in, JsonNode top) {
        JsonNode node = in.object(top, "baseline", "baseline");
        if (node == null) {
            return BaselineConfig.DEFAULT;
        }
        in.onlyKeys(node, "baseline", BASELINE);
        return new BaselineConfig(
                in.text(node, "file", "baseline.file").orElse(BaselineConfig.DEFAULT.file()),
                in.number(node, "tolerance_percent", "baseline.tolerance_percent", 0)
                        .orElse(BaselineConfig.DEFAULT.tolerancePercent()));
    }

    private static RulesConfig rules(ConfigReader in, JsonNode top) {
        JsonNode node = in.object(top, "rules", "rules");
        if (node == null) {
            return RulesConfig.DEFAULT;
        }
        in.onlyKeys(node, "rules", RULES);
        Map<String, String> severity = new LinkedHashMap<>();
        JsonNode severities = in.object(node, "severity", "rules.severity");
        if (severities != null) {
            for (Map.Entry<String, JsonNode> entry : ConfigReader.fields(severities)) {
                String at = "rules.severity." + entry.getKey();
                severity.put(entry.getKey(), in.text(severities, entry.getKey(), at)
                        .orElseThrow(() -> in.problem(at, "must be error, warning or info")));
            }
        }
        Map<String, Integer> limits = new LinkedHashMap<>();
        JsonNode limitNode = in.object(node, "limits", "rules.limits");
        if (limitNode != null) {
            in.onlyKeys(limitNode, "rules.limits", RulesConfig.LIMITS);
            for (Map.Entry<String, JsonNode> entry : ConfigReader.fields(limitNode)) {
                in.wholeNumber(limitNode, entry.getKey(), "rules.limits." + entry.getKey(), 1)
                        .ifPresent(value -> limits.put(entry.getKey(), value));
            }
        }
        return new RulesConfig(in.texts(node, "disable", "rules.disable"), severity,
                in.texts(node, "packs", "rules.packs"), limits);
    }
}
