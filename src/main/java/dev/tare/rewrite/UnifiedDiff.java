package dev.tare.rewrite;

import com.github.difflib.DiffUtils;
import com.github.difflib.UnifiedDiffUtils;
import com.github.difflib.patch.Patch;
import java.util.ArrayList;
import java.util.List;

/** Unified diffs of a file before and after a rewrite, as {@code git diff} shows them. */
public final class UnifiedDiff {
    /** Lines of unchanged context around each change. */
    public static final int CONTEXT_LINES = 3;

    private static final String RED = "\u001b[31m";
    private static final String GREEN = "\u001b[32m";
    private static final String CYAN = "\u001b[36m";
    private static final String BOLD = "\u001b[1m";
    private static final String RESET = "\u001b[0m";

    private UnifiedDiff() {
    }

    /**
     * The diff of {@code before} and {@code after} for the root-relative {@code path}, empty when they
     * are equal. Carriage returns are not shown; with {@code colour}, ANSI colours mark the lines.
     */
    public static String of(String path, String before, String after, boolean colour) {
        if (before.equals(after)) {
            return "";
        }
        List<String> original = lines(before);
        List<String> revised = lines(after);
        Patch<String> patch = DiffUtils.diff(original, revised);
        List<String> diff = UnifiedDiffUtils.generateUnifiedDiff("a/" + path, "b/" + path, original, patch, CONTEXT_LINES);
        StringBuilder out = new StringBuilder();
        for (String line : diff) {
            out.append(colour ? paint(line) : line).append('\n');
        }
        return out.toString();
    }

    private static List<String> lines(String text) {
        List<String> lines = new ArrayList<>();
        int start = 0;
        while (start < text.length()) {
            int newline = text.indexOf('\n', start);
            int end = newline < 0 ? text.length() : newline;
            String line = text.substring(start, end);
            lines.add(line.endsWith("\r") ? line.substring(0, line.length() - 1) : line);
            if (newline < 0) {
                lines.add("\\ No newline at end of file");
                break;
            }
            start = newline + 1;
        }
        return lines;
    }

    private static String paint(String line) {
        if (line.startsWith("+++") || line.startsWith("---")) {
            return BOLD + line + RESET;
        }
        if (line.startsWith("@@")) {
            return CYAN + line + RESET;
        }
        if (line.startsWith("+")) {
            return GREEN + line + RESET;
        }
        if (line.startsWith("-")) {
            return RED + line + RESET;
        }
        return line;
    }
}
