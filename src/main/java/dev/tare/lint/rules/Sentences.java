package dev.tare.lint.rules;

import dev.tare.lint.MessageView;
import dev.tare.structure.Region;
import dev.tare.structure.Role;
import java.util.ArrayList;
import java.util.List;
import java.util.regex.Pattern;

/**
 * The sentences of a message's prose, for the repeated-instruction rules. Text is cut into units
 * (paragraphs, list items, headings; fenced code and lines that are only a tag end a unit) and units
 * into sentences at {@code .}, {@code !} or {@code ?} followed by whitespace. Each sentence knows
 * whether the structure model reads it as an instruction, and its conditional branch.
 */
final class Sentences {
    /** Sentences shorter than this (in words) are too common to count as repeated instructions. */
    static final int MIN_WORDS = 4;
    private static final Pattern LIST_ITEM = Pattern.compile("^\\s*(?:[-*+]|\\d{1,3}[.)])\\s+");
    private static final Pattern HEADING = Pattern.compile("^\\s{0,3}#{1,6}\\s");

    private Sentences() {
    }

    /** Words that make a sentence point at its neighbours, so that a copy elsewhere says something else. */
    static final Pattern POINTS_AROUND = Pattern.compile(
            "(?i)\\b(?:above|below|following|preceding|previous|foregoing|hereafter)\\b");

    /**
     * One sentence.
     *
     * @param start       offset of its first character in the content
     * @param end         offset just past its last character
     * @param text        its text with runs of whitespace made single spaces
     * @param unit        the unit it belongs to
     * @param instruction whether it reads as an instruction of its own: prose or a list item outside
     *                    examples, quotes and XML-style sections, in one conditional branch, and not a
     *                    lead-in to what follows (ending in a colon) or a pointer to its neighbours
     * @param branch      its conditional branch (see {@link dev.tare.structure.Region#branch()})
     */
    record Sentence(int start, int end, String text, Unit unit, boolean instruction, int branch) {
        int words() {
            return text.split(" ").length;
        }
    }

    /**
     * A paragraph, list item or heading.
     *
     * @param start      offset of its first character (after a list marker)
     * @param end        offset just past its last character
     * @param lineStart  offset of the start of its first line
     * @param next       offset of the line after its last line
     * @param listItem   whether it is a list item
     */
    record Unit(int start, int end, int lineStart, int next, boolean listItem) {
    }

    static List<Sentence> of(MessageView message) {
        String content = message.content();
        List<Unit> units = units(message, content);
        List<Sentence> sentences = new ArrayList<>();
        for (Unit unit : units) {
            split(message, unit, sentences);
        }
        return sentences;
    }

    private static List<Unit> units(MessageView message, String content) {
        List<Unit> units = new ArrayList<>();
        int start = -1;
        int lineStart = -1;
        int end = -1;
        int next = -1;
        boolean listItem = false;
        for (ContentLine line : ContentLine.of(content)) {
            String text = line.text(content);
            boolean breaks = line.isBlank(content) || message.touches(line.start(), line.end(), Role.FENCED_CODE,
                    Role.INDENTED_CODE, Role.HTML, Role.TABLE_ROW, Role.SECTION_TAG)
                    || onlyPlaceholders(message, line, content);
            var item = LIST_ITEM.matcher(text);
            boolean startsItem = item.find();
            boolean heading = HEADING.matcher(text).find();
            if (start >= 0 && (breaks || startsItem || heading)) {
                units.add(new Unit(start, end, lineStart, next, listItem));
                start = -1;
            }
            if (breaks) {
                continue;
            }
            if (start < 0) {
                lineStart = line.start();
                start = line.start() + (startsItem ? item.end() : text.length() - text.stripLeading().length());
                listItem = startsItem;
            }
            end = line.end();
            next = line.next();
            if (heading) {
                units.add(new Unit(start, end, lineStart, next, false));
                start = -1;
            }
        }
        if (start >= 0) {
            units.add(new Unit(start, end, lineStart, next, listItem));
        }
        return units;
    }

    private static boolean onlyPlaceholders(MessageView message, ContentLine line, String content) {
        for (int i = line.start(); i < line.end(); i++) {
            char c = content.charAt(i);
            if (c != ' ' && c != '\t' && !message.touches(i, i + 1, Role.PLACEHOLDER)) {
                return false;
            }
        }
        return true;
    }

    private static void split(MessageView message, Unit unit, List<Sentence> out) {
        String content = message.content();
        int start = unit.start();
        for (int i = unit.start(); i < unit.end(); i++) {
            char c = content.charAt(i);
            boolean ends = (c == '.' || c == '!' || c == '?')
                    && (i + 1 == unit.end() || Character.isWhitespace(content.charAt(i + 1)));
            if (ends) {
                add(message, start, i + 1, unit, out);
                start = i + 1;
            }
        }
        add(message, start, unit.end(), unit, out);
    }

