package dev.tare.config;

import com.fasterxml.jackson.databind.JsonNode;
import dev.tare.TareException;
import dev.tare.footprint.Formulas;
import dev.tare.footprint.ModelShape;
import dev.tare.footprint.ShapeBuilder;
import dev.tare.source.SafeReader;
import dev.tare.source.SourceText;
import dev.tare.source.YamlDocument;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalInt;
import java.util.OptionalLong;
import java.util.Set;

/**
 * Reads a model shape from the {@code config.json} an open-weight model release ships: attention
 * (multi-head, grouped-query, multi-query, latent), sliding windows and their per-layer patterns,
 * mixtures of experts with shared experts and leading dense layers, a nested language model beside
 * a vision tower, and the context limit. Params come from the file when it states them; otherwise
 * they are computed from the shape, and the shape says so. A key that changes memory or compute and
 * that Tare does not model becomes a note on the shape.
 */
final class ModelConfigFile {
    /** The largest model config read; real ones are a few kilobytes. */
    static final long MAX_BYTES = 1024 * 1024;

    private static final List<String> LAYERS = List.of("num_hidden_layers", "n_layer", "num_layers");
    private static final List<String> HEADS = List.of("num_attention_heads", "n_head", "num_heads");
    private static final List<String> KV_HEADS = List.of("num_key_value_heads", "num_kv_heads", "n_head_kv");
    private static final List<String> HIDDEN = List.of("hidden_size", "n_embd", "d_model");
    private static final List<String> PARAMS = List.of("num_parameters", "n_params");
    private static final List<String> VOCAB = List.of("vocab_size");
    private static final List<String> FEED_FORWARD = List.of("intermediate_size", "ffn_dim", "n_inner");
    private static final List<String> EXPERTS = List.of("num_local_experts", "num_experts", "n_routed_experts");
    private static final List<String> CONTEXT = List.of("max_position_embeddings", "n_positions",
            "max_sequence_length", "seq_length");

    private ModelConfigFile() {
    }

    /**
     * The shape in {@code relative} (resolved against the configuration's folder), named {@code at}
     * in the configuration's own messages.
     */
    static ModelShape read(Path root, String relative, ConfigReader config, String at) {
        Path file = root.resolve(relative).normalize();
        if (!Files.isRegularFile(file)) {
            throw config.problem(at, "model config " + file + ": no such file; give the path of the model's"
                    + " config.json relative to tare.yaml");
        }
        SourceText text;
        YamlDocument document;
        try {
            text = new SafeReader(MAX_BYTES).read(relative, file);
            document = YamlDocument.parseJson(text.text());
        } catch (TareException e) {
            throw new TareException(relative + ", " + e.getMessage() + "; give a model config.json", e);
        }
        ConfigReader in = new ConfigReader(relative, document);
        JsonNode top = document.root();
        if (!top.isObject()) {
            throw in.problem("", "must be a JSON object of model settings (a model config.json)");
        }
        String prefix = "";
        JsonNode node = top;
        JsonNode textConfig = top.get("text_config");
        if (first(top, LAYERS).isEmpty() && textConfig != null && textConfig.isObject()) {
            // Models that take images keep the language model's shape in a nested section.
            node = textConfig;
            prefix = "text_config.";
        }
        return new Shape(new Reader(in, node, prefix, relative), top).read();
    }

    private static Optional<String> first(JsonNode node, List<String> keys) {
        return keys.stream().filter(k -> node.has(k) && !node.get(k).isNull()).findFirst();
    }

    /** One config's shape, read key by key. */
    private static final class Shape {
        private final Reader r;
        private final JsonNode top;
        private final JsonNode node;
        private final ShapeBuilder shape = new ShapeBuilder();
        private final String modelType;

        Shape(Reader r, JsonNode top) {
            this.r = r;
            this.top = top;
            this.node = r.node();
            this.modelType = r.text(List.of("model_type")).or(() -> top.has("model_type") && top.get("model_type").isTextual()
                    ? Optional.of(top.get("model_type").asText()) : Optional.empty()).orElse("").toLowerCase(Locale.ROOT);
            shape.origin("config " + r.file());
        }

