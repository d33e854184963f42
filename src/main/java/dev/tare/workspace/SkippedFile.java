package dev.tare.workspace;

/**
 * A file that was found but not used, with the reason in words a user can act on.
 *
 * @param path   the path relative to the scanned root, with {@code /} separators
 * @param reason why it was skipped and, where it helps, what to do
 */
public record SkippedFile(String path, String reason) implements Comparable<SkippedFile> {
    @Override
    public int compareTo(SkippedFile other) {
        return path.compareTo(other.path);
    }
}
