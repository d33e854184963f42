package dev.tare.tokenize;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Base64;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/**
 * Test helper: turns the merge ranks of a byte-level BPE encoding shipped inside jtokkit into a
 * {@code tokenizer.json} (a BPE model with vocabulary and merges behind a byte-level pre-tokenizer),
 * so that two independent implementations, jtokkit and DJL's tokenizers library, can be compared on
 * the same vocabulary.
 *
 * <p>Every way of splitting a token into two tokens of the vocabulary becomes a merge, ordered by
 * the rank of the token they make and then by the ranks of the two parts: the library then always
 * applies the merge of lowest rank first, as the rank-based encoder does. Special tokens are left
 * out so that their strings count as ordinary text on both sides.
 *
 * <p>The conversion may keep only the first ranks: the result is then a smaller BPE of its own (the
 * rank-based encoder limited to those tokens), no longer the encoding's counts. Run as a program to
 * write the demo's tokenizer file: {@code java -cp ... dev.tare.tokenize.TiktokenToTokenizerJson r50k_base 3000 OUT}.
 */
public final class TiktokenToTokenizerJson {
    private TiktokenToTokenizerJson() {
    }

    public static void main(String[] args) throws IOException {
        if (args.length != 3) {
            System.err.println("usage: TiktokenToTokenizerJson ENCODING MAX_RANKS OUT_FILE");
            System.exit(2);
        }
        write(args[0], Integer.parseInt(args[1]), Path.of(args[2]));
    }

    /** Writes the tokenizer.json of a jtokkit encoding's first {@code maxRanks} tokens to {@code out}. */
    public static void write(String encoding, int maxRanks, Path out) throws IOException {
        Files.writeString(out, convert(encoding, maxRanks), StandardCharsets.UTF_8);
    }

    /** The tokenizer.json text of a jtokkit encoding (for example {@code r50k_base}), all ranks. */
    public static String convert(String encoding) throws IOException {
        return convert(encoding, Integer.MAX_VALUE);
    }

    /** The tokenizer.json text of a jtokkit encoding's first {@code maxRanks} tokens. */
    public static String convert(String encoding, int maxRanks) throws IOException {
        List<byte[]> all = ranks(encoding);
        List<byte[]> tokens = all.subList(0, Math.min(maxRanks, all.size()));
        Map<String, Integer> rankOf = new HashMap<>();
        String[] symbols = new String[tokens.size()];
        for (int rank = 0; rank < tokens.size(); rank++) {
            symbols[rank] = byteLevel(tokens.get(rank));
            rankOf.put(symbols[rank], rank);
        }
        ObjectMapper mapper = new ObjectMapper();
        ObjectNode root = mapper.createObjectNode();
        root.put("version", "1.0");
        root.putNull("truncation");
        root.putNull("padding");
        root.putArray("added_tokens");
        root.putNull("normalizer");
        root.set("pre_tokenizer", byteLevelStep(mapper));
        root.putNull("post_processor");
        root.set("decoder", byteLevelStep(mapper));
        ObjectNode model = root.putObject("model");
        model.put("type", "BPE");
        model.putNull("dropout");
        model.putNull("unk_token");
        model.putNull("continuing_subword_prefix");
        model.putNull("end_of_word_suffix");
        model.put("fuse_unk", false);
        model.put("byte_fallback", false);
        ObjectNode vocab = model.putObject("vocab");
        for (int rank = 0; rank < symbols.length; rank++) {
            vocab.put(symbols[rank], rank);
        }
        ArrayNode merges = model.putArray("merges");
        for (int rank = 0; rank < symbols.length; rank++) {
            String token = symbols[rank];
            List<int[]> splits = new ArrayList<>();
            for (int i = 1; i < token.length(); i++) {
                Integer left = rankOf.get(token.substring(0, i));
                Integer right = rankOf.get(token.substring(i));
                if (left != null && right != null) {
                    splits.add(new int[] {left, right});
                }
            }
            splits.sort((a, b) -> a[0] != b[0] ? Integer.compare(a[0], b[0]) : Integer.compare(a[1], b[1]));
            for (int[] split : splits) {
                merges.add(symbols[split[0]] + " " + symbols[split[1]]);
            }
        }
        return mapper.writeValueAsString(root) + "\n";
    }

    private static ObjectNode byteLevelStep(ObjectMapper mapper) {
        ObjectNode step = mapper.createObjectNode();
        step.put("type", "ByteLevel");
        step.put("add_prefix_space", false);
        step.put("trim_offsets", true);
        step.put("use_regex", true);
        return step;
    }

    /** The encoding's tokens in rank order, from the {@code .tiktoken} resource inside the jtokkit jar. */
    private static List<byte[]> ranks(String encoding) throws IOException {
        String resource = "/com/knuddels/jtokkit/" + encoding + ".tiktoken";
        List<byte[]> tokens = new ArrayList<>();
        try (InputStream in = TiktokenToTokenizerJson.class.getResourceAsStream(resource)) {
            if (in == null) {
                throw new IOException(resource + " is not on the class path");
            }
            BufferedReader reader = new BufferedReader(new InputStreamReader(in, StandardCharsets.UTF_8));
            for (String line = reader.readLine(); line != null; line = reader.readLine()) {
                if (line.isBlank()) {
                    continue;
                }
                String[] parts = line.split(" ");
                int rank = Integer.parseInt(parts[1]);
                if (rank != tokens.size()) {
                    throw new IOException(resource + ": ranks are not consecutive at " + rank);
                }
                tokens.add(Base64.getDecoder().decode(parts[0]));
            }
        }
        return tokens;
    }

    /**
     * Bytes as the byte-level pre-tokenizer writes them: printable Latin-1 bytes stand for
     * themselves and every other byte for a code point from 256 up, in byte order.
     */
    static String byteLevel(byte[] bytes) {
        StringBuilder out = new StringBuilder(bytes.length);
        for (byte b : bytes) {
            out.appendCodePoint(BYTE_TO_CHAR[b & 0xFF]);
        }
        return out.toString();
    }

    private static final int[] BYTE_TO_CHAR = byteToChar();

    private static int[] byteToChar() {
        int[] map = new int[256];
        int next = 256;
        for (int b = 0; b < 256; b++) {
            boolean printable = (b >= '!' && b <= '~') || (b >= 0xA1 && b <= 0xAC) || (b >= 0xAE && b <= 0xFF);
            map[b] = printable ? b : next++;
        }
        return map;
    }
}
