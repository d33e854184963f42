package dev.tare.template.code;

import dev.tare.template.code.TokenWalk.Callee;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.Set;

/**
 * Reads the code before a value to learn what it is: assigned to a name, the value of a key or a
 * keyword argument, an argument of a call, an element of a list, or nothing the finder knows; and,
 * for keys and elements, the places of the lists and mappings around it, up to a name or a call.
 */
final class Places extends TokenWalk {
    /** How many containers up the finder looks for the name of a list or mapping. */
    private static final int LEVELS = 6;

    private static final Set<String> LEFT_SIDE_OPERATORS = Set.of(".", "?.", "::", ":", "<", ">", ">>", ">>>", "?", "!",
            "*", "&", "|", "@", "...");

    private static final Set<String> ASSIGNMENTS = Set.of("=", ":=", "+=", "??=", "||=");

    private static final Set<String> PAIR_CALLS = Set.of("of", "entry", "put", "ofEntries", "Pair");

    /** What the code before a value says it is. */
    enum Kind { ASSIGN, KEYWORD, KEY, ARGUMENT, ELEMENT, NONE }

    /**
     * The place of a value: its kind, the name or key it has, the token that names it (for the
     * {@code tare:} comments above), the call it is passed to, and the container it stands in.
     */
    record Place(Kind kind, String name, int anchor, Callee callee, int container, String outer) {
        static final Place NONE = new Place(Kind.NONE, "", -1, null, -1, null);
    }

    Places(CodeTokens tokens, Language language) {
        super(tokens, language);
    }

    /** What the code before the expression starting at {@code first} makes of it. */
    Place place(int first) {
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

    /** Whether the string at {@code key} is an even-numbered argument of the call at {@code open}: a pair's key. */
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
    List<Place> outer(Place place) {
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

    /** The chat role the code gives a value: a role key beside it, a system key, or a name that says one. */
    String role(Place place) {
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
                return PromptRules.callSaysPrompt(place.callee()) ? NameWords.role(place.callee().name()) : "";
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
