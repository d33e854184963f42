package dev.tare.workspace;

/**
 * One file as it stands in the git index, ready to be committed.
 *
 * @param path            path relative to the git work tree's top, with {@code /}
 * @param staged          the staged bytes
 * @param matchesWorkTree whether the working-tree file holds exactly the staged bytes; when it does
 *                        not, the file is partially staged and must not be rewritten
 */
public record StagedFile(String path, byte[] staged, boolean matchesWorkTree) {
}
