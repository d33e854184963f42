package dev.tare.lint;

import java.util.Optional;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Decides from a rule's {@code find} and {@code replace} alone whether its rewrite can change nothing
 * but whitespace, the one kind of rewrite a pack may declare {@code class: safe}.
 */
final class WhitespaceOnlyRewrite {
    /** A class member such as {@code \s} that stands for several whitespace characters at once. */
    private static final int SPACE_CLASS = -1;
    /** An escape this reader does not know; it may stand for anything. */
    private static final int UNKNOWN = -2;
    /** RE2 reads a brace that does not fit this, such as {@code {00}} or {@code {,2}}, as a literal. */
    private static final Pattern REPEAT = Pattern.compile("\\{(0|[1-9][0-9]*)(,(0|[1-9][0-9]*)?)?}");

    private final String find;
    private int at;

    private WhitespaceOnlyRewrite(String find) {
        this.find = find;
    }

    /** Empty when the rewrite is whitespace-only, else why not, naming the first offending piece. */
    static Optional<String> whyNot(String find, String replace) {
        WhitespaceOnlyRewrite reader = new WhitespaceOnlyRewrite(find);
        try {
            boolean nonEmpty = reader.alternation();
            if (reader.at < find.length()) {
                throw reader.unread(reader.at, reader.at + 1);
            }
            if (!nonEmpty) {
                return Optional.of("'find' matches only empty text");
            }
        } catch (Rejected e) {
            return Optional.of(e.getMessage());
        }
        for (int i = 0; i < replace.length(); ) {
            int c = replace.codePointAt(i);
            char next = i + 1 < replace.length() ? replace.charAt(i + 1) : 0;
            if (c == '$' && next >= '0' && next <= '9') {
                i += 2; // a group of a whitespace-only match holds only whitespace
            } else if (isWhitespace(c)) {
                i += Character.charCount(c);
            } else {
                return Optional.of("'replace' writes '" + show(Character.toString(c)) + "' (column "
                        + (replace.codePointCount(0, i) + 1) + "), which is not whitespace");
            }
        }
        return Optional.empty();
    }

    /** Reads alternatives up to a closing parenthesis; true when they can match more than empty text. */
    private boolean alternation() {
        boolean nonEmpty = sequence();
        while (at < find.length() && find.charAt(at) == '|') {
            at++;
            nonEmpty |= sequence();
        }
        return nonEmpty;
    }

    private boolean sequence() {
        boolean nonEmpty = false;
        while (at < find.length() && find.charAt(at) != '|' && find.charAt(at) != ')') {
            boolean atom = atom();
            Matcher repeat = REPEAT.matcher(find).region(at, find.length());
            if (at < find.length() && "*+?".indexOf(find.charAt(at)) >= 0) {
                at++;
            } else if (repeat.lookingAt()) {
                at = repeat.end();
                atom &= !"0".equals(repeat.group(repeat.group(2) == null ? 1 : 3)); // {0} and {n,0} match nothing
            }
            if (at < find.length() && find.charAt(at) == '?') {
                at++;
            }
            nonEmpty |= atom;
        }
        return nonEmpty;
    }

    /** Reads one atom, rejecting any that can match something but whitespace; true when it matches a character. */
    private boolean atom() {
        int start = at;
        int c = find.codePointAt(at);
        if (c == '(') {
            return group();
        } else if (c == '[') {
            return characterClass();
        } else if (c == '^' || c == '$') {
            at++;
            return false;
        } else if (c == '\\' && at + 1 < find.length() && "AzbB".indexOf(find.charAt(at + 1)) >= 0) {
            at += 2;
            return false;
        } else if ("*+?".indexOf(c) >= 0 || REPEAT.matcher(find).region(at, find.length()).lookingAt()) {
            throw unread(start, start + 1); // a repetition of nothing
        }
        int value = character();
        if (value != SPACE_CLASS && !isWhitespace(value)) {
            throw other(start, at);
        }
        return true;
    }

    private boolean group() {
        int open = at++;
        if (find.startsWith("?P<", at) || find.startsWith("?<", at)) {
            int close = find.indexOf('>', at);
            if (close < 0) {
                throw unread(open, at + 1);
            }
            at = close + 1;
        } else if (find.startsWith("?", at)) {
            int i = at + 1;
            while (i < find.length() && "imsU-".indexOf(find.charAt(i)) >= 0) {
                i++;
            }
            if (i >= find.length() || find.charAt(i) != ':' && find.charAt(i) != ')') {
                throw unread(open, Math.min(i + 1, find.length())); // lookaround and the like
            }
            at = i + 1;
            if (find.charAt(i) == ')') {
                return false; // flags alone; none of them lets a whitespace atom match anything else
            }
        }
        boolean nonEmpty = alternation();
        if (at >= find.length()) {
            throw unread(open, open + 1);
        }
        at++;
        return nonEmpty;
    }

