package dev.tare.lint;

import dev.tare.structure.Fence;
import dev.tare.structure.Region;
import dev.tare.structure.Role;
import dev.tare.structure.Structure;
import dev.tare.template.Message;
import java.util.ArrayList;
import java.util.EnumSet;
import java.util.List;
import java.util.Optional;
import java.util.Set;

/**
 * One message of a template as rules see it: its content, its structure (the regions and fenced
 * blocks that say what is prose and what must stay as written), and the way back from content
 * offsets to the file.
 */
public final class MessageView {
    /** Text that is not prose at all: prose rules never read or edit it. */
    private static final Set<Role> NOT_PROSE = EnumSet.of(Role.FENCED_CODE, Role.INDENTED_CODE, Role.INLINE_CODE,
            Role.HTML, Role.PLACEHOLDER, Role.URL, Role.RAW);

    private final int index;
    private final Message message;
    private final Structure structure;
    private final ContentMap map;

    MessageView(int index, Message message, Structure structure, ContentMap map) {
        this.index = index;
        this.message = message;
        this.structure = structure;
        this.map = map;
    }

    /** The position of this message in its template, from 0. */
    public int index() {
        return index;
    }

    /** The message as parsed. */
    public Message message() {
        return message;
    }

    /** The text rules read: the body of a text template, or a chat message's content. */
    public String content() {
        return message.content();
    }

    /** The message's structure model. */
    public Structure structure() {
        return structure;
    }

    /** The fenced code blocks, in order. */
    public List<Fence> fences() {
        return structure.fences();
    }

    /** Whether {@code [start, end)} touches text that is not prose: code, HTML, a placeholder, a URL or a raw section. */
    public boolean isProtected(int start, int end) {
        return structure.touching(start, end).stream().anyMatch(r -> NOT_PROSE.contains(r.role()));
    }

    /** Whether a whitespace-only edit of {@code [start, end)} is safe (see {@link Structure#allowsWhitespaceEdit}). */
    public boolean allowsWhitespaceEdit(int start, int end) {
        return structure.allowsWhitespaceEdit(start, end);
    }

    /** Whether {@code [start, end)} touches a region of one of {@code roles}. */
    public boolean touches(int start, int end, Role... roles) {
        Set<Role> wanted = roles.length == 0 ? EnumSet.noneOf(Role.class) : EnumSet.of(roles[0], roles);
        return structure.touching(start, end).stream().anyMatch(r -> wanted.contains(r.role()));
    }

    /** The regions of {@code role} that touch {@code [start, end)}, sorted by start. */
    public List<Region> touching(int start, int end, Role role) {
        return structure.touching(start, end).stream().filter(r -> r.role() == role).toList();
    }

    /** The stretches of content outside code, HTML, placeholders, URLs and raw sections, in order, as {@code [start, end)} pairs. */
    public List<int[]> prose() {
        List<int[]> ranges = new ArrayList<>();
        for (Region region : structure.regions()) {
            if (NOT_PROSE.contains(region.role())) {
                continue;
            }
            if (!ranges.isEmpty() && ranges.get(ranges.size() - 1)[1] == region.start()) {
                ranges.get(ranges.size() - 1)[1] = region.end();
            } else {
                ranges.add(new int[] {region.start(), region.end()});
            }
        }
        return ranges;
    }

    /** The file offset of content offset {@code offset} (the end of the content maps just past its last character). */
    public int sourceOffset(int offset) {
        return map.sourceOffset(offset);
    }

    /**
     * The edit of the file that replaces content {@code [start, end)} as a whole with
     * {@code replacement} (which may not hold a line break), or empty when the span's ends cannot be
     * placed exactly in the file or the quoting there cannot hold the replacement. Inside a chat
     * file's value the span may cross escapes and indentation; what the file then reads as must be
     * verified by parsing it again.
     */
    public Optional<Edit> replacement(int start, int end, String replacement) {
        return map.span(start, end, replacement);
    }

    /**
     * Where a replacement of content {@code [start, end)} as a whole would stand, to be decided later
     * without this message; empty when its ends cannot be placed exactly in the file (see
     * {@link #replacement}).
     */
    public Optional<Replaceable> replaceable(int start, int end) {
        return map.span(start, end);
    }

    /** The content edits moved onto the file, or empty when they cannot be written back exactly. */
    Optional<List<Edit>> toSource(List<Edit> edits) {
        return map.toSource(content(), edits);
    }
}