        ModelShape read() {
            int layers = r.required(LAYERS, "layer count");
            int heads = r.required(HEADS, "attention head count");
            OptionalInt hidden = r.optional(HIDDEN);
            boolean multiQuery = r.bool("multi_query").orElse(false);
            OptionalInt statedKv = r.optional(KV_HEADS);
            int kvHeads = statedKv.isPresent() ? statedKv.getAsInt() : multiQuery ? 1 : heads;
            if (kvHeads > heads || heads % kvHeads != 0) {
                throw r.in().problem(r.prefix() + first(node, KV_HEADS).orElse(KV_HEADS.get(0)), "kv_heads (" + kvHeads
                        + ") must divide the attention heads (" + heads + ") evenly");
            }
            OptionalInt kvLoraRank = r.optional(List.of("kv_lora_rank"));
            int dim;
            int qkRope = 0;
            if (kvLoraRank.isPresent()) {
                qkRope = r.required(List.of("qk_rope_head_dim"), "qk_rope_head_dim (the rotary key width of latent attention)");
                int qkNope = r.optional(List.of("qk_nope_head_dim")).orElse(0);
                dim = qkNope + qkRope;
            } else {
                dim = headDim(hidden, heads);
            }
            shape.attention(layers, heads, kvHeads, dim);
            if (kvLoraRank.isPresent()) {
                // The latent and the shared rotary key are cached, once per layer, no factor 2 (DeepSeek-V2 paper, §2.1).
                shape.latentKv((long) kvLoraRank.getAsInt() + qkRope);
            }
            windows(layers);
            context();
            params(layers, heads, kvHeads, dim, hidden, kvLoraRank, qkRope);
            vision();
            unmodeled();
            return shape.build();
        }

        private int headDim(OptionalInt hidden, int heads) {
            OptionalInt headDim = r.optional(List.of("head_dim"));
            if (headDim.isPresent()) {
                return headDim.getAsInt();
            }
            if (hidden.isEmpty()) {
                throw r.missing(HIDDEN, "hidden size (needed for the head size, as there is no head_dim)");
            }
            if (hidden.getAsInt() % heads != 0) {
                throw r.in().problem(r.prefix() + first(node, HIDDEN).orElseThrow(), "hidden size " + hidden.getAsInt()
                        + " is not a multiple of the " + heads + " attention heads; add head_dim");
            }
            return hidden.getAsInt() / heads;
        }

        /**
         * Sliding windows: every layer (Mistral 7B paper), a list of layer types, one global layer in
         * every N ({@code sliding_window_pattern}), every other layer for the family told by
         * {@code query_pre_attn_scalar}, or the layers from {@code max_window_layers} on.
         */
        private void windows(int layers) {
            OptionalInt window = r.optional(List.of("sliding_window"));
            boolean enabled = r.bool("use_sliding_window").orElse(true);
            List<String> types = r.texts("layer_types");
            if (!types.isEmpty() && types.size() != layers) {
                throw r.in().problem(r.prefix() + "layer_types", "lists " + types.size() + " layers but the model has "
                        + layers + "; give one type per layer");
            }
            int windowed = layers;
            if (!types.isEmpty()) {
                windowed = (int) types.stream().filter(t -> t.contains("sliding") || t.contains("local")).count();
                types.stream().filter(t -> !t.contains("sliding") && !t.contains("local") && !t.contains("full")
                        && !t.contains("global")).distinct().forEach(t -> shape.note("layer type '" + t
                        + "' is not modelled; its layers are counted as full attention"));
            } else if (r.optional(List.of("sliding_window_pattern")).isPresent()) {
                int every = r.optional(List.of("sliding_window_pattern")).getAsInt();
                windowed = layers - layers / every;
            } else if (node.has("query_pre_attn_scalar")) {
                // That family alternates a windowed layer (even index) with a global one.
                windowed = (layers + 1) / 2;
            } else if (node.has("max_window_layers") && node.has("use_sliding_window")) {
                int full = r.optional(List.of("max_window_layers")).orElse(0);
                windowed = Math.max(0, layers - full);
            }
            if (window.isPresent() && enabled) {
                shape.window(windowed, window.getAsInt());
            } else if (!types.isEmpty() && windowed > 0 && window.isEmpty()) {
                shape.note("layer_types lists sliding layers but there is no sliding_window; they are counted global");
            }
        }

        private void context() {
            Optional<String> key = first(node, CONTEXT);
            if (key.isPresent()) {
                shape.contextLimit(r.optional(List.of(key.get())).getAsInt());
            }
        }

