package dev.tare.template;

import dev.tare.TareException;
import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.Collections;
import java.util.Deque;
import java.util.HashMap;
import java.util.IdentityHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalInt;
import java.util.Set;
import java.util.stream.Collectors;

/**
 * Renders templates as Tare measures them: includes are pasted in (refusing cycles and runaway
 * depth), each variable or function call becomes either nothing or its declared sample, and the blocks of
 * double-brace templates are followed along one path. A loop's body renders once per expected item
 * (its iterable's declared {@code items}, else 1); of a conditional's branches (an {@code if} without
 * {@code else} has an empty one) the path takes the longest or the shortest. Branches are weighed by
 * characters, not tokens, since this layer does not tokenize: the characters of their text with
 * samples, a declared token size counting as {@value #CHARACTERS_PER_TOKEN} characters. Macros render
 * where they are called, a captured {@code set} where its name is used, and names bound by a loop,
 * a macro or {@code set} stand for what they were bound to.
 */
public final class Renderer {
    /** Includes nested deeper than this are refused as runaway. */
    public static final int MAX_INCLUDE_DEPTH = 32;
    /** The most characters a rendering may reach, so that loops declared with many items cannot exhaust memory. */
    public static final int MAX_CHARACTERS = 1 << 25;
    /** What a declared token weighs, in characters, when branches are compared (a common rule of thumb for English prose). */
    static final int CHARACTERS_PER_TOKEN = 4;
    /** Macro calls and captured texts nested deeper than this render nothing. */
    private static final int MAX_NESTING = 32;

    /** Which branch of each conditional a rendering takes. */
    public enum Path {
        /** The heaviest branch: what estimates and budgets use. */
        LONGEST,
        /** The lightest branch, an empty one when a conditional has no else. */
        SHORTEST
    }

    private final IncludeResolver includes;

    public Renderer(IncludeResolver includes) {
        this.includes = includes;
    }

    /** The template on its longest path with every variable empty: what the template itself costs. */
    public Rendering renderStatic(Template template) {
        return render(template, Path.LONGEST).empty();
    }

    /** The template on its longest path with each variable and call replaced by its declared sample, or empty when it has none. */
    public Rendering renderWithSamples(Template template) {
        return render(template, Path.LONGEST).samples();
    }

    /** The template along {@code path}, with every variable empty and with samples. */
    public RenderedPath render(Template template, Path path) {
        Walk walk = new Walk(template, path);
        List<String> empty = new ArrayList<>();
        List<String> sampled = new ArrayList<>();
        List<Rendering.Occurrence> variables = new ArrayList<>();
        List<String> included = new ArrayList<>();
        List<Rendering.Loop> loops = new ArrayList<>();
        Optional<Rendering.Position> first = Optional.empty();
        boolean branched = false;
        for (Message message : template.messages()) {
            Out out = new Out();
            List<Segment> segments = message.segments();
            walk.run(template, segments, Blocks.of(segments), 0, segments.size(), new Env(null, null), out);
            String text = joined(out.empty);
            empty.add(text);
            sampled.add(out.differs ? joined(out.sampled) : text);
            variables.addAll(out.variables);
            included.addAll(out.includes);
            out.loops.stream().filter(loop -> !loops.contains(loop)).forEach(loops::add);
            if (first.isEmpty() && out.perCallAt >= 0) {
                first = Optional.of(new Rendering.Position(empty.size() - 1, (int) out.perCallAt));
            }
            branched |= out.branched;
        }
        return new RenderedPath(new Rendering(empty, variables, included, loops, first),
                new Rendering(sampled, variables, included, loops, first), branched);
    }

    /**
     * The pieces as one string. {@code String.join} sizes the result exactly, with the narrowest
     * encoding all pieces fit, and fills it once; a {@code StringBuilder} grew and widened as it went
     * and was copied again at the end, which made rendering the largest source of garbage in a scan
     * (and the collector stops both threads).
     */
    private static String joined(List<String> pieces) {
        return pieces.isEmpty() ? "" : pieces.size() == 1 ? pieces.get(0) : String.join("", pieces);
    }

    /** What a name inside a template stands for while rendering. */
    private sealed interface Binding permits Input, Value, Body, Local {
    }

    /** A template input, by its dotted name. */
    private record Input(String name) implements Binding {
    }

    /** A known text: a string literal. */
    private record Value(String text) implements Binding {
    }

    /** Segments rendered where the name is used: a captured {@code set}, a macro's caller. */
    private record Body(Template owner, List<Segment> segments, Blocks blocks, int from, int to, Env env)
            implements Binding {
    }

