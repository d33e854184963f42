package dev.tare.rewrite;

import dev.tare.source.SourceText;
import java.nio.file.Path;

/**
 * A file a fix read, without its text: a fix of a large repository reads each file again when it
 * needs the text, rather than holding every one, and the hash tells whether it is still what was read.
 *
 * @param path     the path relative to the root, with {@code /}
 * @param file     the file it was read from
 * @param hadBom   whether it started with a byte-order mark
 * @param byteSize its size in bytes
 * @param hash     the hash of its text ({@link String#hashCode})
 */
record Original(String path, Path file, boolean hadBom, long byteSize, int hash) {
    static Original of(SourceText text) {
        return new Original(text.path(), text.file(), text.hadBom(), text.byteSize(), text.text().hashCode());
    }

    /** The file as read, given its text. */
    SourceText with(String text) {
        return new SourceText(path, file, text, hadBom, byteSize);
    }
}
