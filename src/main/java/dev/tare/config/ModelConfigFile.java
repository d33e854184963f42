package dev.tare.config;

import com.fasterxml.jackson.databind.JsonNode;
import dev.tare.TareException;
import dev.tare.footprint.Formulas;
import dev.tare.footprint.ModelShape;
import dev.tare.source.SafeReader;
import dev.tare.source.SourceText;
import dev.tare.source.YamlDocument;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.OptionalInt;
import java.util.OptionalLong;
import java.util.Set;

/**
 * Reads a model shape from the {@code config.json} an open-weight model release ships: layer count,
 * attention heads, KV heads, hidden size and head size when present. Params come from the file when
 * it states them; otherwise they are computed from the shape with the vocabulary and feed-forward
 * sizes, and the shape says so.
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
    private static final List<String> ACTIVATION = List.of("hidden_act", "activation_function");
    /** Activations whose feed-forward blocks are gated (three matrices) in the usual architectures. */
    private static final Set<String> GATED = Set.of("silu", "swish", "swiglu", "geglu");

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
        Reader r = new Reader(in, node, prefix, relative);
        int layers = r.required(LAYERS, "layer count");
        int heads = r.required(HEADS, "attention head count");
        int kvHeads = r.optional(KV_HEADS).orElse(heads);
        OptionalInt hidden = r.optional(HIDDEN);
        OptionalInt headDim = r.optional(List.of("head_dim"));
        int dim;
        if (headDim.isPresent()) {
            dim = headDim.getAsInt();
        } else {
            if (hidden.isEmpty()) {
                throw r.missing(HIDDEN, "hidden size (needed for the head size, as there is no head_dim)");
            }
            if (hidden.getAsInt() % heads != 0) {
                throw in.problem(prefix + first(node, HIDDEN).orElseThrow(), "hidden size " + hidden.getAsInt()
                        + " is not a multiple of the " + heads + " attention heads; add head_dim");
            }
            dim = hidden.getAsInt() / heads;
        }
        if (kvHeads > heads || heads % kvHeads != 0) {
            throw in.problem(prefix + first(node, KV_HEADS).orElse(KV_HEADS.get(0)), "kv_heads (" + kvHeads
                    + ") must divide the attention heads (" + heads + ") evenly");
        }
        OptionalLong stated = r.wholeLong(PARAMS);
        if (stated.isPresent()) {
            return new ModelShape(stated.getAsLong(), layers, heads, kvHeads, dim, "config " + relative, false);
        }
        if (hidden.isEmpty()) {
            throw r.missing(HIDDEN, "hidden size (needed to compute params, which the file does not state)");
        }
        int vocab = r.required(VOCAB, "vocabulary size (needed to compute params, which the file does not state)");
        OptionalInt feedForward = r.optional(FEED_FORWARD);
        if (feedForward.isEmpty() && !hasNullInner(node)) {
            throw r.missing(FEED_FORWARD, "feed-forward size (needed to compute params, which the file does not state)");
        }
        // A null n_inner means four times the hidden size, as the configs that use that key define it.
        long ffn = feedForward.isPresent() ? feedForward.getAsInt() : 4L * hidden.getAsInt();
        String activation = r.text(ACTIVATION).orElse("").toLowerCase(Locale.ROOT);
        boolean tied = r.bool("tie_word_embeddings").orElse(true);
        double params = Formulas.decoderParams(vocab, hidden.getAsInt(), layers, heads, kvHeads, dim, ffn,
                GATED.contains(activation), tied);
        return new ModelShape(params, layers, heads, kvHeads, dim, "config " + relative, true);
    }

    private static boolean hasNullInner(JsonNode node) {
        return node.has("n_inner") && node.get("n_inner").isNull();
    }

    private static Optional<String> first(JsonNode node, List<String> keys) {
        return keys.stream().filter(k -> node.has(k) && !node.get(k).isNull()).findFirst();
    }

    /** Typed reads of one section of the file, trying each of a setting's usual key names. */
    private record Reader(ConfigReader in, JsonNode node, String prefix, String file) {
        int required(List<String> keys, String what) {
            return optional(keys).orElseThrow(() -> missing(keys, what));
        }

        OptionalInt optional(List<String> keys) {
            Optional<String> key = first(node, keys);
            return key.isEmpty() ? OptionalInt.empty() : in.wholeNumber(node, key.get(), prefix + key.get(), 1);
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
