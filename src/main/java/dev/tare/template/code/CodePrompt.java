package dev.tare.template.code;

import dev.tare.template.ContentOrigin;
import dev.tare.template.Message;
import dev.tare.template.Segment;
import dev.tare.template.Span;
import dev.tare.template.TemplateMeta;
import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;

/**
 * A prompt written as string literals in source code: the literal, or the literals joined into one
 * value (adjacent literals, {@code +}, format calls), with where it stands and what it was found by.
 *
 * @param name     the variable, key or call it was found in ({@code SYSTEM_PROMPT}, {@code messages.content},
 *                 {@code client.chat}), or what its {@code tare:} comment names
 * @param role     the chat role it speaks in, when the code says one ({@code "role": "system"} beside it,
 *                 a {@code system} key or argument, a call such as {@code SystemMsg(...)})
 * @param line     1-based file line of its first literal (or of the expression joined before it)
 * @param column   1-based column (UTF-16 code units) there
 * @param start    file offset there: where the literals and what is joined to them start
 * @param end      file offset just past them and the string methods called on them; calls around them
 *                 (a format call, dedent) lie outside
 * @param value    the decoded value: escapes interpreted, literals joined, each variable shown as written
 * @param parts    the text and variables of the value, in order, covering it without gaps
 * @param map      where each character of the value is written in the file
 * @param meta     the settings of its {@code tare:} comment, as front matter would give them
 * @param settings every {@code key=value} of its {@code tare:} comment as written, known keys or not
 */
public record CodePrompt(String name, Optional<String> role, int line, int column, int start, int end, String value,
                         List<CodePart> parts, ValueMap map, TemplateMeta meta, Map<String, String> settings) {
    public CodePrompt {
        parts = List.copyOf(parts);
        settings = Map.copyOf(settings);
    }

    /** The maximal runs of the value that the file holds character for character. */
    public List<ValueMap.Run> oneToOne() {
        return map.runs();
    }

    /** The names of its variables, in order of first use. */
    public Set<String> variableNames() {
        Set<String> names = new LinkedHashSet<>();
        for (CodePart part : parts) {
            part.variable().ifPresent(names::add);
        }
        return names;
    }

    /**
     * The prompt as one message of a template: its role (or {@value Message#TEXT_ROLE}), its value as
     * the content, and its {@link #segments(String) segments}, from a literal named {@code unique}
     * (its name, made unique in the file) whose map places findings and edits in the file.
     */
    public Message message(String source, String unique) {
        return new Message(role.orElse(Message.TEXT_ROLE), value, segments(source),
                new ContentOrigin.Literal(unique, line, column, map, meta));
    }

    /**
     * The value as template segments, for a {@code Message} whose content is {@link #value()}: spans
     * are offsets in the value (as for a chat message's content) with the file's line and column, and
     * a variable's source is what the file writes for it.
     */
    public List<Segment> segments(String source) {
        List<Segment> segments = new ArrayList<>();
        int k = 0;
        while (k < parts.size()) {
            CodePart part = parts.get(k);
            if (part.isVariable()) {
                String written = source.substring(part.sourceStart(), part.sourceEnd());
                segments.add(new Segment.Variable(part.variable().get(), written,
                        new Span(part.valueStart(), part.valueEnd(), part.line(), part.column())));
                k++;
                continue;
            }
            int last = k;
            while (last + 1 < parts.size() && !parts.get(last + 1).isVariable()) {
                last++;
            }
            int valueEnd = parts.get(last).valueEnd();
            segments.add(new Segment.Text(value.substring(part.valueStart(), valueEnd),
                    new Span(part.valueStart(), valueEnd, part.line(), part.column())));
            k = last + 1;
        }
        return segments;
    }
}
