package dev.tare.lint.rules;

import dev.tare.lint.Edit;
import dev.tare.lint.EditKind;
import dev.tare.lint.Example;
import dev.tare.lint.Finding;
import dev.tare.lint.LintContext;
import dev.tare.lint.MessageView;
import dev.tare.lint.Rule;
import dev.tare.lint.Rewrite;
import dev.tare.lint.RuleDescriptor;
import dev.tare.lint.Severity;
import dev.tare.lint.TemplateView;
import dev.tare.template.Template;
import dev.tare.tokenize.Tokenizer;
import java.text.Normalizer;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;

/**
 * Typographic characters and emoji that have a plain form (arrows, check marks, curly quotes,
 * ellipses, dashes, bullets, decorative emoji) and that cost more tokens than that plain form on a
 * tokenizer the template runs on. Whether a character is flagged is measured, occurrence by
 * occurrence: the tokens of its line with the character and with the plain form, on each of the
 * template's tokenizers. The candidates' plain forms come from a table; the cost never does.
 */
final class CostlyCharacter implements Rule {
    /** Characters of the line measured on each side of the character. */
    private static final int WINDOW = 200;

    private static final Map<Integer, String> PLAIN = Map.ofEntries(
            Map.entry(0x2192, "->"), Map.entry(0x27F6, "->"), Map.entry(0x2794, "->"), Map.entry(0x279C, "->"),
            Map.entry(0x27A1, "->"), Map.entry(0x2190, "<-"), Map.entry(0x27F5, "<-"), Map.entry(0x2B05, "<-"),
            Map.entry(0x21D2, "=>"), Map.entry(0x27F9, "=>"), Map.entry(0x21D0, "<="), Map.entry(0x2194, "<->"),
            Map.entry(0x27F7, "<->"), Map.entry(0x21D4, "<=>"),
            Map.entry(0x201C, "\""), Map.entry(0x201D, "\""), Map.entry(0x201E, "\""), Map.entry(0x201F, "\""),
            Map.entry(0x00AB, "\""), Map.entry(0x00BB, "\""), Map.entry(0x2033, "\""),
            Map.entry(0x2018, "'"), Map.entry(0x2019, "'"), Map.entry(0x201A, "'"), Map.entry(0x201B, "'"),
            Map.entry(0x2032, "'"),
            Map.entry(0x2026, "..."), Map.entry(0x2013, "-"), Map.entry(0x2014, "-"), Map.entry(0x2015, "-"),
            Map.entry(0x2022, "-"), Map.entry(0x2023, "-"), Map.entry(0x25AA, "-"), Map.entry(0x25CF, "-"),
            Map.entry(0x25E6, "-"),
            Map.entry(0x00D7, "x"), Map.entry(0x2265, ">="), Map.entry(0x2264, "<="), Map.entry(0x2260, "!="),
            Map.entry(0x00B1, "+/-"));
    /** Check marks: a bullet at the start of a line, decoration elsewhere. */
    private static final List<Integer> CHECKS = List.of(0x2713, 0x2714, 0x2611, 0x2705);
    private static final List<Integer> WARNINGS = List.of(0x26A0);

    static final RuleDescriptor DESCRIPTOR = RuleDescriptor.builtIn("costly-character", Severity.INFO,
            EditKind.TEXT,
            "A typographic character or emoji that costs more tokens than its plain form on the template's tokenizer.",
            "Tokenizers learn mostly from plain text, so many arrows, check marks, quotes and emoji are split"
                    + " into several byte tokens; the plain form says the same for less on every call.",
            "Use the plain form: -> for arrows, straight quotes, ... for an ellipsis, - for a bullet or dash,"
                    + " and leave decorative emoji out.",
            Example.of("Report the leak \uD83D\uDCA7 and call back.\n", "Report the leak and call back.\n"));

    @Override
    public RuleDescriptor descriptor() {
        return DESCRIPTOR;
    }

    @Override
    public List<Finding> check(Template template, LintContext context) {
        TemplateView text = context.text(template);
        // Asked for at the first candidate, not before: a template in plain ASCII then loads no tokenizer
        // here, which in the pre-commit hook spares loading every target's tokenizer for nothing.
        List<Tokenizer> tokenizers = new ArrayList<>();
        List<Finding> findings = new ArrayList<>();
        for (MessageView message : text.messages()) {
            String content = message.content();
            for (int[] range : message.prose()) {
                int i = range[0];
                while (i < range[1]) {
                    int codePoint = content.codePointAt(i);
                    if (codePoint < 0x80 || Character.isSpaceChar(codePoint) || Character.getType(codePoint) == Character.FORMAT
                            || codePoint == 0x00AD) {
                        i++;
                        continue;
                    }
                    int start = i;
                    int end = Math.min(range[1], clusterEnd(content, i));
                    Optional<Edit> edit = plainEdit(content, i, end, range);
                    if (edit.isPresent()) {
                        if (tokenizers.isEmpty()) {
                            tokenizers.addAll(context.targetTokenizers(template));
                        }
                        // The saving is counted on the tokenizer the message names, where the character
                        // costs most, so that the finding, check and fix agree on that tokenizer.
                        Optional<Cost> cost = measure(content, edit.get(), tokenizers);
                        if (cost.isPresent()) {
                            Optional<Rewrite> rewrite = text.rewrite(message, edit.get(), cost.get().tokenizer());
                            if (rewrite.isPresent() && rewrite.get().savingTokens() > 0) {
                                findings.add(text.finding(DESCRIPTOR, message, start, end,
                                        describe(content.substring(start, end), edit.get(), rewrite.get().savingTokens(),
                                                cost.get().tokenizer().name()), rewrite, List.of()));
                            }
                        }
                    }
                    i = end;
                }
            }
        }
        return findings;
    }

