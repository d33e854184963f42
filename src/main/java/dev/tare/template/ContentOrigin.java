package dev.tare.template;

/**
 * Where a message's content stands in its file, so that a position in the content can be mapped
 * back onto the file's lines and characters: findings point there, and rewrites edit there.
 */
public sealed interface ContentOrigin {

    /** The content is the file's own text from {@code offset} on, character for character. */
    record FileText(int offset) implements ContentOrigin {
    }

    /**
     * The content is the string value at {@code key} of the file read as YAML or JSON, a path
     * written as {@code messages[0].content} or {@code template}.
     */
    record DocumentValue(String key) implements ContentOrigin {
    }

    /**
     * The content was made from the file rather than copied (a tool definition written again as
     * minified JSON); it starts at 1-based {@code line} and maps onto no exact place.
     */
    record Made(int line) implements ContentOrigin {
    }

    /**
     * The content is the value of a prompt written as string literals in source code.
     *
     * @param name   the name it was found under (its variable, key or call), unique in the file
     * @param line   1-based line of its first literal
     * @param column 1-based column there
     * @param map    where each character of the content is written in the file
     * @param meta   the settings of its {@code tare:} comment, as front matter would give them
     */
    record Literal(String name, int line, int column, CharacterMap map, TemplateMeta meta) implements ContentOrigin {
    }
}
