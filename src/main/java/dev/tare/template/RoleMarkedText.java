package dev.tare.template;

import java.util.ArrayList;
import java.util.List;

/**
 * Finds the role marker lines of a text template's body and the messages between them. A marker is
 * a line that holds nothing but a role in lower case and a colon ({@code system:}, {@code user:},
 * {@code assistant:}), perhaps after one to six {@code #} marks ({@code # system:}), with at most
 * three spaces before it (more would make it an indented code block in Markdown) and any spaces or
 * tabs after it. Lines inside fenced code blocks are never markers. Capitalised roles are not
 * markers: plain prompts write example dialogues with {@code User:} lines, and reading those as
 * messages would change what is counted.
 *
 * <p>Each message's content is the text between its marker line and the next, without the blank
 * lines around it and without its last line break (the formats that mark roles this way trim that
 * white space). Text before the first marker, when there is any, is a {@code system} message: what a
 * file says before naming a role is its instructions.
 */
final class RoleMarkedText {
    /** The roles a marker can name, as the formats write them. */
    static final List<String> ROLES = List.of("system", "user", "assistant");
    /** The role of text before the first marker. */
    static final String PREAMBLE_ROLE = "system";

    private RoleMarkedText() {
    }

    /**
     * One message's place in the file.
     *
     * @param role  the role its marker names
     * @param start the offset in the file's text where its content starts
     * @param end   the offset just past its content
     */
    record Part(String role, int start, int end) {
    }

    /**
     * The messages of {@code text} from {@code bodyStart} on, split at its marker lines; empty when it
     * has no marker.
     *
     * @param lineStarts the offsets where the text's lines start ({@link LineIndex#starts()})
     */
    static List<Part> split(String text, int bodyStart, int[] lineStarts) {
        List<int[]> markers = new ArrayList<>();
        List<String> roles = new ArrayList<>();
        char fenceChar = 0;
        int fenceLength = 0;
        for (int i = 0; i < lineStarts.length; i++) {
            int start = lineStarts[i];
            if (start < bodyStart) {
                continue;
            }
            int next = i + 1 < lineStarts.length ? lineStarts[i + 1] : text.length();
            int end = contentEnd(text, start, next);
            int at = indentEnd(text, start, end);
            if (at < 0) {
                continue;
            }
            int run = run(text, at, end);
            if (fenceLength > 0) {
                if (run >= fenceLength && text.charAt(at) == fenceChar && blank(text, at + run, end)) {
                    fenceLength = 0;
                }
                continue;
            }
            // A backtick fence's info string holds no backtick (otherwise the line is inline code).
            if (run >= 3 && (text.charAt(at) == '~' || text.substring(at + run, end).indexOf('`') < 0)) {
                fenceChar = text.charAt(at);
                fenceLength = run;
                continue;
            }
            String role = role(text, at, end);
            if (role != null) {
                markers.add(new int[] {start, next});
                roles.add(role);
            }
        }
        if (markers.isEmpty()) {
            return List.of();
        }
        List<Part> parts = new ArrayList<>();
        Part preamble = trimmed(PREAMBLE_ROLE, text, bodyStart, markers.get(0)[0]);
        if (preamble.end() > preamble.start()) {
            parts.add(preamble);
        }
        for (int m = 0; m < markers.size(); m++) {
            int to = m + 1 < markers.size() ? markers.get(m + 1)[0] : text.length();
            parts.add(trimmed(roles.get(m), text, markers.get(m)[1], to));
        }
        return parts;
    }

    /** The end of the line's text, before its line break. */
    private static int contentEnd(String text, int start, int next) {
        int end = next;
        if (end > start && text.charAt(end - 1) == '\n') {
            end--;
        }
        if (end > start && text.charAt(end - 1) == '\r') {
            end--;
        }
        return end;
    }

    /** Where the line's text starts after at most three spaces, or -1 when it is indented further or by a tab. */
    private static int indentEnd(String text, int start, int end) {
        int at = start;
        while (at < end && text.charAt(at) == ' ') {
            at++;
        }
        if (at - start > 3 || at < end && text.charAt(at) == '\t') {
            return -1;
        }
        return at;
    }

    /** The length of the run of backticks or tildes at {@code at}; 0 for any other character. */
    private static int run(String text, int at, int end) {
        if (at >= end || text.charAt(at) != '`' && text.charAt(at) != '~') {
            return 0;
        }
        int i = at;
        while (i < end && text.charAt(i) == text.charAt(at)) {
            i++;
        }
        return i - at;
    }

    /** The role a marker line names, or null when the line is no marker. */
    private static String role(String text, int at, int end) {
        int i = at;
        int hashes = 0;
        while (i < end && text.charAt(i) == '#') {
            i++;
            hashes++;
        }
        if (hashes > 6) {
            return null;
        }
        while (hashes > 0 && i < end && (text.charAt(i) == ' ' || text.charAt(i) == '\t')) {
            i++;
        }
        for (String role : ROLES) {
            int colon = i + role.length();
            if (colon < end && text.startsWith(role, i) && text.charAt(colon) == ':' && blank(text, colon + 1, end)) {
                return role;
            }
        }
        return null;
    }

    private static boolean blank(String text, int from, int to) {
        for (int i = from; i < to; i++) {
            if (text.charAt(i) != ' ' && text.charAt(i) != '\t') {
                return false;
            }
        }
        return true;
    }

    /**
     * The part of {@code role} over the lines {@code [from, to)}: from the start of its first line
     * with text to the end of its last one (before the line break); empty at {@code from} when all
     * of it is white space.
     */
    private static Part trimmed(String role, String text, int from, int to) {
        int first = from;
        while (first < to && Character.isWhitespace(text.charAt(first))) {
            first++;
        }
        if (first == to) {
            return new Part(role, from, from);
        }
        int last = to - 1;
        while (Character.isWhitespace(text.charAt(last))) {
            last--;
        }
        int start = first;
        while (start > from && text.charAt(start - 1) != '\n' && text.charAt(start - 1) != '\r') {
            start--;
        }
        int end = last + 1;
        while (end < to && text.charAt(end) != '\n' && text.charAt(end) != '\r') {
            end++;
        }
        return new Part(role, start, end);
    }
}
