package dev.tare.footprint;

import dev.tare.template.Rendering;
import dev.tare.tokenize.Tokenizer;

/** The estimated-tokens formula of the design, in one place for every command that reports it. */
public final class Estimates {
    private Estimates() {
    }

    /** Estimated tokens: the rendering with samples counted message by message, plus declared sizes. */
    public static int estimatedTokens(Tokenizer tokenizer, Rendering samples) {
        return tokens(tokenizer, samples) + declaredTokens(samples);
    }

    /**
     * Estimated tokens as {@code target}'s provider would count them: the counted text scaled by the
     * target's calibration, plus declared sizes (which are not counted, so not scaled).
     */
    public static int estimatedTokens(Target target, Tokenizer tokenizer, Rendering samples) {
        return target.scaled(tokens(tokenizer, samples)) + declaredTokens(samples);
    }

    /** The tokens of each rendered message, summed. */
    public static int tokens(Tokenizer tokenizer, Rendering rendering) {
        int total = 0;
        for (String message : rendering.messages()) {
            total += tokenizer.count(message);
        }
        return total;
    }

    /** Tokens declared for variables without samples, once per occurrence. */
    public static int declaredTokens(Rendering rendering) {
        int total = 0;
        for (Rendering.Occurrence occurrence : rendering.variables()) {
            var spec = occurrence.spec();
            if (spec.isPresent() && spec.get().sample().isEmpty() && spec.get().tokens().isPresent()) {
                total += spec.get().tokens().getAsInt();
            }
        }
        return total;
    }
}
