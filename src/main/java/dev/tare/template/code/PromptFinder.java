package dev.tare.template.code;

import dev.tare.template.LineIndex;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.Set;

/**
 * Finds the prompts among a file's string literals. It joins literals into values (adjacent literals,
 * {@code +} with the expressions between them as variables, format calls and string methods), reads
 * the code before each value to learn what it is (assigned to a name, the value of a key or keyword
 * argument, an argument of a call, an element of a list), decides by that and by the {@code tare:}
 * comments above it whether it is a prompt, and leaves out what only looks like one (log and error
 * messages, SQL, single words, URLs and paths, format specifiers alone). Every look back or ahead is
 * bounded, so the whole pass stays linear in the number of tokens.
 */
final class PromptFinder {
    /** The most tokens a look back over one name or expression takes. */
    private static final int LOOKBACK = 64;
    /** The most tokens one operand between {@code +} signs may have. */
    private static final int OPERAND = 256;
    /** How many containers up the finder looks for the name of a list or mapping. */
    private static final int LEVELS = 6;
    /** The most operands, wrappers and methods one value is built from. */
    private static final int JOINS = 256;
    private static final Set<String> NOT_CALLEES = Set.of("if", "while", "for", "switch", "catch", "return", "and",
            "or", "not", "in", "is", "elif", "with", "assert", "del", "yield", "await", "typeof", "function", "func",
            "lambda", "else", "case", "of", "instanceof", "throw", "raise", "new", "synchronized");
    private static final Set<String> ENDS_OPERAND = Set.of("if", "else", "for", "in", "and", "or", "not", "is", "lambda",
            "instanceof", "of", "as", "async", "from", "import", "return");
    private static final Set<String> OPERAND_OPERATORS = Set.of(".", "?.", "::", "->", "*", "/", "%", "**", "!", "~",
            "-", "@");
    private static final Set<String> LEFT_SIDE_OPERATORS = Set.of(".", "?.", "::", ":", "<", ">", ">>", ">>>", "?", "!",
            "*", "&", "|", "@", "...");
    private static final Set<String> ASSIGNMENTS = Set.of("=", ":=", "+=", "??=", "||=");
    private static final Set<String> LOG_METHODS = Set.of("debug", "info", "warn", "warning", "error", "exception",
            "critical", "fatal", "trace", "log", "verbose", "notice", "printf", "println", "print", "fatalf", "fatalln",
            "panicf", "debugf", "infof", "warnf", "warningf", "errorf", "tracef", "logf", "logln");
    private static final Set<String> LOG_RECEIVERS = Set.of("console", "slog", "zap", "logging", "logger");
    private static final Set<String> LOG_ATTRIBUTES = Set.of("asctime", "created", "filename", "funcName",
            "levelname", "levelno", "lineno", "message", "module", "msecs", "name", "pathname", "process",
            "processName", "relativeCreated", "thread", "threadName", "taskName");
    private static final Set<String> GO_FORMATS = Set.of("Sprintf", "Printf", "Fprintf", "Errorf", "Fatalf", "Panicf",
            "Logf", "Infof", "Debugf", "Warnf", "Warningf", "Appendf");
    private static final Set<String> PAIR_CALLS = Set.of("of", "entry", "put", "ofEntries", "Pair");
    private static final java.util.regex.Pattern SPECIFIER =
            java.util.regex.Pattern.compile("%(\\([^)\\n]{0,80}\\))?[-#+ 0,(]*\\d{0,6}(\\.\\d{0,6})?[a-zA-Z]|\\{[^{}\\n]{0,80}\\}");

    /** What the code before a value says it is. */
    enum Kind { ASSIGN, KEYWORD, KEY, ARGUMENT, ELEMENT, NONE }

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

    /**
     * The place of a value: its kind, the name or key it has, the token that names it (for the
     * {@code tare:} comments above), the call it is passed to, and the container it stands in.
     */
    record Place(Kind kind, String name, int anchor, Callee callee, int container, String outer) {
        static final Place NONE = new Place(Kind.NONE, "", -1, null, -1, null);
    }

    private final String source;
    private final Language language;
    private final List<String> calls;
    private final CodeTokens t;
    private final LineIndex lines;
    private final List<String> problems = new ArrayList<>();
    private final Map<Integer, Integer> commentEndingOn = new HashMap<>();
    private final int[] commentStartLine;
    private final List<List<TareComments.Line>> commentLines = new ArrayList<>();
    private final boolean[] commentUsed;
    /** The {@code tare:} comments above each line asked for, read once. */
    private final Map<Integer, TareComments> commentsByLine = new HashMap<>();

