package dev.tare.template;

import java.util.List;
import java.util.Optional;

/**
 * A template rendered to the text a model would receive, one string per message, with every
 * per-call part (variable or function call) that the rendering passed through, including those
 * inside includes.
 *
 * @param messages  the rendered text of each message, in order
 * @param variables each occurrence of a variable or call, in order, with the declaration that applies to it
 * @param includes  the root-relative paths of every template pasted in, in order, repeats kept
 */
public record Rendering(List<String> messages, List<Occurrence> variables, List<String> includes) {
    public Rendering {
        messages = List.copyOf(messages);
        variables = List.copyOf(variables);
        includes = List.copyOf(includes);
    }

    /**
     * One occurrence of a variable or function call.
     *
     * @param part  the segment
     * @param owner the path of the template it stands in
     * @param spec  the declaration that applies: the rendered template's, else the owner's
     */
    public record Occurrence(Segment.PerCall part, String owner, Optional<VariableSpec> spec) {
    }
}