    private static void add(MessageView message, int from, int to, Unit unit, List<Sentence> out) {
        String content = message.content();
        int start = from;
        while (start < to && Character.isWhitespace(content.charAt(start))) {
            start++;
        }
        int end = to;
        while (end > start && Character.isWhitespace(content.charAt(end - 1))) {
            end--;
        }
        if (end > start) {
            String text = singleSpaced(content, start, end);
            boolean instruction = message.structure().isInstruction(start, end) && !text.endsWith(":")
                    && !pointsAround(text);
            out.add(new Sentence(start, end, text, unit, instruction, message.structure().branchAt(start)));
        }
    }

    /** The words of {@link #POINTS_AROUND}, each of which a match contains in lower case. */
    private static final List<String> POINTING_WORDS = List.of("above", "below", "following", "preceding", "previous",
            "foregoing", "hereafter");

    /**
     * Whether {@code text} points at its neighbours. The pattern matches ASCII letters only, so a
     * text whose lower case holds none of its words cannot match, and most sentences skip it.
     */
    static boolean pointsAround(String text) {
        String lower = text.toLowerCase(java.util.Locale.ROOT);
        for (String word : POINTING_WORDS) {
            if (lower.contains(word)) {
                return POINTS_AROUND.matcher(text).find();
            }
        }
        return false;
    }

    /** {@code content[start, end)} with each run of whitespace ({@code \\s}: space, tab, line breaks, form feeds) made one space. */
    static String singleSpaced(String content, int start, int end) {
        StringBuilder out = null;
        for (int i = start; i < end; i++) {
            char c = content.charAt(i);
            if (isSpace(c) && (c != ' ' || i + 1 < end && isSpace(content.charAt(i + 1)))) {
                if (out == null) {
                    out = new StringBuilder(end - start).append(content, start, i);
                }
                out.append(' ');
                while (i + 1 < end && isSpace(content.charAt(i + 1))) {
                    i++;
                }
            } else if (out != null) {
                out.append(c);
            }
        }
        return out == null ? content.substring(start, end) : out.toString();
    }

    private static boolean isSpace(char c) {
        return c == ' ' || c == '\t' || c == '\n' || c == '\u000B' || c == '\f' || c == '\r';
    }

    /**
     * The text to delete to drop the sentence at {@code index} of {@code all}: its whole unit's lines
     * when it is the whole unit (with one following blank line when blank lines surround it), else the
     * sentence and the whitespace that separates it from its neighbour; empty when it is in a list and
     * lists are not allowed. Only the sentence's own lines and its neighbours are read, so dropping
     * many sentences of a long text stays linear.
     */
    static java.util.Optional<int[]> removal(String content, List<Sentence> all, int index, boolean allowList) {
        Sentence sentence = all.get(index);
        Unit unit = sentence.unit();
        if (unit.listItem() && !allowList) {
            return java.util.Optional.empty();
        }
        if (sentence.start() == unit.start() && sentence.end() == unit.end()) {
            int end = unit.next();
            boolean blankBefore = unit.lineStart() == 0 || isBlankLineBefore(content, unit.lineStart());
            ContentLine following = end < content.length() ? ContentLine.at(content, end) : null;
            int start = unit.lineStart();
            if (blankBefore && following != null && following.isBlank(content)) {
                end = following.next();
            } else if (blankBefore && following == null && unit.lineStart() > 0) {
                start = previousLineStart(content, unit.lineStart());
            }
            if (end == content.length() && unit.end() == content.length() && start > 0) {
                // The text ends without a line break: take the break before instead, so it still does.
                start -= content.startsWith("\r\n", start - 2) ? 2 : 1;
            }
            return java.util.Optional.of(new int[] {start, end});
        }
        Sentence previous = index > 0 ? all.get(index - 1) : null;
        if (previous != null && previous.unit().equals(unit)) {
            return java.util.Optional.of(new int[] {previous.end(), sentence.end()});
        }
        Sentence following = index + 1 < all.size() ? all.get(index + 1) : null;
        if (following != null && following.unit().equals(unit)) {
            return java.util.Optional.of(new int[] {sentence.start(), following.start()});
        }
        return java.util.Optional.empty();
    }

    private static int previousLineStart(String content, int lineStart) {
        int end = lineStart - 1;
        if (end > 0 && content.charAt(end) == '\n' && content.charAt(end - 1) == '\r') {
            end--;
        }
        int start = end;
        while (start > 0 && content.charAt(start - 1) != '\n' && content.charAt(start - 1) != '\r') {
            start--;
        }
        return start;
    }

    private static boolean isBlankLineBefore(String content, int lineStart) {
        int end = lineStart - 1;
        if (end > 0 && content.charAt(end) == '\n' && content.charAt(end - 1) == '\r') {
            end--;
        }
        int start = end;
        while (start > 0 && content.charAt(start - 1) != '\n' && content.charAt(start - 1) != '\r') {
            start--;
        }
        return isBlank(content.substring(start, end));
    }

    private static boolean isBlank(String text) {
        return text.chars().allMatch(c -> c == ' ' || c == '\t');
    }
}
