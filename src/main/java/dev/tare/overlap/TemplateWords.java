package dev.tare.overlap;

import dev.tare.template.Message;
import dev.tare.template.Segment;
import dev.tare.template.Template;
import java.util.List;

/**
 * A template's literal text as a stream of words (runs of characters that are not whitespace) and
 * breaks. Shared blocks are runs of equal words, so copies that differ only in whitespace (spaces,
 * tabs, where lines are broken, blank lines) are the same block. A break stands at the start of each
 * message and at every variable, include and tag, so no block spans a placeholder or two messages:
 * a block is literal text that can be moved into a partial as it is.
 */
final class TemplateWords {
    private TemplateWords() {
    }

    /** Receives the stream. */
    interface Sink {
        /** A break: the start of a message, or a placeholder. */
        void separator();

        /**
         * A word at {@code [start, end)} of message {@code message}'s content.
         *
         * @param gap the tokens the whitespace between it and the word before it likely costs beyond
         *            one space: one for a line break, one more for indentation or a run of spaces
         *            (0 after a break)
         */
        void word(int message, int start, int end, int gap);
    }

    /** Walks the words and breaks of every message of {@code template}, in order. */
    static void walk(Template template, Sink sink) {
        int base = template.isChat() ? 0 : template.bodyStart();
        List<Message> messages = template.messages();
        for (int m = 0; m < messages.size(); m++) {
            Message message = messages.get(m);
            String content = message.content();
            sink.separator();
            boolean broken = true;
            for (Segment segment : message.segments()) {
                if (!(segment instanceof Segment.Text)) {
                    if (!broken) {
                        sink.separator();
                        broken = true;
                    }
                    continue;
                }
                int from = Math.max(0, segment.span().start() - base);
                int to = Math.min(content.length(), segment.span().end() - base);
                boolean newline = false;
                int spaces = 0;
                int i = from;
                while (i < to) {
                    char c = content.charAt(i);
                    if (isBlank(c)) {
                        if (c == '\n' || c == '\r') {
                            newline = true;
                            spaces = 0;
                        } else {
                            spaces++;
                        }
                        i++;
                        continue;
                    }
                    int start = i;
                    while (i < to && !isBlank(content.charAt(i))) {
                        i++;
                    }
                    int gap = (newline ? 1 : 0) + (spaces > 1 || newline && spaces > 0 ? 1 : 0);
                    sink.word(m, start, i, broken ? 0 : gap);
                    broken = false;
                    newline = false;
                    spaces = 0;
                }
            }
        }
    }

    /** Whitespace as Unicode counts it, no-break spaces included. */
    static boolean isBlank(char c) {
        return Character.isWhitespace(c) || Character.isSpaceChar(c);
    }
}