    private boolean characterClass() {
        int open = at++;
        if (find.startsWith("^", at)) {
            throw other(open, at + 1);
        }
        do { // a bracket first in the class is a member, not its end
            if (at >= find.length()) {
                throw unread(open, open + 1);
            }
            int start = at;
            int low = member();
            if (at + 1 < find.length() && find.charAt(at) == '-' && find.charAt(at + 1) != ']') {
                at++;
                int high = member();
                if (!(low >= '\t' && low <= high && high <= '\r' || low == ' ' && high == ' ')) {
                    throw other(start, at);
                }
            } else if (low != SPACE_CLASS && !isWhitespace(low)) {
                throw other(start, at);
            }
        } while (at >= find.length() || find.charAt(at) != ']');
        at++;
        return true;
    }

    /** One member of a class: a character, {@link #SPACE_CLASS} or {@link #UNKNOWN}. */
    private int member() {
        int start = at;
        int named = find.startsWith("[:", at) ? find.indexOf(":]", at + 2) : -1;
        if (named >= 0) {
            at = named + 2;
            String name = find.substring(start + 2, named);
            if (name.equals("space") || name.equals("blank")) {
                return SPACE_CLASS;
            }
            throw other(start, at);
        }
        return character();
    }

    /** A literal or escaped character at the cursor: a character, {@link #SPACE_CLASS} or {@link #UNKNOWN}. */
    private int character() {
        if (find.charAt(at) == '\\') {
            return escape();
        }
        int c = find.codePointAt(at);
        at += Character.charCount(c);
        return c;
    }

    /** What the escape at the cursor stands for. */
    private int escape() {
        int start = at;
        if (at + 1 >= find.length()) {
            throw unread(start, find.length());
        }
        char kind = find.charAt(at + 1);
        at += 2;
        return switch (kind) {
            case 's' -> SPACE_CLASS;
            case 't' -> '\t';
            case 'n' -> '\n';
            case 'r' -> '\r';
            case 'f' -> '\f';
            case 'v' -> 0x0B;
            case 'x' -> hex(start);
            case 'p', 'P' -> {
                int brace = find.startsWith("{", at) ? find.indexOf('}', at) : -1;
                at = brace >= 0 ? brace + 1 : Math.min(at + 1, find.length());
                throw other(start, at);
            }
            case 'Q' -> throw unread(start, at);
            default -> kind < 0x80 && !Character.isLetterOrDigit(kind) ? kind : UNKNOWN; // punctuation stands for itself
        };
    }

    /** The character of a {@code \xhh} or {@code \x{h..}} escape begun at {@code start}. */
    private int hex(int start) {
        boolean braced = find.startsWith("{", at);
        int end = braced ? find.indexOf('}', at) + 1 : Math.min(at + 2, find.length());
        if (end == 0) {
            throw unread(start, at + 1);
        }
        String digits = find.substring(braced ? at + 1 : at, braced ? end - 1 : end);
        at = end;
        return digits.matches(braced ? "[0-9A-Fa-f]{1,6}" : "[0-9A-Fa-f]{2}") ? Integer.parseInt(digits, 16) : UNKNOWN;
    }

    private static boolean isWhitespace(int c) {
        return c == ' ' || c >= '\t' && c <= '\r';
    }

    private Rejected other(int start, int end) {
        return new Rejected("'find' can match characters other than whitespace ('"
                + show(find.substring(start, end)) + "' at column " + column(start) + ")");
    }

    private Rejected unread(int start, int end) {
        return new Rejected("'find' has '" + show(find.substring(start, end)) + "' at column " + column(start)
                + ", which this check does not read");
    }

    private int column(int index) {
        return find.codePointCount(0, index) + 1;
    }

    /** Spells out invisible characters, since an unexpected one is the likeliest cause of a refusal. */
    private static String show(String piece) {
        StringBuilder out = new StringBuilder();
        piece.codePoints().forEach(c -> out.append(c >= ' ' && c < 0x7F || Character.isLetterOrDigit(c)
                ? Character.toString(c) : String.format("\\x{%X}", c)));
        return out.toString();
    }

    private static final class Rejected extends RuntimeException {
        Rejected(String reason) {
            super(reason, null, false, false);
        }
    }
}
