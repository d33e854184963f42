package dev.tare.lint.rules;

import dev.tare.lint.Edit;
import dev.tare.lint.Example;
import dev.tare.lint.Finding;
import dev.tare.lint.LintContext;
import dev.tare.lint.MessageText;
import dev.tare.lint.RewriteClass;
import dev.tare.lint.Rule;
import dev.tare.lint.RuleDescriptor;
import dev.tare.lint.Severity;
import dev.tare.lint.TemplateText;
import dev.tare.template.Template;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * Characters that show nothing or look like a plain space: zero-width spaces and joiners, word
 * joiners, soft hyphens, byte-order marks inside the text, and no-break spaces. A zero-width joiner
 * inside an emoji sequence, and a zero-width non-joiner between letters of scripts that use it, carry
 * meaning and are left alone.
 */
final class InvisibleCharacter implements Rule {
    static final RuleDescriptor DESCRIPTOR = RuleDescriptor.builtIn("invisible-character", Severity.WARNING,
            RewriteClass.SAFE,
            "Invisible characters: zero-width spaces and joiners, soft hyphens, stray byte-order marks and no-break spaces.",
            "They are invisible in an editor, yet each costs tokens on every call, and inside a word it splits"
                    + " the word into rarer, costlier pieces.",
            "Delete the invisible character, or type a plain space for a no-break space.",
            Example.of("Confirm the ad\u200Bjustment with the cus\u00ADtomer.\u00A0Then close.\n",
                    "Confirm the adjustment with the customer. Then close.\n"));

    @Override
    public RuleDescriptor descriptor() {
        return DESCRIPTOR;
    }

    @Override
    public List<Finding> check(Template template, LintContext context) {
        TemplateText text = context.text(template);
        List<Finding> findings = new ArrayList<>();
        for (MessageText message : text.messages()) {
            String content = message.content();
            for (int[] range : message.prose()) {
                for (int i = range[0]; i < range[1]; i++) {
                    char c = content.charAt(i);
                    String replacement = replacement(content, i);
                    if (replacement == null) {
                        continue;
                    }
                    findings.add(text.finding(DESCRIPTOR, message, i, i + 1,
                            name(c) + " (U+" + String.format(Locale.ROOT, "%04X", (int) c) + ") "
                                    + (replacement.isEmpty() ? "shows nothing; delete it" : "looks like a space; type a plain space"),
                            text.rewrite(message, List.of(new Edit(i, i + 1, replacement)), context.tokenizer(template)),
                            List.of()));
                }
            }
        }
        return findings;
    }

    /** What the character at {@code i} should become, or null when it is not an invisible character to fix. */
    private static String replacement(String content, int i) {
        char c = content.charAt(i);
        return switch (c) {
            case '\u200B', '\u2060', '\uFEFF', '\u00AD' -> "";
            case '\u00A0', '\u202F', '\u2007' -> " ";
            case '\u200D' -> nearEmoji(content, i) ? null : "";
            case '\u200C' -> betweenLatin(content, i) ? "" : null;
            default -> null;
        };
    }

    private static String name(char c) {
        return switch (c) {
            case '\u200B' -> "a zero-width space";
            case '\u2060' -> "a word joiner";
            case '\uFEFF' -> "a byte-order mark inside the text";
            case '\u00AD' -> "a soft hyphen";
            case '\u00A0' -> "a no-break space";
            case '\u202F' -> "a narrow no-break space";
            case '\u2007' -> "a figure space";
            case '\u200D' -> "a zero-width joiner";
            default -> "a zero-width non-joiner";
        };
    }

    private static boolean nearEmoji(String content, int i) {
        return (i > 0 && isPictographic(content.codePointBefore(i)))
                || (i + 1 < content.length() && isPictographic(content.codePointAt(i + 1)));
    }

    private static boolean isPictographic(int codePoint) {
        int type = Character.getType(codePoint);
        return type == Character.OTHER_SYMBOL || codePoint == 0xFE0F || (codePoint >= 0x1F3FB && codePoint <= 0x1F3FF);
    }

    private static boolean betweenLatin(String content, int i) {
        return i > 0 && i + 1 < content.length() && isLatin(content.codePointBefore(i)) && isLatin(content.codePointAt(i + 1));
    }

    private static boolean isLatin(int codePoint) {
        return codePoint < 0x80 || Character.UnicodeScript.of(codePoint) == Character.UnicodeScript.LATIN;
    }
}
