package dev.tare.template.code;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.Set;

/**
 * Steps through a file's tokens the way the finder needs: past line breaks that do not end an
 * expression, over an operand or a bracketed group in one jump, to the call whose argument list a
 * bracket opens. Every walk is bounded, so that finding prompts stays linear in the number of tokens.
 */
abstract class TokenWalk {
    /** The most tokens a look back over one name or expression takes. */
    static final int LOOKBACK = 64;

    /** The most tokens one operand between {@code +} signs may have. */
    static final int OPERAND = 256;

    /** Words before a parenthesis that make it no call. */
    private static final Set<String> NOT_CALLEES = Set.of("if", "while", "for", "switch", "catch", "return", "and",
            "or", "not", "in", "is", "elif", "with", "assert", "del", "yield", "await", "typeof", "function", "func",
            "lambda", "else", "case", "of", "instanceof", "throw", "raise", "new", "synchronized");

    /** Words that end an operand between {@code +} signs. */
    private static final Set<String> ENDS_OPERAND = Set.of("if", "else", "for", "in", "and", "or", "not", "is", "lambda",
            "instanceof", "of", "as", "async", "from", "import", "return");

    /** Operators that bind tighter than {@code +}, and so stay inside an operand. */
    private static final Set<String> OPERAND_OPERATORS = Set.of(".", "?.", "::", "->", "*", "/", "%", "**", "!", "~",
            "-", "@");

    /** A call: its dotted name, its first token, the token of its last name, and how it is written. */
    record Callee(String name, int start, int last, boolean annotation, boolean thrown) {
        String lastPart() {
            int dot = name.lastIndexOf('.');
            return dot < 0 ? name : name.substring(dot + 1);
        }

        String receiver() {
            int dot = name.lastIndexOf('.');
            return dot < 0 ? "" : name.substring(0, dot);
        }
    }

    final CodeTokens t;
    final Language language;

    TokenWalk(CodeTokens tokens, Language language) {
        this.t = tokens;
        this.language = language;
    }

    /** Whether the line break at token {@code k} ends an expression (Go always, Python outside brackets). */
    boolean newlineEnds(int k) {
        return switch (language) {
            case GO -> true;
            case PYTHON -> t.opener(k) < 0;
            default -> false;
        };
    }

    /** The token after {@code k}, past line breaks that do not end an expression; -1 at one that does. */
    int next(int k) {
        int j = k + 1;
        while (j < t.size() && t.kind(j) == CodeTokens.NEWLINE) {
            if (newlineEnds(j)) {
                return -1;
            }
            j++;
        }
        return j < t.size() ? j : -1;
    }

    /** The token after {@code k} past every line break, as after an operator. */
    int nextAfterOperator(int k) {
        int j = k + 1;
        while (j < t.size() && t.kind(j) == CodeTokens.NEWLINE) {
            j++;
        }
        return j < t.size() ? j : -1;
    }

    int previous(int k) {
        int j = k - 1;
        while (j >= 0 && t.kind(j) == CodeTokens.NEWLINE) {
            j--;
        }
        return j;
    }

    boolean isWord(int k) {
        return k >= 0 && k < t.size() && t.kind(k) == CodeTokens.WORD;
    }

    boolean isString(int k) {
        return k >= 0 && k < t.size() && t.kind(k) == CodeTokens.STRING;
    }

    String expression(int from, int to) {
        return PythonLexer.collapse(t.view.text().substring(t.start(from), t.end(to)));
    }

    boolean endsOperand(int q) {
        if (q < 0) {
            return false;
        }
        return switch (t.kind(q)) {
            case CodeTokens.WORD -> !ENDS_OPERAND.contains(t.text(q)) && !NOT_CALLEES.contains(t.text(q));
            case CodeTokens.VALUE -> true;
            case CodeTokens.OP -> (t.is(q, ")") || t.is(q, "]")) && t.match(q) >= 0;
            default -> false;
        };
    }

