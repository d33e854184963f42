package dev.tare.template.code;

import java.util.List;

/**
 * Reads the fields of a format string in decoded text: Python's {@code str.format} fields
 * ({@code {name}}, {@code {0!r:>10}}, with {@code {{} and {@code }}} for braces) and printf-style
 * specifiers in the Java, Go and Python {@code %} dialects. Each field becomes a variable named by the
 * argument it takes when the call's arguments are known, by its key when it names one, and by the
 * specifier as written otherwise. Text that is not a well-formed field stays text.
 */
final class FormatFields {
    /** Which printf-style dialect a format string is written in. */
    enum Dialect { JAVA, GO, PYTHON }

    private FormatFields() {
    }

    /** {@code text} with Python {@code str.format} fields made variables, given the call's positional arguments. */
    static DecodedText braces(DecodedText text, List<String> arguments) {
        DecodedText out = new DecodedText();
        int n = text.length();
        int auto = 0;
        int i = 0;
        while (i < n) {
            char c = text.charAt(i);
            if (text.variableAt(i) >= 0 || c != '{' && c != '}') {
                out.copy(text, i);
                i++;
                continue;
            }
            out.usePiece(text.pieceAt(i));
            if (i + 1 < n && text.charAt(i + 1) == c && text.variableAt(i + 1) < 0) {
                out.decoded(c, text.from(i), text.to(i + 1));
                i += 2;
                continue;
            }
            int close = c == '{' ? fieldEnd(text, i) : -1;
            if (close < 0) {
                out.copy(text, i);
                i++;
                continue;
            }
            String field = text.text(i + 1, close);
            int nameEnd = 0;
            while (nameEnd < field.length() && field.charAt(nameEnd) != '!' && field.charAt(nameEnd) != ':') {
                nameEnd++;
            }
            String name = field.substring(0, nameEnd).strip();
            String variable;
            if (name.isEmpty()) {
                variable = auto < arguments.size() ? arguments.get(auto) : text.text(i, close + 1);
                auto++;
            } else if (name.length() <= 4 && name.chars().allMatch(d -> d >= '0' && d <= '9')) {
                int index = Integer.parseInt(name);
                variable = index < arguments.size() ? arguments.get(index) : name;
            } else {
                variable = name;
            }
            out.variable(text.text(i, close + 1), variable, text.from(i), text.to(close));
            i = close + 1;
        }
        return out;
    }

    /** The closing brace of a field opened at {@code open}, allowing one level of nested fields in its spec. */
    private static int fieldEnd(DecodedText text, int open) {
        int nested = 0;
        for (int k = open + 1; k < text.length() && k < open + 200; k++) {
            char c = text.charAt(k);
            if (text.variableAt(k) >= 0 || c == '\n') {
                return -1;
            }
            if (c == '{') {
                if (++nested > 1) {
                    return -1;
                }
            } else if (c == '}') {
                if (nested == 0) {
                    return k;
                }
                nested--;
            }
        }
        return -1;
    }

    /** {@code text} with printf-style specifiers made variables, given the call's arguments after the format. */
    static DecodedText percent(DecodedText text, Dialect dialect, List<String> arguments) {
        DecodedText out = new DecodedText();
        int n = text.length();
        int next = 0;
        int previous = -1;
        int i = 0;
        while (i < n) {
            if (text.charAt(i) != '%' || text.variableAt(i) >= 0) {
                out.copy(text, i);
                i++;
                continue;
            }
            Specifier spec = specifier(text, i, dialect);
            if (spec == null) {
                out.copy(text, i);
                i++;
                continue;
            }
            int end = spec.end();
            out.usePiece(text.pieceAt(i));
            if (spec.conversion() == '%') {
                out.decoded('%', text.from(i), text.to(end - 1));
            } else if (spec.conversion() == 'n' && dialect == Dialect.JAVA) {
                out.decoded('\n', text.from(i), text.to(end - 1));
            } else {
                int index;
                if (spec.index() > 0) {
                    index = spec.index() - 1;
                    if (dialect == Dialect.GO) {
                        // Go goes on from an explicit index; Java's ordinary specifiers keep their own count.
                        next = index + 1;
                    }
                } else if (spec.index() == Specifier.PREVIOUS) {
                    index = previous;
                } else {
                    index = next++;
                }
                previous = index;
                String shown = text.text(i, end);
                String name = spec.key() != null ? spec.key()
                        : index >= 0 && index < arguments.size() ? arguments.get(index) : shown;
                out.variable(shown, name, text.from(i), text.to(end - 1));
            }
            i = end;
        }
        return out;
    }

