package dev.tare.footprint;

import java.util.ArrayList;
import java.util.List;
import java.util.OptionalInt;

/**
 * Builds a {@link ModelShape} from what a source states: a config file, an inline shape in
 * {@code tare.yaml} or a catalog entry. Unset figures take the dense defaults: active params equal
 * total params, keys and values of every KV head on every layer, no window, no experts.
 */
public final class ShapeBuilder {
    private double paramsTotal;
    private double paramsActive = -1;
    private double embeddingParams;
    private double outputParams;
    private int layers;
    private int heads;
    private int kvHeads;
    private int headDim;
    private long kvWidth = -1;
    private boolean latent;
    private int windowedLayers;
    private int window;
    private int experts;
    private int expertsPerToken;
    private double paramsPerExpert = -1;
    private OptionalInt contextLimit = OptionalInt.empty();
    private final List<String> notes = new ArrayList<>();
    private String origin = "inline";
    private boolean computed;

    /** A builder starting from nothing. */
    public ShapeBuilder() {
    }

    /** A builder starting from {@code shape}, to override some of its figures. */
    public ShapeBuilder(ModelShape shape) {
        paramsTotal = shape.paramsTotal();
        paramsActive = shape.paramsActive();
        embeddingParams = shape.embeddingParams();
        outputParams = shape.outputParams();
        layers = shape.layers();
        heads = shape.heads();
        kvHeads = shape.kvHeads();
        headDim = shape.headDim();
        kvWidth = shape.kv().widthPerLayer();
        latent = shape.kv().latent();
        windowedLayers = shape.kv().windowedLayers();
        window = shape.kv().window();
        experts = shape.experts().count();
        expertsPerToken = shape.experts().perToken();
        paramsPerExpert = shape.experts().paramsPerExpert();
        contextLimit = shape.contextLimit();
        notes.addAll(shape.notes());
        origin = shape.origin();
        computed = shape.paramsComputed();
    }

    public ShapeBuilder params(double total, double active, boolean computedFromShape) {
        paramsTotal = total;
        paramsActive = active;
        computed = computedFromShape;
        return this;
    }

    /** Stated total params: active params follow unless set later, and the per-expert size is derived again. */
    public ShapeBuilder paramsTotal(double total) {
        paramsTotal = total;
        computed = false;
        paramsPerExpert = -1;
        return this;
    }

    public ShapeBuilder paramsActive(double active) {
        paramsActive = active;
        paramsPerExpert = -1;
        return this;
    }

    /** The embeddings (and an untied output layer) and the output layer, in params. */
    public ShapeBuilder embeddings(double embedding, double output) {
        embeddingParams = embedding;
        outputParams = output;
        return this;
    }

    public ShapeBuilder attention(int layerCount, int queryHeads, int keyValueHeads, int headSize) {
        layers = layerCount;
        heads = queryHeads;
        kvHeads = keyValueHeads;
        headDim = headSize;
        if (!latent) {
            kvWidth = -1;
        }
        return this;
    }

    /** A latent KV cache of {@code width} elements per token and layer (multi-head latent attention). */
    public ShapeBuilder latentKv(long width) {
        kvWidth = width;
        latent = true;
        return this;
    }

    /** {@code count} layers attending over a window of {@code tokens}; none when either is 0. */
    public ShapeBuilder window(int count, int tokens) {
        windowedLayers = tokens > 0 ? count : 0;
        window = count > 0 ? tokens : 0;
        return this;
    }

    public ShapeBuilder experts(int count, int perToken, double perExpert) {
        experts = count;
        expertsPerToken = perToken;
        paramsPerExpert = perExpert;
        return this;
    }

    public ShapeBuilder contextLimit(int tokens) {
        contextLimit = OptionalInt.of(tokens);
        return this;
    }

    public ShapeBuilder note(String line) {
        notes.add(line);
        return this;
    }

    public ShapeBuilder origin(String where) {
        origin = where;
        return this;
    }

    public int layers() {
        return layers;
    }

    public int heads() {
        return heads;
    }

    public int kvHeads() {
        return kvHeads;
    }

    public int experts() {
        return experts;
    }

    /** The shape. */
    public ModelShape build() {
        double active = paramsActive < 0 ? paramsTotal : paramsActive;
        double perExpert = paramsPerExpert;
        if (perExpert < 0) {
            perExpert = experts > expertsPerToken ? Math.max(0, (paramsTotal - active) / (experts - expertsPerToken)) : 0;
        }
        long width = kvWidth < 0 ? 2L * kvHeads * headDim : kvWidth;
        return new ModelShape(paramsTotal, active, embeddingParams, outputParams, layers, heads, kvHeads, headDim,
                new ModelShape.KvLayout(width, latent, Math.min(windowedLayers, layers), window),
                new ModelShape.Experts(experts, expertsPerToken, perExpert), contextLimit, notes, origin, computed);
    }
}
