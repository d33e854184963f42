package dev.tare.app;

import dev.tare.TareException;
import dev.tare.lint.LintContext;
import dev.tare.lint.MessageView;
import dev.tare.lint.TemplateView;
import dev.tare.template.Message;
import dev.tare.template.Renderer;
import dev.tare.template.Rendering;
import dev.tare.template.Segment;
import dev.tare.template.Template;
import dev.tare.template.TemplateKind;
import dev.tare.tokenize.Tokenizer;
import java.util.ArrayList;
import java.util.List;

/**
 * Counts the static tokens of each line of a template's file: every piece of literal text is
 * placed on the file line it was read from (through the rules' mapping from message content to the
 * file, so chat files are placed too) and counted on its own; an include's pasted text counts on the
 * include's line; a tool definition counts on the line where it starts.
 */
final class LineCounter {
    private final Tokenizer tokenizer;
    private final Renderer renderer;
    private final LintContext context;

    LineCounter(Tokenizer tokenizer, Renderer renderer, LintContext context) {
        this.tokenizer = tokenizer;
        this.renderer = renderer;
        this.context = context;
    }

    TemplateLines count(Template template) {
        TemplateView text = context.text(template);
        String source = template.source();
        int lineCount = text.lineOfSource(source.length());
        if (lineCount > 1 && text.lineStart(lineCount) == source.length()) {
            lineCount--;
        }
        int[] tokens = new int[lineCount + 2];
        boolean[] prompt = new boolean[lineCount + 2];
        List<List<String>> includes = new ArrayList<>();
        for (int i = 0; i < lineCount + 2; i++) {
            includes.add(new ArrayList<>());
        }
        if (template.kind() == TemplateKind.TOOLS) {
            for (Message message : template.messages()) {
                int line = message.segments().get(0).span().line();
                tokens[line] += tokenizer.count(message.content());
                prompt[line] = true;
            }
        } else {
            int base = template.isChat() ? 0 : template.bodyStart();
            for (MessageView message : text.messages()) {
                for (Segment segment : message.message().segments()) {
                    int from = segment.span().start() - base;
                    int to = segment.span().end() - base;
                    int first = text.line(message, from);
                    int last = text.line(message, Math.max(from, to - 1));
                    for (int line = first; line <= last; line++) {
                        prompt[line] = true;
                    }
                    if (segment instanceof Segment.Text literal) {
                        place(text, message, literal, from, to, tokens);
                    } else if (segment instanceof Segment.Include include) {
                        Rendering pasted = pasted(template, message.message(), include);
                        tokens[first] += pasted.messages().stream().mapToInt(tokenizer::count).sum();
                        pasted.includes().stream().findFirst().ifPresent(includes.get(first)::add);
                    }
                }
            }
        }
        List<TemplateLines.Line> lines = new ArrayList<>();
        for (int line = 1; line <= lineCount; line++) {
            lines.add(new TemplateLines.Line(line, lineText(text, source, line), tokens[line], prompt[line],
                    includes.get(line)));
        }
        return new TemplateLines(template.path(), lines);
    }

    /** Counts a literal's text line by line, or on its first line when escapes make it differ from the source. */
    private void place(TemplateView text, MessageView message, Segment.Text literal, int from, int to, int[] tokens) {
        String rendered = literal.text();
        if (rendered.length() != to - from) {
            tokens[text.line(message, from)] += tokenizer.count(rendered);
            return;
        }
        int pieceStart = 0;
        int pieceLine = text.line(message, from);
        for (int i = 1; i <= rendered.length(); i++) {
            int line = i < rendered.length() ? text.line(message, from + i) : -1;
            if (line != pieceLine) {
                tokens[pieceLine] += tokenizer.count(rendered.substring(pieceStart, i));
                pieceStart = i;
                pieceLine = line;
            }
        }
    }

    /** The text an include pastes in, rendered with every variable empty, as the scan measured it. */
    private Rendering pasted(Template owner, Message message, Segment.Include include) {
        Template alone = new Template(owner.path(), owner.kind(), owner.meta(),
                List.of(new Message(message.role(), message.content(), List.of(include))), owner.source(),
                owner.bodyStart(), owner.syntax());
        try {
            return renderer.renderStatic(alone);
        } catch (TareException e) {
            return new Rendering(List.of(), List.of(), List.of());
        }
    }

    private static String lineText(TemplateView text, String source, int line) {
        int start = text.lineStart(line);
        int end = text.lineStart(line + 1);
        String raw = source.substring(start, Math.max(start, end));
        if (raw.endsWith("\r\n")) {
            return raw.substring(0, raw.length() - 2);
        }
        return raw.endsWith("\n") || raw.endsWith("\r") ? raw.substring(0, raw.length() - 1) : raw;
    }
}
