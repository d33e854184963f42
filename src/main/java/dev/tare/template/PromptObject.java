package dev.tare.template;

import com.fasterxml.jackson.databind.JsonNode;
import dev.tare.TareException;
import dev.tare.source.YamlDocument;
import java.util.OptionalInt;

/**
 * Serialized prompt objects: YAML or JSON holding a prompt {@code template} string with its
 * {@code input_variables} and a {@code template_format} ({@code f-string}, the default, reads as
 * single-brace; {@code jinja2} and {@code mustache} read as double-brace), or, chat-shaped, a
 * {@code messages} list whose items hold a {@code role} and a {@code prompt} object of that kind.
 */
final class PromptObject {
    private PromptObject() {
    }

    /** Whether a document's root is a serialized prompt object holding one template. */
    static boolean isPromptObject(JsonNode root) {
        return root.isObject() && root.path("template").isTextual() && root.has("input_variables");
    }

    /** Whether a message of a chat-shaped object holds its text as {@code prompt.template}. */
    static boolean isPromptMessage(JsonNode message) {
        return message.path("prompt").path("template").isTextual();
    }

    /**
     * The syntax the {@code template_format} at {@code path} names; f-string when there is none.
     *
     * @throws TareException naming the line when it names a format Tare does not read
     */
    static PlaceholderSyntax syntax(YamlDocument document, String path) {
        JsonNode format = document.at(path);
        if (format.isMissingNode() || format.isNull()) {
            return PlaceholderSyntax.SINGLE_BRACE;
        }
        switch (format.asText()) {
            case "f-string":
                return PlaceholderSyntax.SINGLE_BRACE;
            case "jinja2":
            case "mustache":
                return PlaceholderSyntax.DOUBLE_BRACE;
            default:
                OptionalInt line = document.line(path);
                throw new TareException((line.isPresent() ? "line " + line.getAsInt() + ": " : "")
                        + "template_format must be f-string, jinja2 or mustache (got " + format + ")");
        }
    }
}
