package dev.tare.template;

import dev.tare.TareException;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.stream.Collectors;

/** The placeholder syntaxes Tare understands, each with its own parser. */
public enum PlaceholderSyntax {
    /** {@code {{ name }}}, {@code {{> partial }}}, {@code {% tag %}}, {@code {# comment #}}. */
    DOUBLE_BRACE("double-brace", new DoubleBraceParser(), true),
    /** {@code {name}} as in Python's str.format, with {@code {{} and {@code }}} as literal braces. */
    SINGLE_BRACE("single-brace", new SingleBraceParser(), false),
    /** {@code ${name}}, with {@code \$}{@code {} as a literal. */
    DOLLAR_BRACE("dollar-brace", new DollarBraceParser(), false),
    /**
     * {@code {{$name}}} for variables and {@code {{plugin.fn $arg}}} for function calls, with
     * {@code {{ "{{" }}} as a literal.
     */
    DOLLAR_DOUBLE_BRACE("dollar-double-brace", new DollarDoubleBraceParser(), false),
    /** No placeholders: every character is literal text. */
    NONE("none", new LiteralParser(), false);

    private final String label;
    private final SegmentParser parser;
    private final boolean hasIncludes;

    PlaceholderSyntax(String label, SegmentParser parser, boolean hasIncludes) {
        this.label = label;
        this.parser = parser;
        this.hasIncludes = hasIncludes;
    }

    /** The name used in {@code tare.yaml}. */
    public String label() {
        return label;
    }

    /** Whether the syntax can include other templates (needed to extract shared blocks into partials). */
    public boolean hasIncludes() {
        return hasIncludes;
    }

    /**
     * The syntax called {@code label} in configuration.
     *
     * @throws TareException naming the accepted values when there is none
     */
    public static PlaceholderSyntax fromLabel(String label) {
        String wanted = label.trim().toLowerCase(Locale.ROOT);
        return Arrays.stream(values())
                .filter(syntax -> syntax.label.equals(wanted))
                .findFirst()
                .orElseThrow(() -> new TareException("unknown placeholder syntax '" + label + "': use one of "
                        + Arrays.stream(values()).map(PlaceholderSyntax::label).collect(Collectors.joining(", "))));
    }

    /** Splits {@code text[start, end)} into segments; throws {@link TemplateSyntaxException} on a broken placeholder. */
    List<Segment> parse(String text, int start, int end, Locator locator) {
        return parser.parse(text, start, end, locator);
    }
}