        private void params(int layers, int heads, int kvHeads, int dim, OptionalInt hidden, OptionalInt kvLoraRank,
                            int qkRope) {
            OptionalLong stated = r.wholeLong(PARAMS);
            OptionalInt vocab = r.optional(VOCAB);
            // Whether the output layer is tied matters only where the embeddings can be counted.
            boolean tied = vocab.isPresent() && hidden.isPresent() && tied();
            if (vocab.isPresent() && hidden.isPresent()) {
                shape.embeddings(Formulas.embeddingParams(vocab.getAsInt(), hidden.getAsInt(), tied),
                        (double) vocab.getAsInt() * hidden.getAsInt());
            }
            Optional<String> expertKey = first(node, EXPERTS);
            int experts = expertKey.isPresent() ? r.optional(List.of(expertKey.get())).getAsInt() : 0;
            if (stated.isPresent() && experts == 0) {
                shape.params(stated.getAsLong(), stated.getAsLong(), false);
                return;
            }
            if (hidden.isEmpty()) {
                throw r.missing(HIDDEN, "hidden size (needed to compute params, which the file does not state)");
            }
            long d = hidden.getAsInt();
            if (vocab.isEmpty()) {
                throw r.missing(VOCAB, "vocabulary size (needed to compute params, which the file does not state)");
            }
            OptionalInt feedForward = r.optional(FEED_FORWARD);
            if (feedForward.isEmpty() && !hasNullInner()) {
                throw r.missing(FEED_FORWARD, "feed-forward size (needed to compute params, which the file does not state)");
            }
            // A null n_inner means four times the hidden size, as the configs that use that key define it.
            long ffn = feedForward.isPresent() ? feedForward.getAsInt() : 4L * d;
            boolean gated = gated();
            double attention = kvLoraRank.isPresent()
                    ? Formulas.latentAttentionParams(d, heads, r.optional(List.of("q_lora_rank")).orElse(0),
                    kvLoraRank.getAsInt(), r.optional(List.of("qk_nope_head_dim")).orElse(0), qkRope,
                    r.optional(List.of("v_head_dim")).orElse(dim))
                    : Formulas.attentionParams(d, heads, kvHeads, dim);
            double dense = Formulas.feedForwardParams(d, ffn, gated);
            double total = Formulas.embeddingParams(vocab.getAsInt(), d, tied) + layers * attention;
            double active = total;
            if (experts == 0) {
                total += layers * dense;
                active = total;
                shape.params(total, active, true);
                return;
            }
            int perToken = r.required(List.of("num_experts_per_tok"), "experts per token (num_experts_per_tok)");
            if (perToken > experts) {
                throw r.in().problem(r.prefix() + "num_experts_per_tok", "is " + perToken + " but the model has only "
                        + experts + " experts; give at most " + experts);
            }
            long expertSize = r.optional(List.of("moe_intermediate_size")).orElse((int) ffn);
            double expert = Formulas.feedForwardParams(d, expertSize, gated);
            double shared = r.optional(List.of("n_shared_experts")).orElse(0) * expert;
            OptionalInt sharedSize = r.optional(List.of("shared_expert_intermediate_size"));
            if (sharedSize.isPresent()) {
                shared += Formulas.feedForwardParams(d, sharedSize.getAsInt(), gated) + d;
            }
            int moeLayers = moeLayers(layers);
            double router = Formulas.routerParams(d, experts);
            total += (layers - moeLayers) * dense + moeLayers * (router + shared + experts * expert);
            active += (layers - moeLayers) * dense + moeLayers * (router + shared + perToken * expert);
            if (stated.isPresent()) {
                active = stated.getAsLong() - (total - active);
                total = stated.getAsLong();
                shape.params(total, Math.max(0, active), false);
            } else {
                shape.params(total, active, true);
            }
            shape.experts(experts, perToken, moeLayers * expert);
        }

        /**
         * Layers with experts: all but the leading dense ones ({@code first_k_dense_replace}), every
         * {@code moe_layer_freq}-th or {@code decoder_sparse_step}-th, none of {@code mlp_only_layers}.
         */
        private int moeLayers(int layers) {
            int leading = r.optionalFrom(List.of("first_k_dense_replace"), 0).orElse(0);
            int frequency = r.optional(List.of("moe_layer_freq")).orElse(1);
            int step = r.optional(List.of("decoder_sparse_step")).orElse(1);
            Set<Integer> denseOnly = new HashSet<>();
            JsonNode only = node.get("mlp_only_layers");
            if (only != null && !only.isNull()) {
                if (!only.isArray()) {
                    throw r.in().problem(r.prefix() + "mlp_only_layers", "must be a list of layer numbers");
                }
                only.forEach(n -> denseOnly.add(n.asInt()));
            }
            int count = 0;
            for (int i = 0; i < layers; i++) {
                if (i >= leading && i % frequency == 0 && (i + 1) % step == 0 && !denseOnly.contains(i)) {
                    count++;
                }
            }
            return count;
        }

