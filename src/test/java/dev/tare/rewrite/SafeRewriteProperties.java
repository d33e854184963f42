package dev.tare.rewrite;

import com.fasterxml.jackson.databind.DeserializationFeature;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import java.io.IOException;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * What a safe rewrite promises (design.md, "Rewrites that are safe"), checked on one file's text before
 * and after a fix. It reads the text with its own deliberately plain rules (lines, fence marker lines,
 * regular expressions, a word diff) so that it shares no code and no blind spot with the engine's
 * structure model and verifier, which it is meant to hold to account.
 *
 * <p>The properties, each reported under its name:
 * <ul>
 *   <li>{@code words}: the same words in the same order. A word is a maximal run of non-whitespace once
 *       invisible characters are deleted and no-break spaces count as whitespace; a fenced json block
 *       that parses counts as one word, its value, so re-laying it out changes nothing.
 *   <li>{@code fence}: every fenced code block keeps its info string and its body byte for byte (json
 *       blocks: the same value).
 *   <li>{@code indent}: every non-blank line keeps its leading spaces and tabs.
 *   <li>{@code tabs}: a line of a tab-separated block (a tab between words, and a neighbouring line with
 *       one too, or two or more such tabs) keeps every tab where it was.
 *   <li>{@code align}: a line with a run of three or more spaces between words (an aligned block, a
 *       drawing) is unchanged apart from trailing whitespace; Markdown table rows are left to {@code table}.
 *   <li>{@code placeholder}: the same {@code {{...}}} and {@code {%...%}} in the same order.
 *   <li>{@code table}: a Markdown table row (a line starting with {@code |}) is unchanged apart from
 *       trailing whitespace.
 * </ul>
 * Lines are paired before and after by their words (a diff over non-blank lines), so that a line that
 * was rightly left alone is not blamed for one deleted above it.
 */
final class SafeRewriteProperties {
    /** One broken promise: the line (1-based, in the text before the fix), the property and what changed. */
    record Violation(int line, String property, String detail) {
        @Override
        public String toString() {
            return "line " + line + ": " + property + ": " + detail;
        }
    }

    /** Characters a reader does not see, deleted before words are compared. */
    private static final String INVISIBLE = "\u200B\u200C\u200D\u2060\uFEFF\u00AD";
    /** No-break spaces, which separate words as a space does. */
    private static final String NO_BREAK_SPACE = "\u00A0\u202F\u2007";
    private static final Pattern PLACEHOLDER = Pattern.compile("\\{\\{.*?\\}\\}|\\{%.*?%\\}");
    private static final Pattern FENCE_OPENING = Pattern.compile("^[ \\t]*(`{3,}|~{3,})(.*)$");
    private static final Pattern ALIGNED_RUN = Pattern.compile("\\S {3,}\\S");
    /** Past this many differences a diff stops looking for the shortest edit and reports one block. */
    private static final int MAX_DIFFERENCES = 2_000;
    private static final ObjectMapper JSON = new ObjectMapper()
            .enable(DeserializationFeature.FAIL_ON_TRAILING_TOKENS)
            .enable(SerializationFeature.ORDER_MAP_ENTRIES_BY_KEYS);

    private SafeRewriteProperties() {
    }

    /** Every property that {@code after} breaks, in the order of the lines of {@code before}. */
    static List<Violation> check(String before, String after) {
        Text a = new Text(before);
        Text b = new Text(after);
        List<Violation> violations = new ArrayList<>();
        words(a, b, violations);
        fences(a, b, violations);
        placeholders(a, b, violations);
        lines(a, b, violations);
        violations.sort((x, y) -> Integer.compare(x.line(), y.line()));
        return violations;
    }

    // --- the properties --------------------------------------------------------------------------

    private static void words(Text a, Text b, List<Violation> out) {
        List<Located> before = a.words();
        List<Located> after = b.words();
        for (int[] hunk : Diff.hunks(texts(before), texts(after))) {
            out.add(new Violation(lineAt(before, hunk[0], a), "words",
                    quote(before, hunk[0], hunk[1]) + " became " + quote(after, hunk[2], hunk[3])
                            + " (line " + lineAt(after, hunk[2], b) + " after)"));
        }
    }

