package dev.tare.calibrate;

/**
 * The constants that turn Tare's local count of a call into what the provider reports:
 * {@code reported ≈ scale × text tokens + message overhead × messages + reply overhead + tool overhead × tools}.
 *
 * @param scale                 multiplier on counted text tokens (messages' text and tools' minified JSON)
 * @param messageOverheadTokens tokens the chat format adds per message
 * @param replyOverheadTokens   tokens the chat format adds once per call
 * @param toolOverheadTokens    tokens the provider adds per tool definition
 */
public record Calibration(double scale, int messageOverheadTokens, int replyOverheadTokens, int toolOverheadTokens) {
    /** No correction at all. */
    public static final Calibration NONE = new Calibration(1.0, 0, 0, 0);

    /** The input tokens this calibration predicts for a sample. */
    public double predict(UsageSample sample) {
        return scale * sample.textTokens() + messageOverheadTokens * (double) sample.messages() + replyOverheadTokens
                + toolOverheadTokens * (double) sample.tools();
    }
}
