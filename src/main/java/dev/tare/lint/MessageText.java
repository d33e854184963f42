package dev.tare.lint;

import dev.tare.template.Message;
import java.util.ArrayList;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * One message of a template as rules see it: its content, the regions prose rules leave alone, its
 * fenced blocks, and the way back from content offsets to the file.
 */
public final class MessageText {
    private final int index;
    private final Message message;
    private final List<Region> regions;
    private final List<Fence> fences;
    private final ContentMap map;
    /** Every region, and the regions of each kind, indexed for overlap questions. */
    private final RegionIndex all;
    private final Map<Region.Kind, RegionIndex> byKind = new EnumMap<>(Region.Kind.class);

    MessageText(int index, Message message, List<Region> regions, List<Fence> fences, ContentMap map) {
        this.index = index;
        this.message = message;
        this.regions = List.copyOf(regions);
        this.fences = List.copyOf(fences);
        this.map = map;
        this.all = new RegionIndex(this.regions);
        for (Region.Kind kind : Region.Kind.values()) {
            byKind.put(kind, new RegionIndex(this.regions.stream().filter(r -> r.kind() == kind).toList()));
        }
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

    /** The protected regions, sorted by start. */
    public List<Region> regions() {
        return regions;
    }

    /** The fenced code blocks, in order. */
    public List<Fence> fences() {
        return fences;
    }

    /** Whether {@code [start, end)} touches a protected region (see {@link Region#overlaps}). */
    public boolean isProtected(int start, int end) {
        return all.overlaps(start, end);
    }

    /** Whether {@code [start, end)} touches a protected region of the given kinds. */
    public boolean touches(int start, int end, Region.Kind... kinds) {
        for (Region.Kind kind : kinds) {
            if (byKind.get(kind).overlaps(start, end)) {
                return true;
            }
        }
        return false;
    }

    /** The regions of {@code kind} that touch {@code [start, end)}, sorted by start. */
    public List<Region> touching(int start, int end, Region.Kind kind) {
        return byKind.get(kind).touching(start, end);
    }

    /** The stretches of content outside every protected region, in order, as {@code [start, end)} pairs. */
    public List<int[]> prose() {
        List<int[]> ranges = new ArrayList<>();
        int at = 0;
        for (Region region : regions) {
            if (region.start() > at) {
                ranges.add(new int[] {at, region.start()});
            }
            at = Math.max(at, region.end());
        }
        if (at < content().length()) {
            ranges.add(new int[] {at, content().length()});
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
