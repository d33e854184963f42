package dev.tare.config;

import com.fasterxml.jackson.databind.JsonNode;
import dev.tare.TareException;
import dev.tare.footprint.Catalog;
import dev.tare.footprint.Device;
import dev.tare.footprint.ModelShape;
import dev.tare.footprint.Precision;
import dev.tare.footprint.ShapeBuilder;
import java.nio.file.Path;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.OptionalInt;
import java.util.Set;

/** Reads a target's model, precisions and device, resolving catalog names and model config files. */
final class DeploymentReader {
    private static final Set<String> MODEL = Set.of("catalog", "config", "params", "params_active", "layers", "heads",
            "kv_heads", "head_dim", "experts", "experts_per_token", "window", "windowed_layers", "kv_latent_width",
            "context_limit");
    private static final Set<String> DEVICE = Set.of("catalog", "memory_gib", "usable_fraction", "peak_tflops",
            "bandwidth_gbps", "efficiency", "bandwidth_efficiency");

    private final ConfigReader in;
    private final Path root;

    DeploymentReader(ConfigReader in, Path root) {
        this.in = in;
        this.root = root;
    }

    /** The target's {@code model}: a catalog name, or a mapping of numbers, a catalog name or a config file. */
    Optional<ModelShape> model(JsonNode target, String path) {
        String at = path + ".model";
        JsonNode node = target.get("model");
        if (node == null || node.isNull()) {
            return Optional.empty();
        }
        if (node.isTextual()) {
            return Optional.of(catalogModel(node.asText().strip(), at));
        }
        if (!node.isObject()) {
            throw in.problem(at, "must be a catalog model name or a mapping such as "
                    + "{params: 7e9, layers: 32, heads: 32, kv_heads: 8, head_dim: 128} or {config: path/to/config.json}");
        }
        in.onlyKeys(node, at, MODEL);
        Optional<String> catalog = in.text(node, "catalog", at + ".catalog");
        Optional<String> config = in.text(node, "config", at + ".config");
        if (catalog.isPresent() && config.isPresent()) {
            throw in.problem(at, "names both a catalog model and a config file; keep one");
        }
        Optional<ModelShape> base = catalog.map(name -> catalogModel(name, at + ".catalog"))
                .or(() -> config.map(file -> ModelConfigFile.read(root, file, in, at + ".config")));
        OptionalDouble params = positive(node, "params", at);
        OptionalDouble active = positive(node, "params_active", at);
        OptionalInt layers = in.wholeNumber(node, "layers", at + ".layers", 1);
        OptionalInt heads = in.wholeNumber(node, "heads", at + ".heads", 1);
        OptionalInt kvHeads = in.wholeNumber(node, "kv_heads", at + ".kv_heads", 1);
        OptionalInt headDim = in.wholeNumber(node, "head_dim", at + ".head_dim", 1);
        OptionalInt experts = in.wholeNumber(node, "experts", at + ".experts", 1);
        OptionalInt perToken = in.wholeNumber(node, "experts_per_token", at + ".experts_per_token", 1);
        OptionalInt window = in.wholeNumber(node, "window", at + ".window", 1);
        OptionalInt windowed = in.wholeNumber(node, "windowed_layers", at + ".windowed_layers", 0);
        OptionalInt latent = in.wholeNumber(node, "kv_latent_width", at + ".kv_latent_width", 1);
        OptionalInt context = in.wholeNumber(node, "context_limit", at + ".context_limit", 1);
        if (base.isEmpty()) {
            for (String key : new String[] {"params", "layers", "heads", "head_dim"}) {
                if (!node.has(key)) {
                    throw in.problem(at, "has no " + key + "; give params, layers, heads, kv_heads and head_dim,"
                            + " or catalog: NAME, or config: path/to/config.json");
                }
            }
        }
        ShapeBuilder shape = base.map(ShapeBuilder::new).orElseGet(ShapeBuilder::new);
        boolean overridden = base.isPresent() && MODEL.stream().anyMatch(k -> !k.equals("catalog") && !k.equals("config")
                && node.has(k));
        int h = heads.orElse(shape.heads());
        int kv = kvHeads.orElse(base.isPresent() ? shape.kvHeads() : h);
        if (kv > h || h % kv != 0) {
            throw in.problem(at + (kvHeads.isPresent() ? ".kv_heads" : ".heads"), "kv_heads (" + kv
                    + ") must divide heads (" + h + ") evenly: each KV head serves a whole group of query heads");
        }
        ModelShape start = shape.build();
        shape.attention(layers.orElse(start.layers()), h, kv, headDim.orElse(start.headDim()));
        params.ifPresent(shape::paramsTotal);
        active.ifPresent(shape::paramsActive);
        latent.ifPresent(shape::latentKv);
        context.ifPresent(shape::contextLimit);
        if (window.isPresent() || windowed.isPresent()) {
            int tokens = window.orElse(start.kv().window());
            if (tokens == 0) {
                throw in.problem(at + ".windowed_layers", "names windowed layers but no window; add window: TOKENS");
            }
            int count = windowed.orElse(layers.orElse(start.layers()));
            if (count > layers.orElse(start.layers())) {
                throw in.problem(at + ".windowed_layers", count + " windowed layers is more than the "
                        + layers.orElse(start.layers()) + " layers; give at most that many");
            }
            shape.window(count, tokens);
        }
        if (experts.isPresent() || perToken.isPresent()) {
            int e = experts.orElse(shape.experts());
            int k = perToken.orElse(start.experts().perToken());
            if (e == 0 || k == 0 || k > e) {
                throw in.problem(at + ".experts_per_token", "give experts and experts_per_token together, with"
                        + " experts_per_token at most experts (got " + k + " of " + e + ")");
            }
            shape.experts(e, k, -1);
        }
        ModelShape built = shape.origin(overridden ? start.origin() + " with overrides" : start.origin()).build();
        if (built.paramsActive() > built.paramsTotal()) {
            throw in.problem(at + ".params_active", "is more than params (" + built.paramsActive() + " > "
                    + built.paramsTotal() + "); active params are the part of the total one token uses");
        }
        if (built.experts().present() && built.paramsActive() == built.paramsTotal()) {
            throw in.problem(at + ".params_active", "is missing or equal to params for a mixture of experts; give"
                    + " the params one token uses (params_active), which are fewer than the total");
        }
        return Optional.of(built);
    }

