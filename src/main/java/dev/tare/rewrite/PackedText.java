package dev.tare.rewrite;

import java.io.ByteArrayOutputStream;
import java.nio.ByteBuffer;
import java.nio.CharBuffer;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.util.zip.DataFormatException;
import java.util.zip.Deflater;
import java.util.zip.Inflater;

/**
 * A text kept compressed until it is read: a fix of a large repository holds each rewritten file's
 * text before and after until the report is printed, and compressed they take a quarter of the
 * memory. Lossless for any string: text that is not valid UTF-16 (a lone surrogate) is kept as its
 * chars.
 */
final class PackedText {
    private static final PackedText EMPTY = new PackedText(new byte[0], 0, true);

    private final byte[] packed;
    private final int length;
    private final boolean utf8;

    private PackedText(byte[] packed, int length, boolean utf8) {
        this.packed = packed;
        this.length = length;
        this.utf8 = utf8;
    }

    static PackedText of(String text) {
        if (text.isEmpty()) {
            return EMPTY;
        }
        byte[] raw;
        boolean utf8 = true;
        try {
            ByteBuffer encoded = StandardCharsets.UTF_8.newEncoder().onMalformedInput(CodingErrorAction.REPORT)
                    .onUnmappableCharacter(CodingErrorAction.REPORT).encode(CharBuffer.wrap(text));
            raw = new byte[encoded.remaining()];
            encoded.get(raw);
        } catch (CharacterCodingException e) {
            utf8 = false;
            raw = new byte[text.length() * 2];
            for (int i = 0; i < text.length(); i++) {
                raw[2 * i] = (byte) (text.charAt(i) >> 8);
                raw[2 * i + 1] = (byte) text.charAt(i);
            }
        }
        Deflater deflater = new Deflater(Deflater.BEST_SPEED);
        try {
            deflater.setInput(raw);
            deflater.finish();
            ByteArrayOutputStream out = new ByteArrayOutputStream(Math.max(64, raw.length / 3));
            byte[] buffer = new byte[8192];
            while (!deflater.finished()) {
                out.write(buffer, 0, deflater.deflate(buffer));
            }
            return new PackedText(out.toByteArray(), raw.length, utf8);
        } finally {
            deflater.end();
        }
    }

    /** The text as it was given. */
    String text() {
        if (length == 0) {
            return "";
        }
        byte[] raw = new byte[length];
        Inflater inflater = new Inflater();
        try {
            inflater.setInput(packed);
            int at = 0;
            while (at < length) {
                int n = inflater.inflate(raw, at, length - at);
                if (n == 0 && (inflater.finished() || inflater.needsInput())) {
                    throw new IllegalStateException("a packed text is shorter than it was");
                }
                at += n;
            }
        } catch (DataFormatException e) {
            throw new IllegalStateException("a packed text could not be unpacked", e);
        } finally {
            inflater.end();
        }
        if (utf8) {
            return new String(raw, StandardCharsets.UTF_8);
        }
        char[] chars = new char[length / 2];
        for (int i = 0; i < chars.length; i++) {
            chars[i] = (char) ((raw[2 * i] & 0xFF) << 8 | raw[2 * i + 1] & 0xFF);
        }
        return new String(chars);
    }
}