    /** A name bound inside the template to something that renders nothing Tare can size ({@code loop.index}). */
    private record Local() implements Binding {
    }

    private static final Local LOCAL = new Local();

    /** A macro: its body and parameters, and the names visible where it was defined. */
    private record Macro(Template owner, List<Segment> segments, Blocks blocks, int from, int to, List<String> params,
                         Env env) {
    }

    /** The names bound at one level of a rendering, and the Handlebars context (the input a block walks). */
    private static final class Env {
        private final Env parent;
        private final String context;
        private final Map<String, Binding> names = new HashMap<>(4);
        private final Map<String, Macro> macros = new HashMap<>(2);

        Env(Env parent, String context) {
            this.parent = parent;
            this.context = context;
        }

        Env child() {
            return new Env(this, context);
        }

        Binding find(String name) {
            for (Env env = this; env != null; env = env.parent) {
                Binding binding = env.names.get(name);
                if (binding != null) {
                    return binding;
                }
            }
            return null;
        }

        Macro macro(String name) {
            for (Env env = this; env != null; env = env.parent) {
                Macro macro = env.macros.get(name);
                if (macro != null) {
                    return macro;
                }
            }
            return null;
        }
    }

    /**
     * Rendered text collected twice, with variables empty and with samples, and what it passed
     * through. A branch renders into its own, so that it can be weighed before it is kept.
     */
    private static final class Out {
        final List<String> empty = new ArrayList<>();
        final List<String> sampled = new ArrayList<>();
        final List<Rendering.Occurrence> variables = new ArrayList<>();
        final List<String> includes = new ArrayList<>();
        final List<Rendering.Loop> loops = new ArrayList<>();
        long emptyChars;
        long sampledChars;
        long declaredTokens;
        boolean differs;
        boolean branched;
        /** The characters of empty text before the first per-call part, or -1. */
        long perCallAt = -1;

        void text(String text) {
            if (!text.isEmpty()) {
                empty.add(text);
                sampled.add(text);
                emptyChars += text.length();
                sampledChars += text.length();
                limit(sampledChars);
            }
        }

        void sample(String text) {
            if (!text.isEmpty()) {
                sampled.add(text);
                sampledChars += text.length();
                differs = true;
                limit(sampledChars);
            }
        }

        void perCall() {
            if (perCallAt < 0) {
                perCallAt = emptyChars;
            }
        }

        long weight() {
            return sampledChars + CHARACTERS_PER_TOKEN * declaredTokens;
        }

        /** Appends {@code part} {@code times} times. */
        void add(Out part, int times) {
            if (times <= 0) {
                return;
            }
            limit(sampledChars + part.sampledChars * times);
            if (perCallAt < 0 && part.perCallAt >= 0) {
                perCallAt = emptyChars + part.perCallAt;
            }
            String emptyText = joined(part.empty);
            String sampledText = part.differs ? joined(part.sampled) : emptyText;
            for (int i = 0; i < times; i++) {
                if (!emptyText.isEmpty()) {
                    empty.add(emptyText);
                }
                if (!sampledText.isEmpty()) {
                    sampled.add(sampledText);
                }
                variables.addAll(part.variables);
                includes.addAll(part.includes);
            }
            part.loops.stream().filter(loop -> !loops.contains(loop)).forEach(loops::add);
            emptyChars += part.emptyChars * times;
            sampledChars += part.sampledChars * times;
            declaredTokens += part.declaredTokens * times;
            differs |= part.differs;
            branched |= part.branched;
        }

        private static void limit(long characters) {
            if (characters > MAX_CHARACTERS) {
                throw new TareException(String.format(java.util.Locale.ROOT,
                        "rendering it would pass %,d characters; declare fewer loop items", MAX_CHARACTERS));
            }
        }
    }

    /** One branch of a block, rendered into its own output with its own names. */
    private interface Branch {
        void render(Env env, Out out);
    }

    /** One rendering of one template: the path it takes and the includes and macros it is inside. */
    private final class Walk {
        private final Template root;
        private final Path path;
        private final Deque<String> stack = new ArrayDeque<>();
        private final Set<Object> active = Collections.newSetFromMap(new IdentityHashMap<>());

        Walk(Template root, Path path) {
            this.root = root;
            this.path = path;
            stack.push(root.path());
        }

