package dev.tare.template;

import java.util.ArrayDeque;
import java.util.Arrays;
import java.util.Deque;
import java.util.List;

/**
 * The blocks of one message's segments: for each tag that opens a block or starts one of its
 * branches, where that part ends (at the next middle tag or at the closing tag). The parser checks
 * the blocks strictly ({@link #check}); the renderer reads any list of segments leniently
 * ({@link #of}), since callers may render a few segments taken out of a template.
 */
final class Blocks {
    /** The blocks of a list with no block tag. */
    private static final Blocks FLAT = new Blocks(null);

    /** Per segment index: the index of the tag ending the part its tag starts, or -1. */
    private final int[] partEnd;

    private Blocks(int[] partEnd) {
        this.partEnd = partEnd;
    }

    /** The blocks of {@code segments}, read leniently: a stray tag is ignored, an unclosed block ends with the list. */
    static Blocks of(List<Segment> segments) {
        return match(segments, false);
    }

    /**
     * Checks that every block of {@code segments} is closed, in order, by its own kind of tag.
     *
     * @throws TemplateSyntaxException at the first tag out of place, saying what to write
     */
    static void check(List<Segment> segments) {
        match(segments, true);
    }

    /** The index of the tag ending the part that the open or middle tag at {@code index} starts. */
    int partEnd(int index) {
        return partEnd == null ? -1 : partEnd[index];
    }

    private static Blocks match(List<Segment> segments, boolean strict) {
        int n = segments.size();
        int[] partEnd = null;
        Deque<Integer> open = new ArrayDeque<>();
        // Per open block (by its index): the index of the tag starting its current part, and whether it has had a plain else.
        int[] part = null;
        boolean[] elsed = null;
        for (int i = 0; i < n; i++) {
            if (!(segments.get(i) instanceof Segment.Tag tag) || tag.control() instanceof Control.Plain) {
                continue;
            }
            Control control = tag.control();
            if (!(control instanceof Control.Open || control instanceof Control.Middle || control instanceof Control.Close)) {
                continue;
            }
            if (partEnd == null) {
                partEnd = new int[n];
                Arrays.fill(partEnd, -1);
                part = new int[n];
                elsed = new boolean[n];
            }
            if (control instanceof Control.Open) {
                open.push(i);
                part[i] = i;
            } else if (control instanceof Control.Middle middle) {
                if (open.isEmpty()) {
                    if (strict) {
                        throw stray(tag, middle);
                    }
                    continue;
                }
                int top = open.peek();
                if (strict) {
                    checkMiddle(tag(segments, top), tag, middle, elsed[top]);
                }
                elsed[top] |= middle.condition().isEmpty() && !middle.keyword().equals("pluralize");
                partEnd[part[top]] = i;
                part[top] = i;
            } else {
                Control.Close close = (Control.Close) control;
                int match = matching(segments, open, tag, close);
                if (strict && (open.isEmpty() || match != open.peek())) {
                    throw open.isEmpty() || match < 0 ? unopened(tag, close, open.isEmpty() ? null : tag(segments, open.peek()))
                            : mismatched(tag, tag(segments, open.peek()));
                }
                if (match < 0) {
                    continue;
                }
                while (!open.isEmpty()) {
                    int top = open.pop();
                    partEnd[part[top]] = i;
                    if (top == match) {
                        break;
                    }
                }
            }
        }
        if (!open.isEmpty()) {
            if (strict) {
                throw unclosed(tag(segments, open.peek()));
            }
            while (!open.isEmpty()) {
                int top = open.pop();
                partEnd[part[top]] = n;
            }
        }
        return partEnd == null ? FLAT : new Blocks(partEnd);
    }

    /** The innermost open block that {@code close} ends, or -1. */
    private static int matching(List<Segment> segments, Deque<Integer> open, Segment.Tag closer, Control.Close close) {
        for (int index : open) {
            Segment.Tag opener = tag(segments, index);
            if (jinja(opener) == jinja(closer) && ((Control.Open) opener.control()).keyword().equals(close.keyword())) {
                return index;
            }
        }
        return -1;
    }

