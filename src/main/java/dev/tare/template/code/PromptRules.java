package dev.tare.template.code;

import dev.tare.template.code.Places.Kind;
import dev.tare.template.code.Places.Place;
import dev.tare.template.code.TokenWalk.Callee;
import dev.tare.template.code.ValueReader.Value;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.Set;

/**
 * Decides whether a value is a prompt by its place (the name, key, keyword or call it belongs to,
 * and the names around it) and what only looks like one: log and error messages, SQL, single words,
 * URLs and paths, format specifiers alone, short labels. It also names the prompt.
 */
final class PromptRules {
    private static final Set<String> LOG_METHODS = Set.of("debug", "info", "warn", "warning", "error", "exception",
            "critical", "fatal", "trace", "log", "verbose", "notice", "printf", "println", "print", "fatalf", "fatalln",
            "panicf", "debugf", "infof", "warnf", "warningf", "errorf", "tracef", "logf", "logln");

    private static final Set<String> LOG_RECEIVERS = Set.of("console", "slog", "zap", "logging", "logger");

    private static final Set<String> LOG_ATTRIBUTES = Set.of("asctime", "created", "filename", "funcName",
            "levelname", "levelno", "lineno", "message", "module", "msecs", "name", "pathname", "process",
            "processName", "relativeCreated", "thread", "threadName", "taskName");

    private static final java.util.regex.Pattern SPECIFIER =
            java.util.regex.Pattern.compile("%(\\([^)\\n]{0,80}\\))?[-#+ 0,(]*\\d{0,6}(\\.\\d{0,6})?[a-zA-Z]"
                    + "|\\{[^{}\\n]{0,80}\\}");

    private final List<String> calls;

    PromptRules(List<String> calls) {
        this.calls = calls;
    }

    /** Whether the place of a value, and the places around it, say it is a prompt. */
    boolean saysPrompt(Place place, List<Place> outer) {
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
     * constructor named by a strong word ({@code SystemMsg}, {@code withInstructions}); "system"
     * alone is a shell command's name, so it needs a second word.
     */
    static boolean callSaysPrompt(Callee callee) {
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
    Optional<String> excluded(Value value, Place place) {
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
        if (variables && wordCount(words) < 2 && !NameWords.saysPromptStrongly(place.name())
                && !NameWords.isPromptKey(place.name())) {
            // "%s failed" in msg, a status line in message: the name alone does not make it a prompt.
            return Optional.of("too short: a formatted line of one word besides its variables");
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

    /** Whether a call writes a log line: a logging method on something named for logging ({@code logger.info}). */
    static boolean isLogCall(Callee callee) {
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

    /**
     * The prompt's name: its variable, keyword or call; a key with the names of the mappings around it
     * ({@code request.messages.content}); or its line when nothing names it.
     */
    static String name(Place place, List<Place> outer, int line) {
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
}
