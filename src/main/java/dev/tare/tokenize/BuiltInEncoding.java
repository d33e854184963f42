package dev.tare.tokenize;

import com.knuddels.jtokkit.api.Encoding;

/** A byte-pair encoding shipped inside jtokkit, counted as ordinary text. */
final class BuiltInEncoding implements Tokenizer {
    private final Encoding encoding;

    BuiltInEncoding(Encoding encoding) {
        this.encoding = encoding;
    }

    @Override
    public String name() {
        return encoding.getName();
    }

    @Override
    public int count(String text) {
        return encoding.countTokensOrdinary(text);
    }

    @Override
    public int[] encode(String text) {
        return encoding.encodeOrdinary(text).toArray();
    }

    @Override
    public String toString() {
        return name();
    }
}
