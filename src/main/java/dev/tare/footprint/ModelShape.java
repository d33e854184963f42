package dev.tare.footprint;

import java.util.List;
import java.util.OptionalInt;

/**
 * The numbers of a decoder-only transformer that the footprint formulas need: what it stores
 * (memory), what one token uses (compute and batch-1 reads), how its KV cache grows, and where the
 * numbers came from.
 *
 * @param paramsTotal     parameters stored: every expert, embeddings, a vision tower (memory)
 * @param paramsActive    parameters one token uses: the routed experts it picks, not all (compute)
 * @param embeddingParams of those, the token embeddings and an untied output layer, which prefill
 *                        does not multiply for every token (0 when unknown)
 * @param outputParams    the output layer (vocabulary × hidden), multiplied once, for the last
 *                        position only (0 when unknown)
 * @param layers          transformer layers (L)
 * @param heads           attention (query) heads (H)
 * @param kvHeads         key/value heads (Hkv); 1 for multi-query attention
 * @param headDim         size of one attention head (D), as the attention scores use it
 * @param kv              how the KV cache grows per token and layer
 * @param experts         the mixture of experts, or {@link Experts#NONE}
 * @param contextLimit    the most tokens (input plus output) the model takes
 * @param notes           what the source says that Tare does not model, one line each
 * @param origin          where the shape came from, shown to users: a catalog name, a config file, inline
 * @param paramsComputed  whether the params were computed from the shape rather than stated by a source
 */
public record ModelShape(double paramsTotal, double paramsActive, double embeddingParams, double outputParams,
                         int layers, int heads, int kvHeads, int headDim, KvLayout kv, Experts experts,
                         OptionalInt contextLimit, List<String> notes, String origin, boolean paramsComputed) {

    public ModelShape {
        notes = List.copyOf(notes);
    }

    /** A dense shape with grouped-query (or multi-head) attention on every layer and no other detail. */
    public ModelShape(double params, int layers, int heads, int kvHeads, int headDim, String origin,
                      boolean paramsComputed) {
        this(params, params, 0, 0, layers, heads, kvHeads, headDim, KvLayout.full(2L * kvHeads * headDim),
                Experts.NONE, OptionalInt.empty(), List.of(), origin, paramsComputed);
    }

    /** The attention width H × D (d_attn in Kaplan et al. 2020). */
    public long attentionWidth() {
        return (long) heads * headDim;
    }

    /** Active parameters without the embeddings and output layer: Kaplan et al.'s N, for one token. */
    public double activeNonEmbeddingParams() {
        return Math.max(0, paramsActive - embeddingParams);
    }

    /** Layers that attend over the whole context. */
    public int globalLayers() {
        return layers - kv.windowedLayers();
    }

    /**
     * How one token's keys and values are kept in each layer.
     *
     * @param widthPerLayer  elements kept per token in one layer: 2 × Hkv × D, or the latent width
     *                       kv_lora_rank + qk_rope_head_dim for multi-head latent attention
     * @param latent         whether {@code widthPerLayer} is a compressed latent (MLA) rather than keys and values
     * @param windowedLayers layers that attend over a sliding window only
     * @param window         tokens a windowed layer keeps (0 when no layer is windowed)
     */
    public record KvLayout(long widthPerLayer, boolean latent, int windowedLayers, int window) {
        public KvLayout {
            if (widthPerLayer < 0 || windowedLayers < 0 || window < 0 || (windowedLayers > 0) != (window > 0)) {
                throw new IllegalArgumentException("inconsistent KV layout: " + widthPerLayer + ", " + windowedLayers
                        + " windowed layers of " + window);
            }
        }

        /** Keys and values for every token on every layer. */
        public static KvLayout full(long widthPerLayer) {
            return new KvLayout(widthPerLayer, false, 0, 0);
        }
    }

    /**
     * A mixture of experts: each token is routed to {@code perToken} of {@code count} experts.
     *
     * @param count          routed experts per MoE layer (E)
     * @param perToken       experts each token uses (k)
     * @param paramsPerExpert parameters of one routed expert, summed over every MoE layer
     */
    public record Experts(int count, int perToken, double paramsPerExpert) {
        /** A dense model. */
        public static final Experts NONE = new Experts(0, 0, 0);

        public Experts {
            if (count < 0 || perToken < 0 || perToken > count || paramsPerExpert < 0) {
                throw new IllegalArgumentException("inconsistent experts: " + perToken + " of " + count);
            }
        }

        /** Whether this is a mixture of experts. */
        public boolean present() {
            return count > 0;
        }
    }
}