    private static void fences(Text a, Text b, List<Violation> out) {
        List<Fence> before = a.fences();
        List<Fence> after = b.fences();
        for (int i = 0; i < Math.min(before.size(), after.size()); i++) {
            Fence x = before.get(i);
            Fence y = after.get(i);
            if (!x.info().equals(y.info())) {
                out.add(new Violation(x.line(), "fence", "info string '" + x.info() + "' became '" + y.info() + "'"));
            } else if (!x.sameContent(y)) {
                out.add(new Violation(x.line(), "fence", "the block '" + x.opening() + "' changed"
                        + (x.isJson() ? " its JSON value" : " its text") + " (line " + y.line() + " after)"));
            }
        }
        if (before.size() != after.size()) {
            int line = before.size() > after.size() ? before.get(after.size()).line() : a.lastLine();
            out.add(new Violation(line, "fence", before.size() + " fenced blocks before, " + after.size() + " after"));
        }
    }

    private static void placeholders(Text a, Text b, List<Violation> out) {
        List<Located> before = a.placeholders();
        List<Located> after = b.placeholders();
        for (int[] hunk : Diff.hunks(texts(before), texts(after))) {
            out.add(new Violation(lineAt(before, hunk[0], a), "placeholder",
                    quote(before, hunk[0], hunk[1]) + " became " + quote(after, hunk[2], hunk[3])));
        }
    }

    /** Indentation, tab-separated lines, aligned lines and table rows, over lines paired by their words. */
    private static void lines(Text a, Text b, List<Violation> out) {
        List<Integer> before = a.structuralLines();
        List<Integer> after = b.structuralLines();
        int[] partner = Diff.matches(keys(a, before), keys(b, after));
        for (int[] hunk : Diff.hunks(partner, after.size())) {
            // A line whose words changed is the words property's finding; when as many lines stand on
            // each side, each still owes its indentation.
            if (hunk[1] - hunk[0] == hunk[3] - hunk[2]) {
                for (int i = 0; i < hunk[1] - hunk[0]; i++) {
                    indentation(a, before.get(hunk[0] + i), b, after.get(hunk[2] + i), out);
                }
            }
        }
        for (int i = 0; i < before.size(); i++) {
            int line = before.get(i);
            Optional<String> counterpart = partner[i] < 0 ? Optional.empty() : Optional.of(b.line(after.get(partner[i])));
            if (partner[i] >= 0) {
                indentation(a, line, b, after.get(partner[i]), out);
            }
            String text = a.line(line);
            if (a.isTabSeparated(line)) {
                if (counterpart.isEmpty()) {
                    out.add(new Violation(line + 1, "tabs", "the tab-separated line " + show(text) + " is gone or reworded"));
                } else if (!tabsBetweenWords(text).equals(tabsBetweenWords(counterpart.get()))) {
                    out.add(new Violation(line + 1, "tabs", change(text, counterpart.get())));
                }
            }
            boolean tableRow = isTableRow(text);
            if (tableRow || ALIGNED_RUN.matcher(text).find()) {
                String property = tableRow ? "table" : "align";
                if (counterpart.isEmpty()) {
                    out.add(new Violation(line + 1, property, "the line " + show(text) + " is gone or reworded"));
                } else if (!text.stripTrailing().equals(counterpart.get().stripTrailing())) {
                    out.add(new Violation(line + 1, property, change(text, counterpart.get())));
                }
            }
        }
    }

    private static void indentation(Text a, int lineA, Text b, int lineB, List<Violation> out) {
        String x = leading(a.line(lineA));
        String y = leading(b.line(lineB));
        if (!x.equals(y)) {
            out.add(new Violation(lineA + 1, "indent", "leading " + show(x) + " became " + show(y)
                    + " on " + show(a.line(lineA).strip())));
        }
    }

    // --- reading text ------------------------------------------------------------------------------

    /** A piece of text and the 1-based line it starts on. */
    record Located(String text, int line) {
    }

