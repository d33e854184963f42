package dev.tare.overlap;

import dev.tare.template.Renderer;
import dev.tare.template.Rendering;
import dev.tare.template.Template;
import dev.tare.template.TemplateMeta;
import dev.tare.template.VariableSpec;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalInt;

/**
 * The text of a template before its first variable or function call, message by message: the part
 * that is the same on every call, and so the only part a prefix cache can serve. Includes are pasted
 * in as usual.
 * The scan's cached tokens and the {@code cache-order} rule both measure the leading text here, so
 * that they agree on where a template's per-call part starts.
 */
public final class StaticPrefix {
    /** Marks where a variable or call stands; template files cannot contain it, as reading refuses NUL bytes. */
    private static final String MARK = "\u0000";

    private StaticPrefix() {
    }

    /**
     * The messages up to the first variable or call, the last one cut where it stands.
     *
     * @param samples the template's rendering with samples, which lists every variable and call occurrence
     */
    public static List<String> of(Template template, Renderer renderer, Rendering samples) {
        // Rendering each variable and call as a mark finds the first one across messages and includes alike.
        Map<String, VariableSpec> marks = new LinkedHashMap<>();
        for (Rendering.Occurrence occurrence : samples.variables()) {
            marks.put(occurrence.part().name(), new VariableSpec(OptionalInt.empty(), Optional.of(MARK)));
        }
        TemplateMeta meta = template.meta();
        Template marked = new Template(template.path(), template.kind(),
                meta.withVariables(marks), template.messages(),
                template.source(), template.bodyStart(), template.syntax());
        List<String> leading = new ArrayList<>();
        for (String message : renderer.renderWithSamples(marked).messages()) {
            int mark = message.indexOf(MARK);
            if (mark >= 0) {
                leading.add(message.substring(0, mark));
                break;
            }
            leading.add(message);
        }
        return leading;
    }

    /**
     * The leading text the template would have if its per-call parts came after its static parts:
     * every message rendered with its variables empty, in order.
     */
    public static List<String> reordered(Template template, Renderer renderer) {
        return renderer.renderStatic(template).messages();
    }
}
