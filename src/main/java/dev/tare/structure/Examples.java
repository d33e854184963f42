package dev.tare.structure;

import java.util.HashSet;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.Set;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Worked examples and dialogue, which a prompt shows the model as they are: lines labelled as an
 * example's parts ({@code Input:}, {@code Output:}, {@code Q:}, {@code A:}, {@code User:},
 * {@code Assistant:}, ...), turns of named speakers, the text under a heading that names examples
 * (down to the next heading of its level), and XML-style sections with such a name. A repeated line
 * there is part of the example, not a repeated instruction, and its layout is the example's.
 */
final class Examples {
    private static final Pattern LABEL = Pattern.compile(
            "[ \\t]*(?:>[ \\t]*)?(?:[-*+][ \\t]+|\\d{1,3}[.)][ \\t]+)?(?:\\*\\*|__|\\*|_)?"
                    + "([A-Za-z][A-Za-z0-9]*(?:[ '-][A-Za-z0-9]+){0,2})(?:\\*\\*|__|\\*|_)?[ \\t]*:(?:\\*\\*|__)?([ \\t]+.*|[ \\t]*)");
    private static final Set<String> EXAMPLE_LABELS = Set.of("input", "output", "q", "a", "question", "answer", "user",
            "assistant", "human", "ai", "bot", "customer", "agent", "caller", "example", "response", "query",
            "completion", "expected", "reply", "request", "sample", "transcript");
    private static final Pattern EXAMPLE_WORDS = Pattern.compile(
            "(?i)(?<![A-Za-z])(?:examples?|samples?|demos?|demonstrations?|transcripts?|few-shot|dialogues?|"
                    + "conversations?)(?![A-Za-z])");
    private static final Pattern NUMBERED_EXAMPLE = Pattern.compile("(?:example|sample|input|output) ?\\d{1,3}");
    private static final Pattern SPEAKER = Pattern.compile("[A-Z][A-Za-z0-9'.-]*(?: [A-Z][A-Za-z0-9'.-]*){0,2}");

    private Examples() {
    }

    static void mark(String text, LineSpans lines, Role[] roles, List<MarkdownBlocks.HeadingLine> headings,
                     Optional<String>[] sections) {
        for (int i = 0; i < roles.length; i++) {
            if (sections[i].isPresent() && EXAMPLE_WORDS.matcher(sections[i].get()).find()) {
                toExample(roles, i);
            }
        }
        for (int h = 0; h < headings.size(); h++) {
            MarkdownBlocks.HeadingLine heading = headings.get(h);
            if (!EXAMPLE_WORDS.matcher(heading.text()).find()) {
                continue;
            }
            int end = roles.length;
            for (int k = h + 1; k < headings.size(); k++) {
                if (headings.get(k).level() <= heading.level()) {
                    end = headings.get(k).line();
                    break;
                }
            }
            // Blank lines between the section's last text and the next heading separate, they are not the example's.
            while (end > heading.line() + 1 && roles[end - 1] == Role.BLANK) {
                end--;
            }
            for (int i = heading.line() + 1; i < end; i++) {
                if (roles[i] != Role.HEADING) {
                    toExample(roles, i);
                }
            }
        }
        labelled(text, lines, roles);
    }

    /** Paragraphs from a line labelled as an example's part to their end, and runs of speakers' turns. */
    private static void labelled(String text, LineSpans lines, Role[] roles) {
        String[] labels = new String[roles.length];
        for (int i = 0; i < roles.length; i++) {
            if (prose(roles[i])) {
                Matcher label = LABEL.matcher(text).region(lines.start(i), lines.end(i));
                labels[i] = label.matches() ? label.group(1) : null;
            }
        }
        boolean carry = false;
        int i = 0;
        while (i < roles.length) {
            if (!prose(roles[i])) {
                carry = carry && roles[i] == Role.BLANK;
                i++;
                continue;
            }
            int end = i;
            while (end < roles.length && prose(roles[end])) {
                end++;
            }
            int from = carry ? i : -1;
            Set<String> speakers = new HashSet<>();
            boolean repeatedSpeaker = false;
            int turns = 0;
            for (int k = i; k < end; k++) {
                if (labels[k] == null) {
                    continue;
                }
                if (from < 0 && isExampleLabel(labels[k])) {
                    from = k;
                }
                if (SPEAKER.matcher(labels[k]).matches()) {
                    turns++;
                    repeatedSpeaker |= !speakers.add(labels[k]);
                }
            }
            if (turns >= 3 && speakers.size() >= 2 && repeatedSpeaker) {
                from = from < 0 ? i : Math.min(from, i);
            }
            if (from >= 0) {
                for (int k = from; k < end; k++) {
                    roles[k] = Role.EXAMPLE;
                }
            }
            // A label with nothing after it ("Output:") introduces the paragraph that follows.
            int last = end - 1;
            carry = labels[last] != null && text.substring(lines.start(last), lines.end(last)).strip().endsWith(":")
                    && isExampleLabel(labels[last]);
            i = end;
        }
    }

    private static boolean prose(Role role) {
        return role == Role.PROSE || role == Role.LIST_ITEM || role == Role.QUOTE;
    }

    private static void toExample(Role[] roles, int i) {
        if (!roles[i].isVerbatim()) {
            roles[i] = Role.EXAMPLE;
        }
    }

    /** A label naming an example's part, such as "Input", "A" or "Example 2"; not "Output format", which instructs. */
    private static boolean isExampleLabel(String label) {
        String lower = label.toLowerCase(Locale.ROOT);
        return EXAMPLE_LABELS.contains(lower) || NUMBERED_EXAMPLE.matcher(lower).matches();
    }
}