    /** The extra tokens the character costs on the tokenizer where it costs most, when it costs more anywhere. */
    private static Optional<Cost> measure(String content, Edit edit, List<Tokenizer> tokenizers) {
        // The line break is looked for within the window only, so a very long line costs each
        // character its window and not the whole line.
        int from = Math.max(0, edit.start() - WINDOW);
        for (int i = edit.start() - 1; i >= from; i--) {
            if (content.charAt(i) == '\n') {
                from = i + 1;
                break;
            }
        }
        int to = Math.min(content.length(), edit.end() + WINDOW);
        for (int i = edit.end(); i < to; i++) {
            if (content.charAt(i) == '\n') {
                to = i;
                break;
            }
        }
        String before = content.substring(from, to);
        String after = content.substring(from, edit.start()) + edit.replacement() + content.substring(edit.end(), to);
        Cost best = null;
        for (Tokenizer tokenizer : tokenizers) {
            int extra = tokenizer.count(before) - tokenizer.count(after);
            if (extra > 0 && (best == null || extra > best.extra())) {
                best = new Cost(extra, tokenizer);
            }
        }
        return Optional.ofNullable(best);
    }

    private record Cost(int extra, Tokenizer tokenizer) {
    }

    private static String describe(String character, Edit edit, int extra, String tokenizer) {
        String codes = character.codePoints().mapToObj(c -> String.format(Locale.ROOT, "U+%04X", c))
                .reduce((a, b) -> a + " " + b).orElse("");
        String plain = edit.replacement().strip();
        return "'" + character + "' (" + codes + ") costs " + extra + (extra == 1 ? " token" : " tokens")
                + " more here than " + (plain.isEmpty() ? "leaving it out" : "'" + plain + "'") + " on " + tokenizer;
    }

    /** The edit to the plain form of the character at {@code [start, end)}, when it has one. */
    private static Optional<Edit> plainEdit(String content, int start, int end, int[] range) {
        int codePoint = content.codePointAt(start);
        String plain = PLAIN.get(codePoint);
        if (plain != null) {
            return Optional.of(new Edit(start, end, plain));
        }
        boolean lineStart = atLineStart(content, start);
        if (CHECKS.contains(codePoint)) {
            return lineStart ? Optional.of(new Edit(start, end, "-")) : Optional.of(dropped(content, start, end, range));
        }
        if (WARNINGS.contains(codePoint)) {
            return Optional.of(new Edit(start, end, lineStart ? "Warning:" : "warning"));
        }
        String folded = Normalizer.normalize(content.substring(start, end), Normalizer.Form.NFKC);
        if (!folded.equals(content.substring(start, end)) && folded.chars().allMatch(c -> c >= 0x20 && c < 0x7F)) {
            return Optional.of(new Edit(start, end, folded));
        }
        if (isEmoji(codePoint)) {
            return Optional.of(dropped(content, start, end, range));
        }
        return Optional.empty();
    }

    /** Leaves the character out, with the space before it (or after it, at the start of a line). */
    private static Edit dropped(String content, int start, int end, int[] range) {
        if (start > range[0] && content.charAt(start - 1) == ' ') {
            return new Edit(start - 1, end, "");
        }
        if (end < range[1] && content.charAt(end) == ' ') {
            return new Edit(start, end + 1, "");
        }
        return new Edit(start, end, "");
    }

    private static boolean atLineStart(String content, int offset) {
        for (int i = offset - 1; i >= 0; i--) {
            char c = content.charAt(i);
            if (c == '\n' || c == '\r') {
                return true;
            }
            if (c != ' ' && c != '\t') {
                return false;
            }
        }
        return true;
    }

    private static boolean isEmoji(int codePoint) {
        return (codePoint >= 0x1F300 && codePoint <= 0x1FAFF) || (codePoint >= 0x2600 && codePoint <= 0x27BF)
                || (codePoint >= 0x1F000 && codePoint <= 0x1F2FF);
    }

    /** The end of the character at {@code start} with its variation selectors, skin tones and joined parts. */
    static int clusterEnd(String content, int start) {
        int i = start + Character.charCount(content.codePointAt(start));
        while (i < content.length()) {
            int next = content.codePointAt(i);
            if (next == 0xFE0F || next == 0xFE0E || next == 0x20E3 || (next >= 0x1F3FB && next <= 0x1F3FF)) {
                i += Character.charCount(next);
            } else if (next == 0x200D && i + 1 < content.length() && isEmoji(content.codePointAt(i + 1))) {
                i += 1 + Character.charCount(content.codePointAt(i + 1));
            } else {
                break;
            }
        }
        return i;
    }
}
