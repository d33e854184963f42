package dev.tare.template.code;

import dev.tare.template.code.TokenWalk.Callee;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.Set;

/**
 * Builds the value a string literal stands for: the literals next to it (Python), the literals and
 * expressions joined to it with {@code +} (each expression a variable), the string methods called on
 * it, and the calls around it that make it another string (grouping, dedent, format calls).
 */
final class ValueReader extends TokenWalk {
    /** The most operands, wrappers and methods one value is built from. */
    private static final int JOINS = 256;

    private static final Set<String> GO_FORMATS = Set.of("Sprintf", "Printf", "Fprintf", "Errorf", "Fatalf", "Panicf",
            "Logf", "Infof", "Debugf", "Warnf", "Warningf", "Appendf");

    /** A value built from literals: its tokens, its text, and the calls it went through. */
    static final class Value {
        /** The tokens of the whole expression, calls around the literals included. */
        int first;
        int last;
        /** The tokens of the literals and the operands joined to them. */
        int ownFirst;
        int ownLast;
        DecodedText text;
        final List<Callee> through = new ArrayList<>();
    }

    ValueReader(CodeTokens tokens, Language language) {
        super(tokens, language);
    }

    Value value(int s) {
        Value value = new Value();
        DecodedText text = new DecodedText();
        CodeTokens.StringLiteral literal = t.literal(s);
        int first = literal.tagStart() >= 0 ? literal.tagStart() : s;
        List<int[]> leading = new ArrayList<>();
        for (int p = previous(first); t.is(p, "+") && leading.size() < 8; p = previous(first)) {
            int q = previous(p);
            if (!endsOperand(q)) {
                break;
            }
            int b = operandStart(q);
            if (b < 0) {
                break;
            }
            leading.add(0, new int[] {b, q});
            first = b;
        }
        for (int[] operand : leading) {
            text.append(operand(operand[0], operand[1]));
        }
        int last = atom(s, text);
        for (int joins = 0; joins < JOINS; joins++) {
            int plus = next(last);
            if (!t.is(plus, "+")) {
                break;
            }
            int u = nextAfterOperator(plus);
            if (isString(u) && t.literal(u).tagStart() < 0) {
                last = atom(u, text);
                continue;
            }
            int q = operandEnd(u);
            if (q < 0) {
                break;
            }
            text.append(operand(u, q));
            last = q;
        }
        value.first = first;
        value.last = last;
        value.ownFirst = first;
        value.ownLast = last;
        value.text = text;
        wrap(value);
        return value;
    }

    private DecodedText operand(int from, int to) {
        DecodedText text = new DecodedText();
        String name = expression(from, to);
        text.variable(name, name, t.view.from(t.start(from)), t.view.to(t.end(to) - 1));
        return text;
    }

    /** Appends the literal at {@code s}, the literals next to it (Python) and its string methods; returns its last token. */
    private int atom(int s, DecodedText out) {
        DecodedText text = new DecodedText();
        text.append(t.literal(s).text());
        int last = s;
        if (language == Language.PYTHON) {
            for (int n = next(last); isString(n); n = next(last)) {
                text.append(t.literal(n).text());
                last = n;
            }
        }
        int[] end = {last};
        text = methods(text, end);
        out.append(text);
        return end[0];
    }

    /** Applies the string methods called after token {@code end[0]}, moving it past them. */
    private DecodedText methods(DecodedText text, int[] end) {
        for (int calls = 0; calls < 8; calls++) {
            int dot = next(end[0]);
            if ((t.is(dot, ".") || t.is(dot, "?.")) && isWord(dot + 1) && t.is(dot + 2, "(") && t.match(dot + 2) > 0) {
                int open = dot + 2;
                DecodedText changed = method(text, t.text(dot + 1), open, t.match(open));
                if (changed == null) {
                    return text;
                }
                text = changed;
                end[0] = t.match(open);
                continue;
            }
            if (language == Language.PYTHON && t.is(dot, "%")) {
                int u = nextAfterOperator(dot);
                List<String> arguments;
                int last;
                if (t.is(u, "(") && t.match(u) > 0) {
                    last = t.match(u);
                    arguments = arguments(u, last, 0);
                } else {
                    last = operandEnd(u);
                    if (last < 0) {
                        return text;
                    }
                    arguments = List.of(expression(u, last));
                }
                end[0] = last;
                return FormatFields.percent(text, FormatFields.Dialect.PYTHON, arguments);
            }
            return text;
        }
        return text;
    }

