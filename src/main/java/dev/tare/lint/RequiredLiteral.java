package dev.tare.lint;

/**
 * The longest run of plain characters that every match of an RE2 pattern contains, found by reading
 * the pattern: {@code \bin order to\b} must contain {@code "in order to"}, {@code [Dd]ue to} must
 * contain {@code "ue to"}. A text without that run cannot match, so a rule-pack rule skips it with
 * one {@link String#contains} instead of running the pattern's automaton over it, which in a short
 * run such as the pre-commit hook is most of what pattern rules cost.
 *
 * <p>When no run is known, a class every match needs, such as {@code [!?]}, gives a set of characters
 * of which every match contains one.
 *
 * <p>Sound before clever: a pattern with a top-level alternative, flags, or an escape this reader does
 * not know gives the empty string (no shortcut). Groups, classes and {@code .} end a run; an atom made
 * optional by {@code ?}, {@code *} or <code>{0,n}</code> is dropped from its run, and a repeated one ends it.
 */
final class RequiredLiteral {
    private final String pattern;
    private final StringBuilder run = new StringBuilder();
    private String best = "";
    private String anyOf = "";
    private int at;

    private RequiredLiteral(String pattern) {
        this.pattern = pattern;
    }

    /** What every match of {@code pattern} contains, as far as this reader can tell. */
    static Filter filter(String pattern) {
        try {
            RequiredLiteral reader = new RequiredLiteral(pattern);
            String run = reader.read();
            return new Filter(run, run.isEmpty() ? reader.anyOf : "");
        } catch (GiveUp e) {
            return new Filter("", "");
        }
    }

    /**
     * What every match contains: the plain run {@code run}, else (when {@code run} is empty) one of the
     * characters of {@code anyOf}; both empty when nothing is known.
     */
    record Filter(String run, String anyOf) {
        /** Whether a match in {@code text} is possible at all. */
        boolean admits(String text) {
            if (!run.isEmpty()) {
                return text.contains(run);
            }
            if (anyOf.isEmpty()) {
                return true;
            }
            for (int i = 0; i < anyOf.length(); i++) {
                if (text.indexOf(anyOf.charAt(i)) >= 0) {
                    return true;
                }
            }
            return false;
        }
    }

    private String read() {
        while (at < pattern.length()) {
            char c = pattern.charAt(at);
            switch (c) {
                case '|' -> throw new GiveUp();
                case '(' -> {
                    if (pattern.startsWith("(?", at) && !pattern.startsWith("(?:", at)) {
                        throw new GiveUp();
                    }
                    at = closingParenthesis(at) + 1;
                    endRun();
                    skipQuantifier();
                }
                case '[' -> {
                    int open = at;
                    at = closingBracket(open) + 1;
                    endRun();
                    String members = members(pattern.substring(open + 1, at - 1));
                    if (quantifierMinimum() != 0 && !members.isEmpty()
                            && (anyOf.isEmpty() || members.length() < anyOf.length())) {
                        anyOf = members;
                    }
                }
                case '.' -> {
                    at++;
                    endRun();
                    skipQuantifier();
                }
                case '^', '$' -> {
                    at++;
                    endRun();
                    skipQuantifier();
                }
                case '*', '+', '?' -> throw new GiveUp();
                case '\\' -> escape();
                default -> literal(c, 1);
            }
        }
        endRun();
        return best;
    }

    private void escape() {
        if (at + 1 >= pattern.length()) {
            throw new GiveUp();
        }
        char next = pattern.charAt(at + 1);
        if (next == 'b' || next == 'B' || next == 'A' || next == 'z' || next == 'd' || next == 'D' || next == 's' || next == 'S' || next == 'w' || next == 'W') {
            at += 2;
            endRun();
            skipQuantifier();
        } else if (Character.isLetterOrDigit(next) || next > 0x7F) {
            throw new GiveUp();
        } else {
            literal(next, 2);
        }
    }

    /** A plain character {@code width} pattern characters long, and the quantifier after it, if any. */
    private void literal(char c, int width) {
        at += width;
        int minimum = quantifierMinimum();
        if (minimum < 0) {
            run.append(c);
        } else if (minimum == 0) {
            endRun();
        } else {
            run.append(c);
            endRun();
        }
    }

