package dev.tare.template;

import java.util.List;

/**
 * One message of a template: for a chat file, one entry of {@code messages}; for a text template,
 * the whole body after front matter, with role {@value #TEXT_ROLE}, or one part between role markers
 * ({@code system:}, {@code user:}, ...); for a tool file, one tool definition as minified JSON, with
 * role {@value #TOOL_ROLE}.
 *
 * @param role     the chat role ({@code system}, {@code user}, ...) or {@value #TEXT_ROLE}
 * @param content  the text the segments were parsed from
 * @param segments the parsed segments, in order, covering all of {@code content}
 * @param origin   where {@code content} stands in the file
 */
public record Message(String role, String content, List<Segment> segments, ContentOrigin origin) {
    /** The role of a text template's single message. */
    public static final String TEXT_ROLE = "text";
    /** The role of each tool definition of a tool file. */
    public static final String TOOL_ROLE = "tool";

    public Message {
        segments = List.copyOf(segments);
    }

    /**
     * A message that is never mapped back onto a file (one made up to render a piece of another):
     * its origin is the line of its first segment.
     */
    public Message(String role, String content, List<Segment> segments) {
        this(role, content, segments, new ContentOrigin.Made(segments.isEmpty() ? 1 : segments.get(0).span().line()));
    }
}