    PromptFinder(String source, Language language, List<String> calls, CodeTokens tokens, LineIndex lines) {
        this.source = source;
        this.language = language;
        this.calls = calls;
        this.t = tokens;
        this.lines = lines;
        this.commentStartLine = new int[tokens.comments.size()];
        this.commentUsed = new boolean[tokens.comments.size()];
    }

    List<String> problems() {
        return List.copyOf(new LinkedHashSet<>(problems));
    }

    List<CodePrompt> find() {
        indexComments();
        List<CodePrompt> found = new ArrayList<>();
        int i = 0;
        while (i < t.size()) {
            if (t.kind(i) != CodeTokens.STRING) {
                i++;
                continue;
            }
            Value value = value(i);
            consider(value, i).ifPresent(found::add);
            i = Math.max(i, value.last) + 1;
        }
        for (int c = 0; c < commentLines.size(); c++) {
            if (!commentUsed[c] && !commentLines.get(c).isEmpty()) {
                problems.add("line " + commentLines.get(c).get(0).line() + ": this tare: comment stands above no string"
                        + " literal; put it on the line just above the literal or the name it is assigned to");
            }
        }
        return found;
    }

    // ---- comments -------------------------------------------------------------------------------

    private int lineAt(int viewOffset) {
        return lines.line(t.view.from(Math.min(viewOffset, t.view.length())));
    }

    /** Notes each comment that stands alone on its lines, by the line it ends on, and its {@code tare:} lines. */
    private void indexComments() {
        java.util.BitSet code = new java.util.BitSet();
        for (int k = 0; k < t.size(); k++) {
            if (t.kind(k) != CodeTokens.NEWLINE) {
                code.set(lineAt(t.start(k)), lineAt(Math.max(t.start(k), t.end(k) - 1)) + 1);
            }
        }
        for (int c = 0; c < t.comments.size(); c++) {
            CodeTokens.Comment comment = t.comments.get(c);
            int first = lineAt(comment.start());
            int last = lineAt(Math.max(comment.start(), comment.end() - 1));
            commentStartLine[c] = first;
            commentLines.add(TareComments.lines(comment.text(), first));
            int codeOnLines = code.nextSetBit(first);
            if (codeOnLines < 0 || codeOnLines > last) {
                commentEndingOn.put(last, c);
            }
        }
    }

    /** The {@code tare:} comments in the blocks of comment lines just above each of {@code anchorLines}. */
    private TareComments commentsAbove(Set<Integer> anchorLines) {
        List<TareComments> blocks = new ArrayList<>();
        for (int line : anchorLines) {
            TareComments block = commentsByLine.computeIfAbsent(line, this::readBlockAbove);
            if (block.any() && !blocks.contains(block)) {
                blocks.add(block);
            }
        }
        return blocks.size() == 1 ? blocks.get(0) : TareComments.merged(blocks);
    }

    private TareComments readBlockAbove(int line) {
        List<Integer> block = new ArrayList<>();
        Set<Integer> seen = new java.util.HashSet<>();
        Integer c = commentEndingOn.get(line - 1);
        while (c != null && seen.add(c)) {
            block.add(0, c);
            c = commentEndingOn.get(commentStartLine[c] - 1);
        }
        TareComments read = new TareComments();
        for (int comment : block) {
            commentUsed[comment] = true;
            for (TareComments.Line tareLine : commentLines.get(comment)) {
                read.read(tareLine);
            }
        }
        return read;
    }

    // ---- token walking --------------------------------------------------------------------------

    private boolean newlineEnds(int k) {
        return switch (language) {
            case GO -> true;
            case PYTHON -> t.opener(k) < 0;
            default -> false;
        };
    }

