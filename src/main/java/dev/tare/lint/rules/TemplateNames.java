package dev.tare.lint.rules;

import dev.tare.template.Control;
import dev.tare.template.PlaceholderSyntax;
import dev.tare.template.Segment;
import dev.tare.template.Template;
import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.Deque;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * The names a template reads, for the variable rules: every variable placeholder, every function
 * call (its output by the function's name, and the variables it is passed), and in double-brace
 * templates the names tags read ({@code if}, {@code elif}, {@code unless} conditions, the list a
 * {@code for} walks, Mustache sections). Names bound inside the template (loop variables,
 * {@code set} targets, macro arguments) and names inside Mustache sections are local and reported apart.
 */
final class TemplateNames {
    private static final Pattern STATEMENT = Pattern.compile("^\\{%[-+~]?\\s*(\\w+)(.*?)[-+~]?%}$", Pattern.DOTALL);
    private static final Pattern NAME = Pattern.compile("[\\p{L}_][\\p{L}\\p{N}_]*(?:\\.[\\p{L}_][\\p{L}\\p{N}_]*)*");
    private static final Pattern FOR = Pattern.compile("^\\s*([\\w\\s,()]+?)\\s+in\\s+(.*)$", Pattern.DOTALL);
    private static final Pattern QUOTED = Pattern.compile("\"[^\"]*\"|'[^']*'");
    private static final Set<String> WORDS = Set.of("and", "or", "not", "in", "is", "if", "else", "true", "false",
            "none", "null", "defined", "undefined", "loop", "True", "False", "None", "recursive", "super", "self",
            "varargs", "kwargs", "caller");

    private TemplateNames() {
    }

    /**
     * One name a template reads.
     *
     * @param name     the dotted name as written
     * @param segment  the segment it appears in
     * @param local    whether it is bound inside the template (a loop variable, a set target) or inside a section
     * @param rendered whether it is a variable whose value is pasted into the text, or a call's output
     *                 (not only a condition or a call's argument)
     */
    record Use(String name, Segment segment, boolean local, boolean rendered) {
        /** The name a declaration may go under instead: a variable's first part; a call's output has none but its own. */
        String root() {
            int dot = name.indexOf('.');
            return dot < 0 || isCallOutput() ? name : name.substring(0, dot);
        }

        /** Whether this is what a function call returns, named after the function. */
        boolean isCallOutput() {
            return rendered && segment instanceof Segment.Call;
        }
    }

    /** Every name the template's own segments read, in order. */
    static List<Use> of(Template template) {
        boolean tags = template.syntax() == PlaceholderSyntax.DOUBLE_BRACE;
        List<Use> uses = new ArrayList<>();
        Deque<Set<String>> scopes = new ArrayDeque<>();
        Set<String> bound = new HashSet<>();
        int sections = 0;
        Deque<Boolean> blocks = new ArrayDeque<>();
        for (Segment segment : template.segments()) {
            if (segment instanceof Segment.Variable variable) {
                uses.add(new Use(variable.name(), segment, sections > 0 || isLocal(variable.rootName(), scopes, bound), true));
            } else if (segment instanceof Segment.Call call) {
                uses.add(new Use(call.name(), segment, false, true));
                for (String argument : call.arguments()) {
                    uses.add(new Use(argument, segment, false, false));
                }
            } else if (tags && segment instanceof Segment.Tag tag) {
                String source = tag.source();
                if (source.startsWith("{{")) {
                    // A Handlebars or Mustache block reads its subject (each's list, if's condition) in the
                    // context around it; inside a block that walks or opens a value, names are the item's.
                    if (tag.control() instanceof Control.Open open) {
                        reads(open.subject(), segment, scopes, bound, uses, sections > 0);
                        boolean context = open.block() != Control.Block.CONDITION && open.block() != Control.Block.INVERTED;
                        blocks.push(context);
                        sections += context ? 1 : 0;
                    } else if (tag.control() instanceof Control.Middle middle) {
                        boolean inner = !blocks.isEmpty() && blocks.peek();
                        reads(middle.condition(), segment, scopes, bound, uses, sections - (inner ? 1 : 0) > 0);
                    } else if (tag.control() instanceof Control.Close && !blocks.isEmpty()) {
                        sections -= blocks.pop() ? 1 : 0;
                    }
                    continue;
                }
                Matcher statement = STATEMENT.matcher(source);
                if (statement.matches()) {
                    statement(statement.group(1), statement.group(2), segment, scopes, bound, uses, sections > 0);
                }
            }
        }
        return uses;
    }

    private static void statement(String keyword, String rest, Segment segment, Deque<Set<String>> scopes,
                                  Set<String> bound, List<Use> uses, boolean inSection) {
        switch (keyword) {
            case "if", "elif", "unless" -> reads(rest, segment, scopes, bound, uses, inSection);
            case "for" -> {
                Matcher loop = FOR.matcher(rest);
                if (loop.matches()) {
                    reads(loop.group(2).replaceAll("\\bif\\b.*$", ""), segment, scopes, bound, uses, inSection);
                    Set<String> scope = new HashSet<>();
                    Matcher names = NAME.matcher(loop.group(1));
                    while (names.find()) {
                        scope.add(names.group());
                    }
                    scopes.push(scope);
                } else {
                    scopes.push(new HashSet<>());
                }
            }
            case "macro" -> {
                Set<String> scope = new HashSet<>();
                Matcher names = NAME.matcher(rest);
                while (names.find()) {
                    scope.add(names.group());
                }
                scopes.push(scope);
            }
            case "endfor", "endmacro" -> {
                if (!scopes.isEmpty()) {
                    scopes.pop();
                }
            }
            case "set" -> {
                int equals = rest.indexOf('=');
                Matcher target = NAME.matcher(equals < 0 ? rest : rest.substring(0, equals));
                if (target.find()) {
                    bound.add(target.group());
                }
                if (equals >= 0) {
                    reads(rest.substring(equals + 1), segment, scopes, bound, uses, inSection);
                }
            }
            default -> {
            }
        }
    }

    /** Adds the names an expression reads: not keywords, filters, function calls or quoted text. */
    private static void reads(String expression, Segment segment, Deque<Set<String>> scopes, Set<String> bound,
                              List<Use> uses, boolean inSection) {
        String bare = QUOTED.matcher(expression).replaceAll(" ");
        Matcher names = NAME.matcher(bare);
        while (names.find()) {
            String name = names.group();
            int before = names.start() - 1;
            while (before >= 0 && bare.charAt(before) == ' ') {
                before--;
            }
            int after = names.end();
            while (after < bare.length() && bare.charAt(after) == ' ') {
                after++;
            }
            boolean filter = before >= 0 && bare.charAt(before) == '|';
            boolean call = after < bare.length() && bare.charAt(after) == '(';
            boolean test = before >= 1 && bare.startsWith("is", before - 1) && (before < 2 || bare.charAt(before - 2) == ' ');
            if (WORDS.contains(name) || filter || call || test || Character.isDigit(name.charAt(0))) {
                continue;
            }
            String root = name.contains(".") ? name.substring(0, name.indexOf('.')) : name;
            uses.add(new Use(name, segment, inSection || isLocal(root, scopes, bound), false));
        }
    }

    private static boolean isLocal(String root, Deque<Set<String>> scopes, Set<String> bound) {
        if (bound.contains(root) || root.equals("loop")) {
            return true;
        }
        for (Set<String> scope : scopes) {
            if (scope.contains(root)) {
                return true;
            }
        }
        return false;
    }
}
