package dev.tare.structure;

import dev.tare.template.Segment;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * The structure model of one message's text: regions that cover it, each with one role, its
 * conditional branch and its XML-style section, and its fenced code blocks. Computed once per
 * message and read by every rule and by the verifier of safe rewrites, so that both agree on what is
 * prose and what must stay as written.
 */
public final class Structure {
    private static final Pattern URL = Pattern.compile(
            "(?i)\\b(?:https?|ftp|file)://[^\\s<>\"'`)\\]]+|\\bwww\\.[a-z0-9-]+\\.[^\\s<>\"'`)\\]]+");
    private static final Pattern RAW_OPEN = Pattern.compile("\\{%[-+~]?\\s*raw\\s*[-+~]?%}");

    private final String content;
    private final List<Region> regions;
    private final List<Fence> fences;
    private final int[] starts;

    private Structure(String content, List<Region> regions, List<Fence> fences) {
        this.content = content;
        this.regions = List.copyOf(regions);
        this.fences = List.copyOf(fences);
        this.starts = regions.stream().mapToInt(Region::start).toArray();
    }

    /**
     * The structure of a message's {@code content}.
     *
     * @param segments    the message's parsed segments
     * @param segmentBase what to subtract from a segment's span to get a content offset (the body's
     *                    start in the file for a text template, 0 for a chat message)
     * @param message     the message's index in its template
     */
    public static Structure of(String content, List<Segment> segments, int segmentBase, int message) {
        LineSpans lines = new LineSpans(content);
        MarkdownBlocks first = new MarkdownBlocks(content, lines);
        boolean[] code = new boolean[lines.count()];
        for (int i = 0; i < code.length; i++) {
            code[i] = first.roles[i] == Role.FENCED_CODE || first.roles[i] == Role.INDENTED_CODE;
        }
        boolean[] tagLines = new boolean[lines.count()];
        Optional<String>[] sections = TaggedSections.of(content, lines, code, tagLines);
        MarkdownBlocks blocks = first;
        if (any(tagLines)) {
            // Read again with the tag lines blanked, so that a section's text is read as Markdown, not as raw HTML.
            char[] blanked = content.toCharArray();
            for (int i = 0; i < tagLines.length; i++) {
                if (tagLines[i]) {
                    java.util.Arrays.fill(blanked, lines.start(i), lines.end(i), ' ');
                }
            }
            blocks = new MarkdownBlocks(new String(blanked), lines);
        }
        Role[] roles = blocks.roles;
        for (int i = 0; i < tagLines.length; i++) {
            if (tagLines[i]) {
                roles[i] = Role.SECTION_TAG;
            }
        }
        Layouts.mark(lines, content, roles);
        Examples.mark(content, lines, roles, blocks.headings, sections);

        Role[] at = new Role[content.length()];
        for (int i = 0; i < lines.count(); i++) {
            java.util.Arrays.fill(at, lines.start(i), lines.next(i), roles[i]);
        }
        for (int[] span : blocks.codeSpans) {
            overlay(at, span[0], span[1], Role.INLINE_CODE);
        }
        Matcher url = URL.matcher(content);
        while (url.find()) {
            int end = url.end();
            while (end > url.start() && ".,;:!?".indexOf(content.charAt(end - 1)) >= 0) {
                end--;
            }
            if (!at[url.start()].isVerbatim()) {
                overlay(at, url.start(), end, Role.URL);
            }
        }
        placeholders(content, segments, segmentBase, at);
        int[] branches = Branches.of(content, segments, segmentBase);
        return new Structure(content, regions(content, lines, at, branches, sections, message), blocks.fences);
    }

    private static void placeholders(String content, List<Segment> segments, int segmentBase, Role[] at) {
        for (int k = 0; k < segments.size(); k++) {
            Segment segment = segments.get(k);
            int start = segment.span().start() - segmentBase;
            int end = segment.span().end() - segmentBase;
            if (start < 0 || end > content.length()) {
                continue;
            }
            if (segment instanceof Segment.Text) {
                boolean raw = k > 0 && segments.get(k - 1) instanceof Segment.Tag tag && RAW_OPEN.matcher(tag.source()).matches();
                if (raw) {
                    overlay(at, start, end, Role.RAW);
                }
                continue;
            }
            overlay(at, start, end, Role.PLACEHOLDER);
        }
    }

