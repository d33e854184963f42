package dev.tare.template;

import java.util.List;
import java.util.Optional;

/**
 * One tool (function) definition from a tool file, as sent with calls.
 *
 * @param name        the tool's name
 * @param description its description, when it has one
 * @param json        the whole definition as minified JSON: what is counted
 * @param parameters  its parameters, flattened from the JSON Schema ({@code properties}, nested ones too)
 * @param line        the file line the definition starts on
 */
public record ToolDefinition(String name, Optional<String> description, String json, List<Parameter> parameters,
                             int line) {
    public ToolDefinition {
        parameters = List.copyOf(parameters);
    }

    /**
     * One parameter of a tool.
     *
     * @param path        its dotted path in the schema ({@code address.street})
     * @param description its description, when it has one
     * @param enumValues  the values of its {@code enum}, as text, when it has one
     * @param line        the file line it stands on
     */
    public record Parameter(String path, Optional<String> description, List<String> enumValues, int line) {
        public Parameter {
            enumValues = List.copyOf(enumValues);
        }
    }
}