        private boolean gated() {
            Optional<Boolean> known = ModelFamilies.gated(modelType, node);
            if (known.isEmpty()) {
                shape.note("model_type '" + modelType + "' is not one Tare knows: its feed-forward is counted gated"
                        + " (three matrices, as in most current models); state params inline if that is wrong");
            }
            return known.orElse(true);
        }

        private boolean tied() {
            Optional<Boolean> stated = r.bool("tie_word_embeddings");
            if (stated.isPresent()) {
                return stated.get();
            }
            Optional<Boolean> family = ModelFamilies.tiedByDefault(modelType, node);
            if (family.isEmpty()) {
                shape.note("no tie_word_embeddings and model_type '" + modelType + "' unknown: the output layer is"
                        + " counted as tied to the embeddings (stored once)");
            }
            return family.orElse(true);
        }

        private boolean hasNullInner() {
            return node.has("n_inner") && node.get("n_inner").isNull();
        }

        /** A vision tower beside the language model: stored, so counted in total params, but not active for text. */
        private void vision() {
            JsonNode vision = top.get("vision_config");
            if (vision == null || !vision.isObject()) {
                return;
            }
            Reader v = new Reader(r.in(), vision, "vision_config.", r.file());
            OptionalInt width = v.optional(List.of("hidden_size", "embed_dim", "width"));
            OptionalInt depth = v.optional(List.of("num_hidden_layers", "depth", "layers"));
            OptionalInt feedForward = v.optional(List.of("intermediate_size"));
            if (width.isEmpty() || depth.isEmpty()) {
                shape.note("vision_config: a vision tower is not counted (its width and depth are not stated);"
                        + " its weights add memory and each image adds input tokens");
                return;
            }
            long ffn = feedForward.isPresent() ? feedForward.getAsInt() : 4L * width.getAsInt();
            double params = Formulas.visionParams(width.getAsInt(), ffn, depth.getAsInt());
            ModelShape sofar = shape.build();
            shape.params(sofar.paramsTotal() + params, sofar.paramsActive(), sofar.paramsComputed());
            shape.note(String.format(Locale.ROOT, "vision_config: a vision tower of about %.2g params (%d layers of"
                    + " width %d) is added to params_total (stored) but not to params_active; each image adds input"
                    + " tokens Tare does not count", params, depth.getAsInt(), width.getAsInt()));
        }

        private void unmodeled() {
            List<String> seen = new ArrayList<>();
            for (Map.Entry<String, String> entry : ModelFamilies.UNMODELED.entrySet()) {
                String key = entry.getKey();
                JsonNode value = node.has(key) ? node.get(key) : top.get(key);
                if (ModelFamilies.inUse(value)) {
                    seen.add(key + ": " + entry.getValue());
                }
            }
            seen.stream().sorted().forEach(shape::note);
        }
    }

    /** Typed reads of one section of the file, trying each of a setting's usual key names. */
    private record Reader(ConfigReader in, JsonNode node, String prefix, String file) {
        int required(List<String> keys, String what) {
            return optional(keys).orElseThrow(() -> missing(keys, what));
        }

        OptionalInt optional(List<String> keys) {
            return optionalFrom(keys, 1);
        }

        OptionalInt optionalFrom(List<String> keys, long min) {
            Optional<String> key = first(node, keys);
            return key.isEmpty() ? OptionalInt.empty() : in.wholeNumber(node, key.get(), prefix + key.get(), min);
        }

        OptionalLong wholeLong(List<String> keys) {
            Optional<String> key = first(node, keys);
            if (key.isEmpty()) {
                return OptionalLong.empty();
            }
            JsonNode value = node.get(key.get());
            if (!value.canConvertToLong() || !value.isIntegralNumber() || value.asLong() < 1) {
                throw in.problem(prefix + key.get(), "must be a whole number above 0 (got " + value + ")");
            }
            return OptionalLong.of(value.asLong());
        }

        Optional<String> text(List<String> keys) {
            Optional<String> key = first(node, keys);
            return key.isEmpty() ? Optional.empty() : in.text(node, key.get(), prefix + key.get());
        }

        List<String> texts(String key) {
            return in.texts(node, key, prefix + key);
        }

        Optional<Boolean> bool(String key) {
            return in.bool(node, key, prefix + key);
        }

        TareException missing(List<String> keys, String what) {
            return new TareException(file + ": has no " + what + "; add " + prefix + keys.get(0)
                    + (keys.size() > 1 ? " (or " + String.join(", ", keys.subList(1, keys.size())) + ")" : "")
                    + ", or describe the model inline in tare.yaml");
        }
    }
}