        void run(Template owner, List<Segment> segments, Blocks blocks, int from, int to, Env env, Out out) {
            for (int i = from; i < to; i++) {
                Segment segment = segments.get(i);
                if (segment instanceof Segment.Text text) {
                    out.text(text.text());
                } else if (segment instanceof Segment.Variable variable) {
                    variable(owner, variable, env, out);
                } else if (segment instanceof Segment.Call call) {
                    // A function call's output is declared under the function's full name only.
                    perCall(owner, call, call.name(), root.meta().variable(call).or(() -> owner.meta().variable(call)), out);
                } else if (segment instanceof Segment.Include include) {
                    include(owner, include, env, out);
                } else if (segment instanceof Segment.Tag tag) {
                    i = tag(owner, segments, blocks, i, to, tag, env, out);
                }
            }
        }

        /** Renders the tag at {@code at} and returns the index of the last segment it took (a block's close). */
        private int tag(Template owner, List<Segment> segments, Blocks blocks, int at, int to, Segment.Tag tag, Env env,
                        Out out) {
            Control control = tag.control();
            if (control instanceof Control.Literal literal) {
                out.text(literal.text());
            } else if (control instanceof Control.Assign assign) {
                if (!assign.target().isEmpty() && assign.target().indexOf('.') < 0) {
                    env.names.put(assign.target(), resolve(assign.value(), owner, env));
                }
            } else if (control instanceof Control.Call call) {
                call(owner, call.macro(), call.arguments(), LOCAL, env, out);
            } else if (control instanceof Control.Open open) {
                return block(owner, segments, blocks, at, to, tag, open, env, out);
            }
            return at;
        }

        private void variable(Template owner, Segment.Variable variable, Env env, Out out) {
            Binding binding = resolveName(variable.name(), owner, env);
            if (binding instanceof Input input) {
                perCall(owner, variable, input.name(), spec(input.name(), owner), out);
            } else if (binding instanceof Value value) {
                out.text(value.text());
            } else if (binding instanceof Body body) {
                body(body, out);
            }
        }

        /** A variable or call that reads {@code input}: its sample, or nothing and its declared size. */
        private void perCall(Template owner, Segment.PerCall part, String input, Optional<VariableSpec> spec, Out out) {
            out.perCall();
            out.variables.add(new Rendering.Occurrence(part, owner.path(), spec, input));
            if (spec.isPresent() && spec.get().sample().isPresent()) {
                out.sample(spec.get().sample().get());
            } else if (spec.isPresent() && spec.get().tokens().isPresent()) {
                out.declaredTokens += spec.get().tokens().getAsInt();
            }
        }

        private void include(Template owner, Segment.Include include, Env env, Out out) {
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
            out.includes.add(partial.path());
            stack.push(partial.path());
            for (Message message : partial.messages()) {
                List<Segment> segments = message.segments();
                run(partial, segments, Blocks.of(segments), 0, segments.size(), env.child(), out);
            }
            stack.pop();
        }

        /** Renders the block opened at {@code at}; returns the index of its closing tag. */
        private int block(Template owner, List<Segment> segments, Blocks blocks, int at, int to, Segment.Tag tag,
                          Control.Open open, Env env, Out out) {
            List<int[]> parts = new ArrayList<>();
            int start = at;
            int close;
            while (true) {
                int end = blocks.partEnd(start);
                if (end < 0 || end > to) {
                    end = to;
                }
                parts.add(new int[] {start + 1, end});
                if (end >= to || !(segments.get(end) instanceof Segment.Tag next && next.control() instanceof Control.Middle)) {
                    close = end;
                    break;
                }
                start = end;
            }
            int[] body = parts.get(0);
            List<Branch> others = new ArrayList<>();
            for (int[] part : parts.subList(1, parts.size())) {
                others.add((branchEnv, branchOut) -> run(owner, segments, blocks, part[0], part[1], branchEnv, branchOut));
            }
            boolean plainElse = parts.size() > 1 && segments.get(parts.get(parts.size() - 1)[0] - 1) instanceof Segment.Tag last
                    && last.control() instanceof Control.Middle middle && middle.condition().isEmpty();
            switch (open.block()) {
                case LOOP -> loop(owner, segments, blocks, tag, open, body, others, env, out);
                case SECTION -> {
                    List<Branch> branches = new ArrayList<>();
                    branches.add((branchEnv, branchOut) -> loop(owner, segments, blocks, tag, open, body, others, branchEnv,
                            branchOut));
                    branches.addAll(others.isEmpty() ? List.of((e, o) -> { }) : others);
                    choose(branches, env, out);
                }
                case CONDITION, INVERTED -> {
                    List<Branch> branches = new ArrayList<>();
                    branches.add((branchEnv, branchOut) -> run(owner, segments, blocks, body[0], body[1], branchEnv, branchOut));
                    branches.addAll(others);
                    if (!plainElse) {
                        branches.add((e, o) -> { });
                    }
                    choose(branches, env, out);
                }
                case WITH -> {
                    List<Branch> branches = new ArrayList<>();
                    branches.add((branchEnv, branchOut) -> {
                        Binding subject = resolve(open.subject(), owner, branchEnv);
                        Env inner = new Env(branchEnv, subject instanceof Input input ? input.name() : branchEnv.context);
                        open.names().forEach(name -> inner.names.put(name, subject));
                        run(owner, segments, blocks, body[0], body[1], inner, branchOut);
                    });
                    branches.addAll(others.isEmpty() ? List.of((e, o) -> { }) : others);
                    choose(branches, env, out);
                }
                case SCOPE -> {
                    if (others.isEmpty()) {
                        Env inner = env.child();
                        for (String assignment : open.names()) {
                            String name = Expression.argumentName(assignment);
                            if (name != null) {
                                inner.names.put(name, resolve(Expression.argumentValue(assignment), owner, env));
                            }
                        }
                        run(owner, segments, blocks, body[0], body[1], inner, out);
                    } else {
                        List<Branch> branches = new ArrayList<>();
                        branches.add((branchEnv, branchOut) -> run(owner, segments, blocks, body[0], body[1], branchEnv,
                                branchOut));
                        branches.addAll(others);
                        choose(branches, env, out);
                    }
                }
                case CAPTURE -> {
                    if (!open.names().isEmpty()) {
                        env.names.put(open.names().get(0), new Body(owner, segments, blocks, body[0], body[1], env));
                    }
                }
                case MACRO -> {
                    if (!open.subject().isEmpty()) {
                        env.macros.put(open.subject(), new Macro(owner, segments, blocks, body[0], body[1], open.names(), env));
                    }
                }
                case CALL -> {
                    Body caller = new Body(owner, segments, blocks, body[0], body[1], env);
                    if (env.macro(open.subject()) == null) {
                        body(caller, out);
                    } else {
                        call(owner, open.subject(), open.arguments(), caller, env, out);
                    }
                }
                case HIDDEN -> {
                }
                default -> throw new IllegalStateException(open.block().name());
            }
            return close;
        }

