package dev.tare.overlap;

import dev.tare.template.Renderer;
import dev.tare.template.Rendering;
import dev.tare.template.Template;
import java.util.List;

/**
 * The text of a template before its first per-call part (a variable or function call, or a loop or
 * branch that depends on one), message by message: the part that is the same on every call, and so
 * the only part a prefix cache can serve. Includes are pasted in as usual. The scan's cached tokens
 * and the {@code cache-order} rule both measure the leading text here, so that they agree on where a
 * template's per-call part starts.
 */
public final class StaticPrefix {
    private StaticPrefix() {
    }

    /**
     * The messages up to the first per-call part, the last one cut where it stands.
     *
     * @param rendering the template's rendering (with samples or without: they agree up to that part)
     */
    public static List<String> of(Rendering rendering) {
        return rendering.leading();
    }

    /**
     * The leading text the template would have if its per-call parts came after its static parts:
     * every message rendered with its variables empty, in order.
     */
    public static List<String> reordered(Template template, Renderer renderer) {
        return renderer.renderStatic(template).messages();
    }
}
