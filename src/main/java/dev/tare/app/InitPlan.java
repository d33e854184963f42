package dev.tare.app;

import dev.tare.template.code.CodePrompts;
import dev.tare.template.code.Language;
import dev.tare.config.Glob;
import dev.tare.config.TemplatesConfig;
import dev.tare.source.SafeReader;
import dev.tare.source.SourceText;
import dev.tare.template.PlaceholderSyntax;
import dev.tare.workspace.TemplateFinder;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import java.util.TreeMap;
import java.util.TreeSet;
import java.util.regex.Pattern;

/**
 * What {@code tare init} proposes for a repository, from what is there: include globs that select
 * the files that look like prompts (a folder's files by extension where that selects nothing else,
 * else the files by name), the placeholder syntax most of them use, and the partials folder. The
 * globs are checked by selecting with them, so a scan right after finds exactly {@link #templates}.
 *
 * @param include     the include globs, in order
 * @param exclude     the exclude globs (the usual dependency and build folders, and drafts)
 * @param placeholder the placeholder syntax most prompt-like files use, double-brace when none shows
 * @param syntaxSeen  how many of the files show that syntax
 * @param partials    the partials folder: a folder named {@code partials} among them, else the default
 * @param templates   the files the globs select, sorted; empty when nothing looks like a prompt
 * @param codeInclude globs of the source files read for prompts: per folder and extension of the
 *                    source files that hold prompts, {@code folder/**}{@code /*.ext}; empty when
 *                    none does (the configuration then keeps the default)
 * @param codeFiles   the source files that hold prompts, sorted
 */
