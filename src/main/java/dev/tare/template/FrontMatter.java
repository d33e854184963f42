package dev.tare.template;

import dev.tare.TareException;

/**
 * The YAML block between a first line of {@code ---} and the next line of {@code ---} (or
 * {@code ...}) at the top of a text template; it is metadata, not prompt text.
 *
 * @param yaml      the YAML between the fences
 * @param firstLine the file line the YAML starts on
 * @param bodyStart the offset where the prompt text starts
 */
record FrontMatter(String yaml, int firstLine, int bodyStart) {

    /** The front matter of {@code text}, or null when it has none. */
    static FrontMatter find(String text) {
        int firstEnd = lineEnd(text, 0);
        if (!text.substring(0, firstEnd).strip().equals("---") || !text.startsWith("---")) {
            return null;
        }
        int yamlStart = next(text, firstEnd);
        for (int at = yamlStart; at < text.length(); ) {
            int end = lineEnd(text, at);
            String content = text.substring(at, end).stripTrailing();
            if (content.equals("---") || content.equals("...")) {
                return new FrontMatter(text.substring(yamlStart, at), 2, next(text, end));
            }
            at = next(text, end);
        }
        throw new TareException("line 1: front matter opened with '---' is never closed; add a '---' line after it");
    }

    private static int lineEnd(String text, int from) {
        int newline = text.indexOf('\n', from);
        int end = newline < 0 ? text.length() : newline;
        return end > from && text.charAt(end - 1) == '\r' ? end - 1 : end;
    }

    private static int next(String text, int lineEnd) {
        if (lineEnd < text.length() && text.charAt(lineEnd) == '\r') {
            lineEnd++;
        }
        return lineEnd < text.length() && text.charAt(lineEnd) == '\n' ? lineEnd + 1 : lineEnd;
    }
}
