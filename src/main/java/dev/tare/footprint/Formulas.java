package dev.tare.footprint;

/**
 * The one place each footprint formula is written, with its source. Every result is a planning
 * estimate: real servers add activations, fragmentation, kernels that fall short of peak and
 * framework overhead that these formulas leave out.
 */
public final class Formulas {
    /** Bytes in a GiB, the unit device memory is configured in. */
    public static final double BYTES_PER_GIB = 1L << 30;

    private Formulas() {
    }

    /** weight_bytes = P × weight_bits / 8. */
    public static double weightBytes(double params, double weightBits) {
        return params * weightBits / 8;
    }

    /**
     * kv_bytes_per_token = 2 × L × Hkv × D × kv_bits / 8: one key and one value vector per KV head
     * in every layer (Kwon et al., SOSP 2023, "Efficient Memory Management for Large Language Model
     * Serving with PagedAttention", §3).
     */
    public static double kvBytesPerToken(int layers, int kvHeads, int headDim, double kvBits) {
        return 2.0 * layers * kvHeads * headDim * kvBits / 8;
    }

    /** kv_cache_bytes = kv_bytes_per_token × (I + O): the cache one request holds at its longest. */
    public static double kvCacheBytes(double kvBytesPerToken, long tokens) {
        return kvBytesPerToken * tokens;
    }

    /**
     * prefill_flops = 2 × P × I + 2 × L × I² × (H × D): the forward pass costs 2N + 2·n_layer·n_ctx·d_attn
     * per token (Kaplan et al. 2020, "Scaling Laws for Neural Language Models", Table 1), summed over
     * the I prompt tokens with n_ctx = I.
     */
    public static double prefillFlops(double params, int layers, long attentionWidth, long inputTokens) {
        double i = inputTokens;
        return 2 * params * i + 2.0 * layers * i * i * attentionWidth;
    }

    /**
     * prefill_ms = 1000 × max(prefill_flops / (peak_tflops × 1e12 × efficiency), weight_bytes / (bandwidth_gbps × 1e9)):
     * prefill takes at least the compute time and at least one read of every weight.
     */
    public static double prefillMillis(double prefillFlops, double weightBytes, double peakTflops, double efficiency,
                                       double bandwidthGbps) {
        double compute = prefillFlops / (peakTflops * 1e12 * efficiency);
        double memory = weightBytes / (bandwidthGbps * 1e9);
        return 1000 * Math.max(compute, memory);
    }

    /**
     * decode_ms_per_token = 1000 × (weight_bytes + kv_cache_bytes) / (bandwidth_gbps × 1e9): each new
     * token reads every weight and the whole KV cache once (one request, no batching).
     */
    public static double decodeMillisPerToken(double weightBytes, double kvCacheBytes, double bandwidthGbps) {
        return 1000 * (weightBytes + kvCacheBytes) / (bandwidthGbps * 1e9);
    }

    /**
     * max_concurrent = floor((memory_gib × 2^30 × usable_fraction − weight_bytes) / kv_cache_bytes),
     * 0 when the weights alone do not fit.
     */
    public static long maxConcurrent(double memoryGib, double usableFraction, double weightBytes, double kvCacheBytes) {
        double free = memoryGib * BYTES_PER_GIB * usableFraction - weightBytes;
        if (free <= 0 || kvCacheBytes <= 0) {
            return 0;
        }
        return (long) Math.floor(free / kvCacheBytes);
    }

    /**
     * cost_per_call = ((I − cached) × input + cached × cached_input + O × output) / 1e6, prices per
     * million tokens.
     */
    public static double costPerCall(long inputTokens, long cachedTokens, long outputTokens, double inputPerMillion,
                                     double cachedInputPerMillion, double outputPerMillion) {
        return ((inputTokens - cachedTokens) * inputPerMillion + cachedTokens * cachedInputPerMillion
                + outputTokens * outputPerMillion) / 1e6;
    }

    /** cost_per_month = cost_per_call × calls_per_day × 30. */
    public static double costPerMonth(double costPerCall, double callsPerDay) {
        return costPerCall * callsPerDay * 30;
    }

    /**
     * Parameters of a decoder-only transformer from its shape, for a model config that does not
     * state them: token embeddings (V × d), an output projection unless tied to them, and per layer
     * the query and output projections (2 × d × H·D), the key and value projections (2 × d × Hkv·D)
     * and a feed-forward block of two matrices (2 × d × F), or three when gated (3 × d × F). Biases
     * and norms are left out (under 0.1% of the total for the shapes in the catalog); this is the
     * usual accounting of the weight matrices (common practice, no source).
     */
    public static double decoderParams(long vocab, long hidden, int layers, int heads, int kvHeads, int headDim,
                                       long feedForward, boolean gatedFeedForward, boolean tiedEmbeddings) {
        double embeddings = (double) vocab * hidden * (tiedEmbeddings ? 1 : 2);
        double attention = 2.0 * hidden * heads * headDim + 2.0 * hidden * kvHeads * headDim;
        double feedForwardWeights = (gatedFeedForward ? 3.0 : 2.0) * hidden * feedForward;
        return embeddings + layers * (attention + feedForwardWeights);
    }
}
