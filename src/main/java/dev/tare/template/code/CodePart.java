package dev.tare.template.code;

import java.util.Optional;

/**
 * One part of a prompt found in source code: a run of text from one literal, or a variable (an
 * f-string or template literal field, a format specifier, an expression joined in with {@code +}).
 *
 * @param text        the part as it stands in the prompt's value (a variable as written, such as
 *                    {@code {name}} or {@code %s}; an expression between literals as its text)
 * @param variable    the variable's name when the part is one: the expression, the field's key, or
 *                    the format call's argument it takes
 * @param valueStart  offset of the part in the prompt's value
 * @param valueEnd    offset just past it in the value
 * @param sourceStart file offset where the part is written
 * @param sourceEnd   file offset just past it
 * @param line        1-based file line of {@code sourceStart}
 * @param column      1-based column (UTF-16 code units) of {@code sourceStart}
 */
public record CodePart(String text, Optional<String> variable, int valueStart, int valueEnd, int sourceStart,
                       int sourceEnd, int line, int column) {
    /** Whether the part changes from call to call. */
    public boolean isVariable() {
        return variable.isPresent();
    }
}
