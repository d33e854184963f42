package dev.tare.template;

import dev.tare.TareException;

/** A placeholder, tag or include that cannot be parsed, located by line and column. */
public final class TemplateSyntaxException extends TareException {
    private static final long serialVersionUID = 1L;
    private final int line;
    private final int column;

    TemplateSyntaxException(int line, int column, String problem) {
        super("line " + line + ", column " + column + ": " + problem);
        this.line = line;
        this.column = column;
    }

    /** The 1-based line of the problem. */
    public int line() {
        return line;
    }

    /** The 1-based column of the problem. */
    public int column() {
        return column;
    }
}
