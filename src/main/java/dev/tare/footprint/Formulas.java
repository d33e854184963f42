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

    /** kv_cache_bytes = kv_bytes_per_token × (I + O): the cache one request holds at its longest, every layer global. */
    public static double kvCacheBytes(double kvBytesPerToken, long tokens) {
        return kvBytesPerToken * tokens;
    }

    /**
     * KV bytes one token adds over every layer, windows aside: Σ over layers width × kv_bits / 8, the
     * width being 2 × Hkv × D (GQA, Ainslie et al. 2023; MQA, Shazeer 2019, has Hkv = 1) or, for
     * multi-head latent attention, kv_lora_rank + qk_rope_head_dim with no factor 2 (DeepSeek-V2
     * paper, §2.1: the compressed latent and the decoupled rotary key are what is cached).
     */
    public static double kvBytesPerToken(ModelShape model, double kvBits) {
        return (double) model.layers() * model.kv().widthPerLayer() * kvBits / 8;
    }

    /**
     * kv_cache_bytes = Σ over layers min(I + O, window_layer) × width × kv_bits / 8, window_layer = ∞
     * for global layers: a sliding-window layer keeps a rolling buffer of its window only (Mistral 7B
     * paper, Jiang et al. 2023, §2 "Rolling Buffer Cache").
     */
    public static double kvCacheBytes(ModelShape model, long tokens, double kvBits) {
        ModelShape.KvLayout kv = model.kv();
        double tokenLayers = (double) model.globalLayers() * tokens
                + (double) kv.windowedLayers() * Math.min(tokens, kv.window());
        return tokenLayers * kv.widthPerLayer() * kvBits / 8;
    }

    /**
     * KV bytes of a prefix shared by concurrent requests: a server that keeps the prefix's whole blocks
     * stores them once for every request that starts with it (Kwon et al., SOSP 2023, "Efficient
     * Memory Management for Large Language Model Serving with PagedAttention", §4.4, shared prefix).
     * Only global layers are counted: a sliding-window layer's rolling buffer soon holds each request's
     * own latest tokens, so its share is taken as none.
     */
    public static double sharedKvCacheBytes(ModelShape model, long sharedTokens, double kvBits) {
        return (double) model.globalLayers() * sharedTokens * model.kv().widthPerLayer() * kvBits / 8;
    }

    /**
     * Attention-score FLOPs of one token that sees {@code context} tokens: 2 × d_attn × n_ctx per
     * layer (Kaplan et al. 2020, Table 1), with n_ctx capped at the window on windowed layers.
     */
    public static double attentionFlopsPerToken(ModelShape model, long context) {
        ModelShape.KvLayout kv = model.kv();
        double seen = (double) model.globalLayers() * context
                + (double) kv.windowedLayers() * Math.min(context, kv.window());
        return 2.0 * model.attentionWidth() * seen;
    }

    /**
     * prefill_flops = 2 × N_active_nonembedding × I + 2 × L × I² × (H × D) + 2 × output_params:
     * Kaplan et al. 2020 ("Scaling Laws for Neural Language Models", Table 1) count
     * 2N + 2·n_layer·n_ctx·d_attn per token with N excluding embeddings, summed here over the I prompt
     * tokens with n_ctx = I; the output layer's logits are needed for the last prompt position only.
     */
    public static double prefillFlops(ModelShape model, long inputTokens) {
        if (inputTokens == 0) {
            return 0;
        }
        return 2 * model.activeNonEmbeddingParams() * inputTokens
                + inputTokens * attentionFlopsPerToken(model, inputTokens) + 2 * model.outputParams();
    }

    /** {@link #prefillFlops(ModelShape, long)} of a dense shape known by its params only. */
    public static double prefillFlops(double params, int layers, long attentionWidth, long inputTokens) {
        return prefillFlops(new ModelShape(params, layers, (int) attentionWidth, 1, 1, "formula", false), inputTokens);
    }

    /**
     * prefill_ms = 1000 × max(prefill_flops / (peak_tflops × 1e12 × efficiency), weight_bytes_read /
     * (bandwidth_gbps × 1e9 × bandwidth_efficiency)): prefill takes at least the compute time and at
     * least one read of every weight it uses.
     */
    public static double prefillMillis(double prefillFlops, double weightBytes, double peakTflops, double efficiency,
                                       double bandwidthGbps, double bandwidthEfficiency) {
        double compute = prefillFlops / (peakTflops * 1e12 * efficiency);
        double memory = weightBytes / (bandwidthGbps * 1e9 * bandwidthEfficiency);
        return 1000 * Math.max(compute, memory);
    }

    /** {@link #prefillMillis(double, double, double, double, double, double)} at the full bandwidth. */
    public static double prefillMillis(double prefillFlops, double weightBytes, double peakTflops, double efficiency,
                                       double bandwidthGbps) {
        return prefillMillis(prefillFlops, weightBytes, peakTflops, efficiency, bandwidthGbps, 1);
    }

    /**
     * decode_ms_per_token at batch 1 and full bandwidth, reads only: 1000 × (weight_bytes +
     * kv_cache_bytes) / (bandwidth_gbps × 1e9); {@link #stepMillis} is the general form.
     */
    public static double decodeMillisPerToken(double weightBytes, double kvCacheBytes, double bandwidthGbps) {
        return stepMillis(weightBytes + kvCacheBytes, bandwidthGbps, 1, 0, 0, 0);
    }

    /**
     * Routed experts that {@code tokens} tokens are expected to touch in one MoE layer under uniform
     * routing: E × (1 − (1 − k/E)^B), as each expert is missed by one token with chance 1 − k/E (from
     * memory; real routers are not uniform, so this is the expectation of an idealised router).
     */
    public static double expertsTouched(int experts, int perToken, double tokens) {
        if (experts == 0) {
            return 0;
        }
        return experts * (1 - Math.pow(1 - (double) perToken / experts, tokens));
    }

    /**
     * Parameters read by one forward step over {@code tokens} tokens at once: the active ones, plus
     * for a mixture of experts the further experts those tokens are expected to touch
     * ({@link #expertsTouched}).
     */
    public static double paramsRead(ModelShape model, double tokens) {
        ModelShape.Experts e = model.experts();
        if (!e.present() || tokens <= 1) {
            return model.paramsActive();
        }
        double touched = expertsTouched(e.count(), e.perToken(), tokens);
        return model.paramsActive() + e.paramsPerExpert() * (touched - e.perToken());
    }

    /**
     * Bytes one decode step reads at batch B: the weights the B tokens use ({@link #paramsRead} ×
     * weight_bits / 8) plus each of the B requests' KV cache.
     */
    public static double decodeBytesPerStep(ModelShape model, double weightBits, double kvCacheBytes, int batch) {
        return paramsRead(model, batch) * weightBits / 8 + batch * kvCacheBytes;
    }

    /**
     * FLOPs of one decode step at batch B: B × (2 × N_active_nonembedding + 2 × output_params +
     * attention over {@code context} tokens) (Kaplan et al. 2020, Table 1, per token).
     */
    public static double decodeFlopsPerStep(ModelShape model, long context, int batch) {
        return batch * (2 * model.activeNonEmbeddingParams() + 2 * model.outputParams()
                + attentionFlopsPerToken(model, context));
    }

    /**
     * step_ms = 1000 × max(bytes / (bandwidth × bandwidth_efficiency), flops / (peak × efficiency)): a
     * decode step waits for its reads or its arithmetic, whichever is longer; reads alone without a peak.
     */
    public static double stepMillis(double bytes, double bandwidthGbps, double bandwidthEfficiency, double flops,
                                    double peakTflops, double efficiency) {
        double memory = bytes / (bandwidthGbps * 1e9 * bandwidthEfficiency);
        double compute = peakTflops > 0 && efficiency > 0 ? flops / (peakTflops * 1e12 * efficiency) : 0;
        return 1000 * Math.max(memory, compute);
    }

    /** tokens_per_second of one request = 1000 / step_ms; a batch of B makes B times as many in total. */
    public static double tokensPerSecond(double stepMillis) {
        return stepMillis > 0 ? 1000 / stepMillis : 0;
    }

    /** end_to_end_ms = time_to_first_token_ms + O × step_ms. */
    public static double endToEndMillis(double timeToFirstTokenMillis, long outputTokens, double stepMillis) {
        return timeToFirstTokenMillis + outputTokens * stepMillis;
    }

    /**
     * max_concurrent = floor((memory_gib × 2^30 × usable_fraction − weight_bytes) / kv_cache_bytes),
     * 0 when the weights alone do not fit.
     */
    public static long maxConcurrent(double memoryGib, double usableFraction, double weightBytes, double kvCacheBytes) {
        return maxConcurrent(memoryGib, usableFraction, weightBytes, 0, kvCacheBytes);
    }

    /**
     * max_concurrent = floor((memory × usable − weight_bytes − kv_shared) / kv_per_request): the
     * shared prefix's KV is held once, each request adds only its own part.
     */
    public static long maxConcurrent(double memoryGib, double usableFraction, double weightBytes, double sharedKvBytes,
                                     double kvCacheBytes) {
        double free = memoryGib * BYTES_PER_GIB * usableFraction - weightBytes - sharedKvBytes;
        if (free <= 0 || kvCacheBytes <= 0) {
            return 0;
        }
        return (long) Math.floor(free / kvCacheBytes);
    }

    /**
     * cost_per_call = ((I − cached) × input + cached × cached_input + O × output) / 1e6, prices per
     * million tokens: every cached token read from the cache.
     */
    public static double costPerCall(long inputTokens, long cachedTokens, long outputTokens, double inputPerMillion,
                                     double cachedInputPerMillion, double outputPerMillion) {
        return costPerCall(inputTokens, cachedTokens, 1, outputTokens, inputPerMillion, cachedInputPerMillion,
                inputPerMillion, outputPerMillion);
    }

    /**
     * cost_per_call = ((I − C) × p_in + C × (h × p_cached + (1 − h) × p_write) + O × p_out) / 1e6
     * (design.md, "Prefix caching — hosted"): of the C cacheable tokens, a share h is read from the
     * cache and the rest is written to it, at the write price (the input price when the provider
     * charges no premium).
     */
    public static double costPerCall(long inputTokens, long cacheableTokens, double hitRate, long outputTokens,
                                     double inputPerMillion, double cachedInputPerMillion, double cacheWritePerMillion,
                                     double outputPerMillion) {
        double cacheable = cacheableTokens * (hitRate * cachedInputPerMillion + (1 - hitRate) * cacheWritePerMillion);
        return ((inputTokens - cacheableTokens) * inputPerMillion + cacheable + outputTokens * outputPerMillion) / 1e6;
    }

    /**
     * C = 0 when P &lt; min, else min + floor((P − min) / step) × step: providers cache a prefix from a
     * minimum length on, in steps (design.md, "Prefix caching — hosted"). With min = step = a block
     * size this is a self-hosted server's whole blocks, floor(P / block) × block (PagedAttention,
     * Kwon et al. 2023).
     */
    public static int cacheableTokens(int prefixTokens, int minTokens, int stepTokens) {
        if (minTokens < 1 || stepTokens < 1) {
            throw new IllegalArgumentException("the cache's minimum and step must be at least 1 token");
        }
        if (prefixTokens < minTokens) {
            return 0;
        }
        return minTokens + (prefixTokens - minTokens) / stepTokens * stepTokens;
    }

    /**
     * h = 1 − e^(−λ × ttl), λ the calls per second that share the cached prefix: with calls arriving
     * as a Poisson process and each hit keeping the entry alive for another ttl, a call finds the
     * entry when the call before it came less than ttl earlier (design.md, "Prefix caching — hosted").
     */
    public static double hitRate(double callsPerDay, double ttlSeconds) {
        if (callsPerDay <= 0 || ttlSeconds <= 0) {
            return 0;
        }
        return 1 - Math.exp(-callsPerDay / SECONDS_PER_DAY * ttlSeconds);
    }

    /**
     * The traffic below which caching a prefix costs more than it saves, in calls per day of every
     * template sharing it: caching pays when h × p_cached + (1 − h) × p_write &lt; p_in, so from
     * h* = (p_write − p_in) / (p_write − p_cached) on, reached at λ* = −ln(1 − h*) / ttl. 0 when
     * writes carry no premium (caching never costs more); infinite when reads cost no less than
     * uncached input or the entry lives no time (it never pays).
     */
    public static double breakEvenCallsPerDay(double ttlSeconds, double inputPerMillion, double cachedInputPerMillion,
                                              double cacheWritePerMillion) {
        if (cacheWritePerMillion <= inputPerMillion) {
            return 0;
        }
        if (cachedInputPerMillion >= inputPerMillion || ttlSeconds <= 0) {
            return Double.POSITIVE_INFINITY;
        }
        double hit = (cacheWritePerMillion - inputPerMillion) / (cacheWritePerMillion - cachedInputPerMillion);
        return -Math.log(1 - hit) / ttlSeconds * SECONDS_PER_DAY;
    }

    /**
     * prefill_flops when the first {@code cachedTokens} of the prompt are already in the KV cache:
     * only the I − C_b new tokens are computed, each attending to all tokens before it,
     * 2 × N_active × (I − C_b) + 2 × L × (I² − C_b²) × (H × D) (design.md, "Prefix caching —
     * self-hosted").
     */
    public static double prefillFlops(ModelShape model, long inputTokens, long cachedTokens) {
        if (cachedTokens <= 0) {
            return prefillFlops(model, inputTokens);
        }
        long cached = Math.min(cachedTokens, inputTokens);
        if (cached == inputTokens) {
            return 2 * model.outputParams();
        }
        return prefillFlops(model, inputTokens) - prefillFlops(model, cached) + 2 * model.outputParams();
    }

    private static final double SECONDS_PER_DAY = 86_400;

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
        return embeddingParams(vocab, hidden, tiedEmbeddings)
                + layers * (attentionParams(hidden, heads, kvHeads, headDim)
                + feedForwardParams(hidden, feedForward, gatedFeedForward));
    }

    /** Token embeddings V × d, and as many again for an output layer not tied to them. */
    public static double embeddingParams(long vocab, long hidden, boolean tiedEmbeddings) {
        return (double) vocab * hidden * (tiedEmbeddings ? 1 : 2);
    }

    /** One layer's attention projections: query and output 2 × d × H·D, key and value 2 × d × Hkv·D. */
    public static double attentionParams(long hidden, int heads, int kvHeads, int headDim) {
        return 2.0 * hidden * heads * headDim + 2.0 * hidden * kvHeads * headDim;
    }

    /**
     * One layer's multi-head latent attention (DeepSeek-V2 paper, §2.1): queries through a rank
     * q_lora_rank down- and up-projection (d × r_q + r_q × H × (nope + rope)), or straight
     * (d × H × (nope + rope)) when there is none; keys and values down to the latent plus the shared
     * rotary key (d × (r_kv + rope)), up again per head (r_kv × H × (nope + v)); output H × v × d.
     */
    public static double latentAttentionParams(long hidden, int heads, int qLoraRank, int kvLoraRank, int qkNopeDim,
                                               int qkRopeDim, int vHeadDim) {
        double qk = (double) heads * (qkNopeDim + qkRopeDim);
        double query = qLoraRank > 0 ? (double) hidden * qLoraRank + qLoraRank * qk : hidden * qk;
        double keyValue = (double) hidden * (kvLoraRank + qkRopeDim)
                + (double) kvLoraRank * heads * (qkNopeDim + vHeadDim);
        double output = (double) heads * vHeadDim * hidden;
        return query + keyValue + output;
    }

    /** One feed-forward block: two matrices d × F, or three when gated (SwiGLU, GeGLU). */
    public static double feedForwardParams(long hidden, long feedForward, boolean gated) {
        return (gated ? 3.0 : 2.0) * hidden * feedForward;
    }

    /** A mixture-of-experts router: one score per expert from the hidden state, d × E. */
    public static double routerParams(long hidden, int experts) {
        return (double) hidden * experts;
    }

    /**
     * A vision encoder's transformer blocks: per layer 4 × d² for attention and 2 × d × F for an
     * ungated feed-forward (the usual vision-transformer block, from memory); patch embedding and
     * projector left out.
     */
    public static double visionParams(long hidden, long feedForward, int layers) {
        return layers * (4.0 * hidden * hidden + 2.0 * hidden * feedForward);
    }
}
