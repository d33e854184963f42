package dev.tare.structure;

import java.util.ArrayDeque;
import java.util.Deque;
import java.util.Optional;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * XML-style sections: a line that is only an opening tag such as {@code <example>} or
 * {@code <rules id="a">}, and a later line that is only the matching closing tag. Prompts use them
 * to set examples, documents and rules apart; their lines are found before Markdown is read, since
 * a Markdown parser would take a tag line and everything up to the next blank line as raw HTML.
 */
final class TaggedSections {
    private static final Pattern TAG_LINE = Pattern.compile("[ \\t]*<(/?)([A-Za-z][A-Za-z0-9_.:-]*)(?:\\s[^<>]*)?>[ \\t]*");

    /** Elements whose content HTML itself keeps as written: they stay raw HTML, never a section of prose. */
    private static final java.util.Set<String> RAW_ELEMENTS = java.util.Set.of("pre", "script", "style", "textarea");

    private TaggedSections() {
    }

    /**
     * The innermost section of each line (empty outside every section), with the tag lines
     * themselves marked in {@code tagLines}. Only pairs that match are sections; a stray tag is left
     * to Markdown.
     */
    static Optional<String>[] of(String text, LineSpans lines, boolean[] code, boolean[] tagLines) {
        @SuppressWarnings("unchecked")
        Optional<String>[] sections = new Optional[lines.count()];
        java.util.Arrays.fill(sections, Optional.empty());
        Deque<int[]> open = new ArrayDeque<>();
        Deque<String> names = new ArrayDeque<>();
        for (int i = 0; i < lines.count(); i++) {
            if (code[i]) {
                continue;
            }
            Matcher tag = TAG_LINE.matcher(text).region(lines.start(i), lines.end(i));
            if (!tag.matches()) {
                continue;
            }
            String name = tag.group(2);
            if (RAW_ELEMENTS.contains(name.toLowerCase(java.util.Locale.ROOT))) {
                continue;
            }
            if (tag.group(1).isEmpty()) {
                if (!selfClosing(text, lines.start(i), lines.end(i))) {
                    open.push(new int[] {i});
                    names.push(name);
                }
                continue;
            }
            if (!names.contains(name)) {
                continue;
            }
            while (!names.isEmpty()) {
                int from = open.pop()[0];
                String opened = names.pop();
                if (opened.equals(name)) {
                    tagLines[from] = true;
                    tagLines[i] = true;
                    for (int k = from + 1; k < i; k++) {
                        if (sections[k].isEmpty()) {
                            sections[k] = Optional.of(name);
                        }
                    }
                    break;
                }
            }
        }
        return sections;
    }

    private static boolean selfClosing(String text, int start, int end) {
        int last = end - 1;
        while (last > start && (text.charAt(last) == ' ' || text.charAt(last) == '\t')) {
            last--;
        }
        return last > start && text.charAt(last - 1) == '/';
    }
}
