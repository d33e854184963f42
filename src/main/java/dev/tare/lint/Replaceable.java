package dev.tare.lint;

import java.util.Optional;

/**
 * Where a replacement of a stretch of message content as a whole would stand in the file, kept apart
 * from the message, so that a rule can decide later what to write there without holding the
 * template: the file offsets of the stretch's ends and the quoting that decides what it may hold.
 */
public final class Replaceable {
    private final int from;
    private final int to;
    private final ContentMap.Style style;

    Replaceable(int from, int to, ContentMap.Style style) {
        this.from = from;
        this.to = to;
        this.style = style;
    }

    /**
     * The edit of the file writing {@code replacement} (which may not hold a line break) in place of
     * the stretch, or empty when the quoting there cannot hold it (see {@link MessageView#replacement}).
     */
    public Optional<Edit> by(String replacement) {
        if (!ContentMap.holds(style, "", replacement) || replacement.indexOf('\n') >= 0) {
            return Optional.empty();
        }
        return Optional.of(new Edit(from, to, replacement));
    }
}
