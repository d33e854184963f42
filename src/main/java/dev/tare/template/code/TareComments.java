package dev.tare.template.code;

import dev.tare.template.TemplateMeta;
import dev.tare.template.VariableSpec;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.OptionalInt;

/**
 * The {@code tare:} comments above a string literal, read together: whether they mark it a prompt
 * ({@code tare: prompt}) or not ({@code tare: ignore}), its settings ({@code key=value}, the keys front
 * matter has: {@code target}, {@code budget}, {@code output_tokens}, {@code calls_per_day},
 * {@code tools}, and {@code name} and {@code role} for a literal that names none) and its variables'
 * sizes ({@code tare: var question=40 account="A-1042"}: a token count or a quoted sample). A value
 * Tare cannot read is left out with a problem naming its line.
 */
final class TareComments {
    /** One comment line that starts with {@code tare:}, with its 1-based file line and the words after the colon. */
    record Line(int line, String words) {
    }

    private boolean prompt;
    private boolean ignore;
    private final Map<String, String> settings = new LinkedHashMap<>();
    private final Map<String, VariableSpec> variables = new LinkedHashMap<>();
    private final List<String> problems = new ArrayList<>();
    private boolean any;

    /** The {@code tare:} lines of one comment's text (markers removed), each with its file line. */
    static List<Line> lines(String comment, int firstLine) {
        List<Line> found = new ArrayList<>();
        String[] parts = comment.split("\r\n|\r|\n", -1);
        for (int k = 0; k < parts.length; k++) {
            String text = parts[k].strip();
            while (text.startsWith("*") || text.startsWith("#") || text.startsWith("//")) {
                text = text.substring(text.startsWith("//") ? 2 : 1).strip();
            }
            if (text.regionMatches(true, 0, "tare:", 0, 5)) {
                found.add(new Line(firstLine + k, text.substring(5).strip()));
            }
        }
        return found;
    }

    /** The comments of several blocks read as one. */
    static TareComments merged(List<TareComments> blocks) {
        TareComments all = new TareComments();
        for (TareComments block : blocks) {
            all.any |= block.any;
            all.prompt |= block.prompt;
            all.ignore |= block.ignore;
            all.settings.putAll(block.settings);
            all.variables.putAll(block.variables);
            all.problems.addAll(block.problems);
        }
        return all;
    }

    /** Reads one {@code tare:} line into these comments. */
    void read(Line line) {
        any = true;
        List<String> words = words(line);
        boolean inVar = false;
        for (String word : words) {
            int eq = word.indexOf('=');
            if (eq < 0) {
                switch (word.toLowerCase(Locale.ROOT)) {
                    case "prompt" -> prompt = true;
                    case "ignore" -> ignore = true;
                    case "var", "vars" -> inVar = true;
                    default -> problems.add("line " + line.line() + ": tare: does not know '" + word
                            + "'; write prompt, ignore, var NAME=SIZE or KEY=VALUE");
                }
                continue;
            }
            String key = word.substring(0, eq);
            String value = unquote(word.substring(eq + 1));
            if (key.isEmpty()) {
                problems.add("line " + line.line() + ": tare: '" + word + "' has no key before '='");
            } else if (inVar) {
                variable(line.line(), key, word.substring(eq + 1), value);
            } else {
                setting(line.line(), key.toLowerCase(Locale.ROOT), value);
            }
        }
    }

    private void variable(int line, String name, String written, String value) {
        if (written.startsWith("\"")) {
            variables.put(name, new VariableSpec(OptionalInt.empty(), Optional.of(value)));
        } else if (isWholeNumber(value)) {
            variables.put(name, new VariableSpec(OptionalInt.of(Integer.parseInt(value)), Optional.empty()));
        } else {
            problems.add("line " + line + ": tare: var " + name + " must be a whole number of tokens or a quoted"
                    + " sample (got " + written + ")");
        }
    }