    /** The token after {@code k}, past line breaks that do not end an expression; -1 at one that does. */
    private int next(int k) {
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
    private int nextAfterOperator(int k) {
        int j = k + 1;
        while (j < t.size() && t.kind(j) == CodeTokens.NEWLINE) {
            j++;
        }
        return j < t.size() ? j : -1;
    }

    private int previous(int k) {
        int j = k - 1;
        while (j >= 0 && t.kind(j) == CodeTokens.NEWLINE) {
            j--;
        }
        return j;
    }

    private boolean isWord(int k) {
        return k >= 0 && k < t.size() && t.kind(k) == CodeTokens.WORD;
    }

    private boolean isString(int k) {
        return k >= 0 && k < t.size() && t.kind(k) == CodeTokens.STRING;
    }

    private String expression(int from, int to) {
        return PythonLexer.collapse(t.view.text().substring(t.start(from), t.end(to)));
    }

    // ---- values ---------------------------------------------------------------------------------

    /** A value built from literals: its tokens, its text, and the calls it went through. */
    private static final class Value {
        /** The tokens of the whole expression, calls around the literals included. */
        int first;
        int last;
        /** The tokens of the literals and the operands joined to them. */
        int ownFirst;
        int ownLast;
        DecodedText text;
        final List<Callee> through = new ArrayList<>();
    }

    private Value value(int s) {
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

    private boolean endsOperand(int q) {
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
    private int operandStart(int q) {
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
    private int operandEnd(int u) {
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

    /** The positional arguments of the call whose parentheses are {@code open}, {@code close}, from the {@code skip}-th on. */
    private List<String> arguments(int open, int close, int skip) {
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
            case GO -> name.equals("strings.TrimSpace") ? StringMethods.strip(text, StringMethods.Space.GO, true, true) : null;
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
                && isLogCall(callee)) {
            return FormatFields.percent(text, FormatFields.Dialect.GO, arguments(open, close, position + 1));
        }
        return null;
    }

    /** The call whose argument list opens at {@code open}, if a name stands right before it. */
    private Optional<Callee> callee(int open) {
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

    // ---- places ---------------------------------------------------------------------------------

    /** What the code before the expression starting at {@code first} makes of it. */
    private Place place(int first) {
        int p = previous(first);
        if (p < 0 || t.kind(p) != CodeTokens.OP) {
            return Place.NONE;
        }
        String op = t.text(p);
        if (ASSIGNMENTS.contains(op)) {
            return assignment(p);
        }
        if (op.equals(":")) {
            int k = previous(p);
            int before = previous(k);
            int container = k >= 0 ? t.opener(k) : -1;
            if ((isWord(k) || isString(k)) && (t.is(before, "{") || t.is(before, ",")) && t.is(container, "{")) {
                return new Place(Kind.KEY, keyText(k), k, null, container, null);
            }
            return Place.NONE;
        }
        if (op.equals("=>")) {
            return arrow(p);
        }
        if (op.equals("(") || op.equals(",") || op.equals("[") || op.equals("{")) {
            int container = t.opener(first);
            if (container < 0) {
                return Place.NONE;
            }
            if (t.is(container, "(")) {
                Optional<Callee> callee = callee(container);
                if (callee.isEmpty()) {
                    return new Place(Kind.ELEMENT, "", -1, null, container, null);
                }
                if (op.equals(",") && PAIR_CALLS.contains(callee.get().lastPart())) {
                    int key = previous(p);
                    if (isString(key) && (t.is(previous(key), "(") || t.is(previous(key), ","))
                            && keyComesEven(container, key)) {
                        return new Place(Kind.KEY, keyText(key), key, null, container, null);
                    }
                }
                return new Place(Kind.ARGUMENT, callee.get().name(), callee.get().last(), callee.get(), container, null);
            }
            if (t.is(container, "[") && p == container) {
                int before = container - 1;
                if (isWord(before) || t.is(before, ")") || t.is(before, "]")) {
                    return Place.NONE;
                }
            }
            return new Place(Kind.ELEMENT, "", -1, null, container, null);
        }
        return Place.NONE;
    }

    private String keyText(int k) {
        return isString(k) ? t.literal(k).text().text() : t.text(k);
    }

    /** Whether the string at {@code key} is an even-numbered argument of the call opened at {@code open}: a key of a pair. */
    private boolean keyComesEven(int open, int key) {
        int commas = 0;
        int k = key - 1;
        for (int steps = 0; k > open; steps++) {
            if (steps > LOOKBACK) {
                return false;
            }
            if ((t.is(k, ")") || t.is(k, "]") || t.is(k, "}")) && t.match(k) >= 0) {
                k = t.match(k) - 1;
                continue;
            }
            if (t.is(k, ",")) {
                commas++;
            }
            k--;
        }
        return commas % 2 == 0;
    }

    /** The place of a value after an assignment operator at {@code eq}: a name, a keyword argument or a key. */
    private Place assignment(int eq) {
        int a = eq;
        for (int steps = 0; steps < LOOKBACK; steps++) {
            int k = a - 1;
            if (k < 0 || t.kind(k) == CodeTokens.NEWLINE) {
                break;
            }
            if (t.kind(k) == CodeTokens.OP) {
                if ((t.is(k, ")") || t.is(k, "]")) && t.match(k) >= 0) {
                    a = t.match(k);
                    continue;
                }
                if (!LEFT_SIDE_OPERATORS.contains(t.text(k))) {
                    break;
                }
            } else if (t.kind(k) == CodeTokens.STRING) {
                break;
            }
            a = k;
        }
        if (a >= eq) {
            return Place.NONE;
        }
        int end = eq - 1;
        if (t.is(end, "]") && t.match(end) >= a && t.match(end) + 2 == end && isString(end - 1)) {
            int key = end - 1;
            String base = expression(a, t.match(end) - 1 >= a ? t.match(end) - 1 : a);
            return new Place(Kind.KEY, keyText(key), key, null, -1, base);
        }
        int nameToken = nameToken(a, end);
        if (nameToken < 0) {
            return Place.NONE;
        }
        int before = previous(a);
        int open = t.opener(a);
        if ((t.is(before, "(") || t.is(before, ",")) && t.is(open, "(")) {
            Optional<Callee> callee = callee(open);
            if (callee.isPresent()) {
                return new Place(Kind.KEYWORD, t.text(nameToken), nameToken, callee.get(), open, null);
            }
        }
        return new Place(Kind.ASSIGN, t.text(nameToken), nameToken, null, -1, null);
    }

    /** The token that names the left side {@code [a, end]} of an assignment. */
    private int nameToken(int a, int end) {
        int colon = -1;
        for (int k = a; k <= end; k++) {
            if (t.is(k, ":") && t.opener(k) == t.opener(a)) {
                colon = k;
                break;
            }
            int match = t.match(k);
            if (match > k) {
                k = match;
            }
        }
        int limit = colon >= 0 ? colon - 1 : end;
        if (language == Language.GO && colon < 0) {
            int k = a;
            if (t.isWord(k, "var") || t.isWord(k, "const")) {
                k++;
            }
            if (isWord(k) && !t.is(k + 1, ".")) {
                return k;
            }
        }
        for (int k = limit; k >= a; k--) {
            if (isWord(k)) {
                return k;
            }
            if ((t.is(k, ")") || t.is(k, "]")) && t.match(k) >= a) {
                k = t.match(k);
            }
        }
        return -1;
    }

    /** The place of an arrow function's body: the name the function is assigned to, or the key it is the value of. */
    private Place arrow(int arrow) {
        int b = previous(arrow);
        if (!(isWord(b) && !t.is(previous(b), ":"))) {
            // Past a return type ((street: string): Promise<string> =>) to the parameters' closing parenthesis.
            for (int steps = 0; steps < 16 && b >= 0 && !(t.is(b, ")") && t.opener(b) == t.opener(arrow)); steps++) {
                b = previous(b);
            }
        }
        if (t.is(b, ")") && t.match(b) >= 0) {
            b = previous(t.match(b));
        } else if (isWord(b)) {
            b = previous(b);
        } else {
            return Place.NONE;
        }
        if (t.isWord(b, "async")) {
            b = previous(b);
        }
        return b >= 0 && t.kind(b) == CodeTokens.OP ? place(b + 1) : Place.NONE;
    }

    /** Where the list, mapping or call opened at {@code container} stands, past a type written before it ({@code []T{}). */
    private Place containerPlace(int container) {
        int start = container;
        int before = container - 1;
        if (t.is(container, "{") && (isWord(before) || t.is(before, "]") || t.is(before, ")"))) {
            int k = operandStart(before);
            for (int steps = 0; k > 0 && steps < 8; steps++) {
                int p = k - 1;
                if (t.is(p, "]") && t.match(p) >= 0) {
                    k = t.match(p);
                } else if (t.isWord(p, "map") || t.is(p, "*") || t.is(p, "&")) {
                    k = p;
                } else {
                    break;
                }
            }
            start = k < 0 ? container : k;
        } else if (t.is(container, "(")) {
            Optional<Callee> callee = callee(container);
            if (callee.isPresent()) {
                start = callee.get().start();
            }
        }
        return place(start);
    }

    /** The places above a list or mapping, innermost first, up to a name or a call. */
    private List<Place> outer(Place place) {
        List<Place> found = new ArrayList<>();
        int container = place.container();
        for (int level = 0; level < LEVELS && container >= 0; level++) {
            Place up = containerPlace(container);
            found.add(up);
            if (up.kind() != Kind.KEY && up.kind() != Kind.ELEMENT) {
                break;
            }
            container = up.container();
        }
        return found;
    }

    // ---- deciding -------------------------------------------------------------------------------

    private Optional<CodePrompt> consider(Value value, int firstLiteral) {
        Place place = place(value.first);
        List<Place> outer = place.kind() == Kind.KEY || place.kind() == Kind.ELEMENT ? outer(place) : List.of();
        Set<Integer> anchors = new LinkedHashSet<>();
        anchors.add(lineAt(t.start(value.first)));
        anchors.add(lineAt(t.start(firstLiteral)));
        if (place.anchor() >= 0) {
            anchors.add(lineAt(t.start(place.anchor())));
        }
        for (Place up : outer) {
            if (up.anchor() >= 0) {
                anchors.add(lineAt(t.start(up.anchor())));
            }
        }
        TareComments comments = commentsAbove(anchors);
        problems.addAll(comments.problems());
        if (comments.ignore()) {
            return Optional.empty();
        }
        boolean prompt = comments.prompt() || saysPrompt(place, outer) && excluded(value, place).isEmpty();
        if (!prompt) {
            if (comments.hasSettings()) {
                problems.add("line " + lineAt(t.start(firstLiteral)) + ": the tare: settings above this string literal"
                        + " apply to nothing, since Tare does not take it for a prompt; add 'prompt' to the comment to"
                        + " measure it");
            }
            return Optional.empty();
        }
        return Optional.of(prompt(value, place, outer, comments));
    }

    private boolean saysPrompt(Place place, List<Place> outer) {
        return switch (place.kind()) {
            case ASSIGN -> NameWords.saysPrompt(place.name());
            case KEYWORD -> NameWords.saysPrompt(place.name()) || NameWords.isPromptKey(place.name())
                    || configured(place.callee());
            case KEY -> NameWords.isPromptKey(place.name()) || NameWords.saysPromptStrongly(place.name())
                    || place.outer() != null && NameWords.saysPrompt(place.outer()) || outerSaysPrompt(outer);
            case ARGUMENT -> configured(place.callee()) || callSaysPrompt(place.callee());
            case ELEMENT -> outerSaysPrompt(outer);
            case NONE -> false;
        };
    }

    private boolean outerSaysPrompt(List<Place> outer) {
        for (Place up : outer) {
            switch (up.kind()) {
                case ASSIGN:
                    return NameWords.saysPrompt(up.name());
                case KEYWORD:
                    return NameWords.saysPrompt(up.name()) || configured(up.callee());
                case ARGUMENT:
                    return configured(up.callee()) || callSaysPrompt(up.callee());
                case KEY:
                    if (NameWords.saysPrompt(up.name()) || up.outer() != null && NameWords.saysPrompt(up.outer())) {
                        return true;
                    }
                    break;
                case ELEMENT:
                    break;
                default:
                    return false;
            }
        }
        return false;
    }

    private boolean configured(Callee callee) {
        if (callee == null) {
            return false;
        }
        for (String call : calls) {
            if (callee.name().equals(call) || callee.name().endsWith("." + call)) {
                return true;
            }
        }
        return false;
    }

    /**
     * Whether a call's name says its argument is a prompt: an annotation or a setter, builder or
     * constructor named by a strong word ({@code SystemMessage}, {@code withInstructions}); "system"
     * alone is a shell command's name, so it needs a second word.
     */
    private static boolean callSaysPrompt(Callee callee) {
        String name = callee.name();
        int dot = name.lastIndexOf('.');
        int before = dot < 0 ? -1 : name.lastIndexOf('.', dot - 1);
        String tail = name.substring(before + 1);
        List<String> words = NameWords.of(tail);
        if (!NameWords.role(tail).isEmpty() && NameWords.saysPrompt(tail)
                && words.stream().anyMatch(w -> w.startsWith("message") || w.startsWith("msg"))) {
            return true;
        }
        if (!NameWords.saysPromptStrongly(tail)) {
            return false;
        }
        return callee.annotation() || !words.contains("system") || words.size() > 1
                && words.stream().anyMatch(w -> !w.equals("system") && (NameWords.saysPromptStrongly(w)
                || w.startsWith("message") || w.startsWith("msg")));
    }

    /** Why a value that its place calls a prompt is something else, or empty when it is a prompt. */
    private Optional<String> excluded(Value value, Place place) {
        List<Callee> callees = new ArrayList<>(value.through);
        if (place.callee() != null) {
            callees.add(place.callee());
        }
        for (Callee callee : callees) {
            if (isErrorCall(callee)) {
                return Optional.of("an error message");
            }
            if (isLogCall(callee)) {
                return Optional.of("a log message");
            }
        }
        DecodedText text = value.text;
        StringBuilder plain = new StringBuilder();
        StringBuilder probe = new StringBuilder();
        boolean variables = false;
        for (int k = 0; k < text.length(); k++) {
            if (text.variableAt(k) >= 0) {
                variables = true;
                if (k == 0 || text.variableAt(k - 1) != text.variableAt(k)) {
                    probe.append('x');
                }
            } else {
                plain.append(text.charAt(k));
                probe.append(text.charAt(k));
            }
        }
        String words = SPECIFIER.matcher(plain).replaceAll(" ");
        if (words.chars().noneMatch(Character::isLetter)) {
            return Optional.of("no text but format specifiers");
        }
        if (probe.toString().strip().chars().noneMatch(Character::isWhitespace)) {
            return Optional.of("a single word: an identifier, key, URL or path");
        }
        if (!variables && (words.strip().length() < 20 || wordCount(words) < 3)) {
            return Optional.of("too short");
        }
        if (isSql(plain.toString())) {
            return Optional.of("SQL");
        }
        if (isLogFormat(plain.toString())) {
            return Optional.of("a log format");
        }
        return Optional.empty();
    }

    private static int wordCount(String text) {
        int count = 0;
        boolean inWord = false;
        for (int k = 0; k < text.length(); k++) {
            boolean letter = Character.isLetterOrDigit(text.charAt(k));
            if (letter && !inWord) {
                count++;
            }
            inWord = letter || inWord && !Character.isWhitespace(text.charAt(k));
        }
        return count;
    }

    private static boolean isErrorCall(Callee callee) {
        String last = callee.lastPart();
        return callee.thrown() || last.endsWith("Error") || last.endsWith("Exception")
                || last.equals("Errorf") && callee.receiver().equals("fmt")
                || last.equals("New") && callee.receiver().equals("errors") || last.equals("panic");
    }

    private static boolean isLogCall(Callee callee) {
        if (!LOG_METHODS.contains(callee.lastPart().toLowerCase(Locale.ROOT))) {
            return false;
        }
        for (String part : callee.receiver().split("\\.")) {
            String lower = part.toLowerCase(Locale.ROOT);
            if (lower.contains("log") || LOG_RECEIVERS.contains(lower)) {
                return true;
            }
        }
        return false;
    }

    /** Whether the text reads as a SQL statement: its first keyword with its companion, written as SQL is. */
    static boolean isSql(String text) {
        String trimmed = text.strip();
        int space = 0;
        while (space < trimmed.length() && Character.isLetter(trimmed.charAt(space))) {
            space++;
        }
        String first = trimmed.substring(0, space);
        String[] companions = switch (first.toLowerCase(Locale.ROOT)) {
            case "select", "delete" -> new String[] {"from"};
            case "insert", "merge", "upsert" -> new String[] {"into"};
            case "update" -> new String[] {"set"};
            case "create", "drop" -> new String[] {"table", "index", "view", "schema"};
            case "alter" -> new String[] {"table"};
            case "with" -> new String[] {"select"};
            default -> new String[0];
        };
        for (String companion : companions) {
            java.util.regex.Matcher found = java.util.regex.Pattern
                    .compile("\\b" + companion + "\\b", java.util.regex.Pattern.CASE_INSENSITIVE).matcher(trimmed);
            if (!found.find(space)) {
                continue;
            }
            String written = found.group();
            boolean upper = first.equals(first.toUpperCase(Locale.ROOT)) && written.equals(written.toUpperCase(Locale.ROOT));
            boolean symbols = (trimmed.contains("=") || trimmed.contains("*") || trimmed.contains("?"))
                    && !trimmed.endsWith(".");
            if (upper || symbols) {
                return true;
            }
        }
        return false;
    }

    /** Whether the text is a logging format: two or more of Python logging's record attributes as fields. */
    static boolean isLogFormat(String text) {
        int count = 0;
        for (String attribute : LOG_ATTRIBUTES) {
            if (text.contains("%(" + attribute + ")") || text.contains("{" + attribute + "}")) {
                count++;
            }
        }
        return count >= 2;
    }

    // ---- the prompt ------------------------------------------------------------------------------

    private CodePrompt prompt(Value value, Place place, List<Place> outer, TareComments comments) {
        DecodedText text = value.text;
        int firstLine = lineAt(t.start(value.first));
        String name = comments.settings().getOrDefault("name", name(place, outer, firstLine));
        String role = comments.settings().getOrDefault("role", role(place));
        List<CodePart> parts = new ArrayList<>();
        int k = 0;
        while (k < text.length()) {
            int end = k + 1;
            int variable = text.variableAt(k);
            while (end < text.length() && text.variableAt(end) == variable
                    && (variable >= 0 || text.pieceAt(end) == text.pieceAt(k))) {
                end++;
            }
            int sourceStart = text.from(k);
            int sourceEnd = Math.max(sourceStart, text.to(end - 1));
            Optional<String> name0 = variable >= 0 ? Optional.of(text.variable(variable).name()) : Optional.empty();
            parts.add(new CodePart(text.text(k, end), name0, k, end, sourceStart, sourceEnd, lines.line(sourceStart),
                    lines.column(sourceStart)));
            k = end;
        }
        int start = t.view.from(t.start(value.ownFirst));
        int end = t.view.to(t.end(value.ownLast) - 1);
        return new CodePrompt(name, role.isEmpty() ? Optional.empty() : Optional.of(role), lines.line(start),
                lines.column(start), start, end, text.text(), parts, new ValueMap(text), comments.meta(),
                comments.settings());
    }

    private static String name(Place place, List<Place> outer, int line) {
        List<String> names = new ArrayList<>();
        for (Place up : outer) {
            if (up.kind() == Kind.KEY) {
                names.add(0, up.name());
                if (up.outer() != null) {
                    names.add(0, up.outer());
                    break;
                }
            } else if (up.kind() != Kind.ELEMENT) {
                if (up.kind() != Kind.NONE) {
                    names.add(0, up.name());
                }
                break;
            }
        }
        String outerName = names.isEmpty() ? null : String.join(".", names);
        return switch (place.kind()) {
            case ASSIGN, KEYWORD, ARGUMENT -> place.name();
            case KEY -> place.outer() != null ? place.outer() + "." + place.name()
                    : outerName != null ? outerName + "." + place.name() : place.name();
            case ELEMENT -> outerName != null ? outerName : "line " + line;
            case NONE -> "line " + line;
        };
    }

    private String role(Place place) {
        switch (place.kind()) {
            case KEY, KEYWORD -> {
                String sibling = place.container() >= 0 ? siblingRole(place.container()) : "";
                if (!sibling.isEmpty()) {
                    return sibling;
                }
                String key = place.name().toLowerCase(Locale.ROOT);
                return key.equals("system") || key.equals("instructions") ? "system" : NameWords.role(place.name());
            }
            case ASSIGN -> {
                return NameWords.role(place.name());
            }
            case ARGUMENT -> {
                return callSaysPrompt(place.callee()) ? NameWords.role(place.callee().name()) : "";
            }
            default -> {
                return "";
            }
        }
    }

    /** The role written beside a value in its mapping or call: {@code "role": "system"}, {@code role="user"}. */
    private String siblingRole(int container) {
        int close = t.match(container);
        int limit = close < 0 ? Math.min(t.size(), container + 512) : Math.min(close, container + 512);
        for (int k = container + 1; k < limit; k++) {
            if (t.opener(k) != container || !(isWord(k) || isString(k)) || !keyText(k).equalsIgnoreCase("role")) {
                continue;
            }
            int sign = next(k);
            int value = sign < 0 ? -1 : nextAfterOperator(sign);
            if (!(t.is(sign, ":") || t.is(sign, "=") || t.is(sign, ",")) || value < 0) {
                continue;
            }
            if (isString(value)) {
                return t.literal(value).text().text();
            }
            if (isWord(value)) {
                int end = value;
                while (t.is(end + 1, ".") && isWord(end + 2)) {
                    end += 2;
                }
                return NameWords.role(t.text(end));
            }
        }
        return "";
    }
}
