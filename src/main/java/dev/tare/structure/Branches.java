package dev.tare.structure;

import dev.tare.template.Segment;
import java.util.ArrayDeque;
import java.util.Deque;
import java.util.List;
import java.util.Set;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * The conditional branch each character of a message renders in, from its block tags: Jinja's
 * {@code {% if %}}/{@code {% elif %}}/{@code {% else %}}/{@code {% endif %}}, {@code {% for %}} and
 * the other paired statements, and Handlebars' <code>{{#if}}</code>/<code>{{else}}</code>/<code>{{/if}}</code>
 * and <code>{{^x}}</code>. Text in different branches may or may not be sent together, so a
 * sentence in one is not a repeat of the same sentence in another.
 */
final class Branches {
    private static final Pattern STATEMENT = Pattern.compile("\\{%[-+~]?\\s*([A-Za-z_]+)([^%]*)");
    private static final Set<String> OPENERS = Set.of("if", "for", "macro", "call", "filter", "block", "with",
            "autoescape", "trans", "set");
    private static final Set<String> MIDDLES = Set.of("elif", "else", "pluralize");

    private Branches() {
    }

    /** Per character of the content: its branch, 0 outside every block tag (see {@link Region#branch()}). */
    static int[] of(String content, List<Segment> segments, int segmentBase) {
        int[] branches = new int[content.length()];
        Deque<Integer> stack = new ArrayDeque<>();
        int current = 0;
        int at = 0;
        for (Segment segment : segments) {
            if (!(segment instanceof Segment.Tag tag)) {
                continue;
            }
            int start = segment.span().start() - segmentBase;
            int end = segment.span().end() - segmentBase;
            if (start < 0 || end > content.length()) {
                continue;
            }
            Kind kind = kind(tag.source());
            if (kind == Kind.OTHER) {
                continue;
            }
            java.util.Arrays.fill(branches, at, start, current);
            at = start;
            switch (kind) {
                case OPEN -> {
                    stack.push(current);
                    current = start + 1;
                }
                case MIDDLE -> current = stack.isEmpty() ? current : start + 1;
                case CLOSE -> current = stack.isEmpty() ? 0 : stack.pop();
                default -> {
                }
            }
        }
        java.util.Arrays.fill(branches, at, content.length(), current);
        return branches;
    }

    private enum Kind { OPEN, MIDDLE, CLOSE, OTHER }

    private static Kind kind(String source) {
        if (source.startsWith("{{")) {
            String inner = source.replaceFirst("^\\{\\{\\{?[-~]?\\s*", "");
            if (inner.startsWith("#") || inner.startsWith("^")) {
                return Kind.OPEN;
            }
            if (inner.startsWith("/")) {
                return Kind.CLOSE;
            }
            return inner.matches("else\\b[\\s\\S]*") ? Kind.MIDDLE : Kind.OTHER;
        }
        Matcher statement = STATEMENT.matcher(source);
        if (!statement.lookingAt()) {
            return Kind.OTHER;
        }
        String keyword = statement.group(1);
        if (keyword.startsWith("end")) {
            return OPENERS.contains(keyword.substring(3)) ? Kind.CLOSE : Kind.OTHER;
        }
        if (MIDDLES.contains(keyword)) {
            return Kind.MIDDLE;
        }
        // "{% set x = 1 %}" assigns; only "{% set x %}...{% endset %}" opens a block.
        if (keyword.equals("set") && statement.group(2).contains("=")) {
            return Kind.OTHER;
        }
        return OPENERS.contains(keyword) ? Kind.OPEN : Kind.OTHER;
    }
}