    /** {@code weight_bits} or {@code kv_bits}: a precision name or a number of bits. */
    OptionalDouble bits(JsonNode target, String key, String path) {
        String at = path + "." + key;
        JsonNode node = target.get(key);
        if (node == null || node.isNull()) {
            return OptionalDouble.empty();
        }
        try {
            if (node.isNumber()) {
                return OptionalDouble.of(Precision.check(node.asDouble()));
            }
            if (node.isTextual()) {
                return OptionalDouble.of(Precision.parse(node.asText()));
            }
        } catch (TareException e) {
            throw in.problem(at, e.getMessage());
        }
        throw in.problem(at, "must be a precision name (" + String.join(", ", Precision.names().keySet())
                + ") or a number of bits such as 4.5");
    }

    /** The target's {@code device}: a catalog name, or a mapping of numbers with an optional catalog base. */
    Optional<Device> device(JsonNode target, String path) {
        String at = path + ".device";
        JsonNode node = target.get("device");
        if (node == null || node.isNull()) {
            return Optional.empty();
        }
        if (node.isTextual()) {
            return Optional.of(catalogDevice(node.asText().strip(), at));
        }
        if (!node.isObject()) {
            throw in.problem(at, "must be a catalog device name or a mapping such as {memory_gib: 16,"
                    + " usable_fraction: 0.75, peak_tflops: 25, bandwidth_gbps: 120, efficiency: 0.4}");
        }
        in.onlyKeys(node, at, DEVICE);
        Optional<Device> base = in.text(node, "catalog", at + ".catalog").map(name -> catalogDevice(name, at + ".catalog"));
        Device start = base.orElse(new Device("inline", OptionalDouble.empty(), OptionalDouble.empty(),
                OptionalDouble.empty(), OptionalDouble.empty(), OptionalDouble.empty()));
        boolean overridden = base.isPresent() && node.size() > 1;
        return Optional.of(new Device(overridden ? start.origin() + " with overrides" : start.origin(),
                or(positive(node, "memory_gib", at), start.memoryGib()),
                or(fraction(node, "usable_fraction", at), start.usableFraction()),
                or(positive(node, "peak_tflops", at), start.peakTflops()),
                or(positive(node, "bandwidth_gbps", at), start.bandwidthGbps()),
                or(fraction(node, "efficiency", at), start.efficiency()),
                or(fraction(node, "bandwidth_efficiency", at), start.bandwidthEfficiency())));
    }

    private ModelShape catalogModel(String name, String at) {
        return Catalog.shipped().model(name).map(Catalog.ModelEntry::shape)
                .orElseThrow(() -> in.problem(at, "unknown catalog model '" + name + "'; the catalog has "
                        + String.join(", ", Catalog.shipped().modelNames()) + " (see 'tare targets --catalog')"));
    }

    private Device catalogDevice(String name, String at) {
        return Catalog.shipped().device(name).map(Catalog.DeviceEntry::device)
                .orElseThrow(() -> in.problem(at, "unknown catalog device '" + name + "'; the catalog has "
                        + String.join(", ", Catalog.shipped().deviceNames()) + " (see 'tare targets --catalog')"));
    }

    private static OptionalDouble or(OptionalDouble value, OptionalDouble fallback) {
        return value.isPresent() ? value : fallback;
    }

    private OptionalDouble positive(JsonNode node, String key, String at) {
        JsonNode value = node.get(key);
        if (value == null || value.isNull()) {
            return OptionalDouble.empty();
        }
        if (!value.isNumber() || !Double.isFinite(value.asDouble()) || value.asDouble() <= 0) {
            throw in.problem(at + "." + key, "must be a number above 0 (got " + value + ")");
        }
        return OptionalDouble.of(value.asDouble());
    }

    private OptionalDouble fraction(JsonNode node, String key, String at) {
        OptionalDouble value = positive(node, key, at);
        if (value.isPresent() && value.getAsDouble() > 1) {
            throw in.problem(at + "." + key, "must be a fraction above 0 and at most 1 (got " + node.get(key) + ")");
        }
        return value;
    }
}
