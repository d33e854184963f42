package dev.tare.tokenize;

import static ai.djl.huggingface.tokenizers.HuggingFaceTokenizer.newInstance;

import dev.tare.TareException;
import dev.tare.source.SafeReader;
import dev.tare.source.SourceText;
import java.io.ByteArrayInputStream;
import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Map;
import java.util.function.Function;

/**
 * A {@code tokenizer.json} file (the tokenizer definition open-weight model releases ship), counted
 * by DJL's tokenizers library exactly as that library counts: truncation and padding off, no special
 * tokens added. Strings the file declares as added tokens still match as single tokens, because
 * that is what the library does with them. The file is read from disk only, never fetched, and the
 * library's native code is loaded the first time a file is, so runs without one never pay for it.
 */
final class TokenizerFile implements Tokenizer {
    /** The largest tokenizer file read; large vocabularies take a few tens of megabytes. */
    static final long MAX_BYTES = 128L * 1024 * 1024;

    /** The tokenizers library's switch (a system property or environment variable) that stops its usage reports. */
    static final String NO_REPORTING = "OPT_OUT_TRACKING";

    private static final Map<String, String> OPTIONS = Map.of(
            "addSpecialTokens", "false",
            "truncation", "false",
            "padding", "false");

    static {
        // The tokenizers library reports its use over the network the first time a tokenizer is
        // made (it asks the cloud instance-metadata address, then its telemetry address) unless this
        // switch of its own is set. Tare sends nothing anywhere, and where nothing answers that
        // address each attempt waits out a one-second time-out. A value the user set is kept.
        if (System.getProperty(NO_REPORTING) == null && System.getenv(NO_REPORTING) == null) {
            System.setProperty(NO_REPORTING, "true");
        }
    }

    private final String name;
    private final Function<String, long[]> ids;

    private TokenizerFile(String name, Function<String, long[]> ids) {
        this.name = name;
        this.ids = ids;
    }

    /**
     * Loads {@code file}, named {@code name} in messages and reports.
     *
     * @throws TareException when the file is missing, unreadable or not a tokenizer definition
     */
    static TokenizerFile load(String name, Path file) {
        if (!Files.isRegularFile(file)) {
            throw new TareException("tokenizer file " + file + ": no such file; give the path of a tokenizer.json"
                    + " (relative to tare.yaml), or one of " + String.join(", ", TokenizerRegistry.BUILT_IN));
        }
        SourceText text;
        try {
            text = new SafeReader(MAX_BYTES).read(name, file);
        } catch (TareException e) {
            throw new TareException("tokenizer file " + file + ": " + e.getMessage(), e);
        }
        try (InputStream in = new ByteArrayInputStream(text.text().getBytes(StandardCharsets.UTF_8))) {
            var tokenizer = newInstance(in, OPTIONS);
            return new TokenizerFile(name, prompt -> tokenizer.encode(prompt, false, false).getIds());
        } catch (IOException | RuntimeException e) {
            throw new TareException("tokenizer file " + file + ": not a tokenizer definition the tokenizers library"
                    + " can load (" + firstLine(e.getMessage()) + "); give a tokenizer.json from a model release", e);
        } catch (LinkageError e) {
            throw new TareException("tokenizer file " + file + ": the tokenizers library has no native code for this"
                    + " platform (" + firstLine(e.getMessage()) + "); use a built-in encoding instead", e);
        }
    }

    @Override
    public String name() {
        return name;
    }

    @Override
    public int count(String text) {
        return ids.apply(text).length;
    }

    @Override
    public int[] encode(String text) {
        long[] found = ids.apply(text);
        int[] out = new int[found.length];
        for (int i = 0; i < found.length; i++) {
            out[i] = Math.toIntExact(found[i]);
        }
        return out;
    }

    @Override
    public String toString() {
        return name;
    }

    private static String firstLine(String message) {
        if (message == null || message.isBlank()) {
            return "no reason given";
        }
        int newline = message.indexOf('\n');
        return (newline < 0 ? message : message.substring(0, newline)).strip();
    }
}