    /** A printf-style specifier: where it ends, its conversion, its explicit argument (1-based) and its key. */
    record Specifier(int end, char conversion, int index, String key) {
        static final int PREVIOUS = -2;
    }

    private static Specifier specifier(DecodedText text, int at, Dialect dialect) {
        int n = text.length();
        int k = at + 1;
        if (k < n && text.charAt(k) == '%') {
            return new Specifier(k + 1, '%', 0, null);
        }
        int index = 0;
        String key = null;
        if (dialect == Dialect.PYTHON && k < n && text.charAt(k) == '(') {
            int close = k + 1;
            while (close < n && close < k + 80 && text.charAt(close) != ')' && text.charAt(close) != '\n') {
                close++;
            }
            if (close >= n || text.charAt(close) != ')') {
                return null;
            }
            key = text.text(k + 1, close);
            k = close + 1;
        } else if (dialect == Dialect.JAVA) {
            if (k < n && text.charAt(k) == '<') {
                index = Specifier.PREVIOUS;
                k++;
            } else {
                int digits = k;
                while (digits < n && Character.isDigit(text.charAt(digits)) && digits < k + 4) {
                    digits++;
                }
                if (digits > k && digits < n && text.charAt(digits) == '$') {
                    index = Integer.parseInt(text.text(k, digits));
                    k = digits + 1;
                }
            }
        }
        String flags = switch (dialect) {
            case JAVA -> "-#+ 0,(";
            case GO -> "+-# 0";
            case PYTHON -> "#0- +";
        };
        while (k < n && flags.indexOf(text.charAt(k)) >= 0) {
            k++;
        }
        int[] goIndex = {index};
        k = goIndex(text, k, dialect, goIndex);
        k = number(text, k, dialect != Dialect.JAVA);
        if (k < n && text.charAt(k) == '.') {
            k = goIndex(text, k + 1, dialect, goIndex);
            k = number(text, k, dialect != Dialect.JAVA);
        }
        k = goIndex(text, k, dialect, goIndex);
        index = goIndex[0];
        if (dialect == Dialect.PYTHON) {
            while (k < n && "hlL".indexOf(text.charAt(k)) >= 0) {
                k++;
            }
        }
        if (k >= n || text.variableAt(k) >= 0) {
            return null;
        }
        char conversion = text.charAt(k);
        String conversions = switch (dialect) {
            case JAVA -> "bBhHsScCdoxXeEfgGaAtTn";
            case GO -> "vTtbcdoOqxXUeEfFgGspw";
            case PYTHON -> "diouxXeEfFgGcrsa";
        };
        if (conversions.indexOf(conversion) < 0) {
            return null;
        }
        if (dialect == Dialect.JAVA && (conversion == 't' || conversion == 'T')) {
            if (k + 1 >= n || !Character.isLetter(text.charAt(k + 1))) {
                return null;
            }
            k++;
        }
        return new Specifier(k + 1, conversion, index, key);
    }

    private static int number(DecodedText text, int k, boolean star) {
        if (star && k < text.length() && text.charAt(k) == '*') {
            return k + 1;
        }
        int limit = k + 6;
        while (k < text.length() && k < limit && text.charAt(k) >= '0' && text.charAt(k) <= '9') {
            k++;
        }
        return k;
    }

    /** Past a Go explicit argument index ({@code [2]}) at {@code k}, kept in {@code index[0]}; or {@code k} itself. */
    private static int goIndex(DecodedText text, int k, Dialect dialect, int[] index) {
        if (dialect != Dialect.GO || k >= text.length() || text.charAt(k) != '[') {
            return k;
        }
        int j = k + 1;
        while (j < text.length() && j < k + 5 && text.charAt(j) >= '0' && text.charAt(j) <= '9') {
            j++;
        }
        if (j > k + 1 && j < text.length() && text.charAt(j) == ']') {
            index[0] = Integer.parseInt(text.text(k + 1, j));
            return j + 1;
        }
        return k;
    }
}
