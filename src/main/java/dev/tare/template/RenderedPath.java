package dev.tare.template;

/**
 * One path through a template (the longest or the shortest, see {@link Renderer.Path}) rendered
 * twice, with every variable empty and with samples: the same branches and loop iterations in both,
 * so that the samples' text is the empty text plus what the variables add.
 *
 * @param empty    the path with every variable empty: its static text
 * @param samples  the path with each variable's declared sample
 * @param branched whether a choice between branches was made on the way, so that another path may differ
 */
public record RenderedPath(Rendering empty, Rendering samples, boolean branched) {
}
