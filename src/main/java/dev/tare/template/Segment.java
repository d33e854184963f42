package dev.tare.template;

import java.util.List;

/**
 * One piece of a template: literal text, a variable, a function call, an include of another
 * template, or a tag (control flow, comments and anything else that renders to no text of its own).
 */
public sealed interface Segment {

    /** Where this segment stands in its source. */
    Span span();

    /**
     * Literal text. {@code text} is what it renders to, which differs from the source for escaped
     * braces ({@code {{} renders as {@code {} in single-brace templates).
     */
    record Text(String text, Span span) implements Segment {
    }

    /**
     * Text that differs from call to call: a variable, or what a function call returns. Its size is
     * declared under {@link #name()}, and it renders to nothing in the static text.
     */
    sealed interface PerCall extends Segment {
        /** The name its declaration goes under: a variable's dotted path, a call's function. */
        String name();

        /** The placeholder as written. */
        String source();

        /** The names of the variables it reads: a variable itself, a call the variables it is passed. */
        List<String> variableNames();
    }

    /**
     * A placeholder filled in per call. {@code name} is its dotted path ({@code account.id}); the
     * source is the placeholder as written.
     */
    record Variable(String name, String source, Span span) implements PerCall {
        /** The first part of the dotted name: what a front matter declaration usually names. */
        public String rootName() {
            int dot = name.indexOf('.');
            return dot < 0 ? name : name.substring(0, dot);
        }

        @Override
        public List<String> variableNames() {
            return List.of(name);
        }
    }

    /**
     * A function call whose output is pasted in per call, such as {@code {{weather.forecast $city}}}.
     * {@code name} is the function as written ({@code weather.forecast}), and {@code arguments} are
     * the names of the variables passed to it, in order; quoted values passed to it are left out.
     */
    record Call(String name, List<String> arguments, String source, Span span) implements PerCall {
        public Call {
            arguments = List.copyOf(arguments);
        }

        @Override
        public List<String> variableNames() {
            return arguments;
        }
    }

    /** A reference to another template pasted in when rendering. */
    record Include(String name, String source, Span span) implements Segment {
    }

    /**
     * Control flow, a comment, or an expression with no variable. {@code control} says what it does
     * when rendered: most tags render to nothing, a block's tags decide what its body renders, and a
     * lone string literal renders as its value.
     */
    record Tag(String source, Span span, Control control) implements Segment {
        /** A tag that renders to nothing and opens no block. */
        public Tag(String source, Span span) {
            this(source, span, Control.NONE);
        }
    }
}
