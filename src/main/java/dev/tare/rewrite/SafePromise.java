package dev.tare.rewrite;

import com.fasterxml.jackson.databind.JsonNode;
import dev.tare.lint.StrictJson;
import dev.tare.structure.Fence;
import dev.tare.structure.Structure;
import dev.tare.template.Message;
import dev.tare.template.Segment;
import dev.tare.template.Template;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

/**
 * What a safe rewrite promises, checked on the texts before and after, independently of the rules
 * that made it: the same messages and roles; the same words in the same order (whitespace and
 * removed invisible characters aside, JSON by value); the same variables, function calls, includes
 * and tags in the same order; every fenced block the same (a JSON block: the same value); code,
 * tables, tab-separated and aligned blocks, raw sections and HTML byte for byte; the same
 * indentation on every line with text. Each broken promise is one sentence.
 */
final class SafePromise {
    /** Characters an invisible edit may remove; the no-break spaces it may turn into spaces are whitespace here. */
    private static final String INVISIBLE = "\u200B\u200C\u200D\u2060\uFEFF\u00AD";

    private SafePromise() {
    }

    /** The promises {@code after} breaks as a safe rewrite of {@code before}; empty when it keeps them all. */
    static List<String> broken(Template before, Template after) {
        List<String> problems = new ArrayList<>();
        if (before.kind() != after.kind() || before.messages().size() != after.messages().size()) {
            problems.add("the file no longer holds the same kind of template with the same messages");
            return problems;
        }
        for (int i = 0; i < before.messages().size(); i++) {
            Message was = before.messages().get(i);
            Message is = after.messages().get(i);
            String where = before.isChat() ? "message " + (i + 1) : "the text";
            if (!was.role().equals(is.role())) {
                problems.add("the role of " + where + " changed");
            }
            if (!placeholders(was).equals(placeholders(is))) {
                problems.add("the variables, calls, includes or tags of " + where + " changed");
            }
            Optional<JsonNode> json = StrictJson.tree(was.content());
            if (json.isPresent()) {
                if (!json.equals(StrictJson.tree(is.content()))) {
                    problems.add(where + " was JSON and no longer holds the same value");
                }
                continue;
            }
            Structure wasStructure = Structure.of(was.content(), was.segments(), base(before, was), i);
            Structure isStructure = Structure.of(is.content(), is.segments(), base(after, is), i);
            if (!words(was.content(), wasStructure.fences()).equals(words(is.content(), isStructure.fences()))) {
                problems.add("the words of " + where + " changed");
            }
            if (!fences(was.content(), wasStructure.fences()).equals(fences(is.content(), isStructure.fences()))) {
                problems.add("a fenced block of " + where + " changed");
            }
            if (!keptInOrder(wasStructure.verbatimBlocks(), is.content())) {
                problems.add("code, a table, a tab-separated or aligned block, or a raw section of " + where + " changed");
            }
            if (!indentation(was.content(), wasStructure.fences()).equals(indentation(is.content(), isStructure.fences()))) {
                problems.add("the indentation of a line of " + where + " changed");
            }
        }
        return problems;
    }

    /**
     * Whether every block that had to stay byte for byte is in {@code after}, in the same order. The
     * blocks of the text before are what is protected: an edit elsewhere may make a prose line look
     * laid out (its gaps now line up with a neighbour's), and that changes no protected byte.
     */
    private static boolean keptInOrder(List<String> blocks, String after) {
        int from = 0;
        for (String block : blocks) {
            int at = after.indexOf(block, from);
            if (at < 0) {
                return false;
            }
            from = at + block.length();
        }
        return true;
    }

    /** Where a message's segment spans start: text templates count from the file's start, chat messages from the content's. */
    private static int base(Template template, Message message) {
        return template.isChat() ? 0 : template.bodyStart();
    }

    private static List<String> placeholders(Message message) {
        List<String> found = new ArrayList<>();
        for (Segment segment : message.segments()) {
            if (segment instanceof Segment.PerCall part) {
                found.add(part.source());
            } else if (segment instanceof Segment.Include include) {
                found.add(include.source());
            } else if (segment instanceof Segment.Tag tag) {
                found.add(tag.source());
            }
        }
        return found;
    }

    /** The words outside fences, and each fence as one word (a JSON fence as its value), in order. */
    private static List<String> words(String content, List<Fence> fences) {
        List<String> words = new ArrayList<>();
        int at = 0;
        for (Fence fence : fences) {
            split(content.substring(at, fence.start()), words);
            words.add(fenceValue(content, fence));
            at = fence.end();
        }
        split(content.substring(at), words);
        return words;
    }

    private static void split(String text, List<String> words) {
        StringBuilder word = new StringBuilder();
        for (int i = 0; i < text.length(); i++) {
            char c = text.charAt(i);
            if (INVISIBLE.indexOf(c) >= 0) {
                continue;
            }
            if (Character.isWhitespace(c) || Character.isSpaceChar(c)) {
                if (word.length() > 0) {
                    words.add(word.toString());
                    word.setLength(0);
                }
            } else {
                word.append(c);
            }
        }
        if (word.length() > 0) {
            words.add(word.toString());
        }
    }

    private static String withoutInvisibles(String text) {
        StringBuilder out = new StringBuilder(text.length());
        text.chars().filter(c -> INVISIBLE.indexOf(c) < 0).forEach(c -> out.append((char) c));
        return out.toString();
    }

    private static List<String> fences(String content, List<Fence> fences) {
        return fences.stream().map(fence -> fenceValue(content, fence)).toList();
    }

    /** A fence as written; a closed {@code json} fence whose body parses, as its fence lines and value. */
    private static String fenceValue(String content, Fence fence) {
        if (fence.closed() && fence.language().equals("json")) {
            Optional<JsonNode> value = StrictJson.tree(content.substring(fence.bodyStart(), fence.bodyEnd()));
            if (value.isPresent()) {
                return content.substring(fence.start(), fence.bodyStart()).strip() + value.get()
                        + content.substring(fence.bodyEnd(), fence.end()).strip();
            }
        }
        return content.substring(fence.start(), fence.end());
    }

    /** The leading whitespace of every line with text outside fences (fences are compared whole). */
    private static List<String> indentation(String content, List<Fence> fences) {
        List<String> indents = new ArrayList<>();
        int fence = 0;
        int at = 0;
        while (at < content.length()) {
            int end = at;
            while (end < content.length() && content.charAt(end) != '\n' && content.charAt(end) != '\r') {
                end++;
            }
            while (fence < fences.size() && fences.get(fence).end() <= at) {
                fence++;
            }
            boolean inFence = fence < fences.size() && fences.get(fence).start() <= at;
            String line = content.substring(at, end);
            if (!inFence && !withoutInvisibles(line).isBlank()) {
                indents.add(line.substring(0, line.length() - line.stripLeading().length()));
            }
            at = end < content.length() && content.charAt(end) == '\r' && end + 1 < content.length()
                    && content.charAt(end + 1) == '\n' ? end + 2 : end + 1;
        }
        return indents;
    }
}