    private void setting(int line, String key, String value) {
        String problem = switch (key) {
            case "budget" -> isWholeNumber(value) && Integer.parseInt(value) > 0 ? null
                    : "budget must be a whole number of tokens above zero";
            case "output_tokens" -> isWholeNumber(value) ? null
                    : "output_tokens must be a whole number of tokens, zero or more";
            case "calls_per_day" -> isCount(value) ? null : "calls_per_day must be a number of calls a day, zero or more";
            case "target", "name", "role", "tools" -> value.isBlank() ? key + " must not be empty" : null;
            default -> null;
        };
        if (problem != null) {
            problems.add("line " + line + ": tare: " + problem + " (got " + (value.isEmpty() ? "nothing" : value) + ")");
        } else {
            settings.put(key, value);
        }
    }

    private static boolean isWholeNumber(String value) {
        return !value.isEmpty() && value.length() <= 9 && value.chars().allMatch(c -> c >= '0' && c <= '9');
    }

    private static boolean isCount(String value) {
        try {
            double parsed = Double.parseDouble(value);
            return parsed >= 0 && !Double.isInfinite(parsed);
        } catch (NumberFormatException e) {
            return false;
        }
    }

    /** The words of a line, a double-quoted value ({@code key="a b"}) kept whole. */
    private List<String> words(Line line) {
        List<String> words = new ArrayList<>();
        String text = line.words();
        StringBuilder word = new StringBuilder();
        boolean quoted = false;
        for (int k = 0; k < text.length(); k++) {
            char c = text.charAt(k);
            if (quoted && c == '\\' && k + 1 < text.length()) {
                word.append(c).append(text.charAt(++k));
            } else if (c == '"') {
                quoted = !quoted;
                word.append(c);
            } else if (!quoted && Character.isWhitespace(c)) {
                if (word.length() > 0) {
                    words.add(word.toString());
                    word.setLength(0);
                }
            } else {
                word.append(c);
            }
        }
        if (quoted) {
            problems.add("line " + line.line() + ": tare: a quoted value is not closed; end it with \"");
        }
        if (word.length() > 0) {
            words.add(word.toString());
        }
        return words;
    }

    private static String unquote(String value) {
        if (value.length() >= 2 && value.startsWith("\"") && value.endsWith("\"")) {
            StringBuilder out = new StringBuilder();
            for (int k = 1; k < value.length() - 1; k++) {
                char c = value.charAt(k);
                if (c == '\\' && k + 1 < value.length() - 1) {
                    c = value.charAt(++k);
                }
                out.append(c);
            }
            return out.toString();
        }
        return value;
    }

    boolean any() {
        return any;
    }

    boolean prompt() {
        return prompt && !ignore;
    }

    boolean ignore() {
        return ignore;
    }

    /** Whether the comments say anything beyond prompt or ignore. */
    boolean hasSettings() {
        return !settings.isEmpty() || !variables.isEmpty();
    }

    Map<String, String> settings() {
        return settings;
    }

    List<String> problems() {
        return problems;
    }

    /** The settings as front matter would give them. */
    TemplateMeta meta() {
        Optional<String> target = Optional.ofNullable(settings.get("target"));
        OptionalInt budget = settings.containsKey("budget") ? OptionalInt.of(Integer.parseInt(settings.get("budget")))
                : OptionalInt.empty();
        OptionalInt output = settings.containsKey("output_tokens")
                ? OptionalInt.of(Integer.parseInt(settings.get("output_tokens"))) : OptionalInt.empty();
        OptionalDouble calls = settings.containsKey("calls_per_day")
                ? OptionalDouble.of(Double.parseDouble(settings.get("calls_per_day"))) : OptionalDouble.empty();
        List<String> tools = new ArrayList<>();
        if (settings.containsKey("tools")) {
            for (String tool : settings.get("tools").split(",")) {
                if (!tool.isBlank()) {
                    tools.add(tool.strip());
                }
            }
        }
        return new TemplateMeta(target, budget, output, variables, tools, calls, List.of());
    }
}
