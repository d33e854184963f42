package dev.tare.rewrite;

import com.fasterxml.jackson.databind.JsonNode;
import dev.tare.lint.MessageView;
import dev.tare.lint.StrictJson;
import dev.tare.lint.TemplateView;
import dev.tare.structure.Fence;
import dev.tare.structure.Region;
import dev.tare.structure.Role;
import dev.tare.template.Segment;
import dev.tare.template.ContentOrigin;
import dev.tare.template.Template;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.TreeMap;

/**
 * The checks a rewritten file must pass before it may be written, comparing the original text with
 * the final one (both parsed again by the template parser): the same messages, metadata and front
 * matter; the same multiset of variables, function calls, includes and tags; the same code spans and
 * fenced code (a fenced {@code json} block laid out anew must hold an equal JSON tree, and so
 * must a message that was all JSON); no non-whitespace character removed or written by a whitespace
 * rule, and the non-whitespace characters otherwise in the same order; no paragraph break removed or
 * added between the characters that stayed; the same final-newline state; no line-ending style the
 * file did not already use. Each failure is one sentence naming the line.
 */
final class Invariants {
    private Invariants() {
    }

    /** What is wrong with {@code after} as a rewrite of {@code before}; empty when every invariant holds. */
    static List<String> violations(Template before, Template after, Trace trace) {
        List<String> problems = new ArrayList<>();
        String original = trace.original();
        String rewritten = trace.current();
        if (!trace.consistent() || !rewritten.equals(after.source())) {
            problems.add("the rewritten text does not follow from the edits (an internal error)");
            return problems;
        }
        if (before.kind() != after.kind() || before.messages().size() != after.messages().size()) {
            problems.add("the file no longer parses as the same kind of template with the same number of messages");
            return problems;
        }
        for (int i = 0; i < before.messages().size(); i++) {
            if (!before.messages().get(i).role().equals(after.messages().get(i).role())) {
                problems.add("the role of message " + (i + 1) + " changed");
            }
            if (before.messages().get(i).origin() instanceof ContentOrigin.Literal was
                    && !(after.messages().get(i).origin() instanceof ContentOrigin.Literal is
                    && is.name().equals(was.name()) && is.meta().equals(was.meta()))) {
                problems.add("the prompt written at line " + was.line() + " (" + was.name()
                        + ") is no longer found there under its name and settings");
            }
        }
        if (!before.meta().equals(after.meta())
                || !original.substring(0, before.bodyStart()).equals(rewritten.substring(0, after.bodyStart()))) {
            problems.add("the front matter or the keys beside the messages changed");
        }
        placeholders(before, after, problems);
        TemplateView beforeText = TemplateView.of(before);
        TemplateView afterText = TemplateView.of(after);
        code(beforeText, afterText, problems);
        nonWhitespace(trace, problems);
        paragraphs(trace, messageRanges(beforeText), sourceFences(beforeText), sourceFences(afterText), problems);
        finalNewline(original, rewritten, problems);
        lineEndings(original, rewritten, problems);
        return problems;
    }

    private static void placeholders(Template before, Template after, List<String> problems) {
        Map<String, Integer> was = placeholderCounts(before);
        Map<String, Integer> is = placeholderCounts(after);
        if (was.equals(is)) {
            return;
        }
        for (String key : union(was, is)) {
            int a = was.getOrDefault(key, 0);
            int b = is.getOrDefault(key, 0);
            if (a != b) {
                problems.add(key + " appears " + times(a) + " in the original and " + times(b) + " after the rewrite");
            }
        }
    }

    private static Map<String, Integer> placeholderCounts(Template template) {
        Map<String, Integer> counts = new TreeMap<>();
        for (Segment segment : template.segments()) {
            String key = null;
            if (segment instanceof Segment.Variable variable) {
                key = "variable '" + variable.name() + "' (" + variable.source() + ")";
            } else if (segment instanceof Segment.Call call) {
                key = "call '" + call.name() + "' (" + call.source() + ")";
            } else if (segment instanceof Segment.Include include) {
                key = "include '" + include.name() + "' (" + include.source() + ")";
            } else if (segment instanceof Segment.Tag tag) {
                key = "tag " + tag.source();
            }
            if (key != null) {
                counts.merge(key, 1, Integer::sum);
            }
        }
        return counts;
    }

    private static void code(TemplateView before, TemplateView after, List<String> problems) {
        for (int m = 0; m < before.messages().size(); m++) {
            MessageView was = before.messages().get(m);
            MessageView is = after.messages().get(m);
            if (!spans(was).equals(spans(is))) {
                problems.add("the inline code of " + where(before, was) + " changed");
            }
            if (was.fences().size() != is.fences().size()) {
                problems.add("the number of fenced code blocks in " + where(before, was) + " changed");
                continue;
            }
            for (int f = 0; f < was.fences().size(); f++) {
                Fence a = was.fences().get(f);
                Fence b = is.fences().get(f);
                if (!text(was, a).equals(text(is, b)) && !sameJson(was, a, is, b)) {
                    problems.add("the fenced code block at line " + before.line(was, a.start()) + " changed");
                }
            }
            wholeJson(before, was, is, problems);
        }
    }