    private static void checkMiddle(Segment.Tag opener, Segment.Tag tag, Control.Middle middle, boolean elsed) {
        Control.Open block = (Control.Open) opener.control();
        boolean allowed;
        if (jinja(tag)) {
            allowed = jinja(opener) && switch (middle.keyword()) {
                case "elif" -> block.keyword().equals("if");
                case "else" -> block.keyword().equals("if") || block.keyword().equals("for");
                default -> block.keyword().equals("trans");
            };
        } else {
            allowed = !jinja(opener);
        }
        if (!allowed) {
            throw error(tag, "'" + shown(tag) + "' cannot stand in '" + shown(opener) + "' (" + where(opener)
                    + "); close that block with '" + closer(opener) + "' first");
        }
        if (elsed && !middle.keyword().equals("pluralize")) {
            throw error(tag, "'" + shown(tag) + "' comes after the plain else of '" + shown(opener) + "' ("
                    + where(opener) + "); put it before that else, or close the block with '" + closer(opener) + "'");
        }
    }

    private static TemplateSyntaxException stray(Segment.Tag tag, Control.Middle middle) {
        String example = jinja(tag)
                ? (middle.keyword().equals("pluralize") ? "'{% trans %}' and '{% endtrans %}'" : "'{% if ... %}' and '{% endif %}'")
                : "'{{#if ...}}' and '{{/if}}'";
        return error(tag, "'" + shown(tag) + "' stands outside any block; remove it, or put it between " + example);
    }

    private static TemplateSyntaxException unopened(Segment.Tag tag, Control.Close close, Segment.Tag innermost) {
        String opener = jinja(tag) ? "{% " + close.keyword() + " ... %}" : "{{#" + close.keyword() + " ...}}";
        if (innermost != null) {
            return error(tag, "'" + shown(tag) + "' closes no open block (the innermost is '" + shown(innermost) + "', "
                    + where(innermost) + ", which '" + closer(innermost) + "' closes); remove it, or open it with '"
                    + opener + "'");
        }
        return error(tag, "'" + shown(tag) + "' closes no open block; remove it, or open it with '" + opener + "'");
    }

    private static TemplateSyntaxException mismatched(Segment.Tag tag, Segment.Tag innermost) {
        return error(tag, "'" + shown(tag) + "' cannot close '" + shown(innermost) + "' (" + where(innermost)
                + "); close that block first with '" + closer(innermost) + "'");
    }

    private static TemplateSyntaxException unclosed(Segment.Tag opener) {
        return error(opener, "'" + shown(opener) + "' is never closed; add '" + closer(opener) + "' where its body ends");
    }

    /** The tag that closes the block {@code opener} opens. */
    private static String closer(Segment.Tag opener) {
        String keyword = ((Control.Open) opener.control()).keyword();
        return jinja(opener) ? "{% end" + keyword + " %}" : "{{/" + keyword + "}}";
    }

    private static boolean jinja(Segment.Tag tag) {
        return tag.source().startsWith("{%");
    }

    private static Segment.Tag tag(List<Segment> segments, int index) {
        return (Segment.Tag) segments.get(index);
    }

    /** The tag as written, shortened to one line of reasonable length for a message. */
    private static String shown(Segment.Tag tag) {
        String source = tag.source().replaceAll("\\s+", " ");
        return source.length() <= 48 ? source : source.substring(0, 40) + "...";
    }

    private static String where(Segment.Tag tag) {
        return "line " + tag.span().line() + ", column " + tag.span().column();
    }

    private static TemplateSyntaxException error(Segment.Tag tag, String problem) {
        return new TemplateSyntaxException(tag.span().line(), tag.span().column(), problem);
    }
}