    /** The first token of the operand that ends at {@code q}: names, member access, calls and indexing. */
    int operandStart(int q) {
        int k = q;
        for (int steps = 0; steps < LOOKBACK; steps++) {
            if (t.is(k, ")") || t.is(k, "]")) {
                k = t.match(k);
                if (k < 0) {
                    return -1;
                }
            }
            int p = k - 1;
            if (p < 0) {
                return k;
            }
            if (t.is(p, ".") || t.is(p, "?.") || t.is(p, "::") || t.is(p, "->")) {
                k = p - 1;
                if (k < 0) {
                    return -1;
                }
                continue;
            }
            if ((t.is(k, "(") || t.is(k, "[")) && (isWord(p) || t.is(p, ")") || t.is(p, "]"))) {
                k = p;
                continue;
            }
            if (isWord(k) && (t.isWord(p, "new") || t.isWord(p, "await"))) {
                k = p;
                continue;
            }
            return k;
        }
        return -1;
    }

    /** The last token of the operand that starts at {@code u}, or -1 when there is none. */
    int operandEnd(int u) {
        int last = -1;
        int k = u;
        for (int steps = 0; k >= 0 && k < t.size() && steps < OPERAND; steps++) {
            byte kind = t.kind(k);
            if (kind == CodeTokens.NEWLINE) {
                if (newlineEnds(k)) {
                    break;
                }
                k++;
                continue;
            }
            if (kind == CodeTokens.OP) {
                if (t.is(k, "(") || t.is(k, "[") || t.is(k, "{")) {
                    int close = t.match(k);
                    if (close < 0) {
                        return -1;
                    }
                    last = close;
                    k = close + 1;
                    continue;
                }
                if (!OPERAND_OPERATORS.contains(t.text(k))) {
                    break;
                }
                last = k;
                k++;
                continue;
            }
            if (kind == CodeTokens.STRING || kind == CodeTokens.WORD && ENDS_OPERAND.contains(t.text(k))) {
                break;
            }
            last = k;
            k++;
        }
        if (last >= 0 && t.kind(last) == CodeTokens.OP && !t.is(last, ")") && !t.is(last, "]") && !t.is(last, "}")) {
            return -1;
        }
        return last;
    }

    /** The positional arguments of the call between the parentheses {@code open} and {@code close}, from the {@code skip}-th. */
    List<String> arguments(int open, int close, int skip) {
        List<String> found = new ArrayList<>();
        int index = 0;
        int start = -1;
        int last = -1;
        for (int k = open + 1; k <= close; k++) {
            if (k == close || t.is(k, ",") && t.opener(k) == open) {
                if (start >= 0 && index >= skip && !(isWord(start) && t.is(next(start), "=")
                        && language == Language.PYTHON)) {
                    found.add(expression(start, last));
                }
                index++;
                start = -1;
                continue;
            }
            if (t.kind(k) == CodeTokens.NEWLINE) {
                continue;
            }
            if (start < 0) {
                start = k;
            }
            last = k;
            int match = t.match(k);
            if (match > k) {
                last = match;
                k = match;
            }
        }
        return found;
    }

    /** The call whose argument list opens at {@code open}, if a name stands right before it. */
    Optional<Callee> callee(int open) {
        int k = open - 1;
        if (!isWord(k) || NOT_CALLEES.contains(t.text(k)) && !t.is(k - 1, ".")) {
            return Optional.empty();
        }
        int last = k;
        StringBuilder name = new StringBuilder(t.text(k));
        for (int steps = 0; steps < LOOKBACK; steps++) {
            int dot = k - 1;
            if (!(t.is(dot, ".") || t.is(dot, "?.") || t.is(dot, "::"))) {
                break;
            }
            int before = dot - 1;
            if (t.is(before, ")") || t.is(before, "]")) {
                int opener = t.match(before);
                if (opener <= 0 || !isWord(opener - 1)) {
                    break;
                }
                before = opener - 1;
            }
            if (!isWord(before)) {
                break;
            }
            name.insert(0, t.text(before) + ".");
            k = before;
        }
        int start = k;
        boolean thrown = false;
        if (t.isWord(k - 1, "new")) {
            start = k - 1;
            thrown = t.isWord(previous(k - 1), "throw");
        }
        thrown |= t.isWord(previous(start), "raise") || t.isWord(previous(start), "throw");
        boolean annotation = t.is(start - 1, "@");
        return Optional.of(new Callee(name.toString(), start, last, annotation, thrown));
    }

    String keyText(int k) {
        return isString(k) ? t.literal(k).text().text() : t.text(k);
    }
}
