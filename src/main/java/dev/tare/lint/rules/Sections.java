package dev.tare.lint.rules;

import dev.tare.TareException;
import dev.tare.footprint.Estimates;
import dev.tare.lint.LintContext;
import dev.tare.lint.MessageView;
import dev.tare.lint.TemplateView;
import dev.tare.structure.Region;
import dev.tare.structure.Role;
import dev.tare.template.Message;
import dev.tare.template.Segment;
import dev.tare.template.Template;
import dev.tare.tokenize.Tokenizer;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.regex.Pattern;

/**
 * Splits a template into sections for the budget message: one per Markdown heading (the text before
 * the first heading is a section too), and one per message of a chat file with several messages.
 * A section's tokens are its static text plus the static text of the includes inside it.
 */
final class Sections {
    private static final Pattern HEADING = Pattern.compile("^\\s{0,3}#{1,6}\\s+(.*)$");

    private Sections() {
    }

    /**
     * One section.
     *
     * @param label     its heading, or a description of where it is
     * @param firstLine the file line it starts on
     * @param lastLine  the file line it ends on
     * @param tokens    its static tokens, includes pasted in
     */
    record Section(String label, int firstLine, int lastLine, int tokens) {
    }

    /** The sections of the template, costliest first (ties by position). */
    static List<Section> costliest(Template template, LintContext context, Tokenizer tokenizer) {
        TemplateView text = context.text(template);
        List<Section> sections = new ArrayList<>();
        for (MessageView message : text.messages()) {
            String prefix = text.messages().size() > 1 ? "message " + (message.index() + 1) + " (" + message.message().role() + ")" : "";
            String content = message.content();
            List<int[]> cuts = new ArrayList<>();
            List<String> labels = new ArrayList<>();
            cuts.add(new int[] {0, 0});
            labels.add(prefix.isEmpty() ? "text before the first heading" : prefix);
            for (ContentLine line : ContentLine.of(content)) {
                var heading = HEADING.matcher(line.text(content));
                if (heading.matches() && !message.touches(line.start(), line.end(), Role.FENCED_CODE)) {
                    cuts.get(cuts.size() - 1)[1] = line.start();
                    cuts.add(new int[] {line.start(), 0});
                    labels.add((prefix.isEmpty() ? "" : prefix + ", ") + "'" + heading.group(1).strip() + "'");
                }
            }
            cuts.get(cuts.size() - 1)[1] = content.length();
            List<Segment.Include> includes = includes(template, message);
            for (int i = 0; i < cuts.size(); i++) {
                int[] cut = cuts.get(i);
                if (cut[1] <= cut[0] && cuts.size() > 1) {
                    continue;
                }
                int tokens = tokens(template, message, includes, cut[0], cut[1], context, tokenizer);
                sections.add(new Section(labels.get(i), text.line(message, cut[0]),
                        text.line(message, Math.max(cut[0], cut[1] - 1)), tokens));
            }
        }
        sections.sort(Comparator.comparingInt(Section::tokens).reversed().thenComparingInt(Section::firstLine));
        return sections;
    }

    /** The includes of {@code message}, sorted by their offset in the content. */
    private static List<Segment.Include> includes(Template template, MessageView message) {
        int base = base(template);
        List<Segment.Include> includes = new ArrayList<>();
        for (Segment segment : message.message().segments()) {
            if (segment instanceof Segment.Include include) {
                includes.add(include);
            }
        }
        includes.sort(Comparator.comparingInt(include -> include.span().start() - base));
        return includes;
    }

    private static int base(Template template) {
        return template.isChat() ? 0 : template.bodyStart();
    }

    private static int tokens(Template template, MessageView message, List<Segment.Include> includes, int start, int end,
                              LintContext context, Tokenizer tokenizer) {
        String content = message.content();
        StringBuilder plain = new StringBuilder();
        int at = start;
        int includeTokens = 0;
        for (Region region : message.touching(start, end, Role.PLACEHOLDER)) {
            plain.append(content, at, Math.max(at, region.start()));
            at = Math.max(at, region.end());
        }
        plain.append(content, Math.min(at, end), end);
        int base = base(template);
        // Sections are many in a long text; only the includes inside this one are visited.
        int low = 0;
        int high = includes.size();
        while (low < high) {
            int mid = (low + high) >>> 1;
            if (includes.get(mid).span().start() - base < start) {
                low = mid + 1;
            } else {
                high = mid;
            }
        }
        for (int i = low; i < includes.size() && includes.get(i).span().start() - base < end; i++) {
            includeTokens += includeTokens(template, message.message(), includes.get(i), context, tokenizer);
        }
        return tokenizer.count(plain.toString()) + includeTokens;
    }

    private static int includeTokens(Template template, Message message, Segment include, LintContext context,
                                     Tokenizer tokenizer) {
        Template alone = new Template(template.path(), template.kind(), template.meta(),
                List.of(new Message(message.role(), ((Segment.Include) include).source(), List.of(include))), template.source(),
                template.bodyStart(), template.syntax());
        try {
            return Estimates.tokens(tokenizer, context.renderer().renderStatic(alone));
        } catch (TareException e) {
            return 0;
        }
    }
}