        /**
         * A loop: its body once per expected item, in a scope where its variables stand for the
         * iterable (and, for Handlebars and Mustache, where the item is the context); its else
         * branch when no item is expected.
         */
        private void loop(Template owner, List<Segment> segments, Blocks blocks, Segment.Tag tag, Control.Open open,
                          int[] body, List<Branch> others, Env env, Out out) {
            out.perCall();
            Binding iterable = resolve(open.subject(), owner, env);
            String input = iterable instanceof Input in ? in.name() : null;
            OptionalInt declared = input == null ? OptionalInt.empty() : items(input, owner);
            int items = declared.orElse(1);
            boolean handlebars = tag.source().startsWith("{{");
            String variable = open.names().isEmpty() ? "this" : String.join(", ", open.names());
            Rendering.Loop loop = new Rendering.Loop(variable, input != null ? input : open.subject().strip(), items,
                    declared.isPresent(), owner.path(), tag.span().line());
            if (!out.loops.contains(loop)) {
                out.loops.add(loop);
            }
            if (items > 0) {
                Env inner = new Env(env, handlebars ? input : env.context);
                Binding item = input != null ? new Input(input) : LOCAL;
                open.names().forEach(name -> inner.names.put(name, item));
                if (!handlebars) {
                    inner.names.put("loop", LOCAL);
                }
                Out once = new Out();
                run(owner, segments, blocks, body[0], body[1], inner, once);
                if (once.sampledChars * items > MAX_CHARACTERS) {
                    throw new TareException(String.format(java.util.Locale.ROOT,
                            "line %d: the loop over '%s' with %,d items would render more than %,d characters;"
                                    + " declare fewer items", tag.span().line(), loop.iterable(), items, MAX_CHARACTERS));
                }
                out.add(once, items);
            } else {
                for (Branch other : others) {
                    other.render(env.child(), out);
                }
            }
        }

        /** Renders each branch apart and keeps the longest or the shortest, with the names it set. */
        private void choose(List<Branch> branches, Env env, Out out) {
            out.perCall();
            Out best = null;
            Env bestEnv = null;
            for (Branch branch : branches) {
                Env branchEnv = env.child();
                Out branchOut = new Out();
                branch.render(branchEnv, branchOut);
                boolean better = best == null || (path == Path.LONGEST
                        ? branchOut.weight() > best.weight() : branchOut.weight() < best.weight());
                if (better) {
                    best = branchOut;
                    bestEnv = branchEnv;
                }
            }
            out.add(best, 1);
            env.names.putAll(bestEnv.names);
            env.macros.putAll(bestEnv.macros);
            out.branched |= branches.size() > 1;
        }

