package dev.tare.footprint;


/** The tokens a target's chat format adds around a chat template's messages. */
public final class Framing {
    private Framing() {
    }

    /**
     * Framing tokens for a call: {@code messages × message_overhead_tokens + reply_overhead_tokens}
     * for a chat template, none for a text template (whose wrapping the application decides).
     */
    public static int tokens(Target target, boolean chat, int messages) {
        if (!chat) {
            return 0;
        }
        return messages * target.messageOverheadTokens() + target.replyOverheadTokens();
    }

    /** The tokens a provider adds around {@code tools} tool definitions: {@code tools × tool_overhead_tokens}. */
    public static int toolTokens(Target target, int tools) {
        return tools * target.toolOverheadTokens();
    }
}
