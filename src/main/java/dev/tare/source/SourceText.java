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
}