        private void call(Template owner, String name, List<String> arguments, Binding caller, Env env, Out out) {
            Macro macro = env.macro(name);
            if (macro == null || active.contains(macro) || active.size() >= MAX_NESTING) {
                return;
            }
            Env inner = new Env(macro.env(), macro.env().context);
            List<String> positional = new ArrayList<>();
            Map<String, String> named = new HashMap<>();
            for (String argument : arguments) {
                String key = Expression.argumentName(argument);
                if (key == null) {
                    positional.add(argument);
                } else {
                    named.put(key, Expression.argumentValue(argument));
                }
            }
            for (int k = 0; k < macro.params().size(); k++) {
                String param = macro.params().get(k);
                String key = Expression.argumentName(param);
                String parameter = key != null ? key : param.strip();
                String given = named.containsKey(parameter) ? named.get(parameter) : k < positional.size() ? positional.get(k) : null;
                Binding value = given != null ? resolve(given, owner, env)
                        : key != null ? resolve(Expression.argumentValue(param), macro.owner(), macro.env()) : LOCAL;
                inner.names.put(parameter, value);
            }
            inner.names.put("caller", caller);
            inner.names.put("varargs", LOCAL);
            inner.names.put("kwargs", LOCAL);
            active.add(macro);
            try {
                run(macro.owner(), macro.segments(), macro.blocks(), macro.from(), macro.to(), inner, out);
            } finally {
                active.remove(macro);
            }
        }

        private void body(Body body, Out out) {
            if (active.contains(body) || active.size() >= MAX_NESTING) {
                return;
            }
            active.add(body);
            try {
                run(body.owner(), body.segments(), body.blocks(), body.from(), body.to(), body.env().child(), out);
            } finally {
                active.remove(body);
            }
        }

        /** What an expression stands for: a string literal, else the variable it reads, resolved. */
        private Binding resolve(String expression, Template owner, Env env) {
            String literal = Expression.literal(expression);
            if (literal != null) {
                return new Value(literal);
            }
            String name = Expression.variable(expression, Set.of());
            return name == null ? LOCAL : resolveName(name, owner, env);
        }

        /**
         * What a dotted name stands for: a name bound in the template, with the rest of the path
         * appended; inside a Handlebars or Mustache block, {@code this} and undeclared names read the
         * block's item; else the input of that name.
         */
        private Binding resolveName(String name, Template owner, Env env) {
            String first = Expression.root(name);
            String rest = name.substring(first.length());
            if (first.equals("this")) {
                return new Input(env.context == null ? name : env.context + rest);
            }
            Binding bound = env.find(first);
            if (bound != null) {
                if (rest.isEmpty()) {
                    return bound;
                }
                return bound instanceof Input input ? new Input(input.name() + rest) : LOCAL;
            }
            if (env.context != null && !declared(first, owner)) {
                return new Input(env.context + "." + name);
            }
            return new Input(name);
        }

        private boolean declared(String name, Template owner) {
            return declares(root, name) || declares(owner, name);
        }

        /**
         * The declaration of an input: under its full dotted name, else under each shorter prefix
         * ({@code history.text}, then {@code history}); the rendered template's first, then the owner's.
         */
        private Optional<VariableSpec> spec(String name, Template owner) {
            Optional<VariableSpec> spec = lookUp(root, name);
            return spec.isPresent() || owner == root ? spec : lookUp(owner, name);
        }

        /** The items declared for a loop's iterable, under exactly its name. */
        private OptionalInt items(String name, Template owner) {
            VariableSpec spec = root.meta().variables().get(name);
            if ((spec == null || spec.items().isEmpty()) && owner != root) {
                spec = owner.meta().variables().get(name);
            }
            return spec == null ? OptionalInt.empty() : spec.items();
        }
    }

    private static boolean declares(Template template, String name) {
        for (String key : template.meta().variables().keySet()) {
            if (key.equals(name) || key.startsWith(name + ".")) {
                return true;
            }
        }
        return false;
    }

    private static Optional<VariableSpec> lookUp(Template template, String name) {
        Map<String, VariableSpec> declared = template.meta().variables();
        if (declared.isEmpty()) {
            return Optional.empty();
        }
        for (String n = name; ; n = n.substring(0, n.lastIndexOf('.'))) {
            VariableSpec spec = declared.get(n);
            if (spec != null) {
                return Optional.of(spec);
            }
            if (n.indexOf('.') < 0) {
                return Optional.empty();
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
        Collections.reverse(order);
        order.add(repeated);
        return order.stream().collect(Collectors.joining(" -> "));
    }
}
