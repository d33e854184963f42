package dev.tare.template;

import com.fasterxml.jackson.databind.JsonNode;
import java.util.Optional;

/**
 * The text of a chat message's {@code content}, as the common chat formats write it: a string, or a
 * list of parts of which the {@code {type: text, text}} ones (and bare strings) carry text. Other
 * parts (images, audio) carry none Tare can count.
 */
public final class ChatContent {
    private ChatContent() {
    }

    /** The content's text: empty text for a missing or null content, empty Optional for any other shape. */
    public static Optional<String> text(JsonNode content) {
        if (content == null || content.isNull() || content.isMissingNode()) {
            return Optional.of("");
        }
        if (content.isTextual()) {
            return Optional.of(content.asText());
        }
        if (!content.isArray()) {
            return Optional.empty();
        }
        StringBuilder text = new StringBuilder();
        for (JsonNode part : content) {
            if (part.isTextual()) {
                text.append(part.asText());
            } else if (part.isObject() && part.path("text").isTextual()) {
                text.append(part.get("text").asText());
            }
        }
        return Optional.of(text.toString());
    }
}
