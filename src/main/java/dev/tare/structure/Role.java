package dev.tare.structure;

/**
 * The structural role of a region of template text, which decides what a rewrite may do there: a
 * whitespace edit only in prose, never in anything laid out or quoted verbatim; an instruction
 * counted as repeated only in prose and list items.
 */
public enum Role {
    /** A paragraph of running text (also thematic breaks and link definitions). */
    PROSE,
    /** A Markdown heading. */
    HEADING,
    /** A paragraph of a list item. */
    LIST_ITEM,
    /** Text inside a block quote. */
    QUOTE,
    /** A blank line between blocks. */
    BLANK,
    /** A fenced code block, fences included. */
    FENCED_CODE,
    /** A code block set off by four spaces of indentation. */
    INDENTED_CODE,
    /** A backtick code span. */
    INLINE_CODE,
    /** A block of raw HTML. */
    HTML,
    /** A row of a Markdown table, delimiter row included. */
    TABLE_ROW,
    /** Lines whose columns are separated by tabs. */
    TAB_SEPARATED,
    /** Lines laid out with runs of spaces that line up, or drawn with box characters. */
    ALIGNED,
    /** Lines of a worked example or a dialogue: {@code Input:}/{@code Output:}, {@code Q:}/{@code A:}, speakers' turns, example sections. */
    EXAMPLE,
    /** A line that is only the opening or closing tag of an XML-style section such as {@code <rules>}. */
    SECTION_TAG,
    /** Text inside {@code {% raw %}...{% endraw %}}, which the template engine sends as written. */
    RAW,
    /** A variable, include or template tag as written. */
    PLACEHOLDER,
    /** A URL. */
    URL;

    /** Whether a whitespace-only edit (trailing spaces, a space run, a blank-line run, a tab between words) is safe here. */
    public boolean allowsWhitespaceEdits() {
        return this == PROSE || this == HEADING || this == LIST_ITEM || this == QUOTE || this == BLANK;
    }

    /** Whether a safe rewrite must leave this text byte for byte as it is. */
    public boolean isVerbatim() {
        return switch (this) {
            case FENCED_CODE, INDENTED_CODE, INLINE_CODE, HTML, TABLE_ROW, TAB_SEPARATED, ALIGNED, RAW -> true;
            default -> false;
        };
    }

    /** Whether the text is code of some kind, which prose rules never read as instructions. */
    public boolean isCode() {
        return this == FENCED_CODE || this == INDENTED_CODE || this == INLINE_CODE || this == HTML;
    }
}
