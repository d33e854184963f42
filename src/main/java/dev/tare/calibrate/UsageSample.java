package dev.tare.calibrate;

/**
 * One call from a usage log, reduced to what the fit needs.
 *
 * @param line                the line of the log it came from
 * @param textTokens          tokens of the messages' text plus the tools' minified JSON, counted locally
 * @param messages            how many messages the call sent
 * @param tools               how many tool definitions the call sent
 * @param reportedInputTokens the input tokens the provider reported for the call
 */
public record UsageSample(int line, int textTokens, int messages, int tools, int reportedInputTokens) {
}