public record InitPlan(List<String> include, List<String> exclude, PlaceholderSyntax placeholder, int syntaxSeen,
                       String partials, List<String> templates, List<String> codeInclude, List<String> codeFiles) {
    private static final Pattern DOLLAR_DOUBLE_BRACE = Pattern.compile("\\{\\{\\s*\\$[A-Za-z_]");
    private static final Pattern DOUBLE_BRACE = Pattern.compile("\\{\\{\\s*[A-Za-z_#/>^!&]|\\{%-?\\s*\\w");
    private static final Pattern DOLLAR_BRACE = Pattern.compile("\\$\\{[A-Za-z_][\\w.]*}");
    private static final Pattern SINGLE_BRACE = Pattern.compile("(?<![{$])\\{[A-Za-z_][\\w.]*(![rsa])?(:[^{}\\n]*)?}(?!})");
    private static final List<String> DRAFTS = List.of("**/drafts/**");

    public InitPlan {
        include = List.copyOf(include);
        exclude = List.copyOf(exclude);
        templates = List.copyOf(templates);
        codeInclude = List.copyOf(codeInclude);
        codeFiles = List.copyOf(codeFiles);
    }

    /** Looks at the repository at {@code root}. */
    public static InitPlan of(Path root) {
        List<String> exclude = new ArrayList<>(TemplatesConfig.DEFAULT_EXCLUDE);
        exclude.addAll(DRAFTS);
        List<Glob> excluded = Glob.all(exclude);
        List<String> codeFiles = codeFiles(root, excluded);
        List<String> codeInclude = codeGlobs(codeFiles);
        List<String> found = new TemplateFinder(root, List.of(), excluded).promptLikeFiles();
        found.removeAll(codeFiles);
        if (found.isEmpty()) {
            return new InitPlan(TemplatesConfig.DEFAULT_INCLUDE, exclude, PlaceholderSyntax.DOUBLE_BRACE, 0,
                    TemplatesConfig.DEFAULT_PARTIALS, List.of(), codeInclude, codeFiles);
        }
        List<String> include = globs(root, found, excluded);
        List<String> selected = new TemplateFinder(root, Glob.all(include), excluded).find(List.of()).paths();
        Map<PlaceholderSyntax, Integer> seen = syntaxes(root, selected);
        PlaceholderSyntax syntax = seen.entrySet().stream().max(Map.Entry.comparingByValue())
                .map(Map.Entry::getKey).orElse(PlaceholderSyntax.DOUBLE_BRACE);
        return new InitPlan(include, exclude, syntax, seen.getOrDefault(syntax, 0), partials(selected), selected,
                codeInclude, codeFiles);
    }

    /** The source files of the languages Tare reads that hold at least one prompt, sorted. */
    private static List<String> codeFiles(Path root, List<Glob> excluded) {
        SafeReader reader = new SafeReader(SafeReader.DEFAULT_MAX_BYTES);
        List<String> sources = new TemplateFinder(root, Glob.all(TemplatesConfig.Code.DEFAULT_INCLUDE), excluded)
                .find(List.of()).paths();
        List<String> holding = new ArrayList<>();
        for (String path : sources) {
            try {
                String text = reader.read(path, root.resolve(path)).text();
                if (!CodePrompts.find(path, text, Language.of(path).orElseThrow(), List.of()).prompts().isEmpty()) {
                    holding.add(path);
                }
            } catch (RuntimeException e) {
                // A file that cannot be read holds no prompt init can show; the scan will say why.
            }
        }
        return holding;
    }

    /** Per folder and extension of {@code files}, {@code folder/**}{@code /*.ext}, a folder inside one already covered adding nothing. */
    private static List<String> codeGlobs(List<String> files) {
        Map<String, TreeSet<String>> byFolder = new TreeMap<>();
        for (String path : files) {
            int slash = path.lastIndexOf('/');
            byFolder.computeIfAbsent(slash < 0 ? "" : path.substring(0, slash), f -> new TreeSet<>()).add(extension(path));
        }
        List<String> globs = new ArrayList<>();
        for (String path : files) {
            if (Glob.anyMatches(Glob.all(globs), path)) {
                continue;
            }
            int slash = path.lastIndexOf('/');
            String folder = slash < 0 ? "" : path.substring(0, slash);
            TreeSet<String> extensions = byFolder.get(folder);
            String ext = extensions.size() == 1 ? extensions.first() : "{" + String.join(",", extensions) + "}";
            globs.add(folder.isEmpty() ? "*." + ext : folder + "/**/*." + ext);
        }
        return globs;
    }

    /**
     * Per folder holding prompt-like files, {@code folder/**}{@code /*.{ext,...}} with their
     * extensions, when that selects none but such files; otherwise those files by name. A folder
     * inside one already covered adds nothing.
     */
    private static List<String> globs(Path root, List<String> found, List<Glob> excluded) {
        Set<String> wanted = new HashSet<>(found);
        Map<String, TreeSet<String>> byFolder = new TreeMap<>();
        for (String path : found) {
            int slash = path.lastIndexOf('/');
            String folder = slash < 0 ? "" : path.substring(0, slash);
            byFolder.computeIfAbsent(folder, f -> new TreeSet<>()).add(extension(path));
        }
        List<String> globs = new ArrayList<>();
        List<String> coveredFolders = new ArrayList<>();
        for (Map.Entry<String, TreeSet<String>> entry : byFolder.entrySet()) {
            String folder = entry.getKey();
            if (coveredFolders.stream().anyMatch(covered -> folder.startsWith(covered + "/"))
                    && found.stream().filter(p -> inFolder(p, folder)).allMatch(p -> Glob.anyMatches(Glob.all(globs), p))) {
                continue;
            }
            String extensions = entry.getValue().size() == 1 ? entry.getValue().first()
                    : "{" + String.join(",", entry.getValue()) + "}";
            String glob = folder.isEmpty() ? "*." + extensions : folder + "/**/*." + extensions;
            List<String> selects = new TemplateFinder(root, List.of(Glob.of(glob)), excluded).find(List.of()).paths();
            if (!folder.isEmpty() && wanted.containsAll(selects)) {
                globs.add(glob);
                coveredFolders.add(folder);
            } else {
                found.stream().filter(p -> folder.isEmpty() ? p.indexOf('/') < 0 : inFolder(p, folder) && p.indexOf('/',
                        folder.length() + 1) < 0).map(InitPlan::literal).forEach(globs::add);
            }
        }
        return globs;
    }

    private static boolean inFolder(String path, String folder) {
        return path.startsWith(folder + "/");
    }

    /** A glob that matches exactly {@code path}: its special characters escaped. */
    private static String literal(String path) {
        StringBuilder out = new StringBuilder();
        for (char c : path.toCharArray()) {
            if ("*?[]{}\\".indexOf(c) >= 0) {
                out.append('\\');
            }
            out.append(c);
        }
        return out.toString();
    }

    private static String extension(String path) {
        String name = path.substring(path.lastIndexOf('/') + 1);
        int dot = name.lastIndexOf('.');
        return dot < 0 ? "*" : name.substring(dot + 1);
    }

    /** How many of the files show each placeholder syntax (a file may show several). */
    private static Map<PlaceholderSyntax, Integer> syntaxes(Path root, List<String> paths) {
        SafeReader reader = new SafeReader(SafeReader.DEFAULT_MAX_BYTES);
        Map<PlaceholderSyntax, Integer> seen = new LinkedHashMap<>();
        for (String path : paths) {
            String text;
            try {
                SourceText source = reader.read(path, root.resolve(path));
                text = source.text();
            } catch (RuntimeException e) {
                continue;
            }
            if (DOLLAR_DOUBLE_BRACE.matcher(text).find()) {
                seen.merge(PlaceholderSyntax.DOLLAR_DOUBLE_BRACE, 1, Integer::sum);
            } else if (DOUBLE_BRACE.matcher(text).find()) {
                seen.merge(PlaceholderSyntax.DOUBLE_BRACE, 1, Integer::sum);
            }
            if (DOLLAR_BRACE.matcher(text).find()) {
                seen.merge(PlaceholderSyntax.DOLLAR_BRACE, 1, Integer::sum);
            }
            if (!text.contains("{{") && SINGLE_BRACE.matcher(text).find()) {
                seen.merge(PlaceholderSyntax.SINGLE_BRACE, 1, Integer::sum);
            }
        }
        return seen;
    }

    /** The folder named {@code partials} that holds the most of the files, else the default. */
    private static String partials(List<String> paths) {
        Map<String, Integer> folders = new TreeMap<>();
        for (String path : paths) {
            String[] parts = path.split("/");
            StringBuilder prefix = new StringBuilder();
            for (int i = 0; i < parts.length - 1; i++) {
                prefix.append(i == 0 ? "" : "/").append(parts[i]);
                if (parts[i].toLowerCase(Locale.ROOT).equals("partials")) {
                    folders.merge(prefix.toString(), 1, Integer::sum);
                    break;
                }
            }
        }
        return folders.entrySet().stream().max(Map.Entry.comparingByValue()).map(Map.Entry::getKey)
                .orElse(TemplatesConfig.DEFAULT_PARTIALS);
    }
}