    /** Reads a quantifier at the cursor: -1 when there is none, else its minimum count. */
    private int quantifierMinimum() {
        if (at >= pattern.length()) {
            return -1;
        }
        char q = pattern.charAt(at);
        int minimum;
        if (q == '*' || q == '?') {
            at++;
            minimum = 0;
        } else if (q == '+') {
            at++;
            minimum = 1;
        } else if (q == '{') {
            int close = pattern.indexOf('}', at);
            String inside = close < 0 ? "" : pattern.substring(at + 1, close);
            if (!inside.matches("\\d+(,\\d*)?")) {
                return -1;
            }
            at = close + 1;
            minimum = Integer.parseInt(inside.split(",", -1)[0]);
        } else {
            return -1;
        }
        if (at < pattern.length() && pattern.charAt(at) == '?') {
            at++;
        }
        if (at < pattern.length() && "*+?".indexOf(pattern.charAt(at)) >= 0) {
            throw new GiveUp();
        }
        return minimum;
    }

    private void skipQuantifier() {
        quantifierMinimum();
    }

    private void endRun() {
        if (run.length() > best.length()) {
            best = run.toString();
        }
        run.setLength(0);
    }

    private int closingParenthesis(int open) {
        int depth = 0;
        for (int i = open; i < pattern.length(); i++) {
            char c = pattern.charAt(i);
            if (c == '\\') {
                i++;
            } else if (c == '[') {
                i = closingBracket(i);
            } else if (c == '(') {
                depth++;
            } else if (c == ')' && --depth == 0) {
                return i;
            }
        }
        throw new GiveUp();
    }

    /**
     * The characters of a class's inside, when it is a plain positive list of at most
     * {@value #MAX_MEMBERS} characters (single characters, escaped punctuation, short ranges); empty otherwise.
     */
    private static String members(String inside) {
        if (inside.isEmpty() || inside.charAt(0) == '^' || inside.contains("[:")) {
            return "";
        }
        StringBuilder members = new StringBuilder();
        for (int i = 0; i < inside.length(); i++) {
            char c = inside.charAt(i);
            if (c == '\\') {
                if (i + 1 >= inside.length() || Character.isLetterOrDigit(inside.charAt(i + 1)) || inside.charAt(i + 1) > 0x7F) {
                    return "";
                }
                c = inside.charAt(++i);
            }
            if (i + 2 < inside.length() && inside.charAt(i + 1) == '-') {
                char last = inside.charAt(i + 2);
                if (last == '\\' || last < c || last - c >= MAX_MEMBERS) {
                    return "";
                }
                for (char member = c; member <= last; member++) {
                    members.append(member);
                }
                i += 2;
            } else {
                members.append(c);
            }
            if (members.length() > MAX_MEMBERS || members.chars().anyMatch(m -> Character.isSurrogate((char) m))) {
                return "";
            }
        }
        return members.toString();
    }

    private static final int MAX_MEMBERS = 16;

    /** The {@code ]} that closes the class opened at {@code open}; a {@code ]} first in the class is a member. */
    private int closingBracket(int open) {
        int i = open + 1;
        if (i < pattern.length() && pattern.charAt(i) == '^') {
            i++;
        }
        if (i < pattern.length() && pattern.charAt(i) == ']') {
            i++;
        }
        for (; i < pattern.length(); i++) {
            char c = pattern.charAt(i);
            if (c == '\\') {
                i++;
            } else if (c == '[' && pattern.startsWith("[:", i)) {
                int end = pattern.indexOf(":]", i + 2);
                if (end < 0) {
                    throw new GiveUp();
                }
                i = end + 1;
            } else if (c == ']') {
                return i;
            }
        }
        throw new GiveUp();
    }

    /** The pattern uses something this reader does not follow: no shortcut. */
    private static final class GiveUp extends RuntimeException {
        private static final long serialVersionUID = 1L;

        GiveUp() {
            super(null, null, false, false);
        }
    }
}
