package dev.tare.source;

import java.util.Optional;
import org.yaml.snakeyaml.error.Mark;
import org.yaml.snakeyaml.error.MarkedYAMLException;

/**
 * A YAML syntax error as a person reads it: where the problem is (not where the construct it broke
 * began) and what it is in plain words, for the mistakes people make; the parser's own words for
 * the rest.
 */
final class YamlProblems {
    private YamlProblems() {
    }

    /** "line L, column C: what is wrong", when {@code cause} or one of its causes is a YAML syntax error. */
    static Optional<String> describe(Throwable cause) {
        for (Throwable t = cause; t != null; t = t.getCause()) {
            if (t instanceof MarkedYAMLException marked) {
                return Optional.of(describe(marked));
            }
        }
        return Optional.empty();
    }

    private static String describe(MarkedYAMLException e) {
        Mark mark = e.getProblemMark() != null ? e.getProblemMark() : e.getContextMark();
        String where = mark == null ? "" : "line " + (mark.getLine() + 1) + ", column " + (mark.getColumn() + 1) + ": ";
        return where + plain(e.getContext() == null ? "" : e.getContext(), e.getProblem() == null ? "" : e.getProblem(),
                e.getContextMark());
    }

    /** The problem in plain words, from the parser's context ("while parsing ...") and problem. */
    static String plain(String context, String problem, Mark contextMark) {
        String opened = contextMark == null ? "" : " (opened on line " + (contextMark.getLine() + 1) + ")";
        if (problem.contains("\\t(TAB)") || problem.contains("'\\t'") || problem.indexOf('\t') >= 0) {
            return "a tab character; YAML indents with spaces, so replace the tab with spaces";
        }
        if (context.contains("flow sequence")) {
            return "a list in [ ] is not closed" + opened + ", or an item in it needs quotes; close it with ]";
        }
        if (context.contains("flow mapping")) {
            return "a mapping in { } is not closed" + opened + ", or a value in it needs quotes; close it with }";
        }
        if (context.contains("quoted scalar")) {
            return "a quoted text is never closed" + opened + "; end it with the same quote";
        }
        if (problem.contains("mapping values are not allowed")) {
            return "a ':' where no key can start; put text that holds ': ' in quotes";
        }
        if (problem.contains("could not find expected ':'")) {
            return "a line without 'key: value' inside a mapping; add the ':' or put the text in quotes";
        }
        if (context.contains("block mapping") || context.contains("block collection")) {
            return "this line is indented differently from the keys or items around it" + opened
                    + "; line it up with them";
        }
        if (problem.contains("found character") && problem.contains("cannot start any token")) {
            String character = problem.replace("found character", "the character").replaceAll("\\s*\\(Do not use .*\\)", "")
                    .replace(" that cannot start any token.", " cannot start a value");
            return character + "; put the value in quotes";
        }
        return (problem.isEmpty() ? context : problem) + "; fix the YAML syntax there";
    }
}
