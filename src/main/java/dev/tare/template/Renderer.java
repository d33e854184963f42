package dev.tare.template;

import dev.tare.TareException;
import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.Deque;
import java.util.List;
import java.util.Optional;
import java.util.stream.Collectors;

/**
 * Renders templates as Tare measures them: tags render to nothing, includes are pasted in
 * (refusing cycles and runaway depth), and each variable or function call becomes either nothing
 * ({@link #renderStatic}) or its declared sample ({@link #renderWithSamples}).
 */
public final class Renderer {
    /** Includes nested deeper than this are refused as runaway. */
    public static final int MAX_INCLUDE_DEPTH = 32;

    private final IncludeResolver includes;

    public Renderer(IncludeResolver includes) {
        this.includes = includes;
    }

    /** The template with every variable empty: what the template itself costs. */
    public Rendering renderStatic(Template template) {
        return render(template, false);
    }

    /** The template with each variable and call replaced by its declared sample, or empty when it has none. */
    public Rendering renderWithSamples(Template template) {
        return render(template, true);
    }

    private Rendering render(Template template, boolean samples) {
        List<String> texts = new ArrayList<>();
        List<Rendering.Occurrence> variables = new ArrayList<>();
        List<String> included = new ArrayList<>();
        Deque<String> stack = new ArrayDeque<>();
        stack.push(template.path());
        List<String> pieces = new ArrayList<>();
        for (Message message : template.messages()) {
            pieces.clear();
            append(template, template, message.segments(), samples, pieces, variables, included, stack);
            texts.add(joined(pieces));
        }
        return new Rendering(texts, variables, included);
    }

    /**
     * The pieces as one string. {@code String.join} sizes the result exactly, with the narrowest
     * encoding all pieces fit, and fills it once; a {@code StringBuilder} grew and widened as it went
     * and was copied again at the end, which made rendering the largest source of garbage in a scan
     * (and the collector stops both threads).
     */
    private static String joined(List<String> pieces) {
        return pieces.size() == 1 ? pieces.get(0) : String.join("", pieces);
    }

    private void append(Template root, Template owner, List<Segment> segments, boolean samples, List<String> out,
                        List<Rendering.Occurrence> variables, List<String> included, Deque<String> stack) {
        for (Segment segment : segments) {
            if (segment instanceof Segment.Text text) {
                out.add(text.text());
            } else if (segment instanceof Segment.PerCall part) {
                Optional<VariableSpec> spec = root.meta().variable(part).or(() -> owner.meta().variable(part));
                variables.add(new Rendering.Occurrence(part, owner.path(), spec));
                if (samples) {
                    spec.flatMap(VariableSpec::sample).ifPresent(out::add);
                }
            } else if (segment instanceof Segment.Include include) {
                Template partial;
                try {
                    partial = includes.resolve(include, owner);
                } catch (TareException e) {
                    throw within(owner, root, e);
                }
                if (stack.contains(partial.path())) {
                    throw new TareException("include cycle: " + chain(stack, partial.path())
                            + " (line " + include.span().line() + " of " + owner.path() + ")");
                }
                if (stack.size() > MAX_INCLUDE_DEPTH) {
                    throw new TareException("includes nested deeper than " + MAX_INCLUDE_DEPTH + " levels at line "
                            + include.span().line() + " of " + owner.path());
                }
                included.add(partial.path());
                stack.push(partial.path());
                for (Message message : partial.messages()) {
                    append(root, partial, message.segments(), samples, out, variables, included, stack);
                }
                stack.pop();
            }
        }
    }

    private static TareException within(Template owner, Template root, TareException e) {
        if (owner == root) {
            return e;
        }
        return new TareException(owner.path() + ", " + e.getMessage(), e);
    }

    private static String chain(Deque<String> stack, String repeated) {
        List<String> order = new ArrayList<>(stack);
        java.util.Collections.reverse(order);
        order.add(repeated);
        return order.stream().collect(Collectors.joining(" -> "));
    }
}
