package dev.tare.source;

import java.nio.file.Path;

/**
 * The decoded text of one file under the scanned root.
 *
 * @param path    the path relative to the root, with {@code /} separators, as shown in every output
 * @param file    the file on disk
 * @param text    the file's text, without a leading byte-order mark
 * @param hadBom  whether the file started with a UTF-8 byte-order mark (kept when the file is rewritten)
 * @param byteSize the file's size in bytes
 */
public record SourceText(String path, Path file, String text, boolean hadBom, long byteSize) {
    /** A text not (yet) on disk, as it would be written to {@code file}: its size is that of its bytes. */
    public static SourceText unwritten(String path, Path file, String text, boolean bom) {
        return new SourceText(path, file, text, bom, FileBytes.encode(text, bom).length);
    }

    /** {@code newText} as another version of this file: the same path, file and byte-order mark. */
    public SourceText withText(String newText) {
        return unwritten(path, file, newText, hadBom);
    }
}
