package dev.tare.template;

import java.util.Optional;
import java.util.OptionalInt;

/**
 * What a template declares about one variable, for estimating its size: a token count, a sample
 * value, both or neither, and for a list a loop walks, how many items to expect (the token count or
 * sample then sizes each variable of an item inside the loop's body).
 */
public record VariableSpec(OptionalInt tokens, Optional<String> sample, OptionalInt items) {
    /** A declaration that says nothing about size. */
    public static final VariableSpec UNSIZED = new VariableSpec(OptionalInt.empty(), Optional.empty(), OptionalInt.empty());

    /** A declaration of a size or a sample, with no items. */
    public VariableSpec(OptionalInt tokens, Optional<String> sample) {
        this(tokens, sample, OptionalInt.empty());
    }

    /** Whether the declaration says how large the variable is. */
    public boolean isSized() {
        return tokens.isPresent() || sample.isPresent();
    }
}
