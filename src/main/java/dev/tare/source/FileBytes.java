package dev.tare.source;

import java.nio.charset.StandardCharsets;

/** The bytes a file's text is written as: UTF-8, after a byte-order mark when the file had one. */
public final class FileBytes {
    private static final byte[] BOM = {(byte) 0xEF, (byte) 0xBB, (byte) 0xBF};

    private FileBytes() {
    }

    public static byte[] encode(String text, boolean bom) {
        byte[] body = text.getBytes(StandardCharsets.UTF_8);
        if (!bom) {
            return body;
        }
        byte[] bytes = new byte[BOM.length + body.length];
        System.arraycopy(BOM, 0, bytes, 0, BOM.length);
        System.arraycopy(body, 0, bytes, BOM.length, body.length);
        return bytes;
    }
}
