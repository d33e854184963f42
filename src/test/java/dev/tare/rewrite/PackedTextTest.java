package dev.tare.rewrite;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.List;
import org.junit.jupiter.api.Test;

/** A fix's texts are kept compressed; each must come back exactly as it was given, whatever it holds. */
class PackedTextTest {
    @Test
    void everyKindOfTextComesBackExactly() {
        String lone = "a lone high surrogate \uD83D then text, and a lone low one \uDE42 too";
        List<String> texts = List.of("", "plain ASCII\r\nwith CRLF\n", "Ferry to Éilis Harbour 🙂 ≥ 3 ½ hours\u00a0",
                lone, "x".repeat(200_000) + "🙂".repeat(10_000), "\u0000\u0001 control characters \uFEFF");
        for (String text : texts) {
            assertEquals(text, PackedText.of(text).text(), () -> "length " + text.length());
        }
    }
}
