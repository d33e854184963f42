package dev.tare.template.code;

import java.util.Locale;
import java.util.Optional;

/** A programming language whose string literals Tare reads for prompts, chosen by a file's extension. */
public enum Language {
    /** Python ({@code .py}). */
    PYTHON("python"),
    /** JavaScript ({@code .js}, {@code .mjs}, {@code .cjs}, {@code .jsx}). */
    JAVASCRIPT("javascript"),
    /** TypeScript ({@code .ts}, {@code .mts}, {@code .cts}, {@code .tsx}), read by the JavaScript lexer. */
    TYPESCRIPT("typescript"),
    /** Java ({@code .java}). */
    JAVA("java"),
    /** Go ({@code .go}). */
    GO("go");

    private final String label;

    Language(String label) {
        this.label = label;
    }

    /** The lower-case name used in output. */
    public String label() {
        return label;
    }

    /** The language of a file by its extension, or empty when Tare reads no literals from such a file. */
    public static Optional<Language> of(String path) {
        String lower = path.toLowerCase(Locale.ROOT);
        int dot = lower.lastIndexOf('.');
        if (dot < 0 || dot < lower.lastIndexOf('/')) {
            return Optional.empty();
        }
        return switch (lower.substring(dot + 1)) {
            case "py" -> Optional.of(PYTHON);
            case "js", "mjs", "cjs", "jsx" -> Optional.of(JAVASCRIPT);
            case "ts", "mts", "cts", "tsx" -> Optional.of(TYPESCRIPT);
            case "java" -> Optional.of(JAVA);
            case "go" -> Optional.of(GO);
            default -> Optional.empty();
        };
    }

    /** Whether a file of this name may hold JSX, whose text between tags is not code. */
    static boolean mayHoldMarkup(String path) {
        String lower = path.toLowerCase(Locale.ROOT);
        return lower.endsWith(".jsx") || lower.endsWith(".tsx");
    }
}
