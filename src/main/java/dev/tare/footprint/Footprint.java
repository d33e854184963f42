package dev.tare.footprint;

/**
 * The numbers for one template on one target. Every figure other than the token counts is an
 * estimate from the formulas in the design notes, never a measurement or an invoice.
 *
 * @param inputTokens   tokens sent per call: the template's estimated tokens plus framing
 * @param framingTokens per-message and per-reply tokens the target's chat format adds
 */
public record Footprint(int inputTokens, int framingTokens) {
}