    private static List<String> spans(MessageView message) {
        List<String> spans = new ArrayList<>();
        for (Region region : message.structure().regions()) {
            if (region.role() == Role.INLINE_CODE) {
                spans.add(message.content().substring(region.start(), region.end()));
            }
        }
        return spans;
    }

    private static String text(MessageView message, Fence fence) {
        return message.content().substring(fence.start(), fence.end());
    }

    /** Whether two fenced json blocks have the same fence lines and bodies that read to equal JSON trees. */
    private static boolean sameJson(MessageView was, Fence a, MessageView is, Fence b) {
        if (!a.language().equals("json") || !b.language().equals("json") || !a.closed() || !b.closed()) {
            return false;
        }
        String wasContent = was.content();
        String isContent = is.content();
        if (!wasContent.substring(a.start(), a.bodyStart()).equals(isContent.substring(b.start(), b.bodyStart()))
                || !wasContent.substring(a.bodyEnd(), a.end()).equals(isContent.substring(b.bodyEnd(), b.end()))) {
            return false;
        }
        Optional<JsonNode> tree = StrictJson.tree(wasContent.substring(a.bodyStart(), a.bodyEnd()));
        return tree.isPresent() && tree.equals(StrictJson.tree(isContent.substring(b.bodyStart(), b.bodyEnd())));
    }

    private static void wholeJson(TemplateView before, MessageView was, MessageView is, List<String> problems) {
        if (!was.fences().isEmpty() || was.content().equals(is.content())) {
            return;
        }
        Optional<JsonNode> tree = StrictJson.tree(was.content());
        if (tree.isPresent() && !tree.equals(StrictJson.tree(is.content()))) {
            problems.add(where(before, was) + " was JSON and no longer holds the same JSON value");
        }
    }

    private static void nonWhitespace(Trace trace, List<String> problems) {
        if (!trace.breaches().isEmpty()) {
            Trace.Breach breach = trace.breaches().get(0);
            problems.add("the whitespace rule " + breach.rule() + (breach.removed() ? " removed" : " wrote")
                    + " the character '" + breach.character() + "' near line " + breach.originalLine());
            return;
        }
        String original = trace.original();
        String rewritten = trace.current();
        int i = 0;
        int j = 0;
        while (true) {
            while (i < original.length() && (Character.isWhitespace(original.charAt(i)) || trace.removedByTextRule(i))) {
                i++;
            }
            while (j < rewritten.length() && (Character.isWhitespace(rewritten.charAt(j)) || trace.writtenByTextRule(j))) {
                j++;
            }
            if (i >= original.length() || j >= rewritten.length()) {
                if (i < original.length() || j < rewritten.length()) {
                    problems.add("the non-whitespace characters changed near line "
                            + Trace.lineOf(original, Math.min(i, original.length())));
                }
                return;
            }
            if (original.charAt(i) != rewritten.charAt(j)) {
                problems.add("the non-whitespace characters changed near line " + Trace.lineOf(original, i));
                return;
            }
            i++;
            j++;
        }
    }

    /** The fenced code blocks of every message, as {@code [start, end)} offsets of the file's text. */
    private static List<int[]> sourceFences(TemplateView text) {
        List<int[]> ranges = new ArrayList<>();
        for (MessageView message : text.messages()) {
            for (Fence fence : message.fences()) {
                ranges.add(new int[] {message.sourceOffset(fence.start()), message.sourceOffset(fence.end())});
            }
        }
        return ranges;
    }

    /** Each message's text as {@code [start, end)} offsets of the file's text. */
    private static List<int[]> messageRanges(TemplateView text) {
        List<int[]> ranges = new ArrayList<>();
        for (MessageView message : text.messages()) {
            ranges.add(new int[] {message.sourceOffset(0), message.sourceOffset(message.content().length())});
        }
        return ranges;
    }

    /** The index of the range holding {@code offset}, or -1. */
    private static int rangeOf(List<int[]> ranges, int offset) {
        for (int i = 0; i < ranges.size(); i++) {
            if (offset >= ranges.get(i)[0] && offset < ranges.get(i)[1]) {
                return i;
            }
        }
        return -1;
    }

