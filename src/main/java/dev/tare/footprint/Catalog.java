package dev.tare.footprint;

import com.fasterxml.jackson.databind.JsonNode;
import dev.tare.source.YamlDocument;
import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.Iterator;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;

/**
 * The model shapes and devices shipped with Tare, which a target may name instead of writing the
 * numbers out. Each entry carries its published source and whether its numbers were recalled from
 * memory rather than checked. The catalog holds no prices.
 */
public final class Catalog {
    private static final String RESOURCE = "/dev/tare/footprint/catalog.yaml";

    /**
     * A shipped model shape.
     *
     * @param name        the name a target uses
     * @param shape       the shape
     * @param description what kind of model it is
     * @param source      the paper and table, or the published config, the numbers come from
     * @param fromMemory  whether the numbers were recalled without being checked against the source
     */
    public record ModelEntry(String name, ModelShape shape, String description, String source, boolean fromMemory) {
    }

    /**
     * A shipped device.
     *
     * @param name        the name a target uses
     * @param device      the numbers
     * @param description what kind of device it is
     * @param source      where the numbers come from
     * @param fromMemory  whether the numbers were recalled without being checked against the source
     */
    public record DeviceEntry(String name, Device device, String description, String source, boolean fromMemory) {
    }

    private static final class Shipped {
        static final Catalog INSTANCE = load();
    }

    private final List<ModelEntry> models;
    private final List<DeviceEntry> devices;

    private Catalog(List<ModelEntry> models, List<DeviceEntry> devices) {
        this.models = List.copyOf(models);
        this.devices = List.copyOf(devices);
    }

    /** The catalog inside the jar. */
    public static Catalog shipped() {
        return Shipped.INSTANCE;
    }

    /** Every model shape, in catalog order. */
    public List<ModelEntry> models() {
        return models;
    }

    /** Every device, in catalog order. */
    public List<DeviceEntry> devices() {
        return devices;
    }

    /** The model shape called {@code name}. */
    public Optional<ModelEntry> model(String name) {
        return models.stream().filter(m -> m.name().equals(name)).findFirst();
    }

    /** The device called {@code name}. */
    public Optional<DeviceEntry> device(String name) {
        return devices.stream().filter(d -> d.name().equals(name)).findFirst();
    }

    /** The names of every model shape, for messages. */
    public List<String> modelNames() {
        return models.stream().map(ModelEntry::name).toList();
    }

    /** The names of every device, for messages. */
    public List<String> deviceNames() {
        return devices.stream().map(DeviceEntry::name).toList();
    }

    private static Catalog load() {
        String text;
        try (InputStream in = Catalog.class.getResourceAsStream(RESOURCE)) {
            if (in == null) {
                throw new IllegalStateException(RESOURCE + " is missing from the build");
            }
            text = new String(in.readAllBytes(), StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        JsonNode root = YamlDocument.parseYaml(text).root();
        List<ModelEntry> models = new ArrayList<>();
        for (Iterator<Map.Entry<String, JsonNode>> it = root.get("models").fields(); it.hasNext(); ) {
            Map.Entry<String, JsonNode> entry = it.next();
            models.add(model(entry.getKey(), entry.getValue()));
        }
        List<DeviceEntry> devices = new ArrayList<>();
        for (Iterator<Map.Entry<String, JsonNode>> it = root.get("devices").fields(); it.hasNext(); ) {
            Map.Entry<String, JsonNode> entry = it.next();
            devices.add(device(entry.getKey(), entry.getValue()));
        }
        return new Catalog(models, devices);
    }

    private static ModelEntry model(String name, JsonNode node) {
        int layers = node.get("layers").asInt();
        int heads = node.get("heads").asInt();
        int kvHeads = node.get("kv_heads").asInt();
        int headDim = node.get("head_dim").asInt();
        boolean computed = !node.has("params");
        ShapeBuilder shape = new ShapeBuilder().origin("catalog model " + name).attention(layers, heads, kvHeads, headDim);
        if (node.has("vocab_size") && node.has("hidden_size")) {
            long vocab = node.get("vocab_size").asLong();
            long hidden = node.get("hidden_size").asLong();
            boolean tied = node.path("tied_embeddings").asBoolean(false);
            shape.embeddings(Formulas.embeddingParams(vocab, hidden, tied), (double) vocab * hidden);
        }
        double params = computed
                ? Formulas.decoderParams(node.get("vocab_size").asLong(), node.get("hidden_size").asLong(), layers,
                heads, kvHeads, headDim, node.get("intermediate_size").asLong(),
                node.get("gated_feed_forward").asBoolean(), node.get("tied_embeddings").asBoolean())
                : node.get("params").asDouble();
        shape.params(params, node.has("params_active") ? node.get("params_active").asDouble() : params, computed);
        if (node.has("kv_latent_width")) {
            shape.latentKv(node.get("kv_latent_width").asLong());
        }
        if (node.has("window")) {
            shape.window(node.path("windowed_layers").asInt(layers), node.get("window").asInt());
        }
        if (node.has("experts")) {
            shape.experts(node.get("experts").asInt(), node.get("experts_per_token").asInt(), -1);
        }
        if (node.has("context_limit")) {
            shape.contextLimit(node.get("context_limit").asInt());
        }
        return new ModelEntry(name, shape.build(), node.get("description").asText(), node.get("source").asText(),
                node.get("from_memory").asBoolean());
    }

    private static DeviceEntry device(String name, JsonNode node) {
        Device device = new Device("catalog device " + name, number(node, "memory_gib"), number(node, "usable_fraction"),
                number(node, "peak_tflops"), number(node, "bandwidth_gbps"), number(node, "efficiency"),
                number(node, "bandwidth_efficiency"));
        return new DeviceEntry(name, device, node.get("description").asText(), node.get("source").asText(),
                node.get("from_memory").asBoolean());
    }

    private static OptionalDouble number(JsonNode node, String key) {
        return node.has(key) ? OptionalDouble.of(node.get(key).asDouble()) : OptionalDouble.empty();
    }
}
