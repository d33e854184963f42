package dev.tare.template;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

/**
 * A template rendered to the text a model would receive, one string per message, with every
 * per-call part (variable or function call) that the rendering passed through (including those inside
 * includes, once per loop iteration), the loops it assumed, and where the first per-call part stands.
 *
 * @param messages     the rendered text of each message, in order
 * @param variables    each occurrence of a variable or call, in order, with the declaration that applies to it
 * @param includes     the root-relative paths of every template pasted in, in order, repeats kept
 * @param loops        each loop on the rendered path, once, in order
 * @param firstPerCall where the first part that can differ between calls stands (a variable or call, or
 *                     a loop or branch that depends on one); empty when there is none
 */
public record Rendering(List<String> messages, List<Occurrence> variables, List<String> includes, List<Loop> loops,
                        Optional<Position> firstPerCall) {
    public Rendering {
        messages = List.copyOf(messages);
        variables = List.copyOf(variables);
        includes = List.copyOf(includes);
        loops = List.copyOf(loops);
    }

    /** A rendering with no loops and no per-call part. */
    public Rendering(List<String> messages, List<Occurrence> variables, List<String> includes) {
        this(messages, variables, includes, List.of(), Optional.empty());
    }

    /**
     * The text before the first per-call part, message by message: every message before it whole,
     * the one it stands in cut where it starts; every message when there is none. Up to that point
     * the text is the same with every variable empty and with samples.
     */
    public List<String> leading() {
        if (firstPerCall.isEmpty()) {
            return messages;
        }
        Position at = firstPerCall.get();
        List<String> leading = new ArrayList<>(messages.subList(0, at.message()));
        leading.add(messages.get(at.message()).substring(0, at.offset()));
        return leading;
    }

    /**
     * One occurrence of a variable or function call.
     *
     * @param part  the segment
     * @param owner the path of the template it stands in
     * @param spec  the declaration that applies: the rendered template's, else the owner's
     * @param input the template input it reads, as a dotted name: a variable's own name (a call's
     *              function), or for a name the template binds, what it stands for ({@code item.text} in
     *              {@code {% for item in history %}} reads {@code history.text})
     */
    public record Occurrence(Segment.PerCall part, String owner, Optional<VariableSpec> spec, String input) {
    }
    /**
     * A loop the rendering assumed a number of iterations for.
     *
     * @param variable the loop variable as written ({@code item}, {@code key, value}; {@code this} for a
     *                 Handlebars or Mustache block without block parameters)
     * @param iterable the input it walks, the name its {@code items} are declared under; the expression as
     *                 written when it names no input
     * @param items    the iterations assumed
     * @param declared whether {@code items} was declared, rather than the default of 1
     * @param owner    the path of the template the loop stands in
     * @param line     the line of its opening tag
     */
    public record Loop(String variable, String iterable, int items, boolean declared, String owner, int line) {
    }

    /**
     * A place in the rendered text.
     *
     * @param message the index of the message
     * @param offset  the offset in that message's rendered text
     */
    public record Position(int message, int offset) {
    }
}