    /**
     * A fenced code block: its opening line, info string and body lines as written (carriage returns
     * kept), and for a json block whose body parses, its value in one canonical spelling.
     */
    record Fence(int line, String opening, String info, List<String> body, Optional<String> jsonValue) {
        static Fence of(int line, String opening, String info, List<String> body) {
            return new Fence(line, opening, info, body, isJson(info) ? canonicalJson(String.join("\n", body)) : Optional.empty());
        }

        boolean isJson() {
            return isJson(info);
        }

        private static boolean isJson(String info) {
            return info.split("\\s+", 2)[0].toLowerCase(Locale.ROOT).equals("json");
        }

        boolean sameContent(Fence other) {
            return jsonValue.isPresent() ? jsonValue.equals(other.jsonValue) : body.equals(other.body);
        }

        /** Keys sorted, no layout: two spellings of one JSON value (RFC 8259) read the same. */
        private static Optional<String> canonicalJson(String text) {
            try {
                JsonNode node = JSON.readTree(text);
                if (node == null || node.isMissingNode()) {
                    return Optional.empty();
                }
                return Optional.of(JSON.writeValueAsString(JSON.treeToValue(node, Object.class)));
            } catch (IOException e) {
                return Optional.empty();
            }
        }
    }

    /** A file's text cut into lines, with its fenced blocks found once. */
    private static final class Text {
        private final List<String> raw;
        private final List<String> lines;
        private final List<Fence> fences = new ArrayList<>();
        /** For each line, the fence whose body holds it, or null. */
        private final Fence[] bodyOf;

        Text(String text) {
            raw = Arrays.asList(text.split("\n", -1));
            lines = raw.stream().map(line -> line.endsWith("\r") ? line.substring(0, line.length() - 1) : line).toList();
            bodyOf = new Fence[lines.size()];
            findFences();
        }

        /**
         * Fences by their marker lines (CommonMark 0.31.2 §4.5, loosely): three or more backticks or
         * tildes open, the same character at least as many times on a line of its own closes, and an
         * unclosed block runs to the end. Indentation is allowed, so that fences in list items count.
         */
        private void findFences() {
            for (int i = 0; i < lines.size(); i++) {
                Matcher opening = FENCE_OPENING.matcher(lines.get(i));
                if (!opening.matches() || opening.group(1).charAt(0) == '`' && opening.group(2).contains("`")) {
                    continue;
                }
                String marker = opening.group(1);
                Pattern closing = Pattern.compile("^[ \\t]*" + Pattern.quote(marker.substring(0, 1)) + "{"
                        + marker.length() + ",}[ \\t]*$");
                int end = i + 1;
                while (end < lines.size() && !closing.matcher(lines.get(end)).matches()) {
                    end++;
                }
                Fence fence = Fence.of(i + 1, lines.get(i).strip(), opening.group(2).strip(), raw.subList(i + 1, end));
                fences.add(fence);
                for (int j = i + 1; j < end; j++) {
                    bodyOf[j] = fence;
                }
                i = end;
            }
        }

        String line(int index) {
            return lines.get(index);
        }

        int lastLine() {
            return lines.size();
        }

        List<Fence> fences() {
            return fences;
        }

        /** The words in order; a json block that parses stands as one word, its value. */
        List<Located> words() {
            List<Located> words = new ArrayList<>();
            for (int i = 0; i < lines.size(); i++) {
                Fence fence = bodyOf[i];
                if (fence != null && fence.jsonValue().isPresent()) {
                    if (fence.line() == i) {
                        words.add(new Located("json:" + fence.jsonValue().get(), i + 1));
                    }
                    continue;
                }
                for (String word : wordsOf(lines.get(i))) {
                    words.add(new Located(word, i + 1));
                }
            }
            return words;
        }

        List<Located> placeholders() {
            List<Located> found = new ArrayList<>();
            for (int i = 0; i < lines.size(); i++) {
                Matcher matcher = PLACEHOLDER.matcher(lines.get(i));
                while (matcher.find()) {
                    found.add(new Located(matcher.group(), i + 1));
                }
            }
            return found;
        }

