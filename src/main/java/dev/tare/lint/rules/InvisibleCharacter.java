package dev.tare.lint.rules;

import dev.tare.lint.EditKind;
import dev.tare.lint.Example;
import dev.tare.lint.Finding;
import dev.tare.lint.LintContext;
import dev.tare.lint.MessageView;
import dev.tare.lint.Rule;
import dev.tare.lint.RuleDescriptor;
import dev.tare.lint.Severity;
import dev.tare.lint.TemplateView;
import dev.tare.structure.Role;
import dev.tare.template.Template;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * Characters that show nothing or look like a plain space: zero-width spaces and joiners, word
 * joiners, soft hyphens, byte-order marks inside the text, and no-break spaces, outside code and
 * anything laid out verbatim. A zero-width joiner or non-joiner is removed only between Latin
 * letters, digits or punctuation: next to a letter or mark of another script (Devanagari half forms
 * such as क्‍ष, Persian and Arabic word shapes) or inside an emoji sequence it changes what the text
 * shows, and is left alone.
 */
final class InvisibleCharacter implements Rule {
    /** Text a safe rewrite keeps byte for byte; the other roles outside prose are skipped by {@code prose()}. */
    private static final Role[] VERBATIM = {Role.TABLE_ROW, Role.TAB_SEPARATED, Role.ALIGNED};

    static final RuleDescriptor DESCRIPTOR = RuleDescriptor.builtIn("invisible-character", Severity.WARNING,
            EditKind.INVISIBLE,
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
        TemplateView text = context.text(template);
        List<Finding> findings = new ArrayList<>();
        for (MessageView message : text.messages()) {
            String content = message.content();
            for (int[] range : message.prose()) {
                for (int i = range[0]; i < range[1]; i++) {
                    char c = content.charAt(i);
                    String replacement = replacement(content, i);
                    if (replacement == null || message.touches(i, i + 1, VERBATIM)) {
                        continue;
                    }
                    findings.add(text.edit(DESCRIPTOR, message, i, i + 1, replacement,
                            name(c) + " (U+" + String.format(Locale.ROOT, "%04X", (int) c) + ") "
                                    + (replacement.isEmpty() ? "shows nothing; delete it" : "looks like a space; type a plain space"),
                            context.tokenizer(template)));
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
            case '\u200D', '\u200C' -> betweenLatin(content, i) ? "" : null;
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

    private static boolean betweenLatin(String content, int i) {
        return i > 0 && i + 1 < content.length() && isLatin(content.codePointBefore(i)) && isLatin(content.codePointAt(i + 1));
    }

    /** ASCII, or a Latin letter: text whose shapes no joiner changes. */
    private static boolean isLatin(int codePoint) {
        return codePoint < 0x80 || (Character.isLetter(codePoint)
                && Character.UnicodeScript.of(codePoint) == Character.UnicodeScript.LATIN);
    }
}
