package dev.tare.config;

import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.util.List;

/**
 * The commented starter {@code tare.yaml} that {@code tare init} writes: a templates section with
 * the globs, syntax and partials folder it was given, then starter targets and budgets.
 */
public final class StarterConfig {
    private StarterConfig() {
    }

    /** The starter file's text; it loads with {@link ConfigLoader} as it is. */
    public static String text(List<String> include, List<String> exclude, String placeholder, String partials,
                              List<String> codeInclude) {
        StringBuilder out = new StringBuilder();
        out.append("# Tare configuration. Every key is optional; see the README for what each one does.\n");
        out.append("templates:\n");
        out.append("  # Globs relative to this file's folder. A file must match an include and no exclude.\n");
        out.append("  include:\n");
        include.forEach(glob -> out.append("    - ").append(quoted(glob)).append('\n'));
        out.append("  exclude:\n");
        exclude.forEach(glob -> out.append("    - ").append(quoted(glob)).append('\n'));
        out.append("  # How variables are written: double-brace {{ x }}, single-brace {x}, dollar-brace ${x},\n");
        out.append("  # dollar-double-brace {{$x}} (with function calls {{plugin.fn $x}}), or none.\n");
        out.append("  placeholder: ").append(placeholder).append('\n');
        out.append("  # Where {{> name }} and {% include \"name\" %} look first.\n");
        out.append("  partials: ").append(quoted(partials)).append('\n');
        if (!codeInclude.isEmpty()) {
            out.append("  # Source files whose string literals are read for prompts (by default every source file).\n");
            out.append("  code:\n    include:\n");
            codeInclude.forEach(glob -> out.append("      - ").append(quoted(glob)).append('\n'));
        }
        out.append('\n');
        out.append(resource());
        return out.toString();
    }

    /** A YAML double-quoted string: backslashes and quotes escaped. */
    private static String quoted(String text) {
        return "\"" + text.replace("\\", "\\\\").replace("\"", "\\\"") + "\"";
    }

    private static String resource() {
        try (InputStream in = StarterConfig.class.getResourceAsStream("starter-tare.yaml")) {
            if (in == null) {
                throw new IllegalStateException("starter-tare.yaml is missing from the build");
            }
            return new String(in.readAllBytes(), StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }
}
