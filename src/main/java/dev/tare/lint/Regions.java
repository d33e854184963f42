package dev.tare.lint;

import dev.tare.template.Segment;
import java.util.ArrayList;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/** Finds the protected regions and fenced blocks of one message's content. */
final class Regions {
    private static final Pattern FENCE_OPEN = Pattern.compile("^ {0,3}(`{3,}|~{3,})(.*)$");
    private static final Pattern URL = Pattern.compile(
            "(?i)\\b(?:https?|ftp|file)://[^\\s<>\"'`)\\]]+|\\bwww\\.[a-z0-9-]+\\.[^\\s<>\"'`)\\]]+");

    private Regions() {
    }

    /** The fenced code blocks of {@code content}, in order. */
    static List<Fence> fences(String content) {
        List<Fence> fences = new ArrayList<>();
        int at = 0;
        while (at < content.length()) {
            int lineEnd = lineEnd(content, at);
            Matcher open = FENCE_OPEN.matcher(content.substring(at, lineEnd));
            int next = nextLine(content, lineEnd);
            if (open.matches() && !(open.group(1).charAt(0) == '`' && open.group(2).contains("`"))) {
                String marker = open.group(1);
                int bodyStart = next;
                int scan = next;
                Fence fence = null;
                while (scan < content.length()) {
                    int end = lineEnd(content, scan);
                    String line = content.substring(scan, end);
                    String stripped = line.strip();
                    if (line.length() - line.stripLeading().length() <= 3 && stripped.length() >= marker.length()
                            && stripped.chars().allMatch(c -> c == marker.charAt(0))) {
                        fence = new Fence(at, nextLine(content, end), bodyStart, scan, open.group(2).strip(), true);
                        break;
                    }
                    scan = nextLine(content, end);
                }
                if (fence == null) {
                    fence = new Fence(at, content.length(), bodyStart, content.length(), open.group(2).strip(), false);
                }
                fences.add(fence);
                at = fence.end();
                continue;
            }
            at = next;
        }
        return fences;
    }

    /**
     * Every protected region of the content, sorted by start: placeholders (from the parsed
     * segments, whose spans are shifted by {@code segmentBase}), fenced code, inline code and URLs.
     */
    static List<Region> of(String content, List<Segment> segments, int segmentBase, List<Fence> fences) {
        List<Region> regions = new ArrayList<>();
        for (Segment segment : segments) {
            if (!(segment instanceof Segment.Text)) {
                int start = segment.span().start() - segmentBase;
                int end = segment.span().end() - segmentBase;
                if (start >= 0 && end <= content.length()) {
                    regions.add(new Region(start, end, Region.Kind.PLACEHOLDER));
                }
            }
        }
        for (Fence fence : fences) {
            regions.add(new Region(fence.start(), fence.end(), Region.Kind.FENCED_CODE));
        }
        int at = 0;
        for (Fence fence : fences) {
            inline(content, at, fence.start(), regions);
            at = fence.end();
        }
        inline(content, at, content.length(), regions);
        regions.sort(java.util.Comparator.comparingInt(Region::start).thenComparingInt(Region::end));
        return regions;
    }

    /** Backtick code spans and URLs in {@code [from, to)}, outside fences. */
    private static void inline(String content, int from, int to, List<Region> regions) {
        int i = from;
        while (i < to) {
            if (content.charAt(i) != '`') {
                i++;
                continue;
            }
            int run = i;
            while (run < to && content.charAt(run) == '`') {
                run++;
            }
            int width = run - i;
            int close = closingRun(content, run, to, width);
            if (close < 0) {
                i = run;
                continue;
            }
            regions.add(new Region(i, close + width, Region.Kind.INLINE_CODE));
            i = close + width;
        }
        Matcher url = URL.matcher(content).region(from, to);
        while (url.find()) {
            int end = url.end();
            while (end > url.start() && ".,;:!?".indexOf(content.charAt(end - 1)) >= 0) {
                end--;
            }
            regions.add(new Region(url.start(), end, Region.Kind.URL));
        }
    }

    /** The start of the next run of exactly {@code width} backticks before a blank line, or -1. */
    private static int closingRun(String content, int from, int to, int width) {
        int i = from;
        while (i < to) {
            char c = content.charAt(i);
            if (c == '\n' && blankLineFollows(content, i + 1, to)) {
                return -1;
            }
            if (c != '`') {
                i++;
                continue;
            }
            int run = i;
            while (run < to && content.charAt(run) == '`') {
                run++;
            }
            if (run - i == width) {
                return i;
            }
            i = run;
        }
        return -1;
    }

    private static boolean blankLineFollows(String content, int from, int to) {
        int i = from;
        while (i < to && (content.charAt(i) == ' ' || content.charAt(i) == '\t' || content.charAt(i) == '\r')) {
            i++;
        }
        return i >= to || content.charAt(i) == '\n';
    }

    /** The end of the line starting at {@code from}, before its line break. */
    static int lineEnd(String text, int from) {
        int i = from;
        while (i < text.length() && text.charAt(i) != '\n' && text.charAt(i) != '\r') {
            i++;
        }
        return i;
    }

    /** The start of the line after the one ending at {@code lineEnd}. */
    static int nextLine(String text, int lineEnd) {
        if (lineEnd < text.length() && text.charAt(lineEnd) == '\r') {
            lineEnd++;
            if (lineEnd < text.length() && text.charAt(lineEnd) == '\n') {
                lineEnd++;
            }
            return lineEnd;
        }
        return lineEnd < text.length() ? lineEnd + 1 : lineEnd;
    }
}