        /**
         * The 0-based indexes of the non-blank lines outside json blocks, whose layout is the json
         * block's own business (the fence property compares them by value).
         */
        List<Integer> structuralLines() {
            List<Integer> found = new ArrayList<>();
            for (int i = 0; i < lines.size(); i++) {
                boolean json = bodyOf[i] != null && bodyOf[i].isJson();
                if (!json && !lines.get(i).isBlank()) {
                    found.add(i);
                }
            }
            return found;
        }

        /** A tab between words, and either a neighbouring line with one too or two or more such tabs. */
        boolean isTabSeparated(int index) {
            int tabs = tabCount(lines.get(index));
            boolean neighbour = index > 0 && tabCount(lines.get(index - 1)) > 0
                    || index + 1 < lines.size() && tabCount(lines.get(index + 1)) > 0;
            return tabs >= 2 || tabs == 1 && neighbour;
        }
    }

    private static List<String> wordsOf(String line) {
        List<String> words = new ArrayList<>();
        StringBuilder word = new StringBuilder();
        line.codePoints().forEach(c -> {
            if (INVISIBLE.indexOf(c) >= 0) {
                return;
            }
            if (Character.isWhitespace(c) || NO_BREAK_SPACE.indexOf(c) >= 0) {
                if (word.length() > 0) {
                    words.add(word.toString());
                    word.setLength(0);
                }
            } else {
                word.appendCodePoint(c);
            }
        });
        if (word.length() > 0) {
            words.add(word.toString());
        }
        return words;
    }

    /** For each gap between two words of the line (spaces and tabs only), how many tabs it holds. */
    private static List<Integer> tabsBetweenWords(String line) {
        List<Integer> gaps = new ArrayList<>();
        String inner = line.strip();
        int i = 0;
        while (i < inner.length()) {
            if (inner.charAt(i) == ' ' || inner.charAt(i) == '\t') {
                int tabs = 0;
                while (inner.charAt(i) == ' ' || inner.charAt(i) == '\t') {
                    tabs += inner.charAt(i) == '\t' ? 1 : 0;
                    i++;
                }
                gaps.add(tabs);
            } else {
                i++;
            }
        }
        return gaps;
    }

    private static int tabCount(String line) {
        return tabsBetweenWords(line).stream().mapToInt(Integer::intValue).sum();
    }

    private static boolean isTableRow(String line) {
        return line.stripLeading().startsWith("|");
    }

    private static String leading(String line) {
        int i = 0;
        while (i < line.length() && (line.charAt(i) == ' ' || line.charAt(i) == '\t')) {
            i++;
        }
        return line.substring(0, i);
    }

    private static List<String> keys(Text text, List<Integer> lines) {
        return lines.stream().map(i -> String.join(" ", wordsOf(text.line(i)))).toList();
    }

    private static List<String> texts(List<Located> located) {
        return located.stream().map(Located::text).toList();
    }

    private static int lineAt(List<Located> located, int index, Text text) {
        if (index < located.size()) {
            return located.get(index).line();
        }
        return located.isEmpty() ? text.lastLine() : located.get(located.size() - 1).line();
    }

    private static String quote(List<Located> located, int from, int to) {
        String joined = String.join(" ", texts(located.subList(from, to)));
        return joined.isEmpty() ? "nothing" : show(joined);
    }

    /** Two versions of a line, from a little before where they first differ, so that a long line shows its change. */
    private static String change(String before, String after) {
        int same = 0;
        while (same < before.length() && same < after.length() && before.charAt(same) == after.charAt(same)) {
            same++;
        }
        int from = Math.max(0, same - 30);
        if (from > 0 && Character.isLowSurrogate(before.charAt(from))) {
            from--;
        }
        String cut = from > 0 ? "'..." : "'";
        return cut + show(before.substring(from)).substring(1) + " became " + cut + show(after.substring(from)).substring(1);
    }

    /** Text in quotes, with tabs, carriage returns and invisible characters spelled out, cut to 80 characters. */
    private static String show(String text) {
        StringBuilder out = new StringBuilder("'");
        text.codePoints().limit(80).forEach(c -> out.append(c == '\t' ? "\\t" : c == '\r' ? "\\r"
                : INVISIBLE.indexOf(c) >= 0 || NO_BREAK_SPACE.indexOf(c) >= 0 ? String.format("\\u%04X", c)
                : new String(Character.toChars(c))));
        return out.append(text.codePointCount(0, text.length()) > 80 ? "...'" : "'").toString();
    }