    private static void overlay(Role[] at, int start, int end, Role role) {
        java.util.Arrays.fill(at, Math.max(0, start), Math.min(at.length, end), role);
    }

    private static List<Region> regions(String content, LineSpans lines, Role[] at, int[] branches,
                                        Optional<String>[] sections, int message) {
        List<Region> out = new ArrayList<>();
        int start = 0;
        for (int i = 1; i <= content.length(); i++) {
            if (i < content.length() && at[i] == at[start] && branches[i] == branches[start]
                    && sections[lines.lineOf(i)].equals(sections[lines.lineOf(start)])) {
                continue;
            }
            out.add(new Region(start, i, at[start], message, branches[start], sections[lines.lineOf(start)]));
            start = i;
        }
        return out;
    }

    private static boolean any(boolean[] flags) {
        for (boolean flag : flags) {
            if (flag) {
                return true;
            }
        }
        return false;
    }

    /** The regions, in order, covering the whole content. */
    public List<Region> regions() {
        return regions;
    }

    /** The fenced code blocks, in order. */
    public List<Fence> fences() {
        return fences;
    }

    /** The regions that share a character with {@code [from, to)} (for an insertion point, the region holding it). */
    public List<Region> touching(int from, int to) {
        List<Region> found = new ArrayList<>();
        if (regions.isEmpty()) {
            return found;
        }
        int i = Math.max(0, indexAt(from));
        for (; i < regions.size() && regions.get(i).start() < Math.max(to, from + 1); i++) {
            Region region = regions.get(i);
            if (region.end() > from || (from == to && region.start() <= from && region.end() >= from)) {
                found.add(region);
            }
        }
        return found;
    }

    /** The region holding content offset {@code offset}. */
    public Optional<Region> at(int offset) {
        int i = indexAt(offset);
        return i < 0 || offset >= content.length() ? Optional.empty() : Optional.of(regions.get(i));
    }

    private int indexAt(int offset) {
        int found = java.util.Arrays.binarySearch(starts, offset);
        return found >= 0 ? found : -found - 2;
    }

    /**
     * Whether a whitespace-only edit of {@code [from, to)} is safe: every character it replaces (or,
     * for an insertion, the place it inserts at) is in a region whose role allows it.
     */
    public boolean allowsWhitespaceEdit(int from, int to) {
        List<Region> touched = touching(from, to);
        return !touched.isEmpty() && touched.stream().allMatch(r -> r.role().allowsWhitespaceEdits());
    }

    /**
     * Whether {@code [from, to)} reads as one instruction of the prompt: prose or a list item (with
     * inline code, URLs and placeholders in it), outside examples, quotes and XML-style sections,
     * all in one conditional branch.
     */
    public boolean isInstruction(int from, int to) {
        List<Region> touched = touching(from, to);
        if (touched.isEmpty()) {
            return false;
        }
        int branch = touched.get(0).branch();
        boolean prose = false;
        for (Region region : touched) {
            Role role = region.role();
            if (region.branch() != branch || region.section().isPresent()) {
                return false;
            }
            if (role == Role.PROSE || role == Role.LIST_ITEM) {
                prose = true;
            } else if (role != Role.INLINE_CODE && role != Role.URL && role != Role.PLACEHOLDER) {
                return false;
            }
        }
        return prose;
    }

    /** The conditional branch at content offset {@code offset} (see {@link Region#branch()}). */
    public int branchAt(int offset) {
        return at(offset).map(Region::branch).orElse(0);
    }

    /**
     * The text of every region a safe rewrite must keep byte for byte, in order, with runs of
     * neighbouring such regions of one role joined: what the verifier looks for after a rewrite.
     * Fenced blocks are left out: they are compared through {@link #fences()}, since a JSON block may
     * be laid out anew.
     */
    public List<String> verbatimBlocks() {
        List<String> texts = new ArrayList<>();
        int i = 0;
        while (i < regions.size()) {
            Region region = regions.get(i);
            if (!region.role().isVerbatim() || region.role() == Role.FENCED_CODE) {
                i++;
                continue;
            }
            int end = region.end();
            int k = i + 1;
            while (k < regions.size() && regions.get(k).role() == region.role()) {
                end = regions.get(k).end();
                k++;
            }
            texts.add(content.substring(region.start(), end));
            i = k;
        }
        return texts;
    }
}
