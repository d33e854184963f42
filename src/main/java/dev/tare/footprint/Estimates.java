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

    /**
     * What a tool file adds to a call on {@code target}: its definitions as the provider counts them
     * (the local count, scaled) and the target's framing around each of its tools.
     *
     * @param definitions the scaled tokens of the definitions
     * @param framing     the per-tool framing tokens
     */
    public record SentTools(int definitions, int framing) {
        /** Both parts: what the tools add to the call's input and to its static prefix. */
        public int total() {
            return definitions + framing;
        }
    }

    /** The tokens {@code tools} definitions, {@code counted} locally, add to a call on {@code target}. */
    public static SentTools sentTools(Target target, int counted, int tools) {
        return new SentTools(target.scaled(counted), Framing.toolTokens(target, tools));
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
