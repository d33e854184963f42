package dev.tare.workspace;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.DirectoryStream;
import java.nio.file.Files;
import java.nio.file.Path;

/**
 * A folder a walk listed, with a hash of the names it held: a later run that finds the same
 * names may trust that the walk would select the same files there, even when the folder's
 * modification time is too recent to vouch for it.
 *
 * @param path      the folder, absolute
 * @param namesHash {@link #namesHash(Path)} as the walk saw the folder
 */
public record WalkedFolder(Path path, long namesHash) {
    /** The hash of the names the folder holds now (every entry, hidden ones too). */
    public static long namesHash(Path folder) throws IOException {
        long hash = 0;
        try (DirectoryStream<Path> entries = Files.newDirectoryStream(folder)) {
            for (Path entry : entries) {
                hash += nameHash(entry.getFileName().toString());
            }
        }
        return hash;
    }

    /**
     * One name's share of a folder's hash. Shares are added, so the hash does not depend on the
     * order in which the file system lists the names.
     */
    static long nameHash(String name) {
        long h = 0xcbf29ce484222325L;
        for (byte b : name.getBytes(StandardCharsets.UTF_8)) {
            h = (h ^ (b & 0xff)) * 0x100000001b3L;
        }
        // A final mix, so that sums of similar names do not cancel out.
        h ^= h >>> 33;
        h *= 0xff51afd7ed558ccdL;
        h ^= h >>> 33;
        return h;
    }
}
