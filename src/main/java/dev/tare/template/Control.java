package dev.tare.template;

import java.util.List;

/**
 * What a tag does when a double-brace template is rendered: nothing, a literal value, a block's
 * opening, middle or end, an assignment, or a call of a macro defined in the same template.
 */
public sealed interface Control {

    /** A tag that renders to nothing and opens no block: a comment, an import, an expression without a variable. */
    Control NONE = new Plain();

    /** See {@link #NONE}. */
    record Plain() implements Control {
    }

    /** An expression that is one string literal, <code>{{ '{{' }}</code>: it renders as its value. */
    record Literal(String text) implements Control {
    }

    /**
     * {@code {% set target = value %}}: renders nothing; later uses of {@code target} stand for the value.
     *
     * @param target the name assigned
     * @param value  the expression as written
     */
    record Assign(String target, String value) implements Control {
    }

    /**
     * <code>{{ m(x) }}</code> where {@code m} is a macro of the same template: the macro's body renders here.
     *
     * @param macro     the macro's name
     * @param arguments the arguments as written, in order ({@code name=value} for keyword arguments)
     */
    record Call(String macro, List<String> arguments) implements Control {
        public Call {
            arguments = List.copyOf(arguments);
        }
    }

    /**
     * The opening tag of a block.
     *
     * @param block     what the block does with its body
     * @param keyword   the word its closing tag repeats: {@code for}, {@code if}, {@code each}, a section's name
     * @param subject   what it works on, as written: a loop's iterable, a condition, a section's or macro's
     *                  name, a {@code with}'s value; empty when none
     * @param names     the names it binds: a loop's variables, a macro's parameters (with their defaults
     *                  as written, {@code tone='plain'}), a captured {@code set}'s target, block parameters
     * @param arguments a {@code call} block's arguments, as written
     */
    record Open(Block block, String keyword, String subject, List<String> names, List<String> arguments)
            implements Control {
        public Open {
            names = List.copyOf(names);
            arguments = List.copyOf(arguments);
        }
    }

    /**
     * A tag that starts another branch of the open block: {@code {% else %}}, {@code {% elif x %}},
     * <code>{{else}}</code>, <code>{{else if x}}</code>, <code>{{^}}</code>.
     *
     * @param keyword   {@code else}, {@code elif} or {@code pluralize}
     * @param condition the branch's condition as written; empty for a plain else
     */
    record Middle(String keyword, String condition) implements Control {
    }

    /**
     * The closing tag of a block.
     *
     * @param keyword the keyword of the block it closes ({@code for} for {@code {% endfor %}}, {@code each}
     *                for <code>{{/each}}</code>)
     */
    record Close(String keyword) implements Control {
    }

    /** What a block does with its body when rendered. */
    enum Block {
        /** Renders its body once per expected item (Jinja's {@code for}, Handlebars' {@code each}); else when none. */
        LOOP,
        /** Renders one of its branches ({@code if}, {@code unless}, a helper with arguments). */
        CONDITION,
        /** A Mustache section <code>{{#name}}</code>: its body once per expected item, or its else branch. */
        SECTION,
        /** A Mustache inverted section <code>{{^name}}</code>: its body when the value is empty. */
        INVERTED,
        /** Handlebars' {@code with}: its body with the value as context, or its else branch. */
        WITH,
        /** Renders its body in place ({@code filter}, {@code block}, Jinja's {@code with}, {@code trans}, ...). */
        SCOPE,
        /** {@code {% set x %}...{% endset %}}: the body is kept for later uses of the name, not rendered here. */
        CAPTURE,
        /** {@code {% macro m(a) %}...{% endmacro %}}: the body renders where the macro is called. */
        MACRO,
        /** {@code {% call m(x) %}...{% endcall %}}: the macro renders here, with the body as its caller. */
        CALL,
        /** A definition rendered elsewhere or never, such as an inline partial: nothing renders here. */
        HIDDEN
    }
}
