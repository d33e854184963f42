package dev.tare.app;

import java.util.List;

/**
 * A template's file, line by line, with the static tokens each line costs on the primary tokenizer.
 * Each line's text is counted on its own, so the lines add up to about, not exactly, the template's
 * static tokens (the tokenizer merges differently across line ends).
 *
 * @param path  the template's path relative to the root
 * @param lines every line of the file, in order
 */
public record TemplateLines(String path, List<Line> lines) {
    public TemplateLines {
        lines = List.copyOf(lines);
    }

    /** The lines' tokens, summed. */
    public long totalTokens() {
        return lines.stream().mapToLong(Line::tokens).sum();
    }

    /**
     * One line of the file.
     *
     * @param number   1-based line number
     * @param text     the line as written, without its line ending
     * @param tokens   static tokens the line sends: its literal text plus what its includes paste in
     * @param prompt   whether any of it is prompt text; front matter and a chat file's keys are not
     * @param includes the templates its includes paste in, root-relative
     */
    public record Line(int number, String text, int tokens, boolean prompt, List<String> includes) {
        public Line {
            includes = List.copyOf(includes);
        }
    }
}
