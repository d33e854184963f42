package dev.tare.config;

import com.fasterxml.jackson.databind.JsonNode;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;

/**
 * What a model config's family implies when its keys leave it out: whether the feed-forward block
 * is gated, whether the output layer is tied to the embeddings, and which keys change memory or
 * compute in ways Tare does not model. Families are told by {@code model_type}, and where a type is
 * not listed here, by keys only that family's configs carry; the lists are from memory of the
 * published configs and of the modelling code that reads them.
 */
final class ModelFamilies {
    /** Families whose feed-forward is gated (SwiGLU or GeGLU: three matrices). */
    private static final Set<String> GATED = Set.of("mistral", "mixtral", "qwen2", "qwen2_moe", "qwen3", "qwen3_moe",
            "deepseek_v2", "deepseek_v3", "olmo", "olmo2", "olmoe", "granite", "granitemoe", "cohere", "cohere2",
            "internlm2", "stablelm", "minicpm", "baichuan");
    /** Families whose feed-forward is two matrices around one activation. */
    private static final Set<String> UNGATED = Set.of("gpt2", "gpt_neox", "gptj", "opt", "falcon", "gpt_bigcode",
            "starcoder2", "mpt", "codegen", "nemotron", "persimmon", "xglm");
    /**
     * Keys only gated families' configs carry, for families whose type string is not listed: the
     * query scaling and activation keys of the GeGLU families with alternating local and global
     * layers, and the tensor-parallel and MLP-bias keys of the common SwiGLU family.
     */
    private static final List<String> GATED_KEYS = List.of("query_pre_attn_scalar", "hidden_activation",
            "pretraining_tp", "mlp_bias");
    /** Families whose output layer is separate from the embeddings unless the config says otherwise. */
    private static final Set<String> UNTIED = Set.of("mistral", "mixtral", "qwen2", "qwen2_moe", "qwen3",
            "qwen3_moe", "deepseek_v2", "deepseek_v3", "gpt_neox", "gptj", "internlm2", "stablelm", "olmo2", "olmoe");
    /** Families whose output layer is tied to the embeddings unless the config says otherwise. */
    private static final Set<String> TIED = Set.of("gpt2", "opt", "falcon", "gpt_bigcode", "starcoder2", "mpt",
            "codegen", "cohere", "cohere2", "xglm", "olmo");
    /** Keys that change memory or compute which Tare does not model, with what each does. */
    static final Map<String, String> UNMODELED = Map.ofEntries(
            Map.entry("num_nextn_predict_layers", "extra layers that predict further tokens (stored, often unused when serving) are not counted"),
            Map.entry("quantization_config", "the release stores quantized weights; set weight_bits to what they take"),
            Map.entry("attention_chunk_size", "chunked local attention is not modelled; its layers are counted global"),
            Map.entry("interleave_moe_layer_step", "experts on every n-th layer only are not modelled; every layer is counted with experts"),
            Map.entry("layers_block_type", "layers that are not attention (state-space or recurrent) are not modelled"),
            Map.entry("hybrid_override_pattern", "layers that are not attention (state-space or recurrent) are not modelled"),
            Map.entry("attn_layer_period", "layers that are not attention (state-space or recurrent) are not modelled"),
            Map.entry("mamba_d_state", "state-space layers are not modelled"),
            Map.entry("ssm_cfg", "state-space layers are not modelled"),
            Map.entry("cross_attention_layers", "cross-attention layers and their cache are not modelled"),
            Map.entry("audio_config", "an audio encoder is not counted"),
            Map.entry("kv_channels", "a separate key/value width is not modelled; head_dim or hidden_size / heads is used"),
            Map.entry("rope_scaling", "a scaled rotary embedding may stretch the context beyond the limit read here"),
            Map.entry("is_encoder_decoder", "an encoder-decoder model is counted as its decoder only"));

    private ModelFamilies() {
    }

    /**
     * Whether the feed-forward is gated: by the family, else by family keys, else by the norm the
     * family uses (RMSNorm comes with gated blocks in current families, LayerNorm with ungated ones);
     * empty when nothing tells.
     */
    static Optional<Boolean> gated(String modelType, JsonNode section) {
        if (GATED.contains(modelType)) {
            return Optional.of(true);
        }
        if (UNGATED.contains(modelType)) {
            return Optional.of(false);
        }
        if (GATED_KEYS.stream().anyMatch(section::has)) {
            return Optional.of(true);
        }
        if (section.has("rms_norm_eps")) {
            return Optional.of(true);
        }
        if (section.has("layer_norm_eps") || section.has("layer_norm_epsilon")) {
            return Optional.of(false);
        }
        return Optional.empty();
    }

    /** Whether the output layer is tied to the embeddings when the config does not say; empty when unknown. */
    static Optional<Boolean> tiedByDefault(String modelType, JsonNode section) {
        if (UNTIED.contains(modelType) || section.has("pretraining_tp")) {
            return Optional.of(false);
        }
        if (TIED.contains(modelType) || section.has("query_pre_attn_scalar") || section.has("hidden_activation")) {
            return Optional.of(true);
        }
        return Optional.empty();
    }

    /** Whether a key's value says the feature is in use (not null, false, 0 or empty). */
    static boolean inUse(JsonNode value) {
        if (value == null || value.isNull() || value.isMissingNode()) {
            return false;
        }
        if (value.isBoolean()) {
            return value.asBoolean();
        }
        if (value.isNumber()) {
            return value.asDouble() != 0;
        }
        if (value.isContainerNode() || value.isTextual()) {
            return !value.isEmpty() || (value.isTextual() && !value.asText().isEmpty());
        }
        return true;
    }
}
