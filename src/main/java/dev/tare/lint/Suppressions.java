package dev.tare.lint;

import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * The inline directives that silence rules in one file. A directive is the word
 * {@code tare-ignore}, {@code tare-ignore-next-line} or {@code tare-ignore-file}, then one or more
 * rule ids separated by commas (or {@code all}). It may stand anywhere in the file; a template comment
 * (<code>{# ... #}</code>) or a YAML comment in front matter keeps it out of the prompt:
 *
 * <pre>
 * Reply in one line.   {# tare-ignore space-run #}
 * {# tare-ignore-next-line costly-character #}
 * # tare-ignore-file blank-lines, trailing-whitespace     (a YAML comment in front matter or a chat file)
 * </pre>
 */
public final class Suppressions {
    /** A directive and the ids after it. */
    public static final Pattern DIRECTIVE = Pattern.compile(
            "tare-ignore(-next-line|-file)?:?[ \\t]+([a-z0-9][a-z0-9-]*(?:[ \\t]*,[ \\t]*[a-z0-9][a-z0-9-]*)*)");

    private static final String ALL = "all";

    private final Set<String> file = new HashSet<>();
    private final Map<Integer, Set<String>> byLine = new HashMap<>();
    private final List<Directive> directives = new java.util.ArrayList<>();

    /**
     * One directive as written.
     *
     * @param offset where it starts in the file's text
     * @param ids    the rule ids it names
     */
    public record Directive(int offset, List<String> ids) {
    }

    private Suppressions() {
    }

    /** The directives of {@code text}. */
    public static Suppressions of(TemplateView text) {
        Suppressions suppressions = new Suppressions();
        String source = text.template().source();
        if (!source.contains("tare-ignore")) {
            return suppressions;
        }
        Matcher matcher = DIRECTIVE.matcher(source);
        while (matcher.find()) {
            List<String> ids = List.of(matcher.group(2).split("[ \\t]*,[ \\t]*"));
            suppressions.directives.add(new Directive(matcher.start(), ids));
            String kind = matcher.group(1) == null ? "" : matcher.group(1);
            int line = text.lineOfSource(matcher.start());
            switch (kind) {
                case "-file" -> suppressions.file.addAll(ids);
                case "-next-line" -> suppressions.byLine.computeIfAbsent(line + 1, l -> new HashSet<>()).addAll(ids);
                default -> suppressions.byLine.computeIfAbsent(line, l -> new HashSet<>()).addAll(ids);
            }
        }
        return suppressions;
    }

    /**
     * Directives as a cache kept them: the rules silenced in the whole file and on each line, and the
     * directives they came from.
     */
    public static Suppressions restored(List<Directive> directives, Set<String> file, Map<Integer, Set<String>> byLine) {
        Suppressions suppressions = new Suppressions();
        suppressions.directives.addAll(directives);
        suppressions.file.addAll(file);
        byLine.forEach((line, ids) -> suppressions.byLine.put(line, new HashSet<>(ids)));
        return suppressions;
    }

    /** The rules silenced in the whole file. */
    public Set<String> fileWide() {
        return Set.copyOf(file);
    }

    /** The rules silenced on each 1-based line. */
    public Map<Integer, Set<String>> byLine() {
        return java.util.Collections.unmodifiableMap(byLine);
    }

    /** Every directive, in file order. */
    public List<Directive> directives() {
        return List.copyOf(directives);
    }

    /** Whether a directive silences {@code finding} (by the line it starts on). */
    public boolean silences(Finding finding) {
        return silences(finding.rule(), finding.line());
    }

    /** Whether a directive silences rule {@code rule} on 1-based line {@code line} of the file. */
    public boolean silences(String rule, int line) {
        if (file.contains(ALL) || file.contains(rule)) {
            return true;
        }
        Set<String> ids = byLine.get(line);
        return ids != null && (ids.contains(ALL) || ids.contains(rule));
    }
}
