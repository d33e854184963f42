package dev.tare.config;

import dev.tare.TareException;
import java.util.List;
import java.util.regex.Pattern;

/**
 * A path pattern over {@code /}-separated paths relative to the scanned root: {@code *} matches
 * within one path segment, {@code **} across segments ({@code **}{@code /} also matches no folder at
 * all, so {@code prompts/**}{@code /*.md} matches {@code prompts/a.md}), {@code ?} one character,
 * {@code [abc]} a class and {@code {a,b}} alternatives.
 */
public final class Glob {
    private final String pattern;
    private final Pattern regex;
    /** The longest run of plain characters in the pattern: a path without it cannot match. */
    private final String requiredText;
    /** The plain characters the pattern ends with: a path not ending so cannot match. */
    private final String requiredEnd;

    private Glob(String pattern, Pattern regex) {
        this.pattern = pattern;
        this.regex = regex;
        List<String> runs = literalRuns(pattern);
        this.requiredText = runs.stream().max(java.util.Comparator.comparingInt(String::length)).orElse("");
        this.requiredEnd = endsWithLiteral(pattern) && !runs.isEmpty() ? runs.get(runs.size() - 1) : "";
    }

    /**
     * Compiles {@code pattern}.
     *
     * @throws TareException when the pattern is malformed (an unclosed class or brace)
     */
    public static Glob of(String pattern) {
        return new Glob(pattern, Pattern.compile(toRegex(pattern), Pattern.DOTALL));
    }

    /** Compiles every pattern in order. */
    public static List<Glob> all(List<String> patterns) {
        return patterns.stream().map(Glob::of).toList();
    }

    /** Whether {@code relativePath} (with {@code /} separators) matches this pattern. */
    public boolean matches(String relativePath) {
        // Most paths fail on plain text alone, which is far cheaper than running the expression.
        return relativePath.endsWith(requiredEnd) && relativePath.contains(requiredText)
                && regex.matcher(relativePath).matches();
    }

    /** The runs of plain characters between wildcards, classes and alternatives, escapes undone. */
    private static List<String> literalRuns(String glob) {
        List<String> runs = new java.util.ArrayList<>();
        StringBuilder run = new StringBuilder();
        int depth = 0;
        for (int i = 0; i < glob.length(); i++) {
            char c = glob.charAt(i);
            if (c == '*' && glob.startsWith("*/", i + 1) && (i == 0 || glob.charAt(i - 1) == '/')) {
                i += 2; // '**/' may match no folder at all, so its slash is not required either
            }
            boolean plain = depth == 0 && c != '*' && c != '?' && c != '[' && c != '{' && c != '}';
            if (c == '{') {
                depth++;
            } else if (c == '}' && depth > 0) {
                depth--;
            } else if (c == '[') {
                int close = glob.indexOf(']', i + 2);
                i = close < 0 ? glob.length() : close;
            }
            if (plain && c == '\\' && i + 1 < glob.length()) {
                run.append(glob.charAt(++i));
            } else if (plain) {
                run.append(c);
            } else if (run.length() > 0) {
                runs.add(run.toString());
                run.setLength(0);
            }
        }
        if (run.length() > 0) {
            runs.add(run.toString());
        }
        return runs;
    }

    /** Whether the pattern's last character is plain text (not a wildcard, class or alternative). */
    private static boolean endsWithLiteral(String glob) {
        if (glob.isEmpty()) {
            return false;
        }
        char last = glob.charAt(glob.length() - 1);
        boolean escaped = glob.length() >= 2 && glob.charAt(glob.length() - 2) == '\\';
        return escaped || (last != '*' && last != '?' && last != ']' && last != '}');
    }

    /** Whether any of {@code globs} matches {@code relativePath}. */
    public static boolean anyMatches(List<Glob> globs, String relativePath) {
        for (Glob glob : globs) {
            if (glob.matches(relativePath)) {
                return true;
            }
        }
        return false;
    }

    /** The pattern as written. */
    public String pattern() {
        return pattern;
    }

    @Override
    public String toString() {
        return pattern;
    }

    private static String toRegex(String glob) {
        StringBuilder out = new StringBuilder();
        int braces = 0;
        int i = 0;
        while (i < glob.length()) {
            char c = glob.charAt(i);
            switch (c) {
                case '*' -> {
                    if (i + 1 < glob.length() && glob.charAt(i + 1) == '*') {
                        boolean slashAfter = i + 2 < glob.length() && glob.charAt(i + 2) == '/';
                        boolean atSegmentStart = i == 0 || glob.charAt(i - 1) == '/';
                        if (slashAfter && atSegmentStart) {
                            out.append("(?:[^/]*/)*");
                            i += 3;
                        } else {
                            out.append(".*");
                            i += 2;
                        }
                        continue;
                    }
                    out.append("[^/]*");
                }
                case '?' -> out.append("[^/]");
                case '[' -> {
                    int close = glob.indexOf(']', i + 2);
                    if (close < 0) {
                        throw new TareException("glob '" + glob + "': '[' at position " + (i + 1)
                                + " is never closed; write \\[ for a literal bracket");
                    }
                    String body = glob.substring(i + 1, close);
                    if (body.startsWith("!")) {
                        body = "^" + body.substring(1);
                    }
                    out.append('[').append(body.replace("\\", "\\\\").replace("[", "\\[")).append(']');
                    i = close + 1;
                    continue;
                }
                case '{' -> {
                    braces++;
                    out.append("(?:");
                }
                case '}' -> {
                    if (braces == 0) {
                        out.append("\\}");
                    } else {
                        braces--;
                        out.append(')');
                    }
                }
                case ',' -> out.append(braces > 0 ? "|" : ",");
                case '\\' -> {
                    if (i + 1 < glob.length()) {
                        out.append(Pattern.quote(String.valueOf(glob.charAt(i + 1))));
                        i += 2;
                        continue;
                    }
                    out.append("\\\\");
                }
                default -> out.append(Pattern.quote(String.valueOf(c)));
            }
            i++;
        }
        if (braces != 0) {
            throw new TareException("glob '" + glob + "': '{' is never closed");
        }
        return out.toString();
    }
}
