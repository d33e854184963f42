package dev.tare.config;

import dev.tare.template.code.Language;
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
 * @param code         where prompts written in source code are looked for
 */
public record TemplatesConfig(List<String> include, List<String> exclude, PlaceholderSyntax placeholder,
                              String partials, long maxFileBytes, RoleMarkers roles, Code code) {
    /** Where prompt templates usually live when a repository has no {@code tare.yaml}. */
    public static final List<String> DEFAULT_INCLUDE = List.of(
            "**/prompts/**/*.{md,txt,prompt,j2,jinja,jinja2,mustache,hbs,yaml,yml,json}",
            "**/prompt/**/*.{md,txt,prompt,j2,jinja,jinja2,mustache,hbs,yaml,yml,json}",
            "**/*.prompt",
            "**/*.prompt.{md,txt,yaml,yml,json}");
    /** Folders of dependencies, caches and build output, never templates or code of the repository's own. */
    public static final List<String> DEFAULT_EXCLUDE = List.of(
            "**/node_modules/**", "**/.venv/**", "**/venv/**", "**/target/**", "**/build/**", "**/dist/**",
            "**/vendor/**", "**/site-packages/**", "**/__pycache__/**", "**/.tox/**", "**/.next/**", "**/out/**");
    /** The partials folder when none is configured. */
    public static final String DEFAULT_PARTIALS = "prompts/partials";

    public TemplatesConfig {
        include = List.copyOf(include);
        exclude = List.copyOf(exclude);
        partials = trimSlashes(partials);
    }

    /**
     * Where prompts written in source code are looked for ({@code templates.code}).
     *
     * @param include globs of the source files whose string literals are read for prompts; files
     *                of a language Tare does not read are left alone whatever the globs say
     * @param calls   calls whose arguments are prompts, each a dotted name that matches a call ending
     *                in it ({@code assistant.ask} matches {@code self.assistant.ask(...)})
     */
    public record Code(List<String> include, List<String> calls) {
        /** Every source file of the languages Tare reads, outside the excluded folders. */
        public static final List<String> DEFAULT_INCLUDE = List.of("**/*.{py,js,mjs,cjs,jsx,ts,mts,cts,tsx,java,go}");

        public Code {
            include = List.copyOf(include);
            calls = List.copyOf(calls);
        }

        /** The settings used when {@code tare.yaml} says nothing about code. */
        public static Code defaults() {
            return new Code(DEFAULT_INCLUDE, List.of());
        }
    }

    /** The settings used when {@code tare.yaml} says nothing about templates. */
    public static TemplatesConfig defaults() {
        return new TemplatesConfig(DEFAULT_INCLUDE, DEFAULT_EXCLUDE, PlaceholderSyntax.DOUBLE_BRACE, DEFAULT_PARTIALS,
                SafeReader.DEFAULT_MAX_BYTES, RoleMarkers.AUTO, Code.defaults());
    }

    /** Whether a root-relative path is a source file read for prompts written in code, by its extension. */
    public static boolean isCode(String path) {
        return Language.of(path).isPresent();
    }

    /** The globs of every file read: template files and source files. */
    public List<String> allIncludes() {
        List<String> all = new java.util.ArrayList<>(include);
        all.addAll(code.include());
        return all;
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
