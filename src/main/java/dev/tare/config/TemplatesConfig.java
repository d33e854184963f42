package dev.tare.config;

import dev.tare.source.SafeReader;
import dev.tare.template.PlaceholderSyntax;
import dev.tare.template.RoleMarkers;
import java.util.List;

/**
 * Where templates live and how they are written.
 *
 * @param include      globs (relative to the root) a template file matches
 * @param exclude      globs that remove files and folders
 * @param placeholder  the placeholder syntax of every template
 * @param partials     the folder includes are looked up in, relative to the root; empty for none
 * @param maxFileBytes files larger than this are skipped
 * @param roles        whether role marker lines split text templates into chat messages
 */
public record TemplatesConfig(List<String> include, List<String> exclude, PlaceholderSyntax placeholder,
                              String partials, long maxFileBytes, RoleMarkers roles) {
    /** Where prompt templates usually live when a repository has no {@code tare.yaml}. */
    public static final List<String> DEFAULT_INCLUDE = List.of(
            "**/prompts/**/*.{md,txt,prompt,j2,jinja,jinja2,mustache,hbs,yaml,yml,json}",
            "**/prompt/**/*.{md,txt,prompt,j2,jinja,jinja2,mustache,hbs,yaml,yml,json}",
            "**/*.prompt",
            "**/*.prompt.{md,txt,yaml,yml,json}");
    /** Folders of dependencies and build output, never templates of the repository's own. */
    public static final List<String> DEFAULT_EXCLUDE = List.of(
            "**/node_modules/**", "**/.venv/**", "**/venv/**", "**/target/**", "**/build/**", "**/dist/**",
            "**/vendor/**");
    /** The partials folder when none is configured. */
    public static final String DEFAULT_PARTIALS = "prompts/partials";

    public TemplatesConfig {
        include = List.copyOf(include);
        exclude = List.copyOf(exclude);
        partials = trimSlashes(partials);
    }

    /** The settings used when {@code tare.yaml} says nothing about templates. */
    public static TemplatesConfig defaults() {
        return new TemplatesConfig(DEFAULT_INCLUDE, DEFAULT_EXCLUDE, PlaceholderSyntax.DOUBLE_BRACE, DEFAULT_PARTIALS,
                SafeReader.DEFAULT_MAX_BYTES, RoleMarkers.AUTO);
    }

    /** Whether a root-relative path lies in the partials folder. */
    public boolean isPartial(String path) {
        return !partials.isEmpty() && path.startsWith(partials + "/");
    }

    private static String trimSlashes(String folder) {
        String f = folder.replace('\\', '/');
        while (f.startsWith("./")) {
            f = f.substring(2);
        }
        while (f.endsWith("/")) {
            f = f.substring(0, f.length() - 1);
        }
        return f.equals(".") ? "" : f;
    }
}
