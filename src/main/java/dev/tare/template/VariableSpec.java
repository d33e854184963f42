package dev.tare.template;

import java.util.Optional;
import java.util.OptionalInt;

/**
 * What a template declares about one variable, for estimating its size: a token count, a sample
 * value, both or neither.
 */
public record VariableSpec(OptionalInt tokens, Optional<String> sample) {
    /** A declaration that says nothing about size. */
    public static final VariableSpec UNSIZED = new VariableSpec(OptionalInt.empty(), Optional.empty());

    /** Whether the declaration says how large the variable is. */
    public boolean isSized() {
        return tokens.isPresent() || sample.isPresent();
    }
}