    /**
     * Compares, for every two neighbouring non-whitespace characters that stayed from the original
     * and stand in the same message, whether a blank line separates them before and after. Breaks
     * at the edge of a message (after front matter, at the end) are not paragraph breaks.
     */
    private static void paragraphs(Trace trace, List<int[]> messages, List<int[]> fencesBefore, List<int[]> fencesAfter,
                                   List<String> problems) {
        String original = trace.original();
        String rewritten = trace.current();
        int[] blankBefore = blankLineStarts(original, fencesBefore);
        int[] blankAfter = blankLineStarts(rewritten, fencesAfter);
        int previous = -1;
        int previousMessage = -1;
        for (int j = 0; j < rewritten.length(); j++) {
            int from = trace.originOf(j);
            if (from < 0 || Character.isWhitespace(rewritten.charAt(j))) {
                continue;
            }
            int message = rangeOf(messages, from);
            boolean sameMessage = message >= 0 && message == previousMessage;
            previousMessage = message;
            if (previous >= 0 && sameMessage) {
                int was = trace.originOf(previous);
                boolean brokeBefore = blankBefore[from] - blankBefore[was + 1] > 0;
                boolean breaksAfter = blankAfter[j] - blankAfter[previous + 1] > 0;
                if (brokeBefore != breaksAfter) {
                    problems.add((brokeBefore ? "a paragraph break was removed" : "a paragraph break was added")
                            + " near line " + Trace.lineOf(original, from));
                    return;
                }
            }
            previous = j;
        }
    }

    /**
     * For each offset {@code i} (and the end), how many blank lines outside fenced code start before
     * {@code i}. A blank line holds only spaces and tabs and is followed by a line break.
     */
    private static int[] blankLineStarts(String text, List<int[]> fences) {
        int[] counts = new int[text.length() + 1];
        int count = 0;
        int lineStart = 0;
        for (int i = 0; i <= text.length(); i++) {
            counts[i] = count;
            if (i == lineStart && i < text.length() && isBlankLine(text, i) && !inside(fences, i)) {
                count++;
            }
            if (i < text.length()) {
                char c = text.charAt(i);
                boolean breaks = c == '\n' || (c == '\r' && (i + 1 >= text.length() || text.charAt(i + 1) != '\n'));
                if (breaks) {
                    lineStart = i + 1;
                }
            }
        }
        return counts;
    }

    private static boolean isBlankLine(String text, int start) {
        for (int i = start; i < text.length(); i++) {
            char c = text.charAt(i);
            if (c == '\n' || c == '\r') {
                return true;
            }
            if (c != ' ' && c != '\t') {
                return false;
            }
        }
        return false;
    }

    private static boolean inside(List<int[]> ranges, int offset) {
        for (int[] range : ranges) {
            if (offset >= range[0] && offset < range[1]) {
                return true;
            }
        }
        return false;
    }

    /** Whether the file ends with a line break; which break it is follows the line that ends the file now. */
    private static void finalNewline(String original, String rewritten, List<String> problems) {
        boolean was = endsWithBreak(original);
        boolean is = endsWithBreak(rewritten);
        if (was != is) {
            problems.add(was ? "the file ended with a line break and no longer does"
                    : "the file did not end with a line break and now does");
        }
    }

    private static boolean endsWithBreak(String text) {
        return text.endsWith("\n") || text.endsWith("\r");
    }

    private static void lineEndings(String original, String rewritten, List<String> problems) {
        List<String> was = lineEndingStyles(original);
        for (String style : lineEndingStyles(rewritten)) {
            if (!was.contains(style)) {
                problems.add("the rewrite brings " + style + " line endings into a file that had "
                        + (was.isEmpty() ? "none" : String.join(" and ", was)) + " ones");
            }
        }
    }

    private static String where(TemplateView text, MessageView message) {
        return text.template().isChat() ? "message " + (message.index() + 1) : "the text";
    }

    private static String times(int count) {
        return count == 1 ? "once" : count + " times";
    }

    private static java.util.Set<String> union(Map<String, Integer> a, Map<String, Integer> b) {
        java.util.Set<String> keys = new java.util.TreeSet<>(a.keySet());
        keys.addAll(b.keySet());
        return keys;
    }

    /** The line-ending styles a text uses: CRLF, LF and CR, in that order. */
    static List<String> lineEndingStyles(String text) {
        boolean crlf = false;
        boolean lf = false;
        boolean cr = false;
        for (int i = 0; i < text.length(); i++) {
            char c = text.charAt(i);
            if (c == '\r' && i + 1 < text.length() && text.charAt(i + 1) == '\n') {
                crlf = true;
                i++;
            } else if (c == '\r') {
                cr = true;
            } else if (c == '\n') {
                lf = true;
            }
        }
        List<String> styles = new ArrayList<>();
        if (crlf) {
            styles.add("CRLF");
        }
        if (lf) {
            styles.add("LF");
        }
        if (cr) {
            styles.add("CR");
        }
        return styles;
    }
}
