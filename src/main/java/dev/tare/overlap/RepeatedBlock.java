package dev.tare.overlap;

import java.util.List;

/**
 * A block of literal text that two or more templates hold, compared word by word (whitespace-only
 * differences are the same block).
 *
 * @param places every place the block stands, sorted by path, message and offset; at least two
 *               templates among them, and no two places overlapping
 * @param words  how many words the block has
 * @param tokens the tokens of its first copy on the tokenizer it was found with
 * @param text   the text of its first copy
 */
public record RepeatedBlock(List<Place> places, int words, int tokens, String text) {
    public RepeatedBlock {
        places = List.copyOf(places);
    }

    /**
     * One place a shared block stands.
     *
     * @param path    the template's path relative to the root, with {@code /}
     * @param message the message's index in the template, from 0
     * @param start   offset of the block's first character in the message's content
     * @param end     offset just past its last character
     */
    public record Place(String path, int message, int start, int end) {
    }

    /** The distinct templates holding the block, in path order. */
    public List<String> paths() {
        return places.stream().map(Place::path).distinct().toList();
    }
}
