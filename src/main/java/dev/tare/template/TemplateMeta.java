package dev.tare.template;

import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.OptionalInt;

/**
 * What a template says about itself in front matter (text templates) or beside its messages (chat
 * files and serialized prompt objects). Unknown keys are left to their owners and ignored here.
 *
 * @param target       the name of the target it runs on, when it names one
 * @param budget       its token budget, overriding the configured ones
 * @param outputTokens the output tokens expected per call, overriding the target's
 * @param variables    declared variables in declaration order
 * @param tools        root-relative paths of the tool files sent with every call of this template
 * @param callsPerDay  how often it is called, overriding the configured traffic
 * @param inlineTools  the tool definitions written in the template itself (under {@code tools}, beside
 *                     the paths), sent with every call as the tool files are
 */
public record TemplateMeta(Optional<String> target, OptionalInt budget, OptionalInt outputTokens,
                           Map<String, VariableSpec> variables, java.util.List<String> tools,
                           OptionalDouble callsPerDay, java.util.List<ToolDefinition> inlineTools) {
    /** The meta of a template that declares nothing. */
    public static final TemplateMeta EMPTY =
            new TemplateMeta(Optional.empty(), OptionalInt.empty(), OptionalInt.empty(), Map.of(), java.util.List.of(),
                    OptionalDouble.empty(), java.util.List.of());

    public TemplateMeta {
        variables = java.util.Collections.unmodifiableMap(new LinkedHashMap<>(variables));
        tools = java.util.List.copyOf(tools);
        inlineTools = java.util.List.copyOf(inlineTools);
    }

    /** The same declarations with {@code declared} as the variables. */
    public TemplateMeta withVariables(Map<String, VariableSpec> declared) {
        return new TemplateMeta(target, budget, outputTokens, declared, tools, callsPerDay, inlineTools);
    }

    /**
     * The declaration for a variable, by its full dotted name or else by its first part; for a
     * function call, by the function's full name only, since its first part names a group of functions.
     */
    public Optional<VariableSpec> variable(Segment.PerCall part) {
        VariableSpec spec = variables.get(part.name());
        if (spec == null && part instanceof Segment.Variable variable) {
            spec = variables.get(variable.rootName());
        }
        return Optional.ofNullable(spec);
    }
}
