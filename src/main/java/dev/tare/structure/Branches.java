package dev.tare.structure;

import dev.tare.template.Control;
import dev.tare.template.Segment;
import java.util.ArrayDeque;
import java.util.Deque;
import java.util.List;

/**
 * The conditional branch each character of a message renders in, from its block tags as the parser
 * read them ({@link Control}): Jinja's {@code {% if %}}/{@code {% elif %}}/{@code {% else %}}/{@code {% endif %}},
 * {@code {% for %}} and the other paired statements, and Handlebars' <code>{{#if}}</code>/<code>{{else}}</code>/<code>{{/if}}</code>,
 * <code>{{#each}}</code> and Mustache's sections. Text in different branches may or may not be sent together, so a
 * sentence in one is not a repeat of the same sentence in another.
 */
final class Branches {
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
            Control control = tag.control();
            if (!(control instanceof Control.Open || control instanceof Control.Middle || control instanceof Control.Close)) {
                continue;
            }
            java.util.Arrays.fill(branches, at, start, current);
            at = start;
            if (control instanceof Control.Open) {
                stack.push(current);
                current = start + 1;
            } else if (control instanceof Control.Middle) {
                current = stack.isEmpty() ? current : start + 1;
            } else {
                current = stack.isEmpty() ? 0 : stack.pop();
            }
        }
        java.util.Arrays.fill(branches, at, content.length(), current);
        return branches;
    }
}