    /**
     * The shortest edit between two sequences (Myers 1986, "An O(ND) difference algorithm and its
     * variations", the greedy forward search), after trimming what they share at both ends.
     */
    static final class Diff {
        private Diff() {
        }

        /** The differing stretches as {from, to} in {@code a} and {from, to} in {@code b}. */
        static <T> List<int[]> hunks(List<T> a, List<T> b) {
            return hunks(matches(a, b), b.size());
        }

        /** From each element of {@code a}'s partner in {@code b} (-1 for none), the differing stretches. */
        static List<int[]> hunks(int[] partner, int sizeB) {
            List<int[]> hunks = new ArrayList<>();
            int i = 0;
            int j = 0;
            while (i < partner.length || j < sizeB) {
                if (i < partner.length && partner[i] == j) {
                    i++;
                    j++;
                    continue;
                }
                int fromA = i;
                int fromB = j;
                while (i < partner.length && partner[i] < 0) {
                    i++;
                }
                j = i < partner.length ? partner[i] : sizeB;
                hunks.add(new int[] {fromA, i, fromB, j});
            }
            return hunks;
        }

        /** For each element of {@code a}, the index of its partner in {@code b}, or -1. */
        static <T> int[] matches(List<T> a, List<T> b) {
            int[] partner = new int[a.size()];
            Arrays.fill(partner, -1);
            int prefix = 0;
            while (prefix < a.size() && prefix < b.size() && a.get(prefix).equals(b.get(prefix))) {
                partner[prefix] = prefix;
                prefix++;
            }
            int suffix = 0;
            while (suffix < a.size() - prefix && suffix < b.size() - prefix
                    && a.get(a.size() - 1 - suffix).equals(b.get(b.size() - 1 - suffix))) {
                partner[a.size() - 1 - suffix] = b.size() - 1 - suffix;
                suffix++;
            }
            List<T> x = a.subList(prefix, a.size() - suffix);
            List<T> y = b.subList(prefix, b.size() - suffix);
            int[] middle = shortestEdit(x, y);
            for (int i = 0; i < middle.length; i++) {
                partner[prefix + i] = middle[i] < 0 ? -1 : prefix + middle[i];
            }
            return partner;
        }

        private static <T> int[] shortestEdit(List<T> a, List<T> b) {
            int n = a.size();
            int m = b.size();
            int[] partner = new int[n];
            Arrays.fill(partner, -1);
            int limit = Math.min(n + m, MAX_DIFFERENCES);
            int offset = limit + 1;
            int[] v = new int[2 * limit + 3];
            List<int[]> trace = new ArrayList<>();
            int found = -1;
            search:
            for (int d = 0; d <= limit; d++) {
                for (int k = -d; k <= d; k += 2) {
                    int x = k == -d || k != d && v[offset + k - 1] < v[offset + k + 1] ? v[offset + k + 1] : v[offset + k - 1] + 1;
                    int y = x - k;
                    while (x < n && y < m && a.get(x).equals(b.get(y))) {
                        x++;
                        y++;
                    }
                    v[offset + k] = x;
                    if (x >= n && y >= m) {
                        found = d;
                        break search;
                    }
                }
                trace.add(Arrays.copyOfRange(v, offset - d, offset + d + 1));
            }
            if (found < 0) {
                return partner;
            }
            int x = n;
            int y = m;
            for (int d = found; d > 0; d--) {
                // The furthest x on each diagonal k after d - 1 differences, stored from k = -(d - 1).
                int[] previous = trace.get(d - 1);
                int k = x - y;
                int previousK = k == -d || k != d && previous[k - 1 + d - 1] < previous[k + 1 + d - 1] ? k + 1 : k - 1;
                int previousX = previous[previousK + d - 1];
                int previousY = previousX - previousK;
                while (x > previousX && y > previousY) {
                    x--;
                    y--;
                    partner[x] = y;
                }
                x = previousX;
                y = previousY;
            }
            while (x > 0 && y > 0) {
                x--;
                y--;
                partner[x] = y;
            }
            return partner;
        }
    }
}