    private DecodedText method(DecodedText text, String name, int open, int close) {
        boolean none = close == open + 1;
        return switch (language) {
            case PYTHON -> switch (name) {
                case "format" -> FormatFields.braces(text, arguments(open, close, 0));
                case "strip" -> none ? StringMethods.strip(text, StringMethods.Space.PYTHON, true, true) : null;
                case "lstrip" -> none ? StringMethods.strip(text, StringMethods.Space.PYTHON, true, false) : null;
                case "rstrip" -> none ? StringMethods.strip(text, StringMethods.Space.PYTHON, false, true) : null;
                default -> null;
            };
            case JAVA -> switch (name) {
                case "formatted" -> FormatFields.percent(text, FormatFields.Dialect.JAVA, arguments(open, close, 0));
                case "strip" -> none ? StringMethods.strip(text, StringMethods.Space.JAVA, true, true) : null;
                case "stripLeading" -> none ? StringMethods.strip(text, StringMethods.Space.JAVA, true, false) : null;
                case "stripTrailing" -> none ? StringMethods.strip(text, StringMethods.Space.JAVA, false, true) : null;
                case "trim" -> none ? StringMethods.strip(text, StringMethods.Space.JAVA_TRIM, true, true) : null;
                case "stripIndent" -> none ? TextBlock.stripIndent(text) : null;
                default -> null;
            };
            case JAVASCRIPT, TYPESCRIPT -> !none ? null : switch (name) {
                case "trim" -> StringMethods.strip(text, StringMethods.Space.SCRIPT, true, true);
                case "trimStart", "trimLeft" -> StringMethods.strip(text, StringMethods.Space.SCRIPT, true, false);
                case "trimEnd", "trimRight" -> StringMethods.strip(text, StringMethods.Space.SCRIPT, false, true);
                default -> null;
            };
            case GO -> null;
        };
    }

    /** Widens a value over the calls around it that make it into another string: grouping, dedent, format calls. */
    private void wrap(Value value) {
        for (int level = 0; level < 8; level++) {
            int p = previous(value.first);
            if (t.is(p, "(") && t.match(p) > 0) {
                int close = t.match(p);
                boolean sole = nextAfterOperator(value.last) == close;
                Optional<Callee> found = callee(p);
                if (found.isEmpty()) {
                    if (!sole) {
                        return;
                    }
                    widen(value, p, close);
                    continue;
                }
                Callee callee = found.get();
                DecodedText wrapped = sole ? wrapper(value.text, callee) : null;
                if (wrapped == null) {
                    wrapped = format(value.text, callee, p, close, 0);
                }
                if (wrapped == null) {
                    return;
                }
                value.text = wrapped;
                value.through.add(callee);
                widen(value, callee.start(), close);
                continue;
            }
            if (t.is(p, ",") && t.opener(p) >= 0 && t.is(t.opener(p), "(")) {
                int open = t.opener(p);
                Optional<Callee> found = callee(open);
                if (found.isEmpty() || !formatIsSecond(found.get(), open, p)) {
                    return;
                }
                DecodedText wrapped = format(value.text, found.get(), open, t.match(open), 1);
                if (wrapped == null) {
                    return;
                }
                value.text = wrapped;
                value.through.add(found.get());
                widen(value, found.get().start(), t.match(open));
                continue;
            }
            return;
        }
    }

    private void widen(Value value, int first, int close) {
        value.first = first;
        int[] end = {close};
        value.text = methods(value.text, end);
        value.last = end[0];
    }

    /** Whether the format string of this call comes second: after a locale (Java) or a writer (Go). */
    private boolean formatIsSecond(Callee callee, int open, int comma) {
        int before = previous(comma);
        if (before <= open || isString(before)) {
            return false;
        }
        int start = operandStart(before);
        if (start < 0 || previous(start) != open) {
            return false;
        }
        return language == Language.JAVA && callee.name().equals("String.format")
                || language == Language.GO && (callee.name().equals("fmt.Fprintf") || callee.name().equals("fmt.Appendf"));
    }

    private DecodedText wrapper(DecodedText text, Callee callee) {
        String name = callee.name();
        return switch (language) {
            case PYTHON -> name.equals("textwrap.dedent") || name.equals("dedent") ? StringMethods.dedent(text)
                    : name.equals("inspect.cleandoc") || name.equals("cleandoc") ? StringMethods.cleandoc(text) : null;
            case GO -> name.equals("strings.TrimSpace")
                    ? StringMethods.strip(text, StringMethods.Space.GO, true, true) : null;
            default -> null;
        };
    }

    /** The value formatted by a format call whose format string is its {@code position}-th argument; null if none. */
    private DecodedText format(DecodedText text, Callee callee, int open, int close, int position) {
        if (language == Language.JAVA && callee.name().equals("String.format")) {
            return FormatFields.percent(text, FormatFields.Dialect.JAVA, arguments(open, close, position + 1));
        }
        if (language == Language.GO && callee.receiver().equals("fmt") && GO_FORMATS.contains(callee.lastPart())
                || language == Language.GO && GO_FORMATS.contains(callee.lastPart()) && position == 0
                && PromptRules.isLogCall(callee)) {
            return FormatFields.percent(text, FormatFields.Dialect.GO, arguments(open, close, position + 1));
        }
        return null;
    }
}
